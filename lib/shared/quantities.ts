// How each kind of reading is shown and typed in metric or US customary. Values are stored in SI;
// only the display converts (PRACTICE: store canonical SI, convert on display).
import type { UnitSystem } from './domain';
import { ftToM, inToMm, lToUsGal, mmToIn, mToFt, usGalToL, lpsToGpm, gpmToLpm, lpmToLps, m2ToFt2, ft2ToM2 } from './units';

export type Quantity = 'length' | 'diameter' | 'volume' | 'time' | 'flowLps' | 'angle' | 'area' | 'count' | 'litresPerDay' | 'pressureHPa';

// 1 inHg = 33.8639 hPa (conventional inch of mercury at 0 °C).
const HPA_PER_INHG = 33.8639;

interface Display { unit: string; fromSi: (si: number) => number; toSi: (shown: number) => number; decimals: number }

const same = (x: number) => x;

export const QUANTITIES: Record<Quantity, Record<UnitSystem, Display>> = {
  length: { metric: { unit: 'm', fromSi: same, toSi: same, decimals: 3 }, us: { unit: 'ft', fromSi: mToFt, toSi: ftToM, decimals: 2 } },
  diameter: { metric: { unit: 'mm', fromSi: same, toSi: same, decimals: 1 }, us: { unit: 'in', fromSi: mmToIn, toSi: inToMm, decimals: 2 } },
  volume: { metric: { unit: 'L', fromSi: same, toSi: same, decimals: 1 }, us: { unit: 'gal', fromSi: lToUsGal, toSi: usGalToL, decimals: 2 } },
  time: { metric: { unit: 's', fromSi: same, toSi: same, decimals: 1 }, us: { unit: 's', fromSi: same, toSi: same, decimals: 1 } },
  flowLps: {
    metric: { unit: 'L/s', fromSi: same, toSi: same, decimals: 2 },
    us: { unit: 'gal/min', fromSi: lpsToGpm, toSi: (gpm) => lpmToLps(gpmToLpm(gpm)), decimals: 1 },
  },
  angle: { metric: { unit: '°', fromSi: same, toSi: same, decimals: 1 }, us: { unit: '°', fromSi: same, toSi: same, decimals: 1 } },
  area: { metric: { unit: 'm²', fromSi: same, toSi: same, decimals: 3 }, us: { unit: 'ft²', fromSi: m2ToFt2, toSi: ft2ToM2, decimals: 2 } },
  count: { metric: { unit: '', fromSi: same, toSi: same, decimals: 0 }, us: { unit: '', fromSi: same, toSi: same, decimals: 0 } },
  pressureHPa: { metric: { unit: 'hPa', fromSi: same, toSi: same, decimals: 1 }, us: { unit: 'inHg', fromSi: (h) => h / HPA_PER_INHG, toSi: (i) => i * HPA_PER_INHG, decimals: 2 } },
  litresPerDay: { metric: { unit: 'L/day', fromSi: same, toSi: same, decimals: 0 }, us: { unit: 'gal/day', fromSi: lToUsGal, toSi: usGalToL, decimals: 0 } },
};

/** A stored SI value as text in the reader's units, e.g. "12.30 ft". */
export function showQuantity(si: number | null | undefined, quantity: Quantity, system: UnitSystem, withUnit = true): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '—';
  const d = QUANTITIES[quantity][system];
  const text = d.fromSi(si).toFixed(d.decimals);
  return withUnit && d.unit ? `${text} ${d.unit}` : text;
}
