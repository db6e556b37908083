import { describe, expect, it } from 'vitest';
import {
  cfsToLps,
  ftToM,
  gpmToLpm,
  headMToPsi,
  inToMm,
  kPaToPsi,
  lpmToGpm,
  lpsToLpm,
  mToFt,
  parseFieldNumber,
  parseFieldNumberOrUndefined,
  psiToHeadM,
  psiToKPa,
  usGalToL,
} from '@/lib/shared/units';

describe('unit definitions (international foot 1959; US gallon 231 in³)', () => {
  it('1 ft = 0.3048 m exactly; 1 in = 25.4 mm; 1 US gal = 231 in³ = 3.785411784 L', () => {
    expect(ftToM(1)).toBe(0.3048);
    expect(inToMm(1)).toBe(25.4);
    expect(usGalToL(1)).toBeCloseTo((231 * 2.54 ** 3) / 1000, 12);
  });
  it('1 psi = 6.894757 kPa (lbf/in²) and 2.31 ft of water (common practice of the trade)', () => {
    expect(psiToKPa(1)).toBeCloseTo((0.45359237 * 9.80665) / 0.0254 ** 2 / 1000, 9);
    expect(mToFt(psiToHeadM(1))).toBeCloseTo(2.31, 2);
  });
  it('1 cfs = 28.317 L/s; 1 gpm = 3.785 L/min; 1 L/s = 60 L/min', () => {
    expect(cfsToLps(1)).toBeCloseTo(28.3168, 4);
    expect(gpmToLpm(1)).toBeCloseTo(3.7854, 4);
    expect(lpsToLpm(1)).toBe(60);
  });
  it('conversions round-trip', () => {
    for (const x of [0.001, 1, 3.7, 250]) {
      expect(mToFt(ftToM(x))).toBeCloseTo(x, 10);
      expect(lpmToGpm(gpmToLpm(x))).toBeCloseTo(x, 10);
      expect(kPaToPsi(psiToKPa(x))).toBeCloseTo(x, 10);
      expect(psiToHeadM(headMToPsi(x))).toBeCloseTo(x, 10);
    }
  });
});

describe('field number parser', () => {
  it.each([
    ['3.5', 3.5],
    ['3,5', 3.5],
    [' 12 ', 12],
    ['-2,25', -2.25],
    [',5', 0.5],
    ['0.', 0],
    ['+7', 7],
  ])('reads %j as %d', (text, value) => {
    expect(parseFieldNumber(text)).toEqual({ ok: true, value });
  });
  it.each(['abc', '1,234.5', '1.2.3', '12 m', '1e3', '--1', 'NaN', 'Infinity', '.', ','])('rejects %j', (text) => {
    expect(parseFieldNumber(text)).toEqual({ ok: false, error: 'not-a-number' });
    expect(parseFieldNumberOrUndefined(text)).toBeUndefined();
  });
  it('calls empty input empty, not zero', () => {
    expect(parseFieldNumber('')).toEqual({ ok: false, error: 'empty' });
    expect(parseFieldNumber('   ')).toEqual({ ok: false, error: 'empty' });
    expect(parseFieldNumber(undefined)).toEqual({ ok: false, error: 'empty' });
  });
});
