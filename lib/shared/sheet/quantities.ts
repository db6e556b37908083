// Quantities on the sheet in the reader's units (metric or US customary), as display strings.
import type { UnitSystem } from '../domain';
import { fmt } from '@/lib/engine/format';
import { headMToPsi, lToUsGal, mmToIn, mToFt } from '../units';

const group = (n: number): string => n.toLocaleString('en-US', { maximumFractionDigits: 0 });

/** Rounds to two significant figures for "about" sentences: 2,284 → 2,300; 456 → 460; 95 → 95. */
export function roughly(value: number): number {
  if (!Number.isFinite(value) || value === 0) return 0;
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const step = 10 ** Math.max(magnitude - 1, 0);
  return Math.round(value / step) * step;
}

/**
 * A number with sensible precision for a figure, the engine's own rule for its sentences (so a
 * figure reads the same in the table and in the text): ≥ 1000 to tens, ≥ 100 whole, ≥ 10 one
 * decimal, else two.
 */
export function figureNumber(value: number): string {
  return fmt(value);
}

export interface Quantity {
  /** The number as shown, e.g. "2,280". */
  number: string;
  /** The unit as shown, e.g. "L/day" or "gal/day". */
  unit: string;
  /** Both, e.g. "2,280 L/day". */
  text: string;
}

const q = (number: string, unit: string): Quantity => ({ number, unit, text: `${number} ${unit}` });

/** A length or height (m in, m or ft out). */
export function length(m: number, units: UnitSystem): Quantity {
  return units === 'us' ? q(figureNumber(mToFt(m)), 'ft') : q(figureNumber(m), 'm');
}

/** A pipe length to order, whole units (m or ft). */
export function pipeLength(m: number, units: UnitSystem): Quantity {
  return units === 'us' ? q(group(Math.ceil(mToFt(m))), 'ft') : q(group(Math.ceil(m)), 'm');
}

/** A daily volume (L/day in, L/day or gal/day out). */
export function perDay(litres: number, units: UnitSystem): Quantity {
  return units === 'us' ? q(figureNumber(lToUsGal(litres)), 'gal/day') : q(figureNumber(litres), 'L/day');
}

/** A flow per minute (L/min in, L/min or gal/min out). */
export function perMinute(lpm: number, units: UnitSystem): Quantity {
  return units === 'us' ? q(figureNumber(lToUsGal(lpm)), 'gal/min') : q(figureNumber(lpm), 'L/min');
}

/** A volume (L in, L or gal out). */
export function volume(litres: number, units: UnitSystem): Quantity {
  return units === 'us' ? q(figureNumber(lToUsGal(litres)), 'gal') : q(figureNumber(litres), 'L');
}

/** A pipe bore (mm in, mm or in out). */
export function bore(mm: number, units: UnitSystem): Quantity {
  return units === 'us' ? q(mmToIn(mm).toFixed(2), 'in') : q(group(mm), 'mm');
}

/** A pressure given as head of water: "45.0 m of head" or "148 ft of head (64 psi)". */
export function pressureHead(m: number, units: UnitSystem): string {
  if (units === 'us') return `${figureNumber(mToFt(m))} ft of head (${figureNumber(headMToPsi(m))} psi)`;
  return `${figureNumber(m)} m of head (${figureNumber(m * 9.80665)} kPa)`;
}

/** A daily volume in words for the summary, with the same number as the key figure: "2,524 litres". */
export function dailyInWords(litres: number, units: UnitSystem): string {
  return `${perDay(litres, units).number} ${units === 'us' ? 'gallons' : 'litres'}`;
}

/** A pressure as a metric reader reads a pipe rating: "300 psi" → "2,070 kPa (300 psi)". */
export function psiAsKPa(psi: number): string {
  return `${figureNumber(psi * 6.894757)} kPa (${group(psi)} psi)`;
}
