import { describe, expect, it } from 'vitest';
import { QUANTITIES, showQuantity } from '@/lib/shared/quantities';

describe('showing readings in the reader units', () => {
  // 1 ft = 0.3048 m exactly (international foot, 1959); 1 US gal = 3.785411784 L exactly.
  it('metres as feet, using the international foot', () => {
    expect(showQuantity(0.3048, 'length', 'us')).toBe('1.00 ft');
    expect(showQuantity(3.048, 'length', 'metric')).toBe('3.048 m');
  });
  it('litres as US gallons', () => expect(showQuantity(3.785411784, 'volume', 'us')).toBe('1.00 gal'));
  it('typed values go back to SI exactly', () => {
    for (const q of Object.values(QUANTITIES)) {
      for (const d of Object.values(q)) expect(d.toSi(d.fromSi(12.345))).toBeCloseTo(12.345, 9);
    }
  });
  it('an absent value shows a dash', () => expect(showQuantity(null, 'length', 'metric')).toBe('—'));
});
