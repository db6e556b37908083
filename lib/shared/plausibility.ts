// Readings that are possible but unusual: the phone asks "is this right?" at the field and saves them
// only once the advisor confirms; the confirmation stays with the record (`confirmed`). Hard limits
// (what can never be a site) live in the shared schemas; these are the soft ones.
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';
import { floatFlowLps, rectangularWeirFlowLps, vNotchFlowLps, volumetricFlowLps } from '@/lib/engine/flow';
import type { UnitSystem } from './domain';
import { formatWhole } from './display/numbers';
import { showQuantity } from './display/quantities';
import { NOTCH_HEAD_RANGE_M, UNUSUAL_FALL_M, UNUSUAL_HEAD, UNUSUAL_LIFT_M, UNUSUAL_PEOPLE, UNUSUAL_TRIAL_RATIO } from './reading-limits';
import { runDropM, type FallRun, type FlowMeasurement } from './schemas/site-readings';
import type { EntityFields, SyncEntity } from './schemas/sync';

export interface Unusual {
  /** Kept in the record's `confirmed` list once the advisor says it is right. */
  code: string;
  /** Where the form shows the question (a path in the record's fields). */
  path: string;
  /** The question, in the advisor's units. */
  message: string;
  confirmed: boolean;
}

type Found = Omit<Unusual, 'confirmed'>;

function trialFlowsLps(m: FlowMeasurement): number[] {
  try {
    switch (m.method) {
      case 'volumetric':
        return m.trials.map((t) => volumetricFlowLps([t]));
      case 'v-notch':
        return m.trials.map((t) => vNotchFlowLps(t.headM, m.notchAngleDeg));
      case 'rectangular-weir':
        return m.trials.map((t) => rectangularWeirFlowLps(t));
      case 'float':
        return m.trials.map((t) => floatFlowLps({ ...t, areaM2: m.areaM2, coefficient: m.coefficient }));
    }
  } catch {
    return [];
  }
}

function inFlow(m: FlowMeasurement, units: UnitSystem): Found[] {
  const out: Found[] = [];
  if (m.method === 'v-notch' && (m.notchAngleDeg ?? 90) === 90) {
    const [low, high] = NOTCH_HEAD_RANGE_M;
    const i = m.trials.findIndex((t) => t.headM < low || t.headM > high);
    if (i >= 0) {
      out.push({
        code: 'notch-head-range',
        path: `measurement.trials.${i}.headM`,
        message: `A head of ${showQuantity(m.trials[i]!.headM, 'length', units)} is outside the range a 90° notch is calibrated for (${showQuantity(low, 'length', units)} to ${showQuantity(high, 'length', units)}); the flow from it is a guess. Is this right?`,
      });
    }
  }
  const flows = trialFlowsLps(m).filter((f) => f > 0);
  if (flows.length >= 2) {
    const ratio = Math.max(...flows) / Math.min(...flows);
    if (ratio >= UNUSUAL_TRIAL_RATIO) {
      out.push({
        code: 'trial-spread',
        path: 'measurement.trials',
        message: `The trials differ ${Math.round(ratio)}-fold (${showQuantity(Math.min(...flows), 'flowLps', units)} to ${showQuantity(Math.max(...flows), 'flowLps', units)}). A slipped stopwatch, or did the creek change? Is this right?`,
      });
    }
  }
  return out;
}

