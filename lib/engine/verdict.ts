// Verdict rules: each threshold is a named constant with its source; reasons carry the numbers in plain words.
import { fmt, pct } from './format';
import type { Condition, Reason, Verdict } from './screening-types';

/** Least usable fall, m (Water for the World RWS.4.D.5; found). */
export const MIN_FALL_M = 0.5;
/** Lift ratio above which no ram is offered (Ogden 1911: about 30 ft per ft of fall; found). */
export const MAX_LIFT_RATIO = 30;
/** Lift ratio above which efficiency falls off sharply: warn (common practice, no source). */
export const WARN_LIFT_RATIO = 20;
/** Source should give at least 7 × the pumped water (Water for the World RWS.4.D.5; found). */
export const MIN_SUPPLY_MULTIPLE = 7;
/** Back-pressure the ram needs to cycle, m (≈10 psi, Clemson/Smith; found). */
export const MIN_DELIVERY_HEAD_M = 7;
/** Fall uncertainty (1σ) above this share of the fall calls for a better survey (common practice, no source). */
export const MAX_FALL_RELATIVE_SIGMA = 0.1;
/** Below this probability of meeting demand the screen is conditional even when the mean meets it (brief). */
export const MIN_PROBABILITY_MEETS = 0.5;

export interface VerdictFacts {
  fallM: number;
  fallSigmaM: number;
  fallRunsDisagree: number[];
  misclosures: { index: number; misclosureMm: number; allowedMm: number }[];
  bookingFailed: number[];
  anyDrySeason: boolean;
  lowHeadMeasurements: number[];
  lowestLpm: number;
  designLpm: number;
  designFraction: number;
  ramStatus: 'in-table' | 'below-table' | 'capped';
  ramMinLpm: number;
  driveLpm: number;
  staticLiftM: number;
  totalLiftM: number;
  liftRatio: number;
  efficiencyStatus: 'in-range' | 'below-range' | 'above-range';
  curveLabel: string;
  curveRange: [number, number];
  deliveryLpm: number;
  demandLpd: number;
  marginFraction: number;
  /** Delivery with the recommended delivery pipe, when the visit fixed a smaller one. */
  deliveryWithRecommendedPipeLpd: number | null;
  recommendedDeliveryLabel: string | null;
  /** Delivery when taking the organisation's largest allowed share of the lowest flow. */
  deliveryAtMaxFractionLpd: number | null;
  maxFraction: number;
  probabilityMeets: number | null;
  drive: {
    lengthM: number; lengthGiven: boolean; bandMinM: number; bandMaxM: number; bandRule: string;
    lengthToDiameter: number; closureVelocityMps: number; minimumClosureVelocityMps: number;
    peakPressureHeadM: number; surgeHeadM: number; ratingM: number; classLabel: string; higherClassLabel: string | null;
    materialLabel: string; smallerThanRam: boolean;
  };
  delivery: { frictionM: number; ratingM: number; classGiven: boolean; classLabel: string; diameterGiven: boolean };
}

export interface Judgement {
  verdict: Verdict;
  reasons: Reason[];
  conditions: Condition[];
}

