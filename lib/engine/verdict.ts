// Verdict rules: each threshold is a named constant with its source; reasons carry the numbers in plain words.
import { fmt, fmtMm, pct, roundMm } from './format';

export { roundMm };
import type { Condition, Reason, Verdict } from './screening-types';

/** Least usable fall, m (Water for the World RWS.4.D.5; found). */
export const MIN_FALL_M = 0.5;
/** Lift ratio above which no ram is offered (Ogden 1911: about 30 ft per ft of fall; found). */
export const MAX_LIFT_RATIO = 30;
/** Lift ratio above which efficiency falls off sharply: warn (common practice, no source). */
export const WARN_LIFT_RATIO = 20;
/** Below this lift ratio a ram does little and an advisor looks for more fall first (common practice, no source). */
export const LOW_LIFT_RATIO = 2;
/** Source should give at least 7 × the pumped water (Water for the World RWS.4.D.5; found). */
export const MIN_SUPPLY_MULTIPLE = 7;
/** Back-pressure the ram needs to cycle, m (≈10 psi, Clemson/Smith; found). */
export const MIN_DELIVERY_HEAD_M = 7;
/** Fall uncertainty (1σ) above this share of the fall calls for a better survey (common practice, no source). */
export const MAX_FALL_RELATIVE_SIGMA = 0.1;
/** Default least chance of meeting the demand for a plain go; the organisation's setting overrides it (common practice, no source). */
export const MIN_PROBABILITY_MEETS = 0.8;
/** Delivery pipe rated for at least this many times the total lift (common practice, no source). */
export const DELIVERY_SAFETY_FACTOR = 1.25;

export interface DriveFacts {
  lengthM: number; lengthGiven: boolean; bandMinM: number; bandMaxM: number; bandRule: string;
  lengthConflict: null | 'fall-band-above-ld' | 'fall-band-below-ld'; ldMinM: number; ldMaxM: number;
  lengthToDiameter: number; closureVelocityMps: number; minimumClosureVelocityMps: number; limitedByFall: boolean;
  attainableVelocityMps: number; driveLpm: number;
  workingPeakHeadM: number; blockedDeliveryHeadM: number; allowedHeadM: number; ratingM: number; cyclicDerated: boolean;
  classLabel: string; higherClassLabel: string | null; materialLabel: string; rigid: boolean; sizeLabel: string;
  fittingsMade: boolean; smallerThanRam: boolean;
}

export interface RamVerdictFacts {
  fallM: number;
  fallSigmaM: number;
  fallRunsDisagree: number[];
  misclosures: { index: number; misclosureMm: number; allowedMm: number }[];
  bookingFailed: number[];
  anyDrySeason: boolean;
  lowHeadMeasurements: number[];
  lowestLpm: number;
  availableLpm: number;
  designFraction: number;
  /** The plan: how many rams of which size, or why none can run. */
  plan: { status: 'meets' | 'short'; count: number; sizeLabel: string; forced: boolean } | { status: 'no-ram'; cause: 'flow' | 'fall' | 'push' | 'soft'; forced: boolean };
  smallestRamMinLpm: number;
  leastRamFallM: number;
  staticLiftM: number;
  totalLiftM: number;
  liftRatio: number;
  efficiencyStatus: 'in-range' | 'below-range' | 'above-range';
  curveLabel: string;
  curveRange: [number, number];
  curveStatedUpTo: number;
  /** All rams together. */
  deliveryLpd: number;
  demandLpd: number;
  marginFraction: number;
  probabilityMeets: number | null;
  minProbabilityForGo: number;
  /** The fix the figures already assume, when the readings as taken fall short. */
  fix: null | { kind: 'delivery-pipe'; label: string; shortLpd: number } | { kind: 'more-water'; fraction: number; takeLpm: number; leaveLpm: number; shortLpd: number };
  drive: DriveFacts | null;
  delivery: { frictionM: number; frictionOverLimit: boolean; ratingM: number; classLabel: string; diameterGiven: boolean };
}

export interface Judgement {
  verdict: Verdict;
  reasons: Reason[];
  conditions: Condition[];
}

type Add = (code: string, severity: Reason['severity'], text: string, condition?: string) => void;

function collector(): { add: Add; reasons: Reason[]; conditions: Condition[] } {
  const reasons: Reason[] = [];
  const conditions: Condition[] = [];
  const add: Add = (code, severity, text, condition) => {
    reasons.push({ code, severity, text });
    if (condition) conditions.push({ code, text: condition });
  };
  return { add, reasons, conditions };
}

