import { describe, expect, it } from 'vitest';
import { QUANTITIES, dailyInWords, pressureHead, quantity, showQuantity, typedQuantity } from '@/lib/shared/display/quantities';
import { parseFieldNumber } from '@/lib/shared/units';

describe('quantities in the reader units', () => {
  // 1 ft = 0.3048 m exactly (international foot, 1959); 1 US gal = 3.785411784 L exactly.
  it('metres as feet and litres as US gallons, rounded by size', () => {
    expect(showQuantity(0.3048, 'length', 'us')).toBe('1.00 ft');
    expect(showQuantity(3.048, 'length', 'metric')).toBe('3.05 m');
    expect(showQuantity(30.48, 'length', 'us')).toBe('100 ft');
    expect(showQuantity(3.785411784, 'volume', 'us')).toBe('1.00 gal');
    expect(showQuantity(20, 'volume', 'metric')).toBe('20.0 L');
  });

  it('one rounding for a daily volume wherever it is shown', () => {
    expect(showQuantity(1128.4, 'litresPerDay', 'metric')).toBe('1,130 L/day');
    expect(quantity(1128.4, 'litresPerDay', 'metric')).toEqual({ number: '1,130', unit: 'L/day', text: '1,130 L/day' });
    expect(showQuantity(3.785411784 * 2284, 'litresPerDay', 'us')).toBe('2,280 gal/day');
    expect(dailyInWords(3.785411784 * 612, 'us')).toBe('612 gallons');
  });

  it('a fix accuracy in whole units, a pipe to buy rounded up', () => {
    expect(showQuantity(6, 'accuracy', 'metric')).toBe('6 m');
    expect(showQuantity(6, 'accuracy', 'us')).toBe('20 ft');
    expect(showQuantity(120.2, 'pipeLength', 'metric')).toBe('121 m');
    expect(showQuantity(30.48, 'pipeLength', 'us')).toBe('100 ft');
  });

  it('flows, bores and pressures in each system', () => {
    expect(showQuantity(1, 'flowLps', 'us')).toBe('15.9 gal/min');
    expect(showQuantity(0.35, 'flowLps', 'metric')).toBe('0.35 L/s');
    expect(showQuantity(3.785411784 * 12, 'flowLpm', 'us')).toBe('12.0 gal/min');
    expect(showQuantity(25.4, 'diameter', 'us')).toBe('1.00 in');
    expect(showQuantity(25, 'diameter', 'metric')).toBe('25 mm');
    expect(pressureHead(45, 'metric')).toBe('45.0 m of head (441 kPa)');
    expect(pressureHead(45, 'us')).toBe('148 ft of head (64.0 psi)');
  });

  it('an absent value shows a dash', () => {
    expect(showQuantity(null, 'length', 'metric')).toBe('—');
    expect(showQuantity(Number.NaN, 'length', 'us')).toBe('—');
  });

  it('a stored value goes into a field with sensible decimals, and a typed value back to SI exactly', () => {
    expect(typedQuantity(20, 'volume', 'us')).toBe('5.28');
    expect(typedQuantity(50, 'volume', 'us')).toBe('13.21');
    expect(typedQuantity(1234.5678, 'length', 'metric')).toBe('1234.568');
    expect(typedQuantity(undefined, 'length', 'metric')).toBe('');
    for (const kind of Object.values(QUANTITIES)) {
      for (const d of Object.values(kind)) expect(d.toSi(d.fromSi(12.345))).toBeCloseTo(12.345, 9);
    }
    // What the field shows parses back (no thousands separators) to within its shown precision.
    const parsed = parseFieldNumber(typedQuantity(12345.678, 'volume', 'us'));
    expect(parsed.ok && QUANTITIES.volume.us.toSi(parsed.value)).toBeCloseTo(12345.678, 1);
  });
});
