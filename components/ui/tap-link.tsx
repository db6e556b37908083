import Link from 'next/link';
import type { ComponentProps } from 'react';
import { cn } from './cn';

/** A text link at thumb height (48 px): bold, underlined as links are, for a link that stands on its own line. */
export function TapLink({ className, ...props }: ComponentProps<typeof Link>) {
  return <Link className={cn('inline-flex min-h-12 items-center font-bold', className)} {...props} />;
}