function finish(reasons: Reason[], conditions: Condition[], outcome: 'ram' | 'gravity' = 'ram'): Judgement {
  const noGo = reasons.some((r) => r.severity === 'no-go');
  // Gravity stays its own outcome with its conditions listed: no pump is needed whatever else must be checked.
  const verdict: Verdict = noGo ? 'no-go' : outcome === 'gravity' ? 'gravity' : reasons.some((r) => r.severity === 'conditional') ? 'conditional' : 'go';
  // A no-go has no conditions: nothing listed would make it a go.
  return { verdict, reasons, conditions: verdict === 'no-go' ? [] : conditions };
}

/** Fall survey checks, shared by the ram and the gravity outcomes. */
function judgeSurvey(f: Pick<RamVerdictFacts, 'fallM' | 'fallSigmaM' | 'fallRunsDisagree' | 'misclosures' | 'bookingFailed' | 'anyDrySeason' | 'lowHeadMeasurements' | 'lowestLpm'>, add: Add): void {
  if (f.fallSigmaM > MAX_FALL_RELATIVE_SIGMA * Math.max(f.fallM, MIN_FALL_M)) {
    add('FALL_UNCERTAIN', 'conditional', `The fall of ${fmt(f.fallM, 'm')} is known only to ±${fmt(f.fallSigmaM, 'm')}.`, 'Measure the fall again with a level and staff or a hose level before buying pipe.');
  }
  if (f.fallRunsDisagree.length > 0) {
    add('FALL_RUNS_DISAGREE', 'conditional', `Fall run(s) ${f.fallRunsDisagree.map((i) => i + 1).join(', ')} disagree with the most precise run by more than their uncertainty allows; the screen widens the fall's uncertainty by their spread.`, 'Walk the drive pipe route again and repeat the fall measurement.');
  }
  for (const m of f.misclosures) {
    add('FALL_MISCLOSURE', 'conditional', `Level run ${m.index + 1} closes to ${fmt(Math.abs(m.misclosureMm), 'mm')}, more than the ${fmt(m.allowedMm, 'mm')} allowed.`, 'Repeat the level run out and back until it closes.');
  }
  for (const i of f.bookingFailed) add('FALL_BOOKING_CHECK', 'conditional', `Level run ${i + 1} fails the arithmetic check of its booking.`, 'Check the booking of the level run.');
  if (!f.anyDrySeason) {
    add('FLOW_NOT_DRY_SEASON', 'conditional', `No flow was measured in the dry season; the lowest measured flow is ${fmt(f.lowestLpm, 'L/min')}.`, 'Measure the flow again at the end of the dry season, or check local records, before building.');
  }
  for (const i of f.lowHeadMeasurements) add('FLOW_HEAD_BELOW_RANGE', 'note', `Flow measurement ${i + 1} read less than 6 cm on the weir, below its reliable range.`);
}

