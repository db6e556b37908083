// Every quantity the app shows or takes, in the reader's units. Values are stored and computed in SI
// (metres, millimetres for bores, litres, seconds, L/s or L/min for flows, hPa); only the display
// converts. Conversions: lib/shared/units.ts (exact definitions).
import type { UnitSystem } from '../domain';
import { ft2ToM2, gpmToLpm, headMToPsi, inToMm, lpmToGpm, lpmToLps, lpsToGpm, lToUsGal, m2ToFt2, mmToIn, mToFt, ftToM, usGalToL } from '../units';
import { formatFigure, formatNumber, formatTyped, formatWhole } from './numbers';

export type QuantityKind =
  | 'length'
  | 'accuracy'
  | 'pipeLength'
  | 'diameter'
  | 'volume'
  | 'time'
  | 'flowLps'
  | 'flowLpm'
  | 'litresPerDay'
  | 'litresPerHead'
  | 'litresPerArea'
  | 'angle'
  | 'area'
  | 'count'
  | 'pressureHPa'
  | 'speed'
  | 'misclosure'
  | 'stroke'
  | 'level'
  | 'chainage';

/** How one quantity reads in one unit system. */
export interface UnitDisplay {
  /** The unit as shown beside the number ("" for a plain count). */
  unit: string;
  fromSi: (si: number) => number;
  toSi: (shown: number) => number;
  /** Decimals a typed value is shown with when a field is filled in. */
  typed: number;
  /** How the number is rounded for reading: a fixed number of decimals, 'figure' (by size) or 'up' (whole, rounded up: pipe to buy). */
  shown: number | 'figure' | 'up';
}

// 1 inHg = 33.8639 hPa (conventional inch of mercury at 0 °C).
const HPA_PER_INHG = 33.8639;
const same = (x: number) => x;
const d = (unit: string, fromSi: (si: number) => number, toSi: (x: number) => number, typed: number, shown: UnitDisplay['shown']): UnitDisplay => ({
  unit,
  fromSi,
  toSi,
  typed,
  shown,
});

export const QUANTITIES: Record<QuantityKind, Record<UnitSystem, UnitDisplay>> = {
  length: { metric: d('m', same, same, 3, 'figure'), us: d('ft', mToFt, ftToM, 2, 'figure') },
  // A length compared with a threshold to the millimetre, so the text shows what was compared: "0.499 m".
  level: { metric: d('m', same, same, 3, 3), us: d('ft', mToFt, ftToM, 3, 3) },
  // A GPS fix's accuracy: whole metres or feet (a decimal would claim a precision the fix has not).
  accuracy: { metric: d('m', same, same, 0, 0), us: d('ft', mToFt, ftToM, 0, 0) },
  // A distance along the bank, as a place is named by it: whole metres or feet.
  chainage: { metric: d('m', same, same, 1, 0), us: d('ft', mToFt, ftToM, 1, 0) },
  pipeLength: { metric: d('m', same, same, 1, 'up'), us: d('ft', mToFt, ftToM, 0, 'up') },
  // A level run's misclosure, stored in mm.
  misclosure: { metric: d('mm', same, same, 0, 0), us: d('in', mmToIn, inToMm, 2, 2) },
  diameter: { metric: d('mm', same, same, 1, 0), us: d('in', mmToIn, inToMm, 2, 2) },
  // A waste valve's travel, stored in mm: set by eye to the millimetre or the sixteenth of an inch.
  stroke: { metric: d('mm', same, same, 0, 0), us: d('in', mmToIn, inToMm, 2, 2) },
  volume: { metric: d('L', same, same, 1, 'figure'), us: d('gal', lToUsGal, usGalToL, 2, 'figure') },
  time: { metric: d('s', same, same, 1, 1), us: d('s', same, same, 1, 1) },
  flowLps: { metric: d('L/s', same, same, 2, 'figure'), us: d('gal/min', lpsToGpm, (gpm) => lpmToLps(gpmToLpm(gpm)), 1, 'figure') },
  flowLpm: { metric: d('L/min', same, same, 1, 'figure'), us: d('gal/min', lpmToGpm, gpmToLpm, 1, 'figure') },
  litresPerDay: { metric: d('L/day', same, same, 0, 'figure'), us: d('gal/day', lToUsGal, usGalToL, 0, 'figure') },
  litresPerHead: { metric: d('L/day', same, same, 1, 'figure'), us: d('gal/day', lToUsGal, usGalToL, 2, 'figure') },
  // A garden's water per square metre (or foot) a day.
  litresPerArea: {
    metric: d('L/m²/day', same, same, 1, 'figure'),
    us: d(
      'gal/ft²/day',
      (l) => lToUsGal(l) / m2ToFt2(1),
      (g) => usGalToL(g) * m2ToFt2(1),
      3,
      'figure',
    ),
  },
  angle: { metric: d('°', same, same, 1, 1), us: d('°', same, same, 1, 1) },
  area: { metric: d('m²', same, same, 3, 'figure'), us: d('ft²', m2ToFt2, ft2ToM2, 2, 'figure') },
  count: { metric: d('', same, same, 0, 0), us: d('', same, same, 0, 0) },
  pressureHPa: {
    metric: d('hPa', same, same, 1, 1),
    us: d(
      'inHg',
      (h) => h / HPA_PER_INHG,
      (i) => i * HPA_PER_INHG,
      2,
      2,
    ),
  },
  speed: { metric: d('m/s', same, same, 2, 'figure'), us: d('ft/s', mToFt, ftToM, 2, 'figure') },
};

