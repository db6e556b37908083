import { describe, expect, it } from 'vitest';
import { commissioningCheck, designPointFromFigures, ramCycle, wasteValveAdvice } from '@/lib/engine';

// An invented 2″ steel drive pipe, 15 m on a 3 m fall, lifting 30 m; the design drive flow is what the cycle model
// takes with a valve shutting at 1.5 m/s (stroke 15 mm), so the design beat is known from the model itself.
const design = { driveLengthM: 15, driveBoreMm: 52.5, waveSpeedMps: 1300, driveLpm: 0 };
const atDesign = ramCycle({ fallM: 3, liftM: 30, driveLengthM: 15, driveBoreMm: 52.5, waveSpeedMps: 1300, strokeMm: 15, valveWeightN: 1 }, 1.5);
design.driveLpm = atDesign.driveLpm;
const measured = (beatsPerMinute: number) => ({ fallM: 3, liftM: 30, beatsPerMinute, driveLpm: 60, deliveredLpm: 3 });

describe('wasteValveAdvice', () => {
  it('finds the design beat from the design drive flow', () => {
    const a = wasteValveAdvice(measured(atDesign.beatsPerMinute), design);
    expect(a?.atDesign.beatsPerMinute).toBeCloseTo(atDesign.beatsPerMinute, 1);
    expect(a?.move).toBe('leave');
    expect(a?.text).toMatch(/leave the waste valve as it is/);
  });
  it('beating much faster than the design point: lengthen the stroke or add weight', () => {
    const a = wasteValveAdvice(measured(atDesign.beatsPerMinute * 1.5), design);
    expect(a?.move).toBe('slow-down');
    expect(a?.text).toMatch(/Lengthen its stroke or add weight/);
    // The model beating that fast takes less drive water than at the design point.
    expect(a?.atMeasuredBeats.driveLpm).toBeLessThan(a?.atDesign.driveLpm ?? 0);
  });
  it('beating much slower than the design point: shorten the stroke or take weight off', () => {
    const a = wasteValveAdvice(measured(atDesign.beatsPerMinute * 0.7), design);
    expect(a?.move).toBe('speed-up');
    expect(a?.text).toMatch(/Shorten its stroke or take weight off/);
    expect(a?.atMeasuredBeats.driveLpm).toBeGreaterThan(a?.atDesign.driveLpm ?? 0);
  });
  it('no advice when the model cannot beat that fast on this pipe', () => {
    expect(wasteValveAdvice(measured(5000), design)).toBeNull();
  });
  it('commissioningCheck carries the advice only with the drive pipe figures, and not for readings that make energy', () => {
    const r = { driveLpm: 60, deliveredLpm: 3, beatsPerMinute: atDesign.beatsPerMinute * 1.5, liftM: 30, fallM: 3 };
    expect(commissioningCheck(r).valve).toBeNull();
    expect(commissioningCheck(r, null, design).valve?.move).toBe('slow-down');
    expect(commissioningCheck({ ...r, deliveredLpm: 20 }, null, design).valve).toBeNull();
  });
  it('commissioningCheck models the stroke the advisor recorded, and the assumed 15 mm without one', () => {
    const r = { driveLpm: 60, deliveredLpm: 3, beatsPerMinute: atDesign.beatsPerMinute, liftM: 30, fallM: 3 };
    const assumed = commissioningCheck(r, null, design).valve;
    expect(commissioningCheck({ ...r, wasteValveStrokeMm: 15 }, null, design).valve).toEqual(assumed);
    const long = commissioningCheck({ ...r, wasteValveStrokeMm: 25 }, null, design).valve;
    const short = commissioningCheck({ ...r, wasteValveStrokeMm: 10 }, null, design).valve;
    expect(long).toEqual(wasteValveAdvice(r, design, 25));
    // A longer stroke is a longer valve travel in each beat of the model's cycle: at the same drive
    // flow it beats fewer times a minute.
    expect(long?.atDesign.beatsPerMinute).toBeLessThan(assumed?.atDesign.beatsPerMinute ?? 0);
    expect(short?.atDesign.beatsPerMinute).toBeGreaterThan(assumed?.atDesign.beatsPerMinute ?? Infinity);
  });
  it('designPointFromFigures reads the drive pipe and the per-ram drive flow, or null when one is missing', () => {
    const f = { driveLengthM: { value: 15 }, driveBoreMm: { value: 52.5 }, driveFlowLpm: { value: 80 }, waveSpeedMps: { value: 1290 } };
    expect(designPointFromFigures(f)).toEqual({ driveLengthM: 15, driveBoreMm: 52.5, driveLpm: 80, waveSpeedMps: 1290 });
    expect(designPointFromFigures({ ...f, driveBoreMm: { value: null } })).toBeNull();
  });
});

describe('wasteValveAdvice design beat', () => {
  it('a design flow the pipe passes only at a crawl is held to the 40 beats a minute the notes quote', () => {
    const a = wasteValveAdvice(measured(200), { driveLengthM: 24, driveBoreMm: 40.9, waveSpeedMps: 1300, driveLpm: 120 });
    expect(a?.atDesign.beatsPerMinute).toBeCloseTo(40, 1);
    expect(a?.move).toBe('slow-down');
  });
});
