// The engine writes its plain-language texts in metric; a US reader gets the same sentences with
// every quantity converted (1 ft = 0.3048 m, 1 US gal = 3.785411784 L, 1 psi = 6.894757 kPa,
// 1 in = 25.4 mm — exact definitions). "100 mL" and percentages are left as they are.
import { kPaToPsi, lToUsGal, mmToIn, mToFt } from '../units';
import { figureNumber } from './quantities';

const NUMBER = String.raw`(\d{1,3}(?:,\d{3})+|\d+(?:\.\d+)?)`;

const RULES: { pattern: RegExp; unit: string; convert: (v: number) => number }[] = [
  { pattern: new RegExp(`${NUMBER} L/day\\b`, 'g'), unit: 'gal/day', convert: lToUsGal },
  { pattern: new RegExp(`${NUMBER} L/min\\b`, 'g'), unit: 'gal/min', convert: lToUsGal },
  { pattern: new RegExp(`${NUMBER} L/s\\b`, 'g'), unit: 'gal/min', convert: (v) => lToUsGal(v * 60) },
  { pattern: new RegExp(`${NUMBER} kPa\\b`, 'g'), unit: 'psi', convert: kPaToPsi },
  { pattern: new RegExp(`${NUMBER} mm\\b`, 'g'), unit: 'in', convert: mmToIn },
  { pattern: new RegExp(`${NUMBER} m\\b(?!²|³)`, 'g'), unit: 'ft', convert: mToFt },
  { pattern: new RegExp(`${NUMBER} L\\b(?!/)`, 'g'), unit: 'gal', convert: lToUsGal },
];

/** The sentence with its metric quantities in US customary units. */
export function toUsText(text: string): string {
  let out = text;
  for (const rule of RULES) {
    out = out.replace(rule.pattern, (_, n: string) => `${figureNumber(rule.convert(Number(n.replace(/,/g, ''))))} ${rule.unit}`);
  }
  return out;
}
