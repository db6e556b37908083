import { EngineInputError } from './errors';
import type { SourceId } from './sources';
import { inRange, nonNegative, positive } from './validate';

export type EfficiencyCurveId = 'building-trades-table' | 'eytelwein' | 'wftw-commercial' | 'wftw-home-built';

export interface EfficiencyCurve {
  id: EfficiencyCurveId;
  label: string;
  sourceId: SourceId;
  /** Lift ratios (h/H) the curve is published for; outside it the engine reports instead of extrapolating. */
  minRatio: number;
  maxRatio: number;
  /** Above this ratio the curve is no longer stated by its source: the screen says so (constant curves). */
  statedUpToRatio: number;
  at: (liftRatio: number) => number;
}

// Building Trades Pocketbook, "The Hydraulic Ram": efficiency vs lift/fall (found; OCR "10" read as 16).
const BUILDING_TRADES: readonly (readonly [ratio: number, efficiency: number])[] = [
  [4, 0.72],
  [6, 0.61],
  [8, 0.52],
  [10, 0.44],
  [12, 0.37],
  [14, 0.31],
  [16, 0.25],
  [18, 0.19],
  [20, 0.14],
  [22, 0.09],
  [24, 0.04],
  [26, 0],
];

function interpolateTable(table: readonly (readonly [number, number])[], x: number): number {
  for (let i = 1; i < table.length; i++) {
    const hi = table[i];
    const lo = table[i - 1];
    if (hi && lo && x <= hi[0]) return lo[1] + ((x - lo[0]) / (hi[0] - lo[0])) * (hi[1] - lo[1]);
  }
  return table[table.length - 1]?.[1] ?? 0;
}

export const EFFICIENCY_CURVES: Readonly<Record<EfficiencyCurveId, EfficiencyCurve>> = {
  'building-trades-table': {
    id: 'building-trades-table',
    label: 'Historic table (Building Trades Pocketbook), linear between rows',
    sourceId: 'building-trades-pocketbook',
    minRatio: 4,
    maxRatio: 26,
    statedUpToRatio: 26,
    at: (r) => interpolateTable(BUILDING_TRADES, r),
  },
  eytelwein: {
    id: 'eytelwein',
    label: 'Eytelwein: η = 1.12 − 0.2·√(h/H)',
    sourceId: 'eytelwein-1805',
    // Range assumed (from memory): above 1 where the form exceeds 0.9, up to the 30:1 practical limit.
    minRatio: 1.5,
    maxRatio: 30,
    statedUpToRatio: 30,
    at: (r) => 1.12 - 0.2 * Math.sqrt(r),
  },
  'wftw-commercial': {
    id: 'wftw-commercial',
    label: 'Water for the World, commercial ram: E = 0.66',
    sourceId: 'wftw-rws4d5',
    minRatio: 1.5,
    maxRatio: 30,
    // A constant efficiency holds only where efficiency has not yet fallen off: up to about 12 (International Encyclopedia).
    statedUpToRatio: 12,
    at: () => 0.66,
  },
  'wftw-home-built': {
    id: 'wftw-home-built',
    label: 'Water for the World, home-built ram: E = 0.33',
    sourceId: 'wftw-rws4d5',
    minRatio: 1.5,
    maxRatio: 30,
    statedUpToRatio: 12,
    at: () => 0.33,
  },
};

export type EfficiencyStatus = 'in-range' | 'below-range' | 'above-range';

export interface RamEfficiencyResult {
  /** D'Aubuisson efficiency 0…1; below the curve the delivered share q/Q of its first value is held (stated by status), above it 0. */
  efficiency: number;
  status: EfficiencyStatus;
  curve: EfficiencyCurve;
}

/** Ram (D'Aubuisson) efficiency for a lift ratio h/H from a named curve (default: Building Trades Pocketbook table). */
export function ramEfficiency(liftRatio: number, curveId: EfficiencyCurveId = 'building-trades-table'): RamEfficiencyResult {
  const r = positive(liftRatio, 'liftRatio');
  const curve = EFFICIENCY_CURVES[curveId];
  if (!curve) throw new EngineInputError('curveId', 'is not a known efficiency curve');
  const edge = curve.at(curve.minRatio);
  if (r < curve.minRatio) return { efficiency: Math.min(1, (edge * r) / curve.minRatio), status: 'below-range', curve };
  if (r > curve.maxRatio) return { efficiency: 0, status: 'above-range', curve };
  return { efficiency: Math.min(1, Math.max(0, curve.at(r))), status: 'in-range', curve };
}

export interface RamDeliveryInput {
  supplyLpm: number;
  fallM: number;
  liftM: number;
  efficiency: number;
}

/** Delivered flow, L/min: q = η·Q·H/h (D'Aubuisson; Water for the World D = S·F·E/L). */
export function ramDeliveryLpm({ supplyLpm, fallM, liftM, efficiency }: RamDeliveryInput): number {
  nonNegative(supplyLpm, 'supplyLpm');
  const fall = positive(fallM, 'fallM');
  const lift = positive(liftM, 'liftM');
  inRange(efficiency, 'efficiency', 0, 1);
  if (lift <= fall) throw new EngineInputError('liftM', 'must be more than fallM for a ram (lower tanks fill by gravity)');
  return (efficiency * supplyLpm * fall) / lift;
}

export interface RamTestReading {
  supplyLpm: number;
  deliveryLpm: number;
  fallM: number;
  liftM: number;
}

function checkTest({ supplyLpm, deliveryLpm, fallM, liftM }: RamTestReading): void {
  positive(supplyLpm, 'supplyLpm');
  nonNegative(deliveryLpm, 'deliveryLpm');
  positive(fallM, 'fallM');
  positive(liftM, 'liftM');
  if (deliveryLpm >= supplyLpm) throw new EngineInputError('deliveryLpm', 'must be less than supplyLpm');
  if (liftM <= fallM) throw new EngineInputError('liftM', 'must be more than fallM');
}

/** D'Aubuisson efficiency q·h/(Q·H), with Q the total drive flow and h above the ram (NITK notes). */
export function daubuissonEfficiency(t: RamTestReading): number {
  checkTest(t);
  return (t.deliveryLpm * t.liftM) / (t.supplyLpm * t.fallM);
}

/** Rankine efficiency q·(h − H)/((Q − q)·H) (NITK notes). */
export function rankineEfficiency(t: RamTestReading): number {
  checkTest(t);
  return (t.deliveryLpm * (t.liftM - t.fallM)) / ((t.supplyLpm - t.deliveryLpm) * t.fallM);
}
