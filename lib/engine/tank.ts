import { EngineInputError } from './errors';
import type { SourceId } from './sources';
import { nonNegative } from './validate';

export type TankRuleId = 'one-day' | 'undependable-three-day' | 'low-yield-two-day-or-peak' | 'group-watering-quarter-day';

export interface TankRule {
  id: TankRuleId;
  label: string;
  sourceId: SourceId;
  /** Volume, L, from the daily demand and the peak drinking rate (L/h). */
  volumeL: (dailyDemandL: number, peakLph: number) => number;
}

export const TANK_RULES: Readonly<Record<TankRuleId, TankRule>> = {
  'one-day': { id: 'one-day', label: '1 day of demand (continuously running ram)', sourceId: 'tank-one-day', volumeL: (d) => d },
  'undependable-three-day': { id: 'undependable-three-day', label: '3 days of demand (undependable supply)', sourceId: 'nrcs-sd2006-1', volumeL: (d) => 3 * d },
  'low-yield-two-day-or-peak': {
    id: 'low-yield-two-day-or-peak',
    label: 'larger of 2 days or 6 h of peak demand (low-yield source)',
    sourceId: 'low-yield-storage',
    volumeL: (d, peak) => Math.max(2 * d, 6 * peak),
  },
  'group-watering-quarter-day': {
    id: 'group-watering-quarter-day',
    label: '25 % of the daily herd need (group watering)',
    sourceId: 'osu-anr-12',
    volumeL: (d) => 0.25 * d,
  },
};

// Common tank sizes sold for farms, L (common practice, no source).
export const TANK_SIZES_L = [500, 1000, 1500, 2000, 2500, 3000, 5000, 7500, 10000, 15000, 20000, 30000, 50000] as const;

/** Tank volume for a named rule, rounded up to a common size (or to the next 10,000 L above the list). */
export function tankSizeL(dailyDemandL: number, ruleId: TankRuleId = 'one-day', peakLph = 0): { requiredL: number; sizeL: number; rule: TankRule } {
  nonNegative(dailyDemandL, 'dailyDemandL');
  nonNegative(peakLph, 'peakLph');
  const rule = TANK_RULES[ruleId];
  if (!rule) throw new EngineInputError('ruleId', 'is not a known tank rule');
  const requiredL = rule.volumeL(dailyDemandL, peakLph);
  const sizeL = TANK_SIZES_L.find((s) => s >= requiredL) ?? Math.ceil(requiredL / 10000) * 10000;
  return { requiredL, sizeL, rule };
}