/** Applies the verdict rules to the computed facts. */
export function judge(f: VerdictFacts): Judgement {
  const reasons: Reason[] = [];
  const conditions: Condition[] = [];
  const add = (code: string, severity: Reason['severity'], text: string, condition?: string) => {
    reasons.push({ code, severity, text });
    if (condition) conditions.push({ code, text: condition });
  };
  const deliveryLpd = f.deliveryLpm * 1440;
  const needLpd = f.demandLpd * (1 + f.marginFraction);

  // Fall
  if (f.fallM < MIN_FALL_M) {
    add('FALL_TOO_SMALL', 'no-go', `The fall is ${fmt(f.fallM, 'm')}; a ram needs at least ${fmt(MIN_FALL_M, 'm')}.`);
  } else if (f.fallSigmaM > MAX_FALL_RELATIVE_SIGMA * f.fallM) {
    add('FALL_UNCERTAIN', 'conditional', `The fall of ${fmt(f.fallM, 'm')} is known only to ±${fmt(f.fallSigmaM, 'm')}.`, 'Measure the fall again with a level and staff or a hose level before buying pipe.');
  }
  if (f.fallRunsDisagree.length > 0) {
    add('FALL_RUNS_DISAGREE', 'conditional', `Fall run(s) ${f.fallRunsDisagree.map((i) => i + 1).join(', ')} disagree with the most precise run by more than their uncertainty allows.`, 'Walk the drive pipe route again and repeat the fall measurement.');
  }
  for (const m of f.misclosures) {
    add('FALL_MISCLOSURE', 'conditional', `Level run ${m.index + 1} closes to ${fmt(Math.abs(m.misclosureMm), 'mm')}, more than the ${fmt(m.allowedMm, 'mm')} allowed.`, 'Repeat the level run out and back until it closes.');
  }
  for (const i of f.bookingFailed) add('FALL_BOOKING_CHECK', 'conditional', `Level run ${i + 1} fails the arithmetic check of its booking.`, 'Check the booking of the level run.');

  // Flow
  if (!f.anyDrySeason) {
    add('FLOW_NOT_DRY_SEASON', 'conditional', `No flow was measured in the dry season; the lowest measured flow is ${fmt(f.lowestLpm, 'L/min')}.`, 'Measure the flow again at the end of the dry season, or check local records, before building.');
  }
  for (const i of f.lowHeadMeasurements) add('FLOW_HEAD_BELOW_RANGE', 'note', `Flow measurement ${i + 1} read less than 6 cm on the weir, below its reliable range.`);
  if (f.ramStatus === 'below-table') {
    add('FLOW_TOO_SMALL', 'no-go', `The design flow is ${fmt(f.designLpm, 'L/min')} (${pct(f.designFraction)} of the lowest flow); the smallest ram in the size table needs ${fmt(f.ramMinLpm, 'L/min')}.`);
  } else if (f.ramStatus === 'capped') {
    add('DRIVE_FLOW_CAPPED', 'note', `The ram can use ${fmt(f.driveLpm, 'L/min')} of the ${fmt(f.designLpm, 'L/min')} design flow; more flow needs a second ram.`);
  }

  // Lift
  if (f.ramStatus !== 'below-table' && f.fallM >= MIN_FALL_M) {
    if (f.liftRatio <= 1) {
      add('LIFT_NOT_ABOVE_FALL', 'no-go', `The tank (${fmt(f.totalLiftM, 'm')} above the pump) is not above the intake (${fmt(f.fallM, 'm')}): pipe the water by gravity, no ram is needed.`);
    } else if (f.liftRatio > MAX_LIFT_RATIO) {
      add('LIFT_RATIO_TOO_HIGH', 'no-go', `The lift is ${fmt(f.liftRatio)} times the fall (${fmt(f.totalLiftM, 'm')} over ${fmt(f.fallM, 'm')}); rams are offered up to about ${MAX_LIFT_RATIO} times.`);
    } else if (f.efficiencyStatus === 'above-range') {
      add('LIFT_RATIO_BEYOND_CURVE', 'no-go', `The lift ratio ${fmt(f.liftRatio)} is beyond the ${f.curveLabel} (up to ${f.curveRange[1]}); no efficiency can be stated.`);
    } else if (f.liftRatio > WARN_LIFT_RATIO) {
      add('LIFT_RATIO_HIGH', 'conditional', `The lift is ${fmt(f.liftRatio)} times the fall; efficiency is low and uncertain above ${WARN_LIFT_RATIO}.`, "Confirm the delivery with the ram maker's data for this lift ratio, or find more fall.");
    }
    if (f.efficiencyStatus === 'below-range' && f.liftRatio > 1) {
      add('LIFT_RATIO_BELOW_CURVE', 'note', `The lift ratio ${fmt(f.liftRatio)} is below the ${f.curveLabel} (from ${f.curveRange[0]}); its first value is used, not extended.`);
    }
    if (f.totalLiftM < MIN_DELIVERY_HEAD_M && f.liftRatio > 1) {
      add('LIFT_BELOW_START_HEAD', 'conditional', `The total lift of ${fmt(f.totalLiftM, 'm')} is below the ~${MIN_DELIVERY_HEAD_M} m a ram needs to cycle.`, 'Raise the tank or lead the delivery pipe up a rise so the ram sees at least 7 m of back-pressure.');
    }
  }
  const blocked = reasons.some((r) => r.severity === 'no-go');

  // Supply multiple and demand (only meaningful when a ram can run)
  if (!blocked) {
    const multiple = f.deliveryLpm > 0 ? f.lowestLpm / f.deliveryLpm : Infinity;
    if (multiple < MIN_SUPPLY_MULTIPLE) {
      add('SUPPLY_MULTIPLE_LOW', 'conditional', `The source gives ${fmt(multiple)} times the pumped water; at least ${MIN_SUPPLY_MULTIPLE} times is advised.`, 'Confirm the source can spare the water, or take less.');
    }
    if (deliveryLpd < f.demandLpd) {
      const shortfall = `The ram would deliver ${fmt(deliveryLpd, 'L/day')} against a demand of ${fmt(f.demandLpd, 'L/day')}`;
      if (f.deliveryWithRecommendedPipeLpd !== null && f.deliveryWithRecommendedPipeLpd >= f.demandLpd) {
        add('DEMAND_NOT_MET', 'conditional', `${shortfall}; the delivery pipe loses too much lift to friction.`, `Use a ${f.recommendedDeliveryLabel} delivery pipe (or a shorter run): it delivers about ${fmt(f.deliveryWithRecommendedPipeLpd, 'L/day')}.`);
      } else if (f.deliveryAtMaxFractionLpd !== null && f.deliveryAtMaxFractionLpd >= f.demandLpd) {
        add('DEMAND_NOT_MET', 'conditional', `${shortfall} when taking ${pct(f.designFraction)} of the lowest flow.`, `Take up to ${pct(f.maxFraction)} of the lowest flow (about ${fmt(f.deliveryAtMaxFractionLpd, 'L/day')} delivered) only if the stream below can spare it.`);
      } else {
        add('DEMAND_NOT_MET', 'no-go', `${shortfall}.`);
      }
    } else if (deliveryLpd < needLpd) {
      add('DEMAND_MARGIN_THIN', 'conditional', `The ram would deliver ${fmt(deliveryLpd, 'L/day')}, within the ${pct(f.marginFraction)} margin over the ${fmt(f.demandLpd, 'L/day')} demand.`, 'Agree a smaller demand, or a larger tank to ride through dry spells.');
    } else if (f.probabilityMeets !== null && f.probabilityMeets < MIN_PROBABILITY_MEETS) {
      add('DEMAND_UNCERTAIN', 'conditional', `Given the measurement uncertainty, the chance of meeting the demand is only ${pct(f.probabilityMeets)}.`, 'Measure the fall and flow more precisely before building.');
    }
  }

  // Drive pipe
  const d = f.drive;
  if (!blocked) {
    if (d.peakPressureHeadM > d.ratingM) {
      const text = `Lift plus surge reaches ${fmt(d.peakPressureHeadM, 'm')} of head (surge ${fmt(d.surgeHeadM, 'm')}) against the drive pipe's rating of ${fmt(d.ratingM, 'm')} (${d.classLabel}).`;
      if (d.higherClassLabel) add('SURGE_ABOVE_RATING', 'conditional', text, `Use ${d.higherClassLabel} for the drive pipe and ram fittings.`);
      else add('SURGE_ABOVE_RATING', 'no-go', `${text} No higher class of ${d.materialLabel} holds it; a larger drive pipe lowers the surge, so screen again with one.`);
    }
    if (d.closureVelocityMps < d.minimumClosureVelocityMps) {
      add('DRIVE_TOO_SOFT', 'conditional', `The drive flow (about ${fmt(d.closureVelocityMps, 'm/s')} at valve closure) is too slow to raise a surge of the ${fmt(f.totalLiftM, 'm')} lift in this pipe (needs ${fmt(d.minimumClosureVelocityMps, 'm/s')}).`, 'Use a rigid (galvanized steel) drive pipe.');
    }
    if (d.lengthGiven && (d.lengthM < d.bandMinM || d.lengthM > d.bandMaxM)) {
      const fix = d.lengthM > d.bandMaxM
        ? `Build an open stand pipe or tank about ${fmt(d.bandMaxM, 'm')} up the drive pipe from the ram.`
        : `Lengthen the drive pipe to ${fmt(d.bandMinM, 'm')}–${fmt(d.bandMaxM, 'm')}.`;
      add('DRIVE_LENGTH_OUT_OF_BAND', 'conditional', `The drive pipe is ${fmt(d.lengthM, 'm')}; the ${d.bandRule} rule gives ${fmt(d.bandMinM, 'm')}–${fmt(d.bandMaxM, 'm')}.`, fix);
    }
    if (d.lengthToDiameter < 150 || d.lengthToDiameter > 1000) {
      add('DRIVE_LD_OUT_OF_BAND', 'conditional', `The drive pipe's length is ${fmt(d.lengthToDiameter)} times its bore; 150–1000 is advised.`, 'Change the drive pipe length or size to bring length/bore within 150–1000.');
    }
    if (d.smallerThanRam) add('DRIVE_SMALLER_THAN_RAM', 'conditional', 'The drive pipe is smaller than the ram size the flow calls for.', 'Use a drive pipe of the ram inlet size.');
    if (f.delivery.ratingM < f.totalLiftM * 1.25) {
      add('DELIVERY_PIPE_RATING_LOW', f.delivery.classGiven ? 'conditional' : 'note', `The delivery pipe (${f.delivery.classLabel}) is rated for ${fmt(f.delivery.ratingM, 'm')}, less than 1.25 × the ${fmt(f.totalLiftM, 'm')} lift.`, f.delivery.classGiven ? 'Use a higher pressure class of delivery pipe near the ram.' : undefined);
    }
    if (f.delivery.diameterGiven && f.delivery.frictionM > 0.1 * f.staticLiftM && !reasons.some((r) => r.code === 'DEMAND_NOT_MET')) {
      add('DELIVERY_FRICTION_HIGH', 'note', `Friction in the delivery pipe takes ${fmt(f.delivery.frictionM, 'm')}, more than 10 % of the static lift.`);
    }
  }

  const verdict: Verdict = reasons.some((r) => r.severity === 'no-go') ? 'no-go' : reasons.some((r) => r.severity === 'conditional') ? 'conditional' : 'go';
  // A no-go has no conditions: nothing listed would make it a go.
  return { verdict, reasons, conditions: verdict === 'no-go' ? [] : conditions };
}
