// Every number of a screening as a traced figure: value, unit, rule, source id and the inputs behind it.
import type { SiteReadings } from '@/lib/shared/schemas/site-readings';
import type { DemandLineResult } from './demand';
import type { RamSizeRow } from './drive-pipe';
import type { MonteCarloResult } from './monte-carlo';
import type { OperatingPoint } from './operating-point';
import type { DeliveryDesign, DriveDesign } from './pipe-design';
import { CLOSURE_TO_MEAN_VELOCITY } from './pipe-design';
import type { EfficiencyCurve } from './ram';
import type { CombinedEstimate, FlowEstimate } from './readings';
import type { Figure, FigureInputs, FigureKey } from './screening-types';
import type { SourceId } from './sources';
import type { TankRule } from './tank';

export interface FigureContext {
  r: SiteReadings;
  fall: CombinedEstimate;
  lift: CombinedEstimate;
  flows: FlowEstimate[];
  lowest: FlowEstimate;
  supplyMeanLpm: number;
  supplySpreadLpm: number;
  lowestLpm: number;
  designLpm: number;
  driveLpm: number;
  row: RamSizeRow;
  op: OperatingPoint;
  curve: EfficiencyCurve;
  deliveryLpd: number;
  demandLines: DemandLineResult[];
  demandLpd: number;
  tank: { requiredL: number; sizeL: number; rule: TankRule };
  drive: DriveDesign;
  delivery: DeliveryDesign;
  mc: MonteCarloResult;
}

