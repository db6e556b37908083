import type { ComponentProps } from 'react';
import { cn } from './cn';

// Two looks for a typed or chosen value. `form`: the office, farm and sign-in forms (full width,
// thumb height, a stone border, a little space under its label). `phone`: the field book, taller and
// larger for wet thumbs and a phone held at arm's length. `className` adds to either (`figure` for
// numbers, `text-base` in dense filters).
const LOOKS = {
  form: 'mt-1 block min-h-12 w-full rounded-md border-2 border-stone bg-white px-2 text-lg',
  phone: 'min-h-14 w-full rounded-md border-2 border-stone bg-white px-3 text-xl',
};
export type ControlLook = keyof typeof LOOKS;

/** The classes of a form control of this look, with `className` added (and winning on conflicts). */
export function controlClasses(className?: string, look: ControlLook = 'form'): string {
  return cn(LOOKS[look], className);
}

/** A text, number or date input with the control look. */
export function Input({ className, look, ...props }: ComponentProps<'input'> & { look?: ControlLook }) {
  return <input className={controlClasses(className, look)} {...props} />;
}

/** A <select> with the control look. */
export function Select({ className, look, ...props }: ComponentProps<'select'> & { look?: ControlLook }) {
  return <select className={controlClasses(className, look)} {...props} />;
}

/** A <textarea> with the control look (a little vertical padding for its lines). */
export function TextArea({ className, look, ...props }: ComponentProps<'textarea'> & { look?: ControlLook }) {
  return <textarea className={controlClasses(cn('py-2', className), look)} {...props} />;
}
