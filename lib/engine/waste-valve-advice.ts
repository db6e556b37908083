// Waste-valve tuning at commissioning: the cycle model at the measured fall and lift, set to the measured beats, against the design point.
import { amount, renderMessage, say, type Message } from '@/lib/shared/display/message';
import { BEATS_PER_MINUTE_BAND, closureForBeats, ramCycle, type RamCycle, type RamCycleInput } from './ram-cycle';
import { positive } from './validate';

/** Beats within this share of the design point's need no valve change (common practice, no source). */
export const BEATS_TOLERANCE_SHARE = 0.1;
/** Stroke assumed when none is recorded: the middle of the 10–25 mm the parts list quotes (common practice, no source). */
export const ASSUMED_STROKE_MM = 15;

/** The installed drive pipe and the flow the ram was designed to take (the screening's figures, per ram). */
export interface DesignPoint {
  driveLengthM: number;
  driveBoreMm: number;
  waveSpeedMps?: number;
  darcyF?: number;
  /** Drive flow per ram the screening sized the ram for, L/min. */
  driveLpm: number;
}

export type ValveMove = 'slow-down' | 'speed-up' | 'leave';

export interface WasteValveAdvice {
  move: ValveMove;
  /** The model at the measured fall and lift, with its valve set so it beats as measured. */
  atMeasuredBeats: Pick<RamCycle, 'beatsPerMinute' | 'driveLpm' | 'deliveryLpm' | 'efficiency'>;
  /** The model at the measured fall and lift, with its valve set so it takes the design drive flow. */
  atDesign: Pick<RamCycle, 'beatsPerMinute' | 'driveLpm' | 'deliveryLpm' | 'efficiency'>;
  /** The advice in metric words (kept for stored checks); `message` renders it in each reader's units. */
  text: string;
  message: Message;
}

const pick = (c: RamCycle) => ({ beatsPerMinute: c.beatsPerMinute, driveLpm: c.driveLpm, deliveryLpm: c.deliveryLpm, efficiency: c.efficiency });

/** Closure velocity at which the model takes a drive flow (bisection: the drive flow rises with the closure velocity), capped below the open-valve velocity. */
function closureForDriveFlow(p: RamCycleInput, driveLpm: number): number {
  const vInf = ramCycle(p, 1e-9).steadyVelocityMps;
  let lo = vInf * 1e-4;
  let hi = vInf * 0.995;
  if (ramCycle(p, hi).driveLpm <= driveLpm) return hi;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (ramCycle(p, mid).driveLpm < driveLpm) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

const round = (x: number) => Math.round(x);

/**
 * Which way to move the waste valve: the model (Iversen 1975 / Young 1996 cycle, ram-cycle.ts) is set once to beat as
 * measured and once to take the design drive flow (held within the quoted 40–120 beats a minute), both at the measured
 * fall and lift. Beating faster than the design
 * point means the valve shuts too early (lengthen the stroke or add weight); slower means it shuts too late (shorten
 * the stroke or take weight off). Null when the model cannot beat at the measured rate on this pipe and fall.
 */
export function wasteValveAdvice(
  measured: { fallM: number; liftM: number; beatsPerMinute: number; driveLpm: number; deliveredLpm: number },
  design: DesignPoint,
  strokeMm = ASSUMED_STROKE_MM,
): WasteValveAdvice | null {
  positive(design.driveLpm, 'design.driveLpm');
  const p: RamCycleInput = {
    fallM: measured.fallM,
    liftM: measured.liftM,
    driveLengthM: design.driveLengthM,
    driveBoreMm: design.driveBoreMm,
    ...(design.waveSpeedMps ? { waveSpeedMps: design.waveSpeedMps } : {}),
    ...(design.darcyF ? { darcyF: design.darcyF } : {}),
    strokeMm,
    valveWeightN: 1,
  };
  const vMeasured = closureForBeats(p, measured.beatsPerMinute);
  if (vMeasured === null) return null;
  const now = ramCycle(p, vMeasured);
  let target = ramCycle(p, closureForDriveFlow(p, design.driveLpm));
  // A design flow the pipe passes only at a crawl (or a trickle at a flutter) is held to the quoted beat band.
  const edge =
    target.beatsPerMinute < BEATS_PER_MINUTE_BAND.min
      ? BEATS_PER_MINUTE_BAND.min
      : target.beatsPerMinute > BEATS_PER_MINUTE_BAND.max
        ? BEATS_PER_MINUTE_BAND.max
        : null;
  const edgeClosure = edge === null ? null : closureForBeats(p, edge);
  if (edgeClosure !== null) target = ramCycle(p, edgeClosure);
  const ratio = measured.beatsPerMinute / target.beatsPerMinute;
  const designWords = say`the design point (about ${round(target.beatsPerMinute)} beats a minute taking ${amount('flowLpm', target.driveLpm)} of drive water)`;
  let move: ValveMove = 'leave';
  let message = say`The beat is close to ${designWords}: leave the waste valve as it is.`;
  if (ratio > 1 + BEATS_TOLERANCE_SHARE) {
    move = 'slow-down';
    message = say`The ram beats faster (${round(measured.beatsPerMinute)} a minute) than ${designWords}: the waste valve shuts too early. Lengthen its stroke or add weight, a little at a time, until it beats about ${round(target.beatsPerMinute)} a minute.`;
  } else if (ratio < 1 - BEATS_TOLERANCE_SHARE) {
    move = 'speed-up';
    message = say`The ram beats slower (${round(measured.beatsPerMinute)} a minute) than ${designWords}: the waste valve shuts too late and wastes drive water. Shorten its stroke or take weight off, a little at a time, until it beats about ${round(target.beatsPerMinute)} a minute.`;
  }
  return { move, atMeasuredBeats: pick(now), atDesign: pick(target), text: renderMessage(message, 'metric'), message };
}

/** The design point from a stored screening's figures (per ram), or null when a figure is missing. */
export function designPointFromFigures(figures: Partial<Record<string, { value: number | null }>>): DesignPoint | null {
  const v = (k: string) => figures[k]?.value ?? null;
  const length = v('driveLengthM');
  const bore = v('driveBoreMm');
  const flow = v('driveFlowLpm');
  const wave = v('waveSpeedMps');
  if (!(length && length > 0 && bore && bore > 0 && flow && flow > 0)) return null;
  return { driveLengthM: length, driveBoreMm: bore, driveLpm: flow, ...(wave && wave > 0 ? { waveSpeedMps: wave } : {}) };
}