function inRun(f: EntityFields<'fallReading'>, units: UnitSystem): Found[] {
  const run = f.run;
  if (run.method === 'direct') {
    return run.staticLiftM > UNUSUAL_LIFT_M ? [{ code: 'lift-high', path: 'run.staticLiftM', message: liftQuestion(run.staticLiftM, units) }] : [];
  }
  const drop = runDropM(run as FallRun);
  if (drop === null) return [];
  if (f.purpose === 'fall' && drop > UNUSUAL_FALL_M) {
    return [
      {
        code: 'fall-high',
        path: 'run',
        message: `A fall of ${showQuantity(drop, 'length', units)} is more than most rams work on (most use ${showQuantity(1, 'length', units)} to ${showQuantity(20, 'length', units)}; few over ${showQuantity(UNUSUAL_FALL_M, 'length', units)}). Is this right?`,
      },
    ];
  }
  const lift = f.bookedFrom === 'tank' ? drop : -drop;
  if (f.purpose === 'lift' && lift > UNUSUAL_LIFT_M) return [{ code: 'lift-high', path: 'run', message: liftQuestion(lift, units) }];
  return [];
}

const liftQuestion = (liftM: number, units: UnitSystem) =>
  `A lift of ${showQuantity(liftM, 'length', units)} is beyond what ram makers list (about ${showQuantity(UNUSUAL_LIFT_M, 'length', units)}). Is this right?`;

function inDemand(d: EntityFields<'demandLine'>): Found[] {
  const entry = Object.hasOwn(DEMAND_CATALOGUE, d.kind) ? DEMAND_CATALOGUE[d.kind as DemandKind] : undefined;
  if (entry?.unit === 'person' && d.count > UNUSUAL_PEOPLE) {
    return [
      { code: 'people-many', path: 'count', message: `${formatWhole(d.count)} people is a village, not a farm (over ${UNUSUAL_PEOPLE}). Is this right?` },
    ];
  }
  if ((entry?.unit === 'head' || entry?.unit === 'bird') && d.count > UNUSUAL_HEAD) {
    return [
      {
        code: 'head-many',
        path: 'count',
        message: `${formatWhole(d.count)} of one kind is a large herd or flock for a small farm (over ${formatWhole(UNUSUAL_HEAD)}). Is this right?`,
      },
    ];
  }
  return [];
}

/** The confirmations a record carries (where each entity keeps them). */
export function confirmationsOf(entity: SyncEntity, fields: Record<string, unknown>): string[] {
  const list =
    entity === 'flowMeasurement'
      ? (fields.measurement as { confirmed?: string[] } | undefined)?.confirmed
      : entity === 'fallReading'
        ? (fields.run as { confirmed?: string[] } | undefined)?.confirmed
        : entity === 'demandLine'
          ? (fields.confirmed as string[] | null | undefined)
          : undefined;
  return Array.isArray(list) ? list : [];
}

/** The record with these codes added to its confirmations (in the place the entity keeps them). */
export function withConfirmations<E extends SyncEntity>(entity: E, fields: EntityFields<E>, codes: readonly string[]): EntityFields<E> {
  if (codes.length === 0) return fields;
  const f = fields as Record<string, unknown>;
  const merged = [...new Set([...confirmationsOf(entity, f), ...codes])];
  if (entity === 'flowMeasurement') return { ...f, measurement: { ...(f.measurement as object), confirmed: merged } } as EntityFields<E>;
  if (entity === 'fallReading') return { ...f, run: { ...(f.run as object), confirmed: merged } } as EntityFields<E>;
  if (entity === 'demandLine') return { ...f, confirmed: merged } as EntityFields<E>;
  return fields;
}

/** Unusual values in a whole record, each marked confirmed or not. */
export function unusualIn<E extends SyncEntity>(entity: E, fields: EntityFields<E>, units: UnitSystem = 'metric'): Unusual[] {
  let found: Found[] = [];
  if (entity === 'flowMeasurement') found = inFlow((fields as EntityFields<'flowMeasurement'>).measurement, units);
  else if (entity === 'fallReading') found = inRun(fields as EntityFields<'fallReading'>, units);
  else if (entity === 'demandLine') found = inDemand(fields as EntityFields<'demandLine'>);
  const confirmed = confirmationsOf(entity, fields as Record<string, unknown>);
  return found.map((u) => ({ ...u, confirmed: confirmed.includes(u.code) }));
}
