import type { ComponentProps } from 'react';
import { cn } from './cn';

// The look of a typed or chosen value in the office, farm and sign-in forms: full width, thumb
// height, a stone border. `className` adds to it (`figure` for numbers, `text-base` in dense filters).
const CONTROL = 'mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-2 text-lg';

/** The classes of a form control, with `className` added (and winning on conflicts). */
export function controlClasses(className?: string): string {
  return cn(CONTROL, className);
}

/** A text, number or date input with the form-control look. */
export function Input({ className, ...props }: ComponentProps<'input'>) {
  return <input className={controlClasses(className)} {...props} />;
}

/** A <select> with the form-control look. */
export function Select({ className, ...props }: ComponentProps<'select'>) {
  return <select className={controlClasses(className)} {...props} />;
}

/** A <textarea> with the form-control look (a little vertical padding for its lines). */
export function TextArea({ className, ...props }: ComponentProps<'textarea'>) {
  return <textarea className={controlClasses(cn('py-2', className))} {...props} />;
}
