// screenSite: from the raw readings of one visit to a traced go / conditional / no-go screening.
import { siteReadingsSchema, type SiteReadings, type SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
import { billOfMaterials } from './bill-of-materials';
import { cautionsFor } from './cautions';
import { demandBreakdown } from './demand';
import { RAM_SIZE_TABLE, ramSizeForFlow, type RamSizeRow } from './drive-pipe';
import { EngineInputError } from './errors';
import { runMonteCarlo } from './monte-carlo';
import { operatingPoint, type OperatingContext } from './operating-point';
import { designDeliveryPipe, designDrivePipe } from './pipe-design';
import { EFFICIENCY_CURVES, ramEfficiency } from './ram';
import { combineRuns, estimateFlow, estimateLift } from './readings';
import { buildFigures } from './screen-figures';
import type { Screening } from './screening-types';
import { sourcesFor, type SourceId } from './sources';
import { tankSizeL } from './tank';
import { judge } from './verdict';
import { ENGINE_VERSION } from './version';

/** Validates readings with the shared zod schema; the first problem becomes an EngineInputError naming its field. */
export function parseReadingsOrThrow(input: SiteReadingsInput): SiteReadings {
  const parsed = siteReadingsSchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new EngineInputError(issue?.path.map(String).join('.') || 'input', issue?.message ?? 'is not valid');
  }
  return parsed.data;
}

