// screenSite: from the raw readings of one visit to a traced go / conditional / no-go / gravity screening.
import { siteReadingsSchema, type SiteReadings, type SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
import { billOfMaterials, gravityBillOfMaterials } from './bill-of-materials';
import { cautionsFor } from './cautions';
import { demandBreakdown } from './demand';
import { DRIVE_LD_BAND, driveLengthBandM, LEAST_RAM_FALL_M, RAM_SIZE_TABLE } from './drive-pipe';
import { EngineInputError } from './errors';
import { designGravityPipe } from './gravity';
import { runMonteCarlo } from './monte-carlo';
import { planWithFeed, type FeedDesign, type RamPlan, type RamPlanInput } from './ram-plan';
import { EFFICIENCY_CURVES } from './ram';
import { combineRuns, estimateFlow, estimateLift, type CombinedEstimate, type FlowEstimate } from './readings';
import { buildFigures, buildGravityFigures, buildSurveyFigures, type SurveyContext } from './screen-figures';
import type { Screening } from './screening-types';
import { sourcesFor, type SourceId } from './sources';
import { tankSizeL } from './tank';
import { judge, judgeGravity, type RamVerdictFacts, type SurveyFacts } from './verdict';
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

interface Survey {
  r: SiteReadings;
  fall: CombinedEstimate;
  lift: CombinedEstimate;
  flows: FlowEstimate[];
  lowest: FlowEstimate;
  lowestLpm: number;
  ctx: Omit<SurveyContext, 'fraction'>;
  facts: SurveyFacts;
}

/** Fall, lift, flows, demand and tank from the readings: what every outcome is judged on. */
function survey(r: SiteReadings): Survey {
  const s = r.settings;
  const fall = combineRuns(r.fallRuns);
  const lift = estimateLift(r.lift);
  const flows = r.flowMeasurements.map(estimateFlow);
  const lowest = flows.reduce((a, b) => (b.meanLps < a.meanLps ? b : a));
  const allTrials = flows.flatMap((f) => f.trialsLps);
  let hi = -Infinity;
  let lo = Infinity;
  for (const t of allTrials) {
    if (t > hi) hi = t;
    if (t < lo) lo = t;
  }
  const lowestLpm = lowest.meanLps * 60;
  const demandLines = demandBreakdown(r.demand, s.demandOverrides);
  const demandLpd = demandLines.reduce((sum, l) => sum + l.dailyL, 0);
  const tank = tankSizeL(demandLpd, s.tankRule, demandLpd * s.peakHourFraction);
  const ctx = {
    r,
    fall,
    lift,
    flows,
    lowest,
    lowestLpm,
    demandLines,
    demandLpd,
    tank,
    supplyMeanLpm: (flows.reduce((sum, f) => sum + f.meanLps, 0) / flows.length) * 60,
    supplySpreadLpm: (hi - lo) * 60,
  };
  const facts = {
    fallM: fall.valueM,
    fallSigmaM: fall.sigmaM,
    fallRunsDisagree: fall.disagreeing,
    misclosures: fall.runs.flatMap((e) => {
      // Third-order allowance, but never tighter than 1 % of the fall: a screening, not a control survey.
      const allowedMm = Math.max(e.allowedMisclosureMm ?? 0, 10 * Math.abs(e.dropM));
      return e.misclosureMm !== null && Math.abs(e.misclosureMm) > allowedMm ? [{ index: e.index, misclosureMm: e.misclosureMm, allowedMm }] : [];
    }),
    bookingFailed: fall.runs.filter((e) => e.arithmeticCheckOk === false).map((e) => e.index),
    anyDrySeason: flows.some((f) => f.season === 'dry'),
    lowHeadMeasurements: flows.filter((f) => f.lowHead).map((f) => f.index),
    lowestLpm,
    demandLpd,
    marginFraction: s.demandMarginFraction,
  };
  return { r, fall, lift, flows, lowest, lowestLpm, ctx, facts };
}

const SHARED_SOURCES: SourceId[] = ['min-fall-wftw', 'lift-ratio-limit', 'wftw-rws4d5', 'clemson-smith'];

function settingsOf(r: SiteReadings): Screening['settings'] {
  const s = r.settings;
  return {
    designFractionOfLowest: s.designFractionOfLowest,
    maxDesignFractionOfLowest: s.maxDesignFractionOfLowest,
    efficiencyCurve: s.efficiencyCurve,
    demandMarginFraction: s.demandMarginFraction,
    tankRule: s.tankRule,
    driveLengthRule: s.driveLengthRule,
    fittingsAllowanceFraction: s.fittingsAllowanceFraction,
    peakHourFraction: s.peakHourFraction,
    minProbabilityForGo: s.minProbabilityForGo,
  };
}

/** The tank sits below the intake: size the pipe that fills it by gravity. */
function screenGravity(sv: Survey): Screening {
  const { r } = sv;
  const s = r.settings;
  const headM = sv.fall.valueM - sv.lift.valueM;
  const needLpd = sv.facts.demandLpd * (1 + s.demandMarginFraction);
  const routeM = (r.drivePipe.lengthM ?? driveLengthBandM(Math.max(sv.fall.valueM, 1e-3), s.driveLengthRule).minM) + r.deliveryPipe.lengthM;
  const gravity = designGravityPipe({ headM, lengthM: routeM, needLpd, fittingsAllowance: s.fittingsAllowanceFraction, pipe: r.deliveryPipe });
  const availableLpm = s.designFractionOfLowest * sv.lowestLpm;
  const deliveryLpd = Math.min(gravity.capacityLpd ?? 0, availableLpm * 1440);
  const judgement = judgeGravity({
    ...sv.facts,
    availableLpm,
    designFraction: s.designFractionOfLowest,
    staticLiftM: sv.lift.valueM,
    headM,
    pipeLabel: gravity.size?.label ?? null,
    pipeLengthM: routeM,
    capacityLpd: gravity.capacityLpd,
    givenShortLpd: gravity.givenShortLpd,
  });
  const figures = buildGravityFigures({ ...sv.ctx, fraction: s.designFractionOfLowest, gravity, deliveryLpd });
  const bom =
    judgement.verdict === 'no-go' || !gravity.size
      ? []
      : gravityBillOfMaterials({
          pipe: {
            material: gravity.material.label,
            classLabel: gravity.cls.label,
            sizeLabel: gravity.size.label,
            materialId: gravity.material.id,
            boreMm: gravity.boreMm ?? 0,
          },
          lengthM: routeM,
          tankL: sv.ctx.tank.sizeL,
          tankRuleLabel: sv.ctx.tank.rule.label,
        });
  const sourceIds: SourceId[] = [...Object.values(figures).map((f) => f.sourceId), ...sv.ctx.demandLines.map((l) => l.sourceId), 'gravity-flow'];
  return {
    engineVersion: ENGINE_VERSION,
    verdict: judgement.verdict,
    reasons: judgement.reasons,
    conditions: judgement.conditions,
    cautions: cautionsFor({ pressures: null, anyPeople: sv.ctx.demandLines.some((l) => l.kind.startsWith('person') && l.count > 0), deliveryLpd }),
    figures,
    billOfMaterials: bom,
    settings: settingsOf(r),
    monteCarlo: { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed, generator: 'mulberry32 + Box–Muller' },
    sources: sourcesFor(sourceIds),
  };
}

type Fix = RamVerdictFacts['fix'];

/**
 * The plan as the readings stand; when it falls short, the plan with the fix that makes it meet the need (the
 * recommended delivery pipe, then the organisation's largest share of the flow), so the figures show it met.
 */
function planWithFix(sv: Survey, input: RamPlanInput): { plan: RamPlan; fix: Fix; fraction: number; feed: FeedDesign | null; fallM: number } {
  const s = sv.r.settings;
  const plan = (i: RamPlanInput) => planWithFeed(i, sv.r.feedPipe);
  const base = plan(input);
  const fraction = s.designFractionOfLowest;
  const shortLpd = base.plan.status === 'short' ? base.plan.option.deliveryLpd : 0;
  if (base.plan.status === 'meets' || (base.plan.status === 'no-ram' && base.plan.cause !== 'flow')) return { ...base, fix: null, fraction };
  if (base.plan.status === 'short' && sv.r.deliveryPipe.diameterMm) {
    const p = plan({ ...input, deliveryPipe: { ...input.deliveryPipe, diameterMm: undefined } });
    if (p.plan.status === 'meets') return { ...p, fix: { kind: 'delivery-pipe', label: p.plan.option.delivery.size.label, shortLpd }, fraction };
  }
  if (s.maxDesignFractionOfLowest > fraction) {
    const p = plan({ ...input, availableLpm: s.maxDesignFractionOfLowest * sv.lowestLpm });
    if (p.plan.status === 'meets') {
      const takeLpm = p.plan.option.count * p.plan.option.drive.driveLpm;
      return {
        ...p,
        fix: { kind: 'more-water', fraction: takeLpm / sv.lowestLpm, takeLpm, leaveLpm: sv.lowestLpm - takeLpm, shortLpd },
        fraction: s.maxDesignFractionOfLowest,
      };
    }
  }
  return { ...base, fix: null, fraction };
}

/** Screens one site from its raw readings: figures with their rules and sources, verdict, cautions and materials. */
export function screenSite(input: SiteReadingsInput): Screening {
  const r = parseReadingsOrThrow(input);
  const sv = survey(r);
  // Judged on static levels: a tank whose water stands below the intake fills by gravity.
  if (sv.lift.valueM < sv.fall.valueM) return screenGravity(sv);

  const s = r.settings;
  const curve = EFFICIENCY_CURVES[s.efficiencyCurve];
  const needLpd = sv.facts.demandLpd * (1 + s.demandMarginFraction);
  const planInput: RamPlanInput = {
    fallM: Math.max(sv.fall.valueM, 1e-3),
    staticLiftM: Math.max(sv.lift.valueM, 1e-3),
    availableLpm: s.designFractionOfLowest * sv.lowestLpm,
    needLpd,
    curve,
    driveLengthRule: s.driveLengthRule,
    fittingsAllowance: s.fittingsAllowanceFraction,
    drivePipe: r.drivePipe,
    deliveryPipe: r.deliveryPipe,
    forced: r.ram,
  };
  const { plan, fix, fraction, feed, fallM: drivingFallM } = planWithFix(sv, planInput);
  const option = plan.status === 'no-ram' ? null : plan.option;
  const smallest = RAM_SIZE_TABLE[0] as (typeof RAM_SIZE_TABLE)[number];

  const mc = option
    ? runMonteCarlo({
        // Behind a feed pipe the ram works on the fall that its friction leaves.
        ctx: { curve, deliveryFrictionK: option.delivery.frictionK },
        fallM: drivingFallM,
        fallSigmaM: sv.fall.sigmaM,
        staticLiftM: sv.lift.valueM,
        staticLiftSigmaM: sv.lift.sigmaM,
        lowestFlowLpm: sv.lowestLpm,
        lowestFlowRelativeSigma: sv.lowest.relativeSigma,
        designFraction: fraction,
        ramMaxLpm: option.drive.driveLpm,
        ramMinLpm: option.row.minLpm,
        ramCount: option.count,
        demandLpd: sv.facts.demandLpd,
        samples: r.monteCarlo.samples,
        seed: r.monteCarlo.seed,
      })
    : null;

  const d = option?.drive;
  const judgement = judge({
    ...sv.facts,
    availableLpm: fraction * sv.lowestLpm,
    designFraction: s.designFractionOfLowest,
    plan: plan.status === 'no-ram' ? plan : { status: plan.status, count: plan.option.count, sizeLabel: plan.option.drive.size.label, forced: plan.forced },
    smallestRamMinLpm: smallest.minLpm,
    leastRamFallM: LEAST_RAM_FALL_M,
    staticLiftM: sv.lift.valueM,
    totalLiftM: option?.op.totalLiftM ?? sv.lift.valueM,
    liftRatio: option?.op.liftRatio ?? (drivingFallM > 0 ? sv.lift.valueM / drivingFallM : Infinity),
    efficiencyStatus: option
      ? option.op.liftRatio > curve.maxRatio
        ? 'above-range'
        : option.op.liftRatio < curve.minRatio
          ? 'below-range'
          : 'in-range'
      : 'in-range',
    curveLabel: curve.label,
    curveRange: [curve.minRatio, curve.maxRatio],
    curveStatedUpTo: curve.statedUpToRatio,
    deliveryLpd: option?.deliveryLpd ?? 0,
    probabilityMeets: mc?.probabilityMeetsDemand ?? null,
    minProbabilityForGo: s.minProbabilityForGo,
    fix,
    drive: d
      ? {
          lengthM: d.lengthM,
          lengthGiven: d.lengthGiven,
          bandMinM: d.bandMinM,
          bandMaxM: d.bandMaxM,
          bandRule: d.bandRuleLabel,
          lengthConflict: d.lengthConflict,
          ldMinM: (DRIVE_LD_BAND.min * d.boreMm) / 1000,
          ldMaxM: (DRIVE_LD_BAND.max * d.boreMm) / 1000,
          lengthToDiameter: d.lengthToDiameter,
          closureVelocityMps: d.closureVelocityMps,
          minimumClosureVelocityMps: d.minimumClosureVelocityMps,
          limitedByFall: d.limitedByFall,
          attainableVelocityMps: d.attainableVelocityMps,
          driveLpm: d.driveLpm,
          workingPeakHeadM: d.workingPeakHeadM,
          blockedDeliveryHeadM: d.blockedDeliveryHeadM,
          allowedHeadM: d.allowedHeadM,
          ratingM: d.ratingM,
          cyclicDerated: d.cyclicDerated,
          classLabel: d.cls.label,
          higherClassLabel: d.higherClass?.label ?? null,
          materialLabel: d.material.label,
          rigid: d.material.id === 'galvanized-steel',
          sizeLabel: d.size.label,
          fittingsMade: d.fittingsMade,
          smallerThanRam: d.smallerThanRam,
        }
      : null,
    delivery: option
      ? {
          frictionM: option.op.frictionM,
          frictionOverLimit: option.delivery.frictionOverLimit,
          ratingM: option.delivery.ratingM,
          classLabel: option.delivery.cls.label,
          diameterGiven: option.delivery.diameterGiven,
        }
      : { frictionM: 0, frictionOverLimit: false, ratingM: Infinity, classLabel: '', diameterGiven: false },
  });

  const surveyCtx = { ...sv.ctx, fraction };
  const figures = option && mc ? buildFigures({ ...surveyCtx, option, forced: plan.forced, curve, mc, feed, drivingFallM }) : buildSurveyFigures(surveyCtx);
  const relief = judgement.conditions.some((c) => c.code === 'BLOCKED_PRESSURE_ABOVE_RATING' && /relief valve/.test(c.text));
  const bom =
    judgement.verdict === 'no-go' || !option
      ? []
      : billOfMaterials({
          drive: option.drive,
          delivery: option.delivery,
          deliveryLengthM: r.deliveryPipe.lengthM,
          ramDriveIn: option.row.driveIn,
          ramCount: option.count,
          ramMinLpm: option.row.minLpm,
          ramMaxLpm: option.row.maxLpm,
          tankL: sv.ctx.tank.sizeL,
          tankRuleLabel: sv.ctx.tank.rule.label,
          standPipe:
            !feed && ((option.drive.lengthGiven && option.drive.lengthM > option.drive.bandMaxM) || option.drive.lengthConflict === 'fall-band-above-ld'),
          reliefValve: relief,
          feed,
          deliveryLpm: option.op.deliveryLpm,
        });
  const sourceIds: SourceId[] = [...Object.values(figures).map((f) => f.sourceId), ...sv.ctx.demandLines.map((l) => l.sourceId), ...SHARED_SOURCES];
  if (option) sourceIds.push('ogden-1911-least-fall', 'efficiency-spread', 'minor-loss-coefficients');

  return {
    engineVersion: ENGINE_VERSION,
    verdict: judgement.verdict,
    reasons: judgement.reasons,
    conditions: judgement.conditions,
    cautions: cautionsFor({
      pressures: option ? { workingPeakHeadM: option.drive.workingPeakHeadM, blockedDeliveryHeadM: option.drive.blockedDeliveryHeadM } : null,
      anyPeople: sv.ctx.demandLines.some((l) => l.kind.startsWith('person') && l.count > 0),
      deliveryLpd: option?.deliveryLpd ?? 0,
    }),
    figures,
    billOfMaterials: bom,
    settings: settingsOf(r),
    monteCarlo: { samples: r.monteCarlo.samples, seed: r.monteCarlo.seed, generator: 'mulberry32 + Box–Muller' },
    sources: sourcesFor(sourceIds),
  };
}
