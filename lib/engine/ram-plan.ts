// Sizing from demand: the fewest, smallest rams whose delivery meets the need within the water the stream can spare.
import { LEAST_RAM_FALL_M, RAM_SIZE_TABLE, ramRowFor, type DriveLengthRuleId, type RamSizeRow } from './drive-pipe';
import { roundMm } from './format';
import { boreMm, materialOrThrow, NOMINAL_SIZES, pressureClassOrThrow, sizeForBore, type NominalSize } from './materials';
import { hazenWilliamsCoefficient } from './pipes';
import { operatingPoint, type OperatingPoint } from './operating-point';
import { designDeliveryPipe, designDrivePipe, type DeliveryDesign, type DriveDesign } from './pipe-design';
import type { EfficiencyCurve } from './ram';

/** Most rams in parallel the screen offers (common practice, no source); more is a design job. */
export const MAX_RAMS = 4;

export interface PipeEntry {
  lengthM?: number | undefined;
  diameterMm?: number | undefined;
  material: string;
  pressureClass?: string | undefined;
}

export interface RamPlanInput {
  fallM: number;
  staticLiftM: number;
  /** Most the rams may take together, L/min: the design share of the lowest flow. */
  availableLpm: number;
  /** Daily delivery asked for: demand × (1 + margin), L/day. */
  needLpd: number;
  curve: EfficiencyCurve;
  driveLengthRule: DriveLengthRuleId;
  fittingsAllowance: number;
  drivePipe: PipeEntry;
  deliveryPipe: PipeEntry & { lengthM: number };
  /** A size and count the advisor chose; the plan then only works out how it runs. */
  forced?: { driveIn: number; count: number } | undefined;
}

/** One way to build it: `count` rams of one size, each on its own drive pipe, sharing one delivery pipe. */
export interface RamOption {
  row: RamSizeRow;
  count: number;
  drive: DriveDesign;
  delivery: DeliveryDesign;
  /** Per ram: its drive flow, delivery and the friction in the shared pipe at the rams' summed flow. */
  op: OperatingPoint;
  /** All rams together, L/day. */
  deliveryLpd: number;
}

/**
 * Why no ram can run: too little water, too little fall for any size, a fall that cannot push a size's least
 * flow, or a drive flow too slow for its surge to reach the lift ('soft').
 */
export type NoRamCause = 'flow' | 'fall' | 'push' | 'soft';

export type RamPlan = { status: 'meets' | 'short'; option: RamOption; forced: boolean } | { status: 'no-ram'; cause: NoRamCause; forced: boolean };

/** The table rows whose inlet matches a given drive pipe's nominal size; every row when none does. */
function rowsForBore(pipe: PipeEntry): readonly RamSizeRow[] {
  const material = materialOrThrow(pipe.material, 'drivePipe.material');
  const cls = pressureClassOrThrow(material, pipe.pressureClass, 'drivePipe.pressureClass');
  const size = sizeForBore(pipe.diameterMm as number, cls);
  const matching = RAM_SIZE_TABLE.filter((r) => r.driveIn === size.nominalIn);
  return matching.length ? matching : RAM_SIZE_TABLE;
}

/** Designs `count` rams of one size, or says why they cannot run; `allowSoft` keeps an option whose surge falls short of the lift. */
export function designOption(input: RamPlanInput, row: RamSizeRow, count: number, allowSoft = false): RamOption | NoRamCause {
  const asked = Math.min(row.maxLpm, input.availableLpm / count);
  if (asked < row.minLpm) return 'flow';
  // Compared to the millimetre, like every fall threshold, so a unit round trip never flips it.
  if (roundMm(input.fallM) < roundMm(row.minFallM)) return 'fall';
  const driveFor = (totalLiftM: number) =>
    designDrivePipe({
      fallM: input.fallM,
      totalLiftM: Math.max(totalLiftM, 1e-3),
      driveLpm: asked,
      ram: row,
      pipe: input.drivePipe,
      ruleId: input.driveLengthRule,
    });
  const first = driveFor(input.staticLiftM);
  if (first.driveLpm < row.minLpm) return 'push';
  const at = (k: number) => operatingPoint({ curve: input.curve, deliveryFrictionK: k, ramCount: count }, input.fallM, input.staticLiftM, first.driveLpm);
  const delivery = designDeliveryPipe({
    pipe: input.deliveryPipe,
    fittingsAllowance: input.fittingsAllowance,
    ramDeliveryIn: row.deliveryIn,
    staticLiftM: input.staticLiftM,
    frictionFor: (k) => at(k).frictionM,
  });
  const op = at(delivery.frictionK);
  // Pressures follow the total lift, friction included; the drive flow does not depend on it.
  const drive = driveFor(op.totalLiftM);
  if (!allowSoft && drive.closureVelocityMps < drive.minimumClosureVelocityMps) return 'soft';
  return { row, count, drive, delivery, op, deliveryLpd: count * op.deliveryLpm * 1440 };
}

