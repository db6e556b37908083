// Trade names on the sheet in the reader's terms. The engine names pipe sizes the way they are sold
// ("1¼″ (32 mm)", "Schedule 40", "300 psi"); a metric reader gets the metric name first with the
// imperial one in brackets, and "Schedule 40" says what it is.
import type { UnitSystem } from '../domain';
import { psiAsKPa } from '../display/quantities';

const SIZE = /((?:\d+)?[¼½¾]?)″ \((\d+) mm\)/g;

/** The text with sizes, pressures and schedules named for the reader. */
export function plainTrade(text: string, units: UnitSystem): string {
  const out = text.replace(/Schedule 40(?! \()/, 'Schedule 40 (standard-wall steel)');
  // A US reader buys by the inch: the millimetres would only come back as decimal inches.
  if (units === 'us') return out.replace(SIZE, (_, inch: string) => `${inch}″`);
  const psi = (n: string) => psiAsKPa(Number(n.replace(/,/g, '')));
  return out
    .replace(SIZE, (_, inch: string, mm: string) => `DN ${mm} (${inch}″)`)
    .replace(/\((\d[\d,]*) psi\)/g, (_, n: string) => `(${psi(n).replace(' (', ', ').replace(/\)$/, '')})`)
    .replace(/\b(\d[\d,]*) psi\b(?!\))/g, (_, n: string) => psi(n));
}