/** A quantity as shown: the number, the unit and both together. */
export interface ShownQuantity {
  /** The number as shown, e.g. "2,280". */
  number: string;
  /** The unit as shown, e.g. "L/day" or "gal/day". */
  unit: string;
  /** Both, e.g. "2,280 L/day". */
  text: string;
}

function roundShown(value: number, shown: UnitDisplay['shown']): string {
  if (shown === 'figure') return formatFigure(value);
  if (shown === 'up') return formatWhole(Math.ceil(value - 1e-9));
  return formatNumber(value, shown);
}

/** A stored SI value in the reader's units, as number and unit. */
export function quantity(si: number, kind: QuantityKind, units: UnitSystem): ShownQuantity {
  const u = QUANTITIES[kind][units];
  const number = roundShown(u.fromSi(si), u.shown);
  return { number, unit: u.unit, text: u.unit ? `${number} ${u.unit}` : number };
}

/** A stored SI value as text in the reader's units, e.g. "12.3 ft"; a dash when there is none. */
export function showQuantity(si: number | null | undefined, kind: QuantityKind, units: UnitSystem, withUnit = true): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '—';
  const q = quantity(si, kind, units);
  return withUnit ? q.text : q.number;
}

/** A stored SI value as it is put into a field to edit: the reader's units, no separators, "5.28" not "5.283441". */
export function typedQuantity(si: number | undefined, kind: QuantityKind, units: UnitSystem): string {
  if (si === undefined || !Number.isFinite(si)) return '';
  const u = QUANTITIES[kind][units];
  return formatTyped(u.fromSi(si), u.typed);
}

/** A pressure given as head of water: "45.0 m of head (441 kPa)" or "148 ft of head (64.0 psi)". */
export function pressureHead(m: number, units: UnitSystem): string {
  if (units === 'us') return `${formatFigure(mToFt(m))} ft of head (${formatFigure(headMToPsi(m))} psi)`;
  return `${formatFigure(m)} m of head (${formatFigure(m * 9.80665)} kPa)`;
}

/** A daily volume in words for a summary, with the same number as the key figure: "2,520 litres". */
export function dailyInWords(litres: number, units: UnitSystem): string {
  return `${quantity(litres, 'litresPerDay', units).number} ${units === 'us' ? 'gallons' : 'litres'}`;
}

/** A pressure rating as a metric reader reads it: 300 psi → "2,070 kPa (300 psi)". */
export function psiAsKPa(psi: number): string {
  return `${formatFigure(psi * 6.894757)} kPa (${formatWhole(psi)} psi)`;
}

/** Rounds to two significant figures for "about" sentences: 2,284 → 2,300; 456 → 460; 95 → 95. */
export function roughly(value: number): number {
  if (!Number.isFinite(value) || value === 0) return 0;
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const step = 10 ** Math.max(magnitude - 1, 0);
  return Math.round(value / step) * step;
}
