import type { SourceId } from './sources';
import { nonNegative, positive } from './validate';
import { EngineInputError } from './errors';
import { G } from './physics';

export type DriveLengthRuleId = 'perkin-3-7' | 'watt-5-10' | 'peace-corps-6-12' | 'dtu-2-4';

export interface DriveLengthRule {
  id: DriveLengthRuleId;
  label: string;
  minTimesFall: number;
  maxTimesFall: number;
  sourceId: SourceId;
}

// The rules conflict: the organisation chooses; the band is a warning, not a hard limit.
export const DRIVE_LENGTH_RULES: Readonly<Record<DriveLengthRuleId, DriveLengthRule>> = {
  'perkin-3-7': { id: 'perkin-3-7', label: '3–7 × fall (Perkin, via Wikipedia)', minTimesFall: 3, maxTimesFall: 7, sourceId: 'wikipedia-hydraulic-ram' },
  'watt-5-10': { id: 'watt-5-10', label: '5–10 × fall (Watt 1975)', minTimesFall: 5, maxTimesFall: 10, sourceId: 'drive-length-other-rules' },
  'peace-corps-6-12': {
    id: 'peace-corps-6-12',
    label: '6–12 × fall (Peace Corps 1981)',
    minTimesFall: 6,
    maxTimesFall: 12,
    sourceId: 'drive-length-other-rules',
  },
  'dtu-2-4': { id: 'dtu-2-4', label: '2–4 × fall (Jeffery et al. 1992)', minTimesFall: 2, maxTimesFall: 4, sourceId: 'drive-length-other-rules' },
};

/** Recommended drive pipe length band, m, for a fall under a named rule. */
export function driveLengthBandM(fallM: number, ruleId: DriveLengthRuleId = 'perkin-3-7'): { minM: number; maxM: number; rule: DriveLengthRule } {
  positive(fallM, 'fallM');
  const rule = DRIVE_LENGTH_RULES[ruleId];
  if (!rule) throw new EngineInputError('ruleId', 'is not a known drive length rule');
  return { minM: rule.minTimesFall * fallM, maxM: rule.maxTimesFall * fallM, rule };
}

/** Drive pipe length/diameter band (NITK lab notes: 150–1000). */
export const DRIVE_LD_BAND = { min: 150, max: 1000 } as const;

export interface RamSizeRow {
  driveIn: number;
  deliveryIn: number;
  minLpm: number;
  maxLpm: number;
  /** Least fall the size works on, m (Ogden 1911, Table XI). */
  minFallM: number;
}

// Ogden (1911), Rural Hygiene, Table XI: drive/delivery pipe, drive flow in gpm (× 3.785 L/min), least fall in ft.
const GPM = 3.785411784;
const FT = 0.3048;
export const RAM_SIZE_TABLE: readonly RamSizeRow[] = [
  { driveIn: 1.25, deliveryIn: 0.75, minLpm: 2.5 * GPM, maxLpm: 6 * GPM, minFallM: 3 * FT },
  { driveIn: 1.5, deliveryIn: 0.75, minLpm: 6 * GPM, maxLpm: 12 * GPM, minFallM: 3 * FT },
  { driveIn: 2, deliveryIn: 1, minLpm: 8 * GPM, maxLpm: 18 * GPM, minFallM: 2 * FT },
  { driveIn: 2.5, deliveryIn: 1, minLpm: 11 * GPM, maxLpm: 24 * GPM, minFallM: 2 * FT },
  { driveIn: 3, deliveryIn: 1.25, minLpm: 15 * GPM, maxLpm: 35 * GPM, minFallM: 2 * FT },
  { driveIn: 4, deliveryIn: 2, minLpm: 30 * GPM, maxLpm: 75 * GPM, minFallM: 2 * FT },
  { driveIn: 8, deliveryIn: 4, minLpm: 150 * GPM, maxLpm: 350 * GPM, minFallM: 2 * FT },
  { driveIn: 12, deliveryIn: 5, minLpm: 375 * GPM, maxLpm: 700 * GPM, minFallM: 2 * FT },
];

/** The least fall any size of the table works on, m. */
export const LEAST_RAM_FALL_M = Math.min(...RAM_SIZE_TABLE.map((r) => r.minFallM));

/** The table row for a ram's drive pipe size, inches, or null. */
export function ramRowFor(driveIn: number): RamSizeRow | null {
  return RAM_SIZE_TABLE.find((r) => r.driveIn === driveIn) ?? null;
}

export type RamSizeStatus = 'in-table' | 'below-table' | 'capped';

/**
 * Ram and drive pipe size for a design drive flow (Ogden 1911, Table XI): the smallest row whose range holds
 * the flow; above a row's range with no next row covering it, the ram uses only its maximum ("capped").
 */
export function ramSizeForFlow(designLpm: number): { row: RamSizeRow | null; usedLpm: number; status: RamSizeStatus } {
  nonNegative(designLpm, 'designLpm');
  const first = RAM_SIZE_TABLE[0] as RamSizeRow;
  if (designLpm < first.minLpm) return { row: null, usedLpm: 0, status: 'below-table' };
  const fits = RAM_SIZE_TABLE.find((r) => designLpm >= r.minLpm && designLpm <= r.maxLpm);
  if (fits) return { row: fits, usedLpm: designLpm, status: 'in-table' };
  const below = [...RAM_SIZE_TABLE].reverse().find((r) => r.maxLpm < designLpm) ?? first;
  return { row: below, usedLpm: below.maxLpm, status: 'capped' };
}

/**
 * Least closure velocity, m/s, whose Joukowsky rise on top of the fall reaches the delivery head:
 * H + a·v/g ≥ h, so v = g·(h − H)/a (Joukowsky; the concept in Thomas 1994).
 */
export function minimumDriveVelocityMps(deliveryHeadM: number, waveSpeedMps: number, fallM = 0): number {
  const rise = positive(deliveryHeadM, 'deliveryHeadM') - nonNegative(fallM, 'fallM');
  return (G * Math.max(0, rise)) / positive(waveSpeedMps, 'waveSpeedMps');
}