function judgeDemand(f: RamVerdictFacts, add: Add): void {
  const needLpd = f.demandLpd * (1 + f.marginFraction);
  // Compared at the litre the sheet shows: a need that rounds to 0 L/day is no need recorded.
  if (Math.round(f.demandLpd) <= 0) {
    add('DEMAND_MISSING', 'conditional', 'No water need was recorded, so the ram could only be sized as the smallest that runs.', 'Record what the farm needs (people, animals, garden) and screen again.');
    return;
  }
  const multiple = f.deliveryLpd > 0 ? (f.lowestLpm * 1440) / f.deliveryLpd : Infinity;
  if (multiple < MIN_SUPPLY_MULTIPLE) {
    add('SUPPLY_MULTIPLE_LOW', 'conditional', `The source gives ${fmt(multiple)} times the pumped water; at least ${MIN_SUPPLY_MULTIPLE} times is advised.`, 'Confirm the source can spare the water, or take less.');
  }
  if (f.fix?.kind === 'delivery-pipe') {
    add('DELIVERY_PIPE_TOO_SMALL', 'conditional', `With the delivery pipe as recorded the ram would deliver ${fmt(f.fix.shortLpd, 'L/day')}, less than the ${fmt(f.demandLpd, 'L/day')} needed: the pipe loses too much lift to friction. The figures here assume a ${f.fix.label} delivery pipe.`, `Use a ${f.fix.label} delivery pipe (or a shorter run).`);
  } else if (f.fix?.kind === 'more-water') {
    add('DEMAND_NEEDS_MORE_WATER', 'conditional', `Taking ${pct(f.designFraction)} of the lowest flow the ram would deliver ${fmt(f.fix.shortLpd, 'L/day')}, less than the ${fmt(f.demandLpd, 'L/day')} needed. The figures here assume it takes ${fmt(f.fix.takeLpm, 'L/min')} (${pct(f.fix.fraction)}), leaving ${fmt(f.fix.leaveLpm, 'L/min')} in the stream in the dry season.`, `Agree with the water authority and neighbours downstream that the ram may take ${fmt(f.fix.takeLpm, 'L/min')}, leaving ${fmt(f.fix.leaveLpm, 'L/min')} in the stream in the dry season.`);
  }
  if (f.deliveryLpd < f.demandLpd) {
    add('DEMAND_NOT_MET', 'no-go', `The ram${f.plan.status !== 'no-ram' && f.plan.count > 1 ? 's' : ''} would deliver ${fmt(f.deliveryLpd, 'L/day')} against a demand of ${fmt(f.demandLpd, 'L/day')}.`);
  } else if (f.deliveryLpd < needLpd) {
    add('DEMAND_MARGIN_THIN', 'conditional', `The ram would deliver ${fmt(f.deliveryLpd, 'L/day')}, within the ${pct(f.marginFraction)} margin over the ${fmt(f.demandLpd, 'L/day')} demand.`, 'Agree a smaller demand, or a larger tank to ride through dry spells.');
  } else if (f.probabilityMeets !== null && f.probabilityMeets < f.minProbabilityForGo) {
    add('DEMAND_UNCERTAIN', 'conditional', `Given what is uncertain in the readings and in how well a ram performs, the chance of meeting the demand is about ${pct(f.probabilityMeets)} (a plain go needs ${pct(f.minProbabilityForGo)}).`, 'Measure the fall and the dry-season flow more precisely, or fit the next larger ram.');
  }
}

