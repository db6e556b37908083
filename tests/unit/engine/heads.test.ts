import { describe, expect, it } from 'vitest';
import { EngineInputError, pressureHeadM, velocityHeadM } from '@/lib/engine';
import { expectWithin } from './helpers';

describe('heads', () => {
  it('1 psi (6.895 kPa) is 2.31 ft = 0.704 m of water (common practice of the trade, no source)', () => {
    expectWithin(pressureHeadM(6.894757), 0.704, 0.002);
  });
  it('100 kPa of sea water (1025 kg/m³) is 9.95 m (p/ρg, hand-computed)', () => {
    expectWithin(pressureHeadM(100, 1025), 9.95, 0.01);
  });
  it('velocity head v²/2g: 3.06 m/s (Çengel Example 8-3 velocity) gives 0.477 m (hand-computed)', () => {
    expectWithin(velocityHeadM(3.06), 0.477, 0.001);
  });
  it('rejects NaN', () => {
    expect(() => velocityHeadM(Number.NaN)).toThrow(EngineInputError);
    expect(() => pressureHeadM(10, 0)).toThrow(/densityKgM3/);
  });
});