/** Screens one site from its raw readings: figures with their rules and sources, verdict, cautions and materials. */
export function screenSite(input: SiteReadingsInput): Screening {
  const r = parseReadingsOrThrow(input);
  const s = r.settings;
  const curve = EFFICIENCY_CURVES[s.efficiencyCurve];

  // 1. Fall, lift and flow from the readings.
  const fall = combineRuns(r.fallRuns);
  const lift = estimateLift(r.lift);
  const flows = r.flowMeasurements.map(estimateFlow);
  const lowest = flows.reduce((a, b) => (b.meanLps < a.meanLps ? b : a));
  const allTrials = flows.flatMap((f) => f.trialsLps);
  const supplyMeanLpm = (flows.reduce((sum, f) => sum + f.meanLps, 0) / flows.length) * 60;
  const supplySpreadLpm = (Math.max(...allTrials) - Math.min(...allTrials)) * 60;
  const lowestLpm = lowest.meanLps * 60;
  const designLpm = s.designFractionOfLowest * lowestLpm;
  const ram = ramSizeForFlow(designLpm);
  const row: RamSizeRow = ram.row ?? (RAM_SIZE_TABLE[0] as RamSizeRow);
  const driveLpm = ram.usedLpm;

  // 2. Delivery pipe and operating point (friction solved with the delivery).
  const at = (k: number, lpm = driveLpm) => operatingPoint({ curve, deliveryFrictionK: k }, fall.valueM, lift.valueM, lpm);
  const deliveryInput = { pipe: r.deliveryPipe, fittingsAllowance: s.fittingsAllowanceFraction, ram: row, staticLiftM: lift.valueM, deliveryFor: (k: number) => { const p = at(k); return { deliveryLpm: p.deliveryLpm, frictionM: p.frictionM }; } };
  const delivery = designDeliveryPipe(deliveryInput);
  const ctx: OperatingContext = { curve, deliveryFrictionK: delivery.frictionK };
  const op = at(delivery.frictionK);
  const effStatus = op.liftRatio > 0 ? ramEfficiency(op.liftRatio, s.efficiencyCurve).status : 'in-range';
  const deliveryLpd = op.deliveryLpm * 1440;

  // 3. Demand and tank.
  const demandLines = demandBreakdown(r.demand, s.demandOverrides);
  const demandLpd = demandLines.reduce((sum, l) => sum + l.dailyL, 0);
  const tank = tankSizeL(demandLpd, s.tankRule, demandLpd * s.peakHourFraction);

  // 4. Drive pipe: band, L/D, size, velocity, surge against rating.
  const drive = designDrivePipe({
    fallM: Math.max(fall.valueM, 1e-3),
    totalLiftM: Math.max(op.totalLiftM, 1e-3),
    driveLpm,
    ram: row,
    pipe: r.drivePipe,
    ruleId: s.driveLengthRule,
  });

  // What would change a shortfall: the recommended delivery pipe, or the largest allowed share of the flow.
  const recommended = delivery.diameterGiven ? designDeliveryPipe({ ...deliveryInput, pipe: { ...r.deliveryPipe, diameterMm: undefined } }) : null;
  const withRecommended = recommended && recommended.boreMm > delivery.boreMm ? at(recommended.frictionK).deliveryLpm * 1440 : null;
  const maxRam = s.maxDesignFractionOfLowest > s.designFractionOfLowest ? ramSizeForFlow(s.maxDesignFractionOfLowest * lowestLpm) : null;
  const atMaxFraction = maxRam && maxRam.row ? at(delivery.frictionK, maxRam.usedLpm).deliveryLpm * 1440 : null;

  // 5. Uncertainty by Monte Carlo.
  const mc = runMonteCarlo({
    ctx, fallM: fall.valueM, fallSigmaM: fall.sigmaM, staticLiftM: lift.valueM, staticLiftSigmaM: lift.sigmaM,
    lowestFlowLpm: lowestLpm, lowestFlowRelativeSigma: lowest.relativeSigma, designFraction: s.designFractionOfLowest,
    ramMaxLpm: row.maxLpm, ramMinLpm: row.minLpm, demandLpd, samples: r.monteCarlo.samples, seed: r.monteCarlo.seed,
  });

  // 6. Verdict.
  const judgement = judge({
    fallM: fall.valueM, fallSigmaM: fall.sigmaM, fallRunsDisagree: fall.disagreeing,
    misclosures: fall.runs.flatMap((e) => {
      // Third-order allowance, but never tighter than 1 % of the fall: a screening, not a control survey.
      const allowedMm = Math.max(e.allowedMisclosureMm ?? 0, 10 * Math.abs(e.dropM));
      return e.misclosureMm !== null && Math.abs(e.misclosureMm) > allowedMm ? [{ index: e.index, misclosureMm: e.misclosureMm, allowedMm }] : [];
    }),
    bookingFailed: fall.runs.filter((e) => e.arithmeticCheckOk === false).map((e) => e.index),
    anyDrySeason: flows.some((f) => f.season === 'dry'),
    lowHeadMeasurements: flows.filter((f) => f.lowHead).map((f) => f.index),
    lowestLpm, designLpm, designFraction: s.designFractionOfLowest, ramStatus: ram.status, ramMinLpm: row.minLpm, driveLpm,
    staticLiftM: lift.valueM, totalLiftM: op.totalLiftM, liftRatio: op.liftRatio, efficiencyStatus: effStatus,
    curveLabel: curve.label, curveRange: [curve.minRatio, curve.maxRatio],
    deliveryLpm: op.deliveryLpm, demandLpd, marginFraction: s.demandMarginFraction,
    deliveryWithRecommendedPipeLpd: withRecommended, recommendedDeliveryLabel: recommended?.size.label ?? null,
    deliveryAtMaxFractionLpd: atMaxFraction, maxFraction: s.maxDesignFractionOfLowest,
    probabilityMeets: mc.probabilityMeetsDemand,
    drive: {
      lengthM: drive.lengthM, lengthGiven: drive.lengthGiven, bandMinM: drive.bandMinM, bandMaxM: drive.bandMaxM, bandRule: drive.bandRuleLabel,
      lengthToDiameter: drive.lengthToDiameter, closureVelocityMps: drive.closureVelocityMps, minimumClosureVelocityMps: drive.minimumClosureVelocityMps,
      peakPressureHeadM: drive.peakPressureHeadM, surgeHeadM: drive.surgeHeadM, ratingM: drive.ratingM, classLabel: drive.cls.label,
      higherClassLabel: drive.higherClass?.label ?? null, materialLabel: drive.material.label, smallerThanRam: drive.smallerThanRam,
    },
    delivery: { frictionM: op.frictionM, ratingM: delivery.ratingM, classGiven: delivery.classGiven, classLabel: delivery.cls.label, diameterGiven: delivery.diameterGiven },
  });

  const figures = buildFigures({ r, fall, lift, flows, lowest, supplyMeanLpm, supplySpreadLpm, lowestLpm, designLpm, driveLpm, row, op, curve, deliveryLpd, demandLines, demandLpd, tank, drive, delivery, mc });
  const bom = judgement.verdict === 'no-go' ? [] : billOfMaterials({
    drive, delivery, deliveryLengthM: r.deliveryPipe.lengthM, ramDriveIn: row.driveIn, ramMinLpm: row.minLpm, ramMaxLpm: row.maxLpm,
    tankL: tank.sizeL, tankRuleLabel: tank.rule.label, standPipe: drive.lengthGiven && drive.lengthM > drive.bandMaxM,
  });
  const sourceIds: SourceId[] = [...Object.values(figures).map((f) => f.sourceId), ...demandLines.map((l) => l.sourceId), 'min-fall-wftw', 'lift-ratio-limit', 'wftw-rws4d5', 'clemson-smith'];

  return {
    engineVersion: ENGINE_VERSION,
    verdict: judgement.verdict,
    reasons: judgement.reasons,
    conditions: judgement.conditions,
    cautions: cautionsFor({ peakPressureHeadM: driveLpm > 0 ? drive.peakPressureHeadM : null, anyPeople: demandLines.some((l) => l.kind.startsWith('person') && l.count > 0), deliveryLpd }),
    figures,
    billOfMaterials: bom,
    settings: {
      designFractionOfLowest: s.designFractionOfLowest, maxDesignFractionOfLowest: s.maxDesignFractionOfLowest, efficiencyCurve: s.efficiencyCurve,
      demandMarginFraction: s.demandMarginFraction, tankRule: s.tankRule, driveLengthRule: s.driveLengthRule,
      fittingsAllowanceFraction: s.fittingsAllowanceFraction, peakHourFraction: s.peakHourFraction,
    },
    monteCarlo: { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed, generator: 'mulberry32 + Box–Muller' },
    sources: sourcesFor(sourceIds),
  };
}