function judgeDrive(f: RamVerdictFacts, d: DriveFacts, add: Add): void {
  if (d.limitedByFall) {
    add('DRIVE_FLOW_LIMITED_BY_FALL', 'note', `The fall can push about ${fmt(d.driveLpm, 'L/min')} through the drive pipe and open waste valve (closure at ${fmt(d.closureVelocityMps, 'm/s')}, never above the ${fmt(d.attainableVelocityMps, 'm/s')} steady flow); the figures use that, not the ram's full size.`);
  }
  const over = Math.max(d.workingPeakHeadM, d.blockedDeliveryHeadM) > d.allowedHeadM;
  const soft = d.closureVelocityMps < d.minimumClosureVelocityMps;
  const rated = `${d.rigid ? `${d.materialLabel}, ${d.classLabel}` : d.classLabel} (used to ${fmt(d.allowedHeadM, 'm')}${d.cyclicDerated ? `, half its ${fmt(d.ratingM, 'm')} rating for the ram's pressure cycles` : ''})`;
  if (over && d.workingPeakHeadM > d.allowedHeadM) {
    const text = `In normal running the ram and drive pipe see about ${fmt(d.workingPeakHeadM, 'm')} of head, more than ${rated} holds.`;
    if (d.higherClassLabel && !(soft && !d.rigid)) add('WORKING_PRESSURE_ABOVE_RATING', 'conditional', text, `Use ${d.higherClassLabel} for the drive pipe and ram fittings.`);
    else if (!d.rigid) add('WORKING_PRESSURE_ABOVE_RATING', 'conditional', text, 'Use a galvanized steel drive pipe, rated for the working and blocked-delivery pressures.');
    else add('WORKING_PRESSURE_ABOVE_RATING', 'no-go', `${text} No class of it made in ${d.sizeLabel} holds it.`);
  } else if (over) {
    const text = `If the delivery is blocked (a shut valve, a float valve, a waterlogged air vessel) the ram and drive pipe see up to ${fmt(d.blockedDeliveryHeadM, 'm')} (fall plus surge), more than ${rated} holds; in normal running they see about ${fmt(d.workingPeakHeadM, 'm')}.`;
    if (d.higherClassLabel) add('BLOCKED_PRESSURE_ABOVE_RATING', 'conditional', text, `Use ${d.higherClassLabel} for the drive pipe and ram fittings.`);
    else add('BLOCKED_PRESSURE_ABOVE_RATING', 'conditional', text, `Never let the delivery be shut while the ram runs: fit a pressure-relief valve at the ram set below ${fmt(d.allowedHeadM, 'm')} of head, no float valve on the delivery, and keep the air vessel charged.`);
  }
  if (!d.fittingsMade) add('FITTINGS_NOT_MADE', 'note', `Threaded fittings of the class chosen (${d.classLabel}) are not made in ${d.sizeLabel}: use flanged or welded joints of the same rating.`);
  if (d.cyclicDerated) add('PLASTIC_DRIVE_PIPE', 'note', `A plastic drive pipe is counted at half its pressure class because a ram cycles it ten to a hundred million times a year, and its give weakens the pulse; a rigid galvanized steel drive pipe is the usual choice.`);
  if (soft) {
    const text = `The drive flow (about ${fmt(d.closureVelocityMps, 'm/s')} at valve closure) is too slow to raise the ${fmt(f.totalLiftM, 'm')} lift above the fall in this pipe (needs ${fmt(d.minimumClosureVelocityMps, 'm/s')}).`;
    if (d.rigid) add('DRIVE_TOO_SOFT', 'no-go', `${text} Find more fall or a lower tank.`);
    else add('DRIVE_TOO_SOFT', 'conditional', text, 'Use a rigid (galvanized steel) drive pipe.');
  }
  if (d.lengthGiven && (d.lengthM < d.bandMinM || d.lengthM > d.bandMaxM)) {
    const fix = d.lengthM > d.bandMaxM
      ? `Build an open stand pipe or tank about ${fmt(d.bandMaxM, 'm')} up the drive pipe from the ram, fed from the intake.`
      : `Lengthen the drive pipe to ${fmt(d.bandMinM, 'm')}–${fmt(d.bandMaxM, 'm')}.`;
    add('DRIVE_LENGTH_OUT_OF_BAND', 'conditional', `The drive pipe is ${fmt(d.lengthM, 'm')}; the ${d.bandRule} rule gives ${fmt(d.bandMinM, 'm')}–${fmt(d.bandMaxM, 'm')}.`, fix);
  }
  if (d.lengthConflict === 'fall-band-above-ld') {
    add('DRIVE_BANDS_CONFLICT', 'note', `The ${d.bandRule} rule asks for ${fmt(d.bandMinM, 'm')}–${fmt(d.bandMaxM, 'm')} of drive pipe, but more than ${fmt(d.ldMaxM, 'm')} is over 1,000 times its bore; the screen uses ${fmt(d.lengthM, 'm')}. Where the intake is farther from the ram, feed an open stand pipe that far up the line and start the drive pipe there.`);
  } else if (d.lengthConflict === 'fall-band-below-ld') {
    add('DRIVE_BANDS_CONFLICT', 'note', `The ${d.bandRule} rule gives at most ${fmt(d.bandMaxM, 'm')} of drive pipe, but it needs at least ${fmt(d.ldMinM, 'm')} (150 times its bore) to beat steadily; the screen uses ${fmt(d.lengthM, 'm')}, laid at a gentle slope.`);
  }
  if (d.lengthToDiameter < 150 || d.lengthToDiameter > 1000) {
    add('DRIVE_LD_OUT_OF_BAND', 'conditional', `The drive pipe's length is ${fmt(d.lengthToDiameter)} times its bore; 150–1,000 is advised.`, `Make the drive pipe ${fmt(d.ldMinM, 'm')}–${fmt(d.ldMaxM, 'm')} long, or change its size.`);
  }
  if (d.smallerThanRam) add('DRIVE_SMALLER_THAN_RAM', 'conditional', 'The drive pipe is smaller than the ram size the screen chose.', 'Use a drive pipe of the ram inlet size.');
}

