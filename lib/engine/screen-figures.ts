// Every number of a screening as a traced figure: value, unit, rule, source id and the inputs behind it.
import type { SiteReadings } from '@/lib/shared/schemas/site-readings';
import type { DemandLineResult } from './demand';
import type { GravityDesign } from './gravity';
import type { MonteCarloResult } from './monte-carlo';
import { CLOSURE_TO_MEAN_VELOCITY } from './pipe-design';
import type { FeedDesign, RamOption } from './ram-plan';
import type { EfficiencyCurve } from './ram';
import type { CombinedEstimate, FlowEstimate } from './readings';
import type { Figure, FigureInputs, FigureKey } from './screening-types';
import type { SourceId } from './sources';
import type { TankRule } from './tank';

export interface SurveyContext {
  r: SiteReadings;
  fall: CombinedEstimate;
  lift: CombinedEstimate;
  flows: FlowEstimate[];
  lowest: FlowEstimate;
  supplyMeanLpm: number;
  supplySpreadLpm: number;
  lowestLpm: number;
  /** The share of the lowest flow the figures assume (the organisation's, or the larger one a condition asks for). */
  fraction: number;
  demandLines: DemandLineResult[];
  demandLpd: number;
  tank: { requiredL: number; sizeL: number; rule: TankRule };
}

export interface FigureContext extends SurveyContext {
  option: RamOption;
  /** The feed pipe to a stand pipe, when the drive pipe starts there; its friction comes off the fall. */
  feed: FeedDesign | null;
  /** The fall the ram works on: the measured fall less the feed pipe's friction. */
  drivingFallM: number;
  forced: boolean;
  curve: EfficiencyCurve;
  mc: MonteCarloResult;
}

export interface GravityFigureContext extends SurveyContext {
  gravity: GravityDesign;
  deliveryLpd: number;
}

const RUN_SOURCE: Record<string, SourceId> = {
  level: 'levelling-hi',
  hose: 'hose-level',
  clinometer: 'clinometer-sine',
  gps: 'gps-sps-2008',
  barometric: 'standard-atmosphere',
};
const FLOW_SOURCE: Record<string, SourceId> = {
  volumetric: 'bucket-method',
  'v-notch': 'usbr-wmm-ch7',
  'rectangular-weir': 'francis-weir',
  float: 'float-method',
};

function round(x: number, digits = 4): number {
  return Number.isFinite(x) ? Number(x.toPrecision(digits + 2)) : x;
}

function fig(value: number | null, unit: string, rule: string, sourceId: SourceId, inputs: FigureInputs = {}): Figure {
  return { value: value === null ? null : round(value), unit, rule, sourceId, inputs };
}

function runInputs(est: CombinedEstimate): FigureInputs {
  const inputs: FigureInputs = {};
  for (const e of est.runs) {
    inputs[`run${e.index + 1}Method`] = e.method;
    inputs[`run${e.index + 1}DropM`] = round(e.dropM);
    inputs[`run${e.index + 1}SigmaM`] = round(e.sigmaM);
    if (e.misclosureMm !== null) inputs[`run${e.index + 1}MisclosureMm`] = round(e.misclosureMm);
  }
  return inputs;
}

function bestSource(est: CombinedEstimate): SourceId {
  const best = est.runs.reduce<CombinedEstimate['runs'][number] | null>((a, b) => (a === null || b.sigmaM < a.sigmaM ? b : a), null);
  return best ? (RUN_SOURCE[best.method] ?? 'common-practice') : 'reading-uncertainty';
}

function demandInputsOf(c: SurveyContext): FigureInputs {
  const demandInputs: FigureInputs = {};
  c.demandLines.forEach((l, i) => {
    demandInputs[`line${i + 1}`] = `${l.kind} × ${l.count} × ${l.litresPerHeadPerDay} L (${l.figureFrom}: ${l.sourceId})`;
  });
  return demandInputs;
}