/**
 * The smallest ram, then the fewest rams, whose delivery meets the need within the water available (one ram of
 * each size first, then two, …); when none does, the option that delivers most, marked short.
 */
export function planRams(input: RamPlanInput): RamPlan {
  const plan = searchPlan(input, false);
  // When every option's surge falls short of the lift, keep the best of them so the verdict can say why.
  return plan.status === 'no-ram' && plan.cause === 'soft' ? searchPlan(input, true) : plan;
}

function searchPlan(input: RamPlanInput, allowSoft: boolean): RamPlan {
  if (input.forced) {
    const row = ramRowFor(input.forced.driveIn) ?? (RAM_SIZE_TABLE[0] as RamSizeRow);
    const o = designOption(input, row, input.forced.count, allowSoft);
    if (typeof o === 'string') return { status: 'no-ram', cause: o, forced: true };
    return { status: o.deliveryLpd >= input.needLpd ? 'meets' : 'short', option: o, forced: true };
  }
  let best: RamOption | null = null;
  const causes = new Set<NoRamCause>();
  // A drive pipe already on the farm fixes the ram's inlet size; otherwise every size is open.
  const rows = input.drivePipe.diameterMm ? rowsForBore(input.drivePipe) : RAM_SIZE_TABLE;
  for (let count = 1; count <= MAX_RAMS; count++) {
    for (const row of rows) {
      const o = designOption(input, row, count, allowSoft);
      if (typeof o === 'string') {
        causes.add(o);
        continue;
      }
      if (o.deliveryLpd >= input.needLpd) return { status: 'meets', option: o, forced: false };
      // Short everywhere: the most water delivered, but fewer or smaller rams unless more deliver clearly more.
      if (!best || o.deliveryLpd > best.deliveryLpd * 1.02) best = o;
    }
  }
  if (best) return { status: 'short', option: best, forced: false };
  // The most telling cause: a fall too small for every size, one too slow to lift, one that cannot push, else too little water.
  const cause: NoRamCause = roundMm(input.fallM) < roundMm(LEAST_RAM_FALL_M) ? 'fall' : causes.has('soft') ? 'soft' : causes.has('push') ? 'push' : 'flow';
  return { status: 'no-ram', cause, forced: false };
}

export interface FeedEntry {
  lengthM: number;
  diameterMm?: number | undefined;
  material: string;
}

/** The feed pipe of an arrangement: its size, bore and the friction it takes off the fall at the rams' summed drive flow. */
export interface FeedDesign {
  lengthM: number;
  size: NominalSize;
  boreMm: number;
  materialLabel: string;
  classLabel: string;
  frictionM: number;
}

/** Feed pipe one size up from the ram's drive pipe (common practice, no source), or as given; Hazen–Williams friction. */
export function designFeedPipe(feed: FeedEntry, ramDriveIn: number, totalDriveLpm: number, fittingsAllowance: number): FeedDesign {
  const material = materialOrThrow(feed.material, 'feedPipe.material');
  const cls = pressureClassOrThrow(material, undefined, 'feedPipe.pressureClass');
  const driveAt = NOMINAL_SIZES.findIndex((s) => s.nominalIn >= ramDriveIn);
  const size = feed.diameterMm
    ? sizeForBore(feed.diameterMm, cls)
    : (NOMINAL_SIZES[Math.min(NOMINAL_SIZES.length - 1, Math.max(0, driveAt) + 1)] as NominalSize);
  const bore = feed.diameterMm ?? boreMm(size, cls);
  const k = hazenWilliamsCoefficient(feed.lengthM * (1 + fittingsAllowance), bore, material.hazenC);
  return { lengthM: feed.lengthM, size, boreMm: bore, materialLabel: material.label, classLabel: cls.label, frictionM: k * (totalDriveLpm / 60000) ** 1.852 };
}

/**
 * Plans the rams behind a feed pipe and stand pipe: the feed's friction at the rams' drive flow comes off the
 * fall, so the plan is made again on the fall that is left (once: the drive flow moves little with it).
 */
export function planWithFeed(input: RamPlanInput, feed: FeedEntry | undefined): { plan: RamPlan; feed: FeedDesign | null; fallM: number } {
  let plan = planRams(input);
  if (!feed) return { plan, feed: null, fallM: input.fallM };
  let design: FeedDesign | null = null;
  let fallM = input.fallM;
  for (let i = 0; i < 1 && plan.status !== 'no-ram'; i++) {
    design = designFeedPipe(feed, plan.option.row.driveIn, plan.option.count * plan.option.drive.driveLpm, input.fittingsAllowance);
    fallM = Math.max(1e-3, input.fallM - design.frictionM);
    plan = planRams({ ...input, fallM });
  }
  return { plan, feed: design, fallM };
}