/** Applies the verdict rules for a ram to the computed facts. */
export function judge(f: RamVerdictFacts): Judgement {
  const { add, reasons, conditions } = collector();

  // Fall: compared at the millimetre the text shows.
  const fallMm = roundMm(f.fallM);
  if (fallMm < MIN_FALL_M) {
    add('FALL_TOO_SMALL', 'no-go', `The fall is ${fmtMm(fallMm)}; a ram needs at least ${fmtMm(MIN_FALL_M)}.`);
  } else if (f.plan.status === 'no-ram' && f.plan.cause === 'fall') {
    add('FALL_BELOW_RAM_SIZES', 'no-go', `The fall is ${fmtMm(fallMm)}; the rams of the size table need at least ${fmtMm(f.leastRamFallM)} (Ogden 1911).`);
  }
  judgeSurvey(f, add);

  // Water and ram size
  if (f.plan.status === 'no-ram' && f.plan.cause === 'flow') {
    add('FLOW_TOO_SMALL', 'no-go', `The ram may take ${fmt(f.availableLpm, 'L/min')} (${pct(f.designFraction)} of the lowest flow); the smallest ram in the size table needs ${fmt(f.smallestRamMinLpm, 'L/min')}.`);
  } else if (f.plan.status === 'no-ram' && (f.plan.cause === 'push' || f.plan.cause === 'soft')) {
    add('FALL_CANNOT_PUSH', 'no-go', `A fall of ${fmt(f.fallM, 'm')} cannot push the least drive flow of any ram that fits the water through its drive pipe.`);
  } else if (f.plan.status !== 'no-ram' && f.plan.count > 1) {
    add('RAMS_IN_PARALLEL', 'note', `One ram cannot use the water needed: ${f.plan.count} rams of ${f.plan.sizeLabel}, each on its own drive pipe, share one delivery pipe.`);
  }

  // Lift
  if (f.plan.status !== 'no-ram' && fallMm >= MIN_FALL_M) {
    if (roundMm(f.liftRatio) > MAX_LIFT_RATIO) {
      add('LIFT_RATIO_TOO_HIGH', 'no-go', `The lift is ${fmt(f.liftRatio)} times the fall (${fmt(f.totalLiftM, 'm')} over ${fmt(f.fallM, 'm')}); rams are offered up to about ${MAX_LIFT_RATIO} times.`);
    } else if (f.efficiencyStatus === 'above-range') {
      add('LIFT_RATIO_BEYOND_CURVE', 'no-go', `The lift ratio ${fmt(f.liftRatio)} is beyond the ${f.curveLabel} (up to ${f.curveRange[1]}); no efficiency can be stated.`);
    } else if (f.liftRatio > WARN_LIFT_RATIO) {
      add('LIFT_RATIO_HIGH', 'conditional', `The lift is ${fmt(f.liftRatio)} times the fall; efficiency is low and uncertain above ${WARN_LIFT_RATIO}.`, "Confirm the delivery with the ram maker's data for this lift ratio, or find more fall.");
    }
    if (f.liftRatio > f.curveStatedUpTo && f.liftRatio <= f.curveRange[1]) {
      add('LIFT_RATIO_BEYOND_STATED', 'note', `The ${f.curveLabel} is stated up to a lift ratio of ${f.curveStatedUpTo}; at ${fmt(f.liftRatio)} it likely overstates the delivery.`);
    }
    if (f.efficiencyStatus === 'below-range') {
      add('LIFT_RATIO_BELOW_CURVE', 'note', `The lift ratio ${fmt(f.liftRatio)} is below the ${f.curveLabel} (from ${f.curveRange[0]}); the share of the drive water delivered is held at its first value, not extended.`);
    }
    if (f.liftRatio < LOW_LIFT_RATIO) {
      add('LIFT_RATIO_LOW', 'note', `The tank is only ${fmt(f.liftRatio)} times the fall above the ram; a ram does little below about ${LOW_LIFT_RATIO}. A site with more fall, or the tank set a little lower so it fills by gravity, may serve better.`);
    }
    if (roundMm(f.totalLiftM) < MIN_DELIVERY_HEAD_M) {
      add('LIFT_BELOW_START_HEAD', 'conditional', `The total lift of ${fmt(f.totalLiftM, 'm')} is below the ~${MIN_DELIVERY_HEAD_M} m a ram needs to cycle.`, 'Raise the tank or lead the delivery pipe up a rise so the ram sees at least 7 m of back-pressure.');
    }
  }
  const blocked = reasons.some((r) => r.severity === 'no-go');

  if (!blocked) {
    judgeDemand(f, add);
    if (f.drive) judgeDrive(f, f.drive, add);
    if (f.delivery.ratingM < f.totalLiftM * DELIVERY_SAFETY_FACTOR) {
      add('DELIVERY_PIPE_RATING_LOW', 'conditional', `The delivery pipe (${f.delivery.classLabel}) is rated for ${fmt(f.delivery.ratingM, 'm')}, less than ${DELIVERY_SAFETY_FACTOR} × the ${fmt(f.totalLiftM, 'm')} lift.`, `Use delivery pipe rated for at least ${fmt(f.totalLiftM * DELIVERY_SAFETY_FACTOR, 'm')} of head near the ram (a higher class, or steel for the first lengths).`);
    }
    if (f.delivery.frictionOverLimit && f.fix?.kind !== 'delivery-pipe' && !reasons.some((r) => r.code === 'DEMAND_NOT_MET')) {
      add('DELIVERY_FRICTION_HIGH', 'note', `Friction in the delivery pipe takes ${fmt(f.delivery.frictionM, 'm')}, more than 10 % of the ${fmt(f.staticLiftM, 'm')} static lift${f.delivery.diameterGiven ? '' : ' even in the largest size'}.`);
    }
  }
  return finish(reasons, conditions);
}