const RUN_SOURCE: Record<string, SourceId> = {
  level: 'levelling-hi', hose: 'hose-level', clinometer: 'clinometer-sine', gps: 'gps-sps-2008', barometric: 'standard-atmosphere',
};
const FLOW_SOURCE: Record<string, SourceId> = {
  volumetric: 'bucket-method', 'v-notch': 'usbr-wmm-ch7', 'rectangular-weir': 'francis-weir', float: 'float-method',
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

/** Builds the traced figures of a screening. */
export function buildFigures(c: FigureContext): Record<FigureKey, Figure> {
  const { r, fall, lift, op, drive, delivery, mc } = c;
  const s = r.settings;
  const flowInputs: FigureInputs = {};
  for (const f of c.flows) {
    flowInputs[`measurement${f.index + 1}MeanLpm`] = round(f.meanLps * 60);
    flowInputs[`measurement${f.index + 1}Method`] = f.method;
    flowInputs[`measurement${f.index + 1}Season`] = f.season;
    flowInputs[`measurement${f.index + 1}Trials`] = f.trialsLps.length;
  }
  const demandInputs: FigureInputs = {};
  c.demandLines.forEach((l, i) => {
    demandInputs[`line${i + 1}`] = `${l.kind} × ${l.count} × ${l.litresPerHeadPerDay} L (${l.figureFrom}: ${l.sourceId})`;
  });
  const biggest = c.demandLines.reduce<DemandLineResult | null>((a, b) => (a === null || b.dailyL > a.dailyL ? b : a), null);
  const liftRule = r.lift.kind === 'direct' ? `entered directly (${r.lift.method})` : `runs booked from the ${r.lift.bookedFrom}, inverse-variance weighted`;
  const driveIn = { fallM: round(fall.valueM), totalLiftM: round(op.totalLiftM), driveLpm: round(c.driveLpm), boreMm: round(drive.boreMm) };

  return {
    fallM: fig(fall.valueM, 'm', `Drop from intake to ram: inverse-variance weighted mean of ${fall.runs.length} run(s) (${fall.methods})`, bestSource(fall), runInputs(fall)),
    fallUncertaintyM: fig(fall.sigmaM, 'm (1σ)', 'Per-method reading uncertainty combined over runs', 'reading-uncertainty', runInputs(fall)),
    supplyMeanLpm: fig(c.supplyMeanLpm, 'L/min', 'Mean of the measurements\u2019 mean flows', FLOW_SOURCE[c.lowest.method] ?? 'bucket-method', flowInputs),
    supplyLowestLpm: fig(c.lowestLpm, 'L/min', 'Lowest measurement mean', FLOW_SOURCE[c.lowest.method] ?? 'bucket-method', { measurement: c.lowest.index + 1, season: c.lowest.season, relativeSigma: round(c.lowest.relativeSigma) }),
    supplySpreadLpm: fig(c.supplySpreadLpm, 'L/min', 'Highest minus lowest single trial', 'common-practice', flowInputs),
    designFlowLpm: fig(c.designLpm, 'L/min', 'Stated fraction of the lowest flow', 'design-flow-fraction', { lowestLpm: round(c.lowestLpm), fraction: s.designFractionOfLowest }),
    driveFlowLpm: fig(c.driveLpm, 'L/min', 'Design flow, up to the chosen ram size\u2019s maximum', 'ogden-1911', { designLpm: round(c.designLpm), ramMinLpm: round(c.row.minLpm), ramMaxLpm: round(c.row.maxLpm) }),
    staticLiftM: fig(lift.valueM, 'm', `Pump to tank water level: ${liftRule}`, r.lift.kind === 'direct' ? 'common-practice' : bestSource(lift), r.lift.kind === 'direct' ? { staticLiftM: r.lift.staticLiftM, method: r.lift.method } : runInputs(lift)),
    staticLiftUncertaintyM: fig(lift.sigmaM, 'm (1σ)', r.lift.kind === 'direct' && r.lift.uncertaintyM !== undefined ? 'As entered' : 'Per-method reading uncertainty', 'reading-uncertainty', {}),
    deliveryFrictionM: fig(op.frictionM, 'm', `Hazen–Williams at the delivery flow over the pipe length plus ${Math.round(s.fittingsAllowanceFraction * 100)} % for fittings`, 'hazen-williams-epanet', { lengthM: r.deliveryPipe.lengthM, fittingsAllowance: s.fittingsAllowanceFraction, boreMm: round(delivery.boreMm), c: delivery.material.hazenC, deliveryLpm: round(op.deliveryLpm) }),
    totalLiftM: fig(op.totalLiftM, 'm', 'Static lift + delivery pipe friction', 'common-practice', { staticLiftM: round(lift.valueM), frictionM: round(op.frictionM) }),
    liftRatio: fig(op.liftRatio, 'h/H', 'Total lift / fall', 'lift-ratio-limit', { totalLiftM: round(op.totalLiftM), fallM: round(fall.valueM) }),
    efficiency: fig(op.efficiency, 'fraction', c.curve.label, c.curve.sourceId, { liftRatio: round(op.liftRatio), curveMinRatio: c.curve.minRatio, curveMaxRatio: c.curve.maxRatio }),
    deliveryLpm: fig(op.deliveryLpm, 'L/min', 'q = η·Q·H/h', 'wftw-rws4d5', { efficiency: round(op.efficiency), driveLpm: round(c.driveLpm), fallM: round(fall.valueM), totalLiftM: round(op.totalLiftM) }),
    deliveryLpd: fig(c.deliveryLpd, 'L/day', 'Delivery × 1440 min (ram runs all day)', 'wftw-rws4d5', { deliveryLpm: round(op.deliveryLpm) }),
    wasteFlowLpm: fig(c.driveLpm - op.deliveryLpm, 'L/min', 'Drive flow − delivery (returns to the stream)', 'daubuisson-efficiency', { driveLpm: round(c.driveLpm), deliveryLpm: round(op.deliveryLpm) }),
    supplyToPumpedRatio: fig(op.deliveryLpm > 0 ? c.lowestLpm / op.deliveryLpm : null, '×', 'Lowest flow / delivery (at least 7 advised)', 'wftw-rws4d5', { lowestLpm: round(c.lowestLpm), deliveryLpm: round(op.deliveryLpm) }),
    demandLpd: fig(c.demandLpd, 'L/day', 'Σ count × daily figure per head', biggest?.sourceId ?? 'common-practice', demandInputs),
    demandMarginLpd: fig(c.deliveryLpd - c.demandLpd, 'L/day', `Delivery − demand (a margin of ${Math.round(s.demandMarginFraction * 100)} % of demand is asked)`, 'common-practice', { deliveryLpd: round(c.deliveryLpd), demandLpd: round(c.demandLpd), marginFraction: s.demandMarginFraction }),
    tankL: fig(c.tank.sizeL, 'L', `${c.tank.rule.label}, rounded up to a common size`, c.tank.rule.sourceId, { demandLpd: round(c.demandLpd), requiredL: round(c.tank.requiredL) }),
    driveLengthMinM: fig(drive.bandMinM, 'm', drive.bandRuleLabel, drive.bandSourceId, { fallM: round(fall.valueM) }),
    driveLengthMaxM: fig(drive.bandMaxM, 'm', drive.bandRuleLabel, drive.bandSourceId, { fallM: round(fall.valueM) }),
    driveLengthM: fig(drive.lengthM, 'm', drive.lengthGiven ? 'As entered' : 'Middle of the length band, within L/D 150–1000, to the next 0.5 m', drive.lengthGiven ? 'common-practice' : drive.bandSourceId, { bandMinM: round(drive.bandMinM), bandMaxM: round(drive.bandMaxM) }),
    driveLengthToDiameter: fig(drive.lengthToDiameter, 'L/D', 'Drive length / bore (150–1000 advised)', 'nitk-ram-notes', { lengthM: drive.lengthM, boreMm: round(drive.boreMm) }),
    driveBoreMm: fig(drive.boreMm, 'mm', r.drivePipe.diameterMm ? 'As entered' : `Ram size table for the drive flow: ${drive.size.label}, ${drive.cls.label}`, 'ogden-1911', { driveLpm: round(c.driveLpm), nominalIn: drive.size.nominalIn }),
    driveVelocityMps: fig(drive.velocityMps, 'm/s', 'Mean drive velocity v = Q/A', 'continuity', { driveLpm: round(c.driveLpm), boreMm: round(drive.boreMm) }),
    driveClosureVelocityMps: fig(drive.closureVelocityMps, 'm/s', `Velocity at waste-valve closure ≈ ${CLOSURE_TO_MEAN_VELOCITY} × mean`, 'common-practice', { velocityMps: round(drive.velocityMps) }),
    minimumClosureVelocityMps: fig(drive.minimumClosureVelocityMps, 'm/s', 'Least closure velocity whose surge reaches the lift: g·h/a', 'thomas-1994', { totalLiftM: round(op.totalLiftM), waveSpeedMps: round(drive.waveSpeedMps) }),
    waveSpeedMps: fig(drive.waveSpeedMps, 'm/s', 'Korteweg, water K = 2.2 GPa, support factor 1', 'korteweg', { boreMm: round(drive.boreMm), wallMm: round(drive.wallMm), modulusGPa: drive.material.modulusGPa, material: drive.material.id }),
    surgeHeadM: fig(drive.surgeHeadM, 'm', 'Joukowsky ΔH = a·Δv/g at valve closure', 'joukowsky', { waveSpeedMps: round(drive.waveSpeedMps), closureVelocityMps: round(drive.closureVelocityMps) }),
    peakPressureHeadM: fig(drive.peakPressureHeadM, 'm', 'Total lift + surge (rate the ram and drive pipe for it)', 'joukowsky', { ...driveIn, surgeHeadM: round(drive.surgeHeadM) }),
    drivePipeRatingM: fig(drive.ratingM, 'm', `Pressure rating of ${drive.material.label} ${drive.cls.label}`, drive.cls.sourceId, { ratingKPa: round(drive.cls.ratingKPa) }),
    deliveryBoreMm: fig(delivery.boreMm, 'mm', delivery.diameterGiven ? 'As entered' : `Ram table delivery size, enlarged until friction ≤ 10 % of static lift: ${delivery.size.label}`, delivery.diameterGiven ? 'common-practice' : 'delivery-friction-limit', { lengthM: r.deliveryPipe.lengthM, nominalIn: delivery.size.nominalIn }),
    deliveryPipeRatingM: fig(delivery.ratingM, 'm', `Pressure rating of ${delivery.material.label} ${delivery.cls.label}`, delivery.cls.sourceId, { ratingKPa: round(delivery.cls.ratingKPa) }),
    probabilityMeetsDemand: fig(mc.probabilityMeetsDemand, 'probability', 'Share of Monte Carlo draws whose daily delivery ≥ demand', 'monte-carlo', { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed, demandLpd: round(c.demandLpd) }),
    deliveryP10Lpd: fig(mc.p10Lpd, 'L/day', '10th percentile of delivery over the draws', 'monte-carlo', { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed }),
    deliveryP50Lpd: fig(mc.p50Lpd, 'L/day', 'Median delivery over the draws', 'monte-carlo', { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed }),
    deliveryP90Lpd: fig(mc.p90Lpd, 'L/day', '90th percentile of delivery over the draws', 'monte-carlo', { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed }),
  };
}
