// Unit conversion (metric ↔ US customary) and a field-input number parser, shared by forms and the engine tests.
// Exact definitions: 1 ft = 0.3048 m (international foot, 1959); 1 US gal = 3.785411784 L; 1 in = 25.4 mm;
// 1 psi = 6.894757293 kPa (lbf/in² with g = 9.80665).

export const M_PER_FT = 0.3048;
export const L_PER_US_GAL = 3.785411784;
export const MM_PER_IN = 25.4;
export const KPA_PER_PSI = 6.894757293168361;
const G = 9.80665;

export const mToFt = (m: number): number => m / M_PER_FT;
export const ftToM = (ft: number): number => ft * M_PER_FT;
export const lToUsGal = (l: number): number => l / L_PER_US_GAL;
export const usGalToL = (gal: number): number => gal * L_PER_US_GAL;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const inToMm = (inch: number): number => inch * MM_PER_IN;
export const kPaToPsi = (kPa: number): number => kPa / KPA_PER_PSI;
export const psiToKPa = (psi: number): number => psi * KPA_PER_PSI;
export const lpsToLpm = (lps: number): number => lps * 60;
export const lpmToLps = (lpm: number): number => lpm / 60;
export const lpmToGpm = (lpm: number): number => lpm / L_PER_US_GAL;
export const gpmToLpm = (gpm: number): number => gpm * L_PER_US_GAL;
export const lpsToGpm = (lps: number): number => lpmToGpm(lpsToLpm(lps));
export const gpmToLps = (gpm: number): number => lpmToLps(gpmToLpm(gpm));
export const m2ToFt2 = (m2: number): number => m2 / (M_PER_FT * M_PER_FT);
export const ft2ToM2 = (ft2: number): number => ft2 * M_PER_FT * M_PER_FT;
/** Cubic feet per second to L/s. */
export const cfsToLps = (cfs: number): number => cfs * M_PER_FT ** 3 * 1000;

/** Head of fresh water (1000 kg/m³), m, to psi. */
export const headMToPsi = (m: number): number => kPaToPsi((m * 1000 * G) / 1000);
/** psi to head of fresh water (1000 kg/m³), m. */
export const psiToHeadM = (psi: number): number => (psiToKPa(psi) * 1000) / (1000 * G);

export type ParseResult = { ok: true; value: number } | { ok: false; error: 'empty' | 'not-a-number' };

const NUMBER_PATTERN = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/;

/**
 * Parses a number typed in the field: accepts "." or "," as the decimal separator and surrounding spaces;
 * rejects thousands separators, units, several separators and anything else.
 */
export function parseFieldNumber(text: string | null | undefined): ParseResult {
  const trimmed = (text ?? '').trim();
  if (trimmed === '') return { ok: false, error: 'empty' };
  if (!NUMBER_PATTERN.test(trimmed)) return { ok: false, error: 'not-a-number' };
  const value = Number(trimmed.replace(',', '.'));
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, error: 'not-a-number' };
}

/** Like parseFieldNumber, but undefined for empty or garbage input. */
export function parseFieldNumberOrUndefined(text: string | null | undefined): number | undefined {
  const r = parseFieldNumber(text);
  return r.ok ? r.value : undefined;
}