export interface GravityVerdictFacts extends Pick<RamVerdictFacts, 'fallM' | 'fallSigmaM' | 'fallRunsDisagree' | 'misclosures' | 'bookingFailed' | 'anyDrySeason' | 'lowHeadMeasurements' | 'lowestLpm' | 'availableLpm' | 'designFraction' | 'demandLpd' | 'marginFraction'> {
  staticLiftM: number;
  headM: number;
  pipeLabel: string | null;
  pipeLengthM: number;
  capacityLpd: number | null;
  /** The pipe on the farm, when it was recorded and carries too little: its capacity, L/day. */
  givenShortLpd: number | null;
}

/** The tank sits below the intake: water flows by gravity, and the question is the pipe and the water, not a pump. */
export function judgeGravity(f: GravityVerdictFacts): Judgement {
  const { add, reasons, conditions } = collector();
  const needLpd = f.demandLpd * (1 + f.marginFraction);
  add('GRAVITY_SUPPLY', 'note', `The tank's water level is ${fmt(f.headM, 'm')} below the intake: a pipe fills it by gravity and no pump is needed.`);
  judgeSurvey(f, add);
  if (f.fallSigmaM > 0 && f.headM < 2 * f.fallSigmaM) {
    add('GRAVITY_HEAD_UNCERTAIN', 'conditional', `The ${fmt(f.headM, 'm')} difference in level is within the survey's uncertainty (±${fmt(f.fallSigmaM, 'm')}).`, 'Level the intake and the tank site against each other before laying pipe.');
  }
  if (f.pipeLabel !== null && f.givenShortLpd !== null) {
    add('GRAVITY_PIPE_TOO_SMALL', 'conditional', `The pipe as recorded carries only about ${fmt(f.givenShortLpd, 'L/day')} over ${fmt(f.pipeLengthM, 'm')} with ${fmt(f.headM, 'm')} of fall; the figures here assume a ${f.pipeLabel} pipe.`, `Use a ${f.pipeLabel} pipe from the intake to the tank.`);
  }
  if (f.pipeLabel === null) {
    add('GRAVITY_HEAD_TOO_SMALL', 'no-go', `Over ${fmt(f.pipeLengthM, 'm')} of pipe, friction takes more than the ${fmt(f.headM, 'm')} difference in level in every pipe size at the ${fmt(needLpd, 'L/day')} needed. Set the tank lower or find a shorter route.`);
  }
  // Compared at the litre the sheet shows: a need that rounds to 0 L/day is no need recorded.
  if (Math.round(f.demandLpd) <= 0) {
    add('DEMAND_MISSING', 'conditional', 'No water need was recorded, so the pipe could not be sized for it.', 'Record what the farm needs (people, animals, garden) and screen again.');
  } else if (f.availableLpm * 1440 < f.demandLpd) {
    add('DEMAND_NOT_MET', 'no-go', `The stream can spare ${fmt(f.availableLpm * 1440, 'L/day')} (${pct(f.designFraction)} of the lowest flow), less than the ${fmt(f.demandLpd, 'L/day')} needed.`);
  } else if (f.availableLpm * 1440 < needLpd) {
    add('DEMAND_MARGIN_THIN', 'conditional', `The stream can spare ${fmt(f.availableLpm * 1440, 'L/day')}, within the ${pct(f.marginFraction)} margin over the ${fmt(f.demandLpd, 'L/day')} demand.`, 'Agree a smaller demand, or a larger tank to ride through dry spells.');
  }
  return finish(reasons, conditions, 'gravity');
}