/** Figures every outcome has: the survey, the water, the demand and the tank. */
function surveyFigures(c: SurveyContext, deliveryLpd: number): Partial<Record<FigureKey, Figure>> {
  const { r, fall, lift } = c;
  const s = r.settings;
  const flowInputs: FigureInputs = {};
  for (const f of c.flows) {
    flowInputs[`measurement${f.index + 1}MeanLpm`] = round(f.meanLps * 60);
    flowInputs[`measurement${f.index + 1}Method`] = f.method;
    flowInputs[`measurement${f.index + 1}Season`] = f.season;
    flowInputs[`measurement${f.index + 1}Trials`] = f.trialsLps.length;
  }
  const biggest = c.demandLines.reduce<DemandLineResult | null>((a, b) => (a === null || b.dailyL > a.dailyL ? b : a), null);
  const liftRule = r.lift.kind === 'direct' ? `entered directly (${r.lift.method})` : `runs booked from the ${r.lift.bookedFrom}, inverse-variance weighted`;
  return {
    fallM: fig(
      fall.valueM,
      'm',
      `Drop from intake to ram: inverse-variance weighted mean of ${fall.runs.length} run(s) (${fall.methods})`,
      bestSource(fall),
      runInputs(fall),
    ),
    fallUncertaintyM: fig(
      fall.sigmaM,
      'm (1σ)',
      'Per-method reading uncertainty combined over runs, widened by the Birge ratio when runs disagree',
      fall.runs.length > 1 ? 'birge-1932' : 'reading-uncertainty',
      runInputs(fall),
    ),
    supplyMeanLpm: fig(c.supplyMeanLpm, 'L/min', 'Mean of the measurements\u2019 mean flows', FLOW_SOURCE[c.lowest.method] ?? 'bucket-method', flowInputs),
    supplyLowestLpm: fig(c.lowestLpm, 'L/min', 'Lowest measurement mean', FLOW_SOURCE[c.lowest.method] ?? 'bucket-method', {
      measurement: c.lowest.index + 1,
      season: c.lowest.season,
      relativeSigma: round(c.lowest.relativeSigma),
    }),
    supplySpreadLpm: fig(c.supplySpreadLpm, 'L/min', 'Highest minus lowest single trial', 'common-practice', flowInputs),
    designFlowLpm: fig(c.fraction * c.lowestLpm, 'L/min', 'Most the stream may give: the stated share of the lowest flow', 'design-flow-fraction', {
      lowestLpm: round(c.lowestLpm),
      fraction: round(c.fraction),
    }),
    staticLiftM: fig(
      lift.valueM,
      'm',
      `Pump to tank water level: ${liftRule}`,
      r.lift.kind === 'direct' ? 'common-practice' : bestSource(lift),
      r.lift.kind === 'direct' ? { staticLiftM: r.lift.staticLiftM, method: r.lift.method } : runInputs(lift),
    ),
    staticLiftUncertaintyM: fig(
      lift.sigmaM,
      'm (1σ)',
      r.lift.kind === 'direct' && r.lift.uncertaintyM !== undefined ? 'As entered' : 'Per-method reading uncertainty',
      'reading-uncertainty',
      {},
    ),
    demandLpd: fig(c.demandLpd, 'L/day', 'Σ count × daily figure per head', biggest?.sourceId ?? 'common-practice', demandInputsOf(c)),
    demandMarginLpd: fig(
      deliveryLpd - c.demandLpd,
      'L/day',
      `Delivery − demand (a margin of ${Math.round(s.demandMarginFraction * 100)} % of demand is asked)`,
      'common-practice',
      { deliveryLpd: round(deliveryLpd), demandLpd: round(c.demandLpd), marginFraction: s.demandMarginFraction },
    ),
    tankL: fig(c.tank.sizeL, 'L', `${c.tank.rule.label}, rounded up to a common size`, c.tank.rule.sourceId, {
      demandLpd: round(c.demandLpd),
      requiredL: round(c.tank.requiredL),
    }),
  };
}

