import Link from 'next/link';
import type { ComponentProps } from 'react';
import { cn } from './cn';

// Every button and button-like link is at least 48 px tall (min-h-12): a thumb on a phone in the rain.
export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'caution' | 'quiet';
export type ButtonSize = 'sm' | 'md' | 'lg' | 'xl' | 'wide';

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-slate text-white disabled:opacity-70',
  secondary: 'border-2 border-slate text-slate disabled:opacity-50',
  danger: 'border-2 border-clay text-clay disabled:opacity-50',
  caution: 'border-2 border-ochre text-ochre disabled:opacity-50',
  quiet: 'border-2 border-stone disabled:opacity-50',
};

const SIZES: Record<ButtonSize, string> = {
  sm: 'px-3',
  md: 'px-4',
  lg: 'px-5 text-lg',
  // The field book's main action on a form.
  xl: 'min-h-14 px-4 text-xl',
  // Fills its row: no side padding needed.
  wide: 'w-full',
};

export interface ButtonLook {
  variant?: ButtonVariant;
  size?: ButtonSize;
  className?: string;
}

/** The classes of a button of this variant and size, with `className` added (and winning on conflicts). */
export function buttonClasses({ variant = 'primary', size = 'md', className }: ButtonLook = {}): string {
  return cn('min-h-12 rounded-md font-bold', VARIANTS[variant], SIZES[size], className);
}

/** A <button>; `type` defaults to "button" so it never submits a form by accident. */
export function Button({ variant, size, className, type = 'button', ...props }: ButtonLook & ComponentProps<'button'>) {
  return <button type={type} className={buttonClasses({ variant, size, className })} {...props} />;
}

type ButtonLinkProps =
  | (ButtonLook & ComponentProps<typeof Link> & { plain?: false })
  /** A plain <a>: a download or an address outside the app's routes. */
  | (ButtonLook & ComponentProps<'a'> & { plain: true; href: string });

/** A link that looks like a button of the same variant and size: a Next <Link>, or with `plain` an <a>. */
export function ButtonLink(props: ButtonLinkProps) {
  const classes = buttonClasses({ variant: props.variant, size: props.size, className: cn('inline-flex items-center no-underline', props.className) });
  if (props.plain) {
    const { variant: _v, size: _s, className: _c, plain: _p, ...rest } = props;
    return <a {...rest} className={classes} />;
  }
  const { variant: _v, size: _s, className: _c, plain: _p, ...rest } = props;
  return <Link {...rest} className={classes} />;
}
