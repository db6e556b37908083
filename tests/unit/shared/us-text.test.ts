import { describe, expect, it } from 'vitest';
import { toUsText } from '@/lib/shared/sheet/us-text';

// Conversions by the exact definitions: 1 ft = 0.3048 m; 1 US gal = 3.785411784 L;
// 1 psi = 6.894757293 kPa; 1 in = 25.4 mm (NIST SP 811, appendix B).
describe('engine sentences for a US reader', () => {
  it('converts litres a day, heads in metres and pressures', () => {
    expect(toUsText('The ram would deliver 719 L/day against a demand of 753 L/day.'))
      .toBe('The ram would deliver 190 gal/day against a demand of 199 gal/day.');
    expect(toUsText('lift plus surge may reach about 155 m of head (1,520 kPa).'))
      .toBe('lift plus surge may reach about 509 ft of head (220 psi).');
  });
  it('converts millimetres and plain litres but leaves mL, m² and percentages alone', () => {
    expect(toUsText('a 50 mm pipe and a 2,000 L tank')).toBe('a 1.97 in pipe and a 528 gal tank');
    expect(toUsText('no E. coli in any 100 mL sample; take 50 % of the flow over 12 m²')).toBe('no E. coli in any 100 mL sample; take 50 % of the flow over 12 m²');
  });
  it('leaves a sentence with no quantities unchanged', () => {
    expect(toUsText('Streams flood, sometimes suddenly.')).toBe('Streams flood, sometimes suddenly.');
  });
});