/** Builds the traced figures of a ram screening; per-ram figures are per ram, daily delivery is all rams together. */
export function buildFigures(c: FigureContext): Partial<Record<FigureKey, Figure>> {
  const { r, fall, lift, mc } = c;
  const { op, drive, delivery, row, count } = c.option;
  const s = r.settings;
  const deliveryLpd = c.option.deliveryLpd;
  const driveIn = { fallM: round(fall.valueM), totalLiftM: round(op.totalLiftM), driveLpm: round(drive.driveLpm), boreMm: round(drive.boreMm) };
  const sizing = c.forced ? 'As chosen by the advisor' : 'Smallest size, then fewest rams, whose delivery meets demand plus margin within the design flow';
  return {
    ...surveyFigures(c, deliveryLpd),
    ...(c.feed
      ? {
          feedPipeLengthM: fig(c.feed.lengthM, 'm', 'Intake to the stand pipe where the drive pipe starts', 'common-practice', {
            boreMm: round(c.feed.boreMm),
          }),
          feedPipeBoreMm: fig(c.feed.boreMm, 'mm', `One size up from the drive pipe: ${c.feed.size.label}, ${c.feed.materialLabel}`, 'common-practice', {
            nominalIn: c.feed.size.nominalIn,
          }),
          feedFrictionM: fig(c.feed.frictionM, 'm', 'Hazen–Williams at the rams\u2019 summed drive flow, taken off the fall', 'hazen-williams-epanet', {
            lengthM: round(c.feed.lengthM),
            boreMm: round(c.feed.boreMm),
            driveLpm: round(count * drive.driveLpm),
          }),
          drivingFallM: fig(c.drivingFallM, 'm', 'Fall less the feed pipe\u2019s friction: what drives the ram', 'common-practice', {
            fallM: round(fall.valueM),
            feedFrictionM: round(c.feed.frictionM),
          }),
        }
      : {}),
    ramSizeIn: fig(row.driveIn, 'in', `${sizing} (drive pipe size of the ram)`, 'ogden-1911', {
      ramMinLpm: round(row.minLpm),
      ramMaxLpm: round(row.maxLpm),
      ramMinFallM: round(row.minFallM),
      needLpd: round(c.demandLpd * (1 + s.demandMarginFraction)),
    }),
    ramCount: fig(
      count,
      'rams',
      count > 1 ? 'Rams in parallel, each on its own drive pipe, sharing the delivery pipe' : sizing,
      count > 1 ? 'parallel-rams' : 'ogden-1911',
      { ramSizeIn: row.driveIn },
    ),
    driveFlowLpm: fig(
      drive.driveLpm,
      'L/min',
      'Per ram: the design flow shared between the rams, up to the size\u2019s maximum and what the fall can push',
      'ogden-1911',
      {
        designLpm: round(c.fraction * c.lowestLpm),
        ramCount: count,
        ramMinLpm: round(row.minLpm),
        ramMaxLpm: round(row.maxLpm),
        limitedByFall: drive.limitedByFall,
      },
    ),
    attainableDriveVelocityMps: fig(
      drive.attainableVelocityMps,
      'm/s',
      'Steady flow through the open waste valve: √(2gH / (1 + ΣK + fL/D)), ΣK 2.65, f from Colebrook',
      'iversen-1975',
      { fallM: round(fall.valueM), lengthM: round(drive.lengthM), boreMm: round(drive.boreMm), roughnessMm: drive.material.roughnessMm },
    ),
    deliveryFrictionM: fig(
      op.frictionM,
      'm',
      `Hazen–Williams at the rams\u2019 summed delivery over the pipe length plus ${Math.round(s.fittingsAllowanceFraction * 100)} % for fittings`,
      'hazen-williams-epanet',
      {
        lengthM: r.deliveryPipe.lengthM,
        fittingsAllowance: s.fittingsAllowanceFraction,
        boreMm: round(delivery.boreMm),
        c: delivery.material.hazenC,
        deliveryLpm: round(op.deliveryLpm * count),
      },
    ),
    totalLiftM: fig(op.totalLiftM, 'm', 'Static lift + delivery pipe friction', 'common-practice', {
      staticLiftM: round(lift.valueM),
      frictionM: round(op.frictionM),
    }),
    liftRatio: fig(op.liftRatio, 'h/H', 'Total lift / fall', 'lift-ratio-limit', { totalLiftM: round(op.totalLiftM), fallM: round(fall.valueM) }),
    efficiency: fig(
      op.efficiency,
      'fraction',
      op.liftRatio < c.curve.minRatio ? `${c.curve.label}; below ratio ${c.curve.minRatio} the delivered share is held at its first value` : c.curve.label,
      op.liftRatio < c.curve.minRatio ? 'low-lift-ratio' : c.curve.sourceId,
      { liftRatio: round(op.liftRatio), curveMinRatio: c.curve.minRatio, curveMaxRatio: c.curve.maxRatio },
    ),
    deliveryLpm: fig(op.deliveryLpm, 'L/min', 'Per ram: q = η·Q·H/h', 'wftw-rws4d5', {
      efficiency: round(op.efficiency),
      driveLpm: round(drive.driveLpm),
      fallM: round(fall.valueM),
      totalLiftM: round(op.totalLiftM),
    }),
    deliveryLpd: fig(
      deliveryLpd,
      'L/day',
      count > 1 ? `Delivery × 1440 min × ${count} rams (they run all day)` : 'Delivery × 1440 min (the ram runs all day)',
      'wftw-rws4d5',
      { deliveryLpm: round(op.deliveryLpm), ramCount: count },
    ),
    wasteFlowLpm: fig(drive.driveLpm - op.deliveryLpm, 'L/min', 'Per ram: drive flow − delivery (returns to the stream)', 'daubuisson-efficiency', {
      driveLpm: round(drive.driveLpm),
      deliveryLpm: round(op.deliveryLpm),
    }),
    supplyToPumpedRatio: fig(
      deliveryLpd > 0 ? (c.lowestLpm * 1440) / deliveryLpd : null,
      '×',
      'Lowest flow / delivery of all rams (at least 7 advised)',
      'wftw-rws4d5',
      { lowestLpm: round(c.lowestLpm), deliveryLpd: round(deliveryLpd) },
    ),
    driveLengthMinM: fig(drive.bandMinM, 'm', drive.bandRuleLabel, drive.bandSourceId, { fallM: round(fall.valueM) }),
    driveLengthMaxM: fig(drive.bandMaxM, 'm', drive.bandRuleLabel, drive.bandSourceId, { fallM: round(fall.valueM) }),
    driveLengthM: fig(
      drive.lengthM,
      'm',
      drive.lengthGiven
        ? 'As entered'
        : drive.lengthConflict
          ? 'The fall band and L/D 150–1000 do not meet: the nearest L/D edge, to 0.5 m'
          : 'Middle of where the fall band and L/D 150–1000 overlap, to 0.5 m inside it',
      drive.lengthGiven ? 'common-practice' : drive.bandSourceId,
      { bandMinM: round(drive.bandMinM), bandMaxM: round(drive.bandMaxM), ldMinM: round(drive.boreMm * 0.15), ldMaxM: round(drive.boreMm) },
    ),
    driveLengthToDiameter: fig(drive.lengthToDiameter, 'L/D', 'Drive length / bore (150–1000 advised)', 'nitk-ram-notes', {
      lengthM: drive.lengthM,
      boreMm: round(drive.boreMm),
    }),
    driveBoreMm: fig(
      drive.boreMm,
      'mm',
      r.drivePipe.diameterMm ? 'As entered' : `Ram size table for the drive flow: ${drive.size.label}, ${drive.cls.label}`,
      'ogden-1911',
      { driveLpm: round(drive.driveLpm), nominalIn: drive.size.nominalIn },
    ),
    driveVelocityMps: fig(drive.velocityMps, 'm/s', 'Mean drive velocity v = Q/A', 'continuity', {
      driveLpm: round(drive.driveLpm),
      boreMm: round(drive.boreMm),
    }),
    driveClosureVelocityMps: fig(
      drive.closureVelocityMps,
      'm/s',
      `Velocity at waste-valve closure ≈ ${CLOSURE_TO_MEAN_VELOCITY} × mean, never above the open-valve steady velocity`,
      'common-practice',
      { velocityMps: round(drive.velocityMps), attainableMps: round(drive.attainableVelocityMps) },
    ),
    minimumClosureVelocityMps: fig(
      drive.minimumClosureVelocityMps,
      'm/s',
      'Least closure velocity whose surge lifts the fall to the total lift: g·(h − H)/a',
      'thomas-1994',
      { totalLiftM: round(op.totalLiftM), fallM: round(fall.valueM), waveSpeedMps: round(drive.waveSpeedMps) },
    ),
    waveSpeedMps: fig(drive.waveSpeedMps, 'm/s', 'Korteweg, water K = 2.2 GPa, support factor 1', 'korteweg', {
      boreMm: round(drive.boreMm),
      wallMm: round(drive.wallMm),
      modulusGPa: drive.material.modulusGPa,
      material: drive.material.id,
    }),
    surgeHeadM: fig(drive.surgeHeadM, 'm', 'Joukowsky ΔH = a·Δv/g at valve closure', 'joukowsky', {
      waveSpeedMps: round(drive.waveSpeedMps),
      closureVelocityMps: round(drive.closureVelocityMps),
    }),
    workingPeakHeadM: fig(
      drive.workingPeakHeadM,
      'm',
      'In normal running: total lift + 20 % (the delivery valve opens at about the lift)',
      'ram-pressure-cases',
      { totalLiftM: round(op.totalLiftM) },
    ),
    blockedDeliveryHeadM: fig(drive.blockedDeliveryHeadM, 'm', 'With the delivery blocked: fall + Joukowsky surge', 'ram-pressure-cases', {
      ...driveIn,
      surgeHeadM: round(drive.surgeHeadM),
    }),
    drivePipeRatingM: fig(drive.ratingM, 'm', `Pressure rating of ${drive.material.label} ${drive.cls.label}`, drive.cls.sourceId, {
      ratingKPa: round(drive.cls.ratingKPa),
    }),
    drivePipeAllowedHeadM: fig(
      drive.allowedHeadM,
      'm',
      drive.cyclicDerated ? 'Half the rating: plastic under a ram\u2019s pressure cycles' : 'The rating (steel)',
      drive.cyclicDerated ? 'plastic-cyclic-derating' : drive.cls.sourceId,
      { ratingM: round(drive.ratingM) },
    ),
    deliveryBoreMm: fig(
      delivery.boreMm,
      'mm',
      delivery.diameterGiven ? 'As entered' : `Ram table delivery size, enlarged until friction ≤ 10 % of static lift: ${delivery.size.label}`,
      delivery.diameterGiven ? 'common-practice' : 'delivery-friction-limit',
      { lengthM: r.deliveryPipe.lengthM, nominalIn: delivery.size.nominalIn },
    ),
    deliveryPipeRatingM: fig(delivery.ratingM, 'm', `Pressure rating of ${delivery.material.label} ${delivery.cls.label}`, delivery.cls.sourceId, {
      ratingKPa: round(delivery.cls.ratingKPa),
    }),
    probabilityMeetsDemand: fig(
      mc.probabilityMeetsDemand,
      'probability',
      'Share of Monte Carlo draws (fall, lift, flow and ram efficiency) whose daily delivery ≥ demand',
      'monte-carlo',
      { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed, demandLpd: round(c.demandLpd) },
    ),
    deliveryP10Lpd: fig(mc.p10Lpd, 'L/day', '10th percentile of delivery over the draws', 'monte-carlo', {
      samples: r.monteCarlo.samples,
      seed: r.monteCarlo.seed,
    }),
    deliveryP50Lpd: fig(mc.p50Lpd, 'L/day', 'Median delivery over the draws', 'monte-carlo', { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed }),
    deliveryP90Lpd: fig(mc.p90Lpd, 'L/day', '90th percentile of delivery over the draws', 'monte-carlo', {
      samples: r.monteCarlo.samples,
      seed: r.monteCarlo.seed,
    }),
  };
}

