// Sentences that carry figures: the engine writes a sentence once with its figures as SI amounts, and
// each reader gets it rendered in their own units ("a fall of 4.20 m" / "a fall of 13.8 ft").
import type { UnitSystem } from '../domain';
import { formatFigure, formatPercent } from './numbers';
import { pressureHead, quantity, type QuantityKind } from './quantities';

/** One figure in a sentence: an SI value and how to show it. 'head' is a pressure as head of water; 'ratio' a plain number; 'percent' a 0…1 fraction. */
export interface Amount {
  kind: QuantityKind | 'head' | 'ratio' | 'percent';
  value: number;
}

/** A sentence whose "{0}", "{1}"… are the amounts, in order. */
export interface Message {
  template: string;
  amounts: Amount[];
}

/** The amount as text in the reader's units. */
export function renderAmount(a: Amount, units: UnitSystem): string {
  if (a.kind === 'head') return pressureHead(a.value, units);
  if (a.kind === 'ratio') return formatFigure(a.value);
  if (a.kind === 'percent') return formatPercent(a.value);
  return quantity(a.value, a.kind, units).text;
}

/** The sentence in the reader's units. */
export function renderMessage(m: Message, units: UnitSystem): string {
  return m.template.replace(/\{(\d+)\}/g, (whole, i: string) => {
    const a = m.amounts[Number(i)];
    return a ? renderAmount(a, units) : whole;
  });
}

/**
 * Builds a message from a template literal: amounts become placeholders, words and plain numbers are
 * written in, messages within it joined. `say\`The fall is ${amount('length', 4.2)}.\``
 */
export function say(strings: TemplateStringsArray, ...parts: (Amount | Message | string | number)[]): Message {
  const amounts: Amount[] = [];
  let template = strings[0] ?? '';
  parts.forEach((part, i) => {
    if (typeof part !== 'object') template += String(part);
    else if ('template' in part) {
      // A message within a message: its placeholders follow this one's.
      const offset = amounts.length;
      template += part.template.replace(/\{(\d+)\}/g, (_, n: string) => `{${Number(n) + offset}}`);
      amounts.push(...part.amounts);
    } else {
      template += `{${amounts.length}}`;
      amounts.push(part);
    }
    template += strings[i + 1] ?? '';
  });
  return { template, amounts };
}

/** An amount for a sentence. */
export const amount = (kind: Amount['kind'], value: number): Amount => ({ kind, value });
