import type { ComponentProps, ElementType } from 'react';
import { cn } from './cn';

export type CardTone = 'plain' | 'field' | 'strong' | 'caution' | 'alarm' | 'creek';
export type CardPadding = 'none' | 'sm' | 'md' | 'lg';
type CardElement = 'div' | 'section' | 'article' | 'aside' | 'li' | 'ul' | 'ol' | 'form' | 'fieldset' | 'figure' | 'details' | 'p';

// A white panel on the paper background; the border says what kind of panel it is.
const TONES: Record<CardTone, string> = {
  plain: 'border border-rule',
  field: 'border-2 border-rule',
  strong: 'border-2 border-slate',
  caution: 'border-2 border-ochre',
  alarm: 'border-2 border-clay',
  creek: 'border-2 border-creek',
};

const PADDINGS: Record<CardPadding, string> = { none: '', sm: 'p-2', md: 'p-3', lg: 'p-4' };

export interface CardLook {
  tone?: CardTone;
  padding?: CardPadding;
  className?: string;
}

/** The classes of a card of this tone and padding, with `className` added (and winning on conflicts). */
export function cardClasses({ tone = 'plain', padding = 'lg', className }: CardLook = {}): string {
  return cn('rounded-md bg-white', TONES[tone], PADDINGS[padding], className);
}

/** A card: a <div>, or the element `as` names (a list, a list item, a section, a form, an alert paragraph). */
export function Card<T extends CardElement = 'div'>({ as, tone, padding, className, ...props }: CardLook & { as?: T } & Omit<ComponentProps<T>, 'className'>) {
  const Tag: ElementType = as ?? 'div';
  return <Tag className={cardClasses({ tone, padding, className })} {...(props as Record<string, unknown>)} />;
}
