import { describe, expect, it } from 'vitest';
import { EngineInputError, floatFlowLps, rectangularWeirFlowLps, vNotchFlowLps, volumetricFlowLps } from '@/lib/engine';
import { cfsToLps, ftToM } from '@/lib/shared/units';
import { expectRelative, expectWithin } from './helpers';

describe('volumetric flow (bucket and stopwatch; Peace Corps hydram manual, Session 3)', () => {
  it('20 L in 8.0 s is 2.5 L/s = 150 L/min (REFERENCES §5, computed from Q = V/t)', () => {
    expectWithin(volumetricFlowLps([{ volumeL: 20, seconds: 8 }]), 2.5, 1e-9);
    expectWithin(volumetricFlowLps([{ volumeL: 20, seconds: 8 }]) * 60, 150, 1e-9);
  });
  it('takes the mean of the trials, not total volume over total time', () => {
    // (20/8 + 20/10)/2 = 2.25, whereas 40/18 would give 2.22
    expectWithin(
      volumetricFlowLps([
        { volumeL: 20, seconds: 8 },
        { volumeL: 20, seconds: 10 },
      ]),
      2.25,
      1e-9,
    );
  });
});

describe('V-notch weir, Kindsvater–Shen (ISO 1438; USBR Water Measurement Manual ch. 7, eq. 7-3)', () => {
  it('90° notch, h = 0.100 m gives 4.41 L/s (USBR WMM Ce 0.578, kh 0.85 mm)', () => {
    expectWithin(vNotchFlowLps(0.1), 4.41, 0.01);
  });
  it('agrees within 2 % with the USBR 90° rating Q = 2.49·h^2.48 (cfs, ft) at h = 0.5 ft (0.446 cfs)', () => {
    expectRelative(vNotchFlowLps(ftToM(0.5)), cfsToLps(0.446), 0.02);
  });
  it('agrees within 2 % with Thomson Q = 1.38·H^2.5 at 0.100 m (4.36 L/s, Cd 0.585)', () => {
    expectRelative(vNotchFlowLps(0.1), 4.36, 0.02);
  });
  it('a 60° notch passes about tan 30°/tan 45° of a 90° notch (ISO 1438 form; Ce for 60° from memory)', () => {
    expectRelative(vNotchFlowLps(0.2, 60) / vNotchFlowLps(0.2, 90), Math.tan(Math.PI / 6), 0.03);
  });
  it('rejects angles outside the method range 25–100° (USBR WMM ch. 7, Kulin & Compton 1975)', () => {
    expect(() => vNotchFlowLps(0.1, 120)).toThrow(EngineInputError);
    expect(() => vNotchFlowLps(0.1, 20)).toThrow(EngineInputError);
  });
});

describe('rectangular contracted weir, Francis (1883)', () => {
  it('L = 0.50 m, h = 0.10 m gives 27.9 L/s (REFERENCES §5; SI coefficient 1.84 from memory)', () => {
    expectWithin(rectangularWeirFlowLps({ crestWidthM: 0.5, headM: 0.1 }), 27.9, 0.05);
  });
  it('matches the US form Q = 3.33·(L − 0.2h)·h^1.5 in ft and cfs (found) within 0.5 %', () => {
    const lFt = 0.5 / 0.3048;
    const hFt = 0.1 / 0.3048;
    const usCfs = 3.33 * (lFt - 0.2 * hFt) * hFt ** 1.5;
    expectRelative(rectangularWeirFlowLps({ crestWidthM: 0.5, headM: 0.1 }), cfsToLps(usCfs), 0.005);
  });
});

describe('float method (Herschy; USGS WSP 2175, k = 0.85)', () => {
  it('surface velocity 0.50 m/s over 0.20 m² gives 0.085 m³/s = 85 L/s (REFERENCES §5)', () => {
    expectWithin(floatFlowLps({ distanceM: 10, seconds: 20, areaM2: 0.2 }), 85, 1e-9);
  });
  it('uses a stated coefficient when given (0.8, low end of Herschy 0.8–0.9)', () => {
    expectWithin(floatFlowLps({ distanceM: 10, seconds: 20, areaM2: 0.2, coefficient: 0.8 }), 80, 1e-9);
  });
});
