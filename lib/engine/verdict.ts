// Verdict rules: each threshold is a named constant with its source; reasons carry the numbers in plain words.
import { amount, renderMessage, say, type Message } from '@/lib/shared/display/message';
import { roundMm } from './format';

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
  lengthM: number;
  lengthGiven: boolean;
  bandMinM: number;
  bandMaxM: number;
  bandRule: string;
  lengthConflict: null | 'fall-band-above-ld' | 'fall-band-below-ld';
  ldMinM: number;
  ldMaxM: number;
  lengthToDiameter: number;
  closureVelocityMps: number;
  minimumClosureVelocityMps: number;
  limitedByFall: boolean;
  attainableVelocityMps: number;
  driveLpm: number;
  workingPeakHeadM: number;
  blockedDeliveryHeadM: number;
  allowedHeadM: number;
  ratingM: number;
  cyclicDerated: boolean;
  classLabel: string;
  higherClassLabel: string | null;
  materialLabel: string;
  rigid: boolean;
  sizeLabel: string;
  fittingsMade: boolean;
  smallerThanRam: boolean;
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
  plan:
    | { status: 'meets' | 'short'; count: number; sizeLabel: string; forced: boolean }
    | { status: 'no-ram'; cause: 'flow' | 'fall' | 'push' | 'soft'; forced: boolean };
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
  fix:
    | null
    | { kind: 'delivery-pipe'; label: string; shortLpd: number }
    | { kind: 'more-water'; fraction: number; takeLpm: number; leaveLpm: number; shortLpd: number };
  drive: DriveFacts | null;
  delivery: { frictionM: number; frictionOverLimit: boolean; ratingM: number; classLabel: string; diameterGiven: boolean };
}

export interface Judgement {
  verdict: Verdict;
  reasons: Reason[];
  conditions: Condition[];
}

type Add = (code: string, severity: Reason['severity'], text: Message | string, condition?: Message | string) => void;

/** A sentence with no figures as a message. */
const plain = (text: Message | string): Message => (typeof text === 'string' ? { template: text, amounts: [] } : text);