/** Figures of a screening where no ram could be sized: the survey, the water and the demand. */
export function buildSurveyFigures(c: SurveyContext): Partial<Record<FigureKey, Figure>> {
  return surveyFigures(c, 0);
}

/** Figures of a gravity supply. */
export function buildGravityFigures(c: GravityFigureContext): Partial<Record<FigureKey, Figure>> {
  const g = c.gravity;
  return {
    ...surveyFigures(c, c.deliveryLpd),
    gravityHeadM: fig(g.headM, 'm', 'Intake level above the tank water level: fall − static lift', 'gravity-flow', {
      fallM: round(c.fall.valueM),
      staticLiftM: round(c.lift.valueM),
    }),
    gravityPipeLengthM: fig(g.lengthM, 'm', 'Drive route plus delivery route, as walked', 'common-practice', {
      deliveryLengthM: c.r.deliveryPipe.lengthM,
      driveLengthM: c.r.drivePipe.lengthM ?? null,
    }),
    gravityPipeBoreMm: fig(
      g.boreMm,
      'mm',
      g.size
        ? `Smallest size whose friction at the need stays within 90 % of the head: ${g.size.label}, ${g.cls.label}`
        : 'No size carries the need within the head',
      'hazen-williams-epanet',
      {
        headM: round(g.headM),
        lengthM: round(g.lengthM),
        needLpd: round(c.demandLpd * (1 + c.r.settings.demandMarginFraction)),
        nominalIn: g.size?.nominalIn ?? null,
      },
    ),
    gravityCapacityLpd: fig(g.capacityLpd, 'L/day', 'What the pipe carries with the whole difference in level', 'hazen-williams-epanet', {
      headM: round(g.headM),
      boreMm: g.boreMm === null ? null : round(g.boreMm),
    }),
    deliveryLpd: fig(c.deliveryLpd, 'L/day', 'What the pipe carries, up to the water the stream can spare', 'gravity-flow', {
      capacityLpd: g.capacityLpd === null ? null : round(g.capacityLpd),
      availableLpd: round(c.fraction * c.lowestLpm * 1440),
    }),
  };
}
