import { describe, expect, it } from 'vitest';
import { allowedMisclosureMm, barometricFallM, clinometerFallM, EngineInputError, hoseLevelFallM, levelRun } from '@/lib/engine';
import { expectWithin } from './helpers';

describe('levelling by height of instrument (surveying textbooks: HI = RL + BS, RL = HI − FS)', () => {
  // Invented booking, reduced by hand: HI 1.500 → RL −1.300; HI −0.700 → RL −3.800; HI −2.600 → RL −5.000.
  const rows = [{ backsightM: 1.5 }, { foresightM: 2.8, backsightM: 0.6 }, { foresightM: 3.1, backsightM: 1.2 }, { foresightM: 2.4 }];
  it('reduces the levels as worked by hand', () => {
    const run = levelRun(rows);
    [0, -1.3, -3.8, -5.0].forEach((rl, i) => expectWithin(run.reducedLevelsM[i] ?? NaN, rl, 1e-9));
  });
  it('fall equals ΣFS − ΣBS (arithmetic check: ΣBS − ΣFS = last RL − first RL)', () => {
    const run = levelRun(rows);
    expectWithin(run.fallM, 8.3 - 3.3, 1e-9);
    expect(run.arithmeticCheckOk).toBe(true);
    expect(run.setups).toBe(3);
  });
  it('a rising run gives a negative fall', () => {
    expectWithin(levelRun([{ backsightM: 2.0 }, { foresightM: 0.5 }]).fallM, -1.5, 1e-9);
  });
  it('rejects a booking with a foresight on the first station or a missing change-point sight', () => {
    expect(() => levelRun([{ backsightM: 1, foresightM: 1 }, { foresightM: 1 }])).toThrow(/rows\.0\.foresightM/);
    expect(() => levelRun([{ backsightM: 1 }, { foresightM: 1 }, { foresightM: 1 }])).toThrow(/rows\.1\.backsightM/);
  });
});

describe('clinometer (Δh = s·sin α; Peace Corps mapping notes, FAO topography manual)', () => {
  it('50 m slope distance at 6° below horizontal gives 5.23 m (REFERENCES §6)', () => {
    expectWithin(clinometerFallM([{ slopeDistanceM: 50, angleBelowHorizontalDeg: 6 }]), 5.23, 0.005);
  });
  it('a rising leg subtracts', () => {
    const legs = [
      { slopeDistanceM: 50, angleBelowHorizontalDeg: 6 },
      { slopeDistanceM: 50, angleBelowHorizontalDeg: -6 },
    ];
    expectWithin(clinometerFallM(legs), 0, 1e-9);
  });
});

describe('hose (water-tube) level: both surfaces at one elevation (construction guides; FAO)', () => {
  it('ground drops by lower reading − upper reading per step, hand-computed: 1.20 + 1.25 = 2.45 m', () => {
    const steps = [
      { upperReadingM: 0.2, lowerReadingM: 1.4 },
      { upperReadingM: 0.1, lowerReadingM: 1.35 },
    ];
    expectWithin(hoseLevelFallM(steps), 2.45, 1e-9);
  });
});

describe('allowed loop misclosure k·√K (orders of accuracy; US Army EN0593)', () => {
  it('first order 4.0 mm at 1 km; second 8.4 mm at 1 km; third 24 mm at 4 km', () => {
    expectWithin(allowedMisclosureMm(1, 'first'), 4.0, 1e-9);
    expectWithin(allowedMisclosureMm(1, 'second'), 8.4, 1e-9);
    expectWithin(allowedMisclosureMm(4, 'third'), 24.0, 1e-9);
  });
  it('rejects a zero-length loop', () => {
    expect(() => allowedMisclosureMm(0, 'third')).toThrow(EngineInputError);
  });
});

describe('barometric fall (standard atmosphere, about 8.3 m per hPa near sea level)', () => {
  it('1 hPa more at the lower station near 1013 hPa is about 8.3 m of fall', () => {
    expectWithin(barometricFallM(1012.25, 1013.25), 8.3, 0.1);
  });
});