function collector(): { add: Add; reasons: Reason[]; conditions: Condition[] } {
  const reasons: Reason[] = [];
  const conditions: Condition[] = [];
  // Each sentence is kept as a message (rendered per reader) and as its metric text (logs, tests, older readers).
  const add: Add = (code, severity, text, condition) => {
    const message = plain(text);
    reasons.push({ code, severity, text: renderMessage(message, 'metric'), message });
    if (condition) {
      const fix = plain(condition);
      conditions.push({ code, text: renderMessage(fix, 'metric'), message: fix });
    }
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
function judgeSurvey(
  f: Pick<
    RamVerdictFacts,
    'fallM' | 'fallSigmaM' | 'fallRunsDisagree' | 'misclosures' | 'bookingFailed' | 'anyDrySeason' | 'lowHeadMeasurements' | 'lowestLpm'
  >,
  add: Add,
): void {
  if (f.fallSigmaM > MAX_FALL_RELATIVE_SIGMA * Math.max(f.fallM, MIN_FALL_M)) {
    add(
      'FALL_UNCERTAIN',
      'conditional',
      say`The fall of ${amount('length', f.fallM)} is known only to ±${amount('length', f.fallSigmaM)}.`,
      'Measure the fall again with a level and staff or a hose level before buying pipe.',
    );
  }
  if (f.fallRunsDisagree.length > 0) {
    add(
      'FALL_RUNS_DISAGREE',
      'conditional',
      say`Fall run(s) ${f.fallRunsDisagree.map((i) => i + 1).join(', ')} disagree with the most precise run by more than their uncertainty allows; the screen widens the fall's uncertainty by their spread.`,
      'Walk the drive pipe route again and repeat the fall measurement.',
    );
  }
  for (const m of f.misclosures) {
    add(
      'FALL_MISCLOSURE',
      'conditional',
      say`Level run ${m.index + 1} closes to ${amount('misclosure', Math.abs(m.misclosureMm))}, more than the ${amount('misclosure', m.allowedMm)} allowed.`,
      'Repeat the level run out and back until it closes.',
    );
  }
  for (const i of f.bookingFailed)
    add('FALL_BOOKING_CHECK', 'conditional', say`Level run ${i + 1} fails the arithmetic check of its booking.`, 'Check the booking of the level run.');
  if (!f.anyDrySeason) {
    add(
      'FLOW_NOT_DRY_SEASON',
      'conditional',
      say`No flow was measured in the dry season; the lowest measured flow is ${amount('flowLpm', f.lowestLpm)}.`,
      'Measure the flow again at the end of the dry season, or check local records, before building.',
    );
  }
  for (const i of f.lowHeadMeasurements)
    add('FLOW_HEAD_BELOW_RANGE', 'note', say`Flow measurement ${i + 1} read less than ${amount('length', 0.06)} on the weir, below its reliable range.`);
}

function judgeDemand(f: RamVerdictFacts, add: Add): void {
  const needLpd = f.demandLpd * (1 + f.marginFraction);
  // Compared at the litre the sheet shows: a need that rounds to 0 L/day is no need recorded.
  if (Math.round(f.demandLpd) <= 0) {
    add(
      'DEMAND_MISSING',
      'conditional',
      'No water need was recorded, so the ram could only be sized as the smallest that runs.',
      'Record what the farm needs (people, animals, garden) and screen again.',
    );
    return;
  }
  const multiple = f.deliveryLpd > 0 ? (f.lowestLpm * 1440) / f.deliveryLpd : Infinity;
  if (multiple < MIN_SUPPLY_MULTIPLE) {
    add(
      'SUPPLY_MULTIPLE_LOW',
      'conditional',
      say`The source gives ${amount('ratio', multiple)} times the pumped water; at least ${MIN_SUPPLY_MULTIPLE} times is advised.`,
      'Confirm the source can spare the water, or take less.',
    );
  }
  if (f.fix?.kind === 'delivery-pipe') {
    add(
      'DELIVERY_PIPE_TOO_SMALL',
      'conditional',
      say`With the delivery pipe as recorded the ram would deliver ${amount('litresPerDay', f.fix.shortLpd)}, less than the ${amount('litresPerDay', f.demandLpd)} needed: the pipe loses too much lift to friction. The figures here assume a ${f.fix.label} delivery pipe.`,
      say`Use a ${f.fix.label} delivery pipe (or a shorter run).`,
    );
  } else if (f.fix?.kind === 'more-water') {
    add(
      'DEMAND_NEEDS_MORE_WATER',
      'conditional',
      say`Taking ${amount('percent', f.designFraction)} of the lowest flow the ram would deliver ${amount('litresPerDay', f.fix.shortLpd)}, less than the ${amount('litresPerDay', f.demandLpd)} needed. The figures here assume it takes ${amount('flowLpm', f.fix.takeLpm)} (${amount('percent', f.fix.fraction)}), leaving ${amount('flowLpm', f.fix.leaveLpm)} in the stream in the dry season.`,
      say`Agree with the water authority and neighbours downstream that the ram may take ${amount('flowLpm', f.fix.takeLpm)}, leaving ${amount('flowLpm', f.fix.leaveLpm)} in the stream in the dry season.`,
    );
  }
  if (f.deliveryLpd < f.demandLpd) {
    add(
      'DEMAND_NOT_MET',
      'no-go',
      say`The ram${f.plan.status !== 'no-ram' && f.plan.count > 1 ? 's' : ''} would deliver ${amount('litresPerDay', f.deliveryLpd)} against a demand of ${amount('litresPerDay', f.demandLpd)}.`,
    );
  } else if (f.deliveryLpd < needLpd) {
    add(
      'DEMAND_MARGIN_THIN',
      'conditional',
      say`The ram would deliver ${amount('litresPerDay', f.deliveryLpd)}, within the ${amount('percent', f.marginFraction)} margin over the ${amount('litresPerDay', f.demandLpd)} demand.`,
      'Agree a smaller demand, or a larger tank to ride through dry spells.',
    );
  } else if (f.probabilityMeets !== null && f.probabilityMeets < f.minProbabilityForGo) {
    add(
      'DEMAND_UNCERTAIN',
      'conditional',
      say`Given what is uncertain in the readings and in how well a ram performs, the chance of meeting the demand is about ${amount('percent', f.probabilityMeets)} (a plain go needs ${amount('percent', f.minProbabilityForGo)}).`,
      'Measure the fall and the dry-season flow more precisely, or fit the next larger ram.',
    );
  }
}

function judgeDrive(f: RamVerdictFacts, d: DriveFacts, add: Add): void {
  if (d.limitedByFall) {
    add(
      'DRIVE_FLOW_LIMITED_BY_FALL',
      'note',
      say`The fall can push about ${amount('flowLpm', d.driveLpm)} through the drive pipe and open waste valve (closure at ${amount('speed', d.closureVelocityMps)}, never above the ${amount('speed', d.attainableVelocityMps)} steady flow); the figures use that, not the ram's full size.`,
    );
  }
  const over = Math.max(d.workingPeakHeadM, d.blockedDeliveryHeadM) > d.allowedHeadM;
  const soft = d.closureVelocityMps < d.minimumClosureVelocityMps;
  const rated = say`${d.rigid ? `${d.materialLabel}, ${d.classLabel}` : d.classLabel} (used to ${amount('length', d.allowedHeadM)}${d.cyclicDerated ? say`, half its ${amount('length', d.ratingM)} rating for the ram's pressure cycles` : ''})`;
  if (over && d.workingPeakHeadM > d.allowedHeadM) {
    const text = say`In normal running the ram and drive pipe see about ${amount('length', d.workingPeakHeadM)} of head, more than ${rated} holds.`;
    if (d.higherClassLabel && !(soft && !d.rigid))
      add('WORKING_PRESSURE_ABOVE_RATING', 'conditional', text, say`Use ${d.higherClassLabel} for the drive pipe and ram fittings.`);
    else if (!d.rigid)
      add('WORKING_PRESSURE_ABOVE_RATING', 'conditional', text, 'Use a galvanized steel drive pipe, rated for the working and blocked-delivery pressures.');
    else add('WORKING_PRESSURE_ABOVE_RATING', 'no-go', say`${text} No class of it made in ${d.sizeLabel} holds it.`);
  } else if (over) {
    const text = say`If the delivery is blocked (a shut valve, a float valve, a waterlogged air vessel) the ram and drive pipe see up to ${amount('length', d.blockedDeliveryHeadM)} (fall plus surge), more than ${rated} holds; in normal running they see about ${amount('length', d.workingPeakHeadM)}.`;
    if (d.higherClassLabel) add('BLOCKED_PRESSURE_ABOVE_RATING', 'conditional', text, say`Use ${d.higherClassLabel} for the drive pipe and ram fittings.`);
    else
      add(
        'BLOCKED_PRESSURE_ABOVE_RATING',
        'conditional',
        text,
        say`Never let the delivery be shut while the ram runs: fit a pressure-relief valve at the ram set below ${amount('length', d.allowedHeadM)} of head, no float valve on the delivery, and keep the air vessel charged.`,
      );
  }
  if (!d.fittingsMade)
    add(
      'FITTINGS_NOT_MADE',
      'note',
      say`Threaded fittings of the class chosen (${d.classLabel}) are not made in ${d.sizeLabel}: use flanged or welded joints of the same rating.`,
    );
  if (d.cyclicDerated)
    add(
      'PLASTIC_DRIVE_PIPE',
      'note',
      say`A plastic drive pipe is counted at half its pressure class because a ram cycles it ten to a hundred million times a year, and its give weakens the pulse; a rigid galvanized steel drive pipe is the usual choice.`,
    );
  if (soft) {
    const text = say`The drive flow (about ${amount('speed', d.closureVelocityMps)} at valve closure) is too slow to raise the ${amount('length', f.totalLiftM)} lift above the fall in this pipe (needs ${amount('speed', d.minimumClosureVelocityMps)}).`;
    if (d.rigid) add('DRIVE_TOO_SOFT', 'no-go', say`${text} Find more fall or a lower tank.`);
    else add('DRIVE_TOO_SOFT', 'conditional', text, 'Use a rigid (galvanized steel) drive pipe.');
  }
  if (d.lengthGiven && (d.lengthM < d.bandMinM || d.lengthM > d.bandMaxM)) {
    const fix =
      d.lengthM > d.bandMaxM
        ? say`Build an open stand pipe or tank about ${amount('length', d.bandMaxM)} up the drive pipe from the ram, fed from the intake.`
        : say`Lengthen the drive pipe to ${amount('length', d.bandMinM)}–${amount('length', d.bandMaxM)}.`;
    add(
      'DRIVE_LENGTH_OUT_OF_BAND',
      'conditional',
      say`The drive pipe is ${amount('length', d.lengthM)}; the ${d.bandRule} rule gives ${amount('length', d.bandMinM)}–${amount('length', d.bandMaxM)}.`,
      fix,
    );
  }
  if (d.lengthConflict === 'fall-band-above-ld') {
    add(
      'DRIVE_BANDS_CONFLICT',
      'note',
      say`The ${d.bandRule} rule asks for ${amount('length', d.bandMinM)}–${amount('length', d.bandMaxM)} of drive pipe, but more than ${amount('length', d.ldMaxM)} is over 1,000 times its bore; the screen uses ${amount('length', d.lengthM)}. Where the intake is farther from the ram, feed an open stand pipe that far up the line and start the drive pipe there.`,
    );
  } else if (d.lengthConflict === 'fall-band-below-ld') {
    add(
      'DRIVE_BANDS_CONFLICT',
      'note',
      say`The ${d.bandRule} rule gives at most ${amount('length', d.bandMaxM)} of drive pipe, but it needs at least ${amount('length', d.ldMinM)} (150 times its bore) to beat steadily; the screen uses ${amount('length', d.lengthM)}, laid at a gentle slope.`,
    );
  }
  if (d.lengthToDiameter < 150 || d.lengthToDiameter > 1000) {
    add(
      'DRIVE_LD_OUT_OF_BAND',
      'conditional',
      say`The drive pipe's length is ${amount('ratio', d.lengthToDiameter)} times its bore; 150–1,000 is advised.`,
      say`Make the drive pipe ${amount('length', d.ldMinM)}–${amount('length', d.ldMaxM)} long, or change its size.`,
    );
  }
  if (d.smallerThanRam)
    add('DRIVE_SMALLER_THAN_RAM', 'conditional', 'The drive pipe is smaller than the ram size the screen chose.', 'Use a drive pipe of the ram inlet size.');
}

/** Applies the verdict rules for a ram to the computed facts. */
export function judge(f: RamVerdictFacts): Judgement {
  const { add, reasons, conditions } = collector();

  // Fall: compared at the millimetre the text shows.
  const fallMm = roundMm(f.fallM);
  if (fallMm < MIN_FALL_M) {
    add('FALL_TOO_SMALL', 'no-go', say`The fall is ${amount('level', fallMm)}; a ram needs at least ${amount('level', MIN_FALL_M)}.`);
  } else if (f.plan.status === 'no-ram' && f.plan.cause === 'fall') {
    add(
      'FALL_BELOW_RAM_SIZES',
      'no-go',
      say`The fall is ${amount('level', fallMm)}; the rams of the size table need at least ${amount('level', f.leastRamFallM)} (Ogden 1911).`,
    );
  }
  judgeSurvey(f, add);

  // Water and ram size
  if (f.plan.status === 'no-ram' && f.plan.cause === 'flow') {
    add(
      'FLOW_TOO_SMALL',
      'no-go',
      say`The ram may take ${amount('flowLpm', f.availableLpm)} (${amount('percent', f.designFraction)} of the lowest flow); the smallest ram in the size table needs ${amount('flowLpm', f.smallestRamMinLpm)}.`,
    );
  } else if (f.plan.status === 'no-ram' && (f.plan.cause === 'push' || f.plan.cause === 'soft')) {
    add(
      'FALL_CANNOT_PUSH',
      'no-go',
      say`A fall of ${amount('length', f.fallM)} cannot push the least drive flow of any ram that fits the water through its drive pipe.`,
    );
  } else if (f.plan.status !== 'no-ram' && f.plan.count > 1) {
    add(
      'RAMS_IN_PARALLEL',
      'note',
      say`One ram cannot use the water needed: ${f.plan.count} rams of ${f.plan.sizeLabel}, each on its own drive pipe, share one delivery pipe.`,
    );
  }

  // Lift
  if (f.plan.status !== 'no-ram' && fallMm >= MIN_FALL_M) {
    if (roundMm(f.liftRatio) > MAX_LIFT_RATIO) {
      add(
        'LIFT_RATIO_TOO_HIGH',
        'no-go',
        say`The lift is ${amount('ratio', f.liftRatio)} times the fall (${amount('length', f.totalLiftM)} over ${amount('length', f.fallM)}); rams are offered up to about ${MAX_LIFT_RATIO} times.`,
      );
    } else if (f.efficiencyStatus === 'above-range') {
      add(
        'LIFT_RATIO_BEYOND_CURVE',
        'no-go',
        say`The lift ratio ${amount('ratio', f.liftRatio)} is beyond the ${f.curveLabel} (up to ${f.curveRange[1]}); no efficiency can be stated.`,
      );
    } else if (f.liftRatio > WARN_LIFT_RATIO) {
      add(
        'LIFT_RATIO_HIGH',
        'conditional',
        say`The lift is ${amount('ratio', f.liftRatio)} times the fall; efficiency is low and uncertain above ${WARN_LIFT_RATIO}.`,
        "Confirm the delivery with the ram maker's data for this lift ratio, or find more fall.",
      );
    }
    if (f.liftRatio > f.curveStatedUpTo && f.liftRatio <= f.curveRange[1]) {
      add(
        'LIFT_RATIO_BEYOND_STATED',
        'note',
        say`The ${f.curveLabel} is stated up to a lift ratio of ${f.curveStatedUpTo}; at ${amount('ratio', f.liftRatio)} it likely overstates the delivery.`,
      );
    }
    if (f.efficiencyStatus === 'below-range') {
      add(
        'LIFT_RATIO_BELOW_CURVE',
        'note',
        say`The lift ratio ${amount('ratio', f.liftRatio)} is below the ${f.curveLabel} (from ${f.curveRange[0]}); the share of the drive water delivered is held at its first value, not extended.`,
      );
    }
    if (f.liftRatio < LOW_LIFT_RATIO) {
      add(
        'LIFT_RATIO_LOW',
        'note',
        say`The tank is only ${amount('ratio', f.liftRatio)} times the fall above the ram; a ram does little below about ${LOW_LIFT_RATIO}. A site with more fall, or the tank set a little lower so it fills by gravity, may serve better.`,
      );
    }
    if (roundMm(f.totalLiftM) < MIN_DELIVERY_HEAD_M) {
      add(
        'LIFT_BELOW_START_HEAD',
        'conditional',
        say`The total lift of ${amount('length', f.totalLiftM)} is below the ~${amount('length', MIN_DELIVERY_HEAD_M)} a ram needs to cycle.`,
        say`Raise the tank or lead the delivery pipe up a rise so the ram sees at least ${amount('length', MIN_DELIVERY_HEAD_M)} of back-pressure.`,
      );
    }
  }
  const blocked = reasons.some((r) => r.severity === 'no-go');

  if (!blocked) {
    judgeDemand(f, add);
    if (f.drive) judgeDrive(f, f.drive, add);
    if (f.delivery.ratingM < f.totalLiftM * DELIVERY_SAFETY_FACTOR) {
      add(
        'DELIVERY_PIPE_RATING_LOW',
        'conditional',
        say`The delivery pipe (${f.delivery.classLabel}) is rated for ${amount('length', f.delivery.ratingM)}, less than ${DELIVERY_SAFETY_FACTOR} × the ${amount('length', f.totalLiftM)} lift.`,
        say`Use delivery pipe rated for at least ${amount('length', f.totalLiftM * DELIVERY_SAFETY_FACTOR)} of head near the ram (a higher class, or steel for the first lengths).`,
      );
    }
    if (f.delivery.frictionOverLimit && f.fix?.kind !== 'delivery-pipe' && !reasons.some((r) => r.code === 'DEMAND_NOT_MET')) {
      add(
        'DELIVERY_FRICTION_HIGH',
        'note',
        say`Friction in the delivery pipe takes ${amount('length', f.delivery.frictionM)}, more than 10 % of the ${amount('length', f.staticLiftM)} static lift${f.delivery.diameterGiven ? '' : ' even in the largest size'}.`,
      );
    }
  }
  return finish(reasons, conditions);
}

/** What the readings say of the site before any outcome is chosen: the same facts judge a ram and a gravity supply. */
export type SurveyFacts = Pick<
  RamVerdictFacts,
  | 'fallM'
  | 'fallSigmaM'
  | 'fallRunsDisagree'
  | 'misclosures'
  | 'bookingFailed'
  | 'anyDrySeason'
  | 'lowHeadMeasurements'
  | 'lowestLpm'
  | 'demandLpd'
  | 'marginFraction'
>;

export interface GravityVerdictFacts extends SurveyFacts, Pick<RamVerdictFacts, 'availableLpm' | 'designFraction'> {
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
  add(
    'GRAVITY_SUPPLY',
    'note',
    say`The tank's water level is ${amount('length', f.headM)} below the intake: a pipe fills it by gravity and no pump is needed.`,
  );
  judgeSurvey(f, add);
  if (f.fallSigmaM > 0 && f.headM < 2 * f.fallSigmaM) {
    add(
      'GRAVITY_HEAD_UNCERTAIN',
      'conditional',
      say`The ${amount('length', f.headM)} difference in level is within the survey's uncertainty (±${amount('length', f.fallSigmaM)}).`,
      'Level the intake and the tank site against each other before laying pipe.',
    );
  }
  if (f.pipeLabel !== null && f.givenShortLpd !== null) {
    add(
      'GRAVITY_PIPE_TOO_SMALL',
      'conditional',
      say`The pipe as recorded carries only about ${amount('litresPerDay', f.givenShortLpd)} over ${amount('length', f.pipeLengthM)} with ${amount('length', f.headM)} of fall; the figures here assume a ${f.pipeLabel} pipe.`,
      say`Use a ${f.pipeLabel} pipe from the intake to the tank.`,
    );
  }
  if (f.pipeLabel === null) {
    add(
      'GRAVITY_HEAD_TOO_SMALL',
      'no-go',
      say`Over ${amount('length', f.pipeLengthM)} of pipe, friction takes more than the ${amount('length', f.headM)} difference in level in every pipe size at the ${amount('litresPerDay', needLpd)} needed. Set the tank lower or find a shorter route.`,
    );
  }
  // Compared at the litre the sheet shows: a need that rounds to 0 L/day is no need recorded.
  if (Math.round(f.demandLpd) <= 0) {
    add(
      'DEMAND_MISSING',
      'conditional',
      'No water need was recorded, so the pipe could not be sized for it.',
      'Record what the farm needs (people, animals, garden) and screen again.',
    );
  } else if (f.availableLpm * 1440 < f.demandLpd) {
    add(
      'DEMAND_NOT_MET',
      'no-go',
      say`The stream can spare ${amount('litresPerDay', f.availableLpm * 1440)} (${amount('percent', f.designFraction)} of the lowest flow), less than the ${amount('litresPerDay', f.demandLpd)} needed.`,
    );
  } else if (f.availableLpm * 1440 < needLpd) {
    add(
      'DEMAND_MARGIN_THIN',
      'conditional',
      say`The stream can spare ${amount('litresPerDay', f.availableLpm * 1440)}, within the ${amount('percent', f.marginFraction)} margin over the ${amount('litresPerDay', f.demandLpd)} demand.`,
      'Agree a smaller demand, or a larger tank to ride through dry spells.',
    );
  }
  return finish(reasons, conditions, 'gravity');
}
