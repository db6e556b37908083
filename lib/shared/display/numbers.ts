// Numbers as people read them: thousands separators, sensible decimals, the same on the server and
// every phone. They are written out by hand rather than by an Intl.NumberFormat: building the first
// Intl formatter loads locale data, about 80 ms of a phone's start-up at 4× slower CPU. The rounding
// is Intl's (V8's, for "en-GB"): the number's shortest decimal form ("1.005", as String() writes it)
// rounded half away from zero, so 1.005 shows "1.01" where toFixed would say "1.00"; the unit tests
// hold every shape to Intl's output over thousands of values.

/** The shortest decimal form of a non-negative finite number, as digits and where the point goes. */
function decimalDigits(abs: number): { digits: string; point: number } {
  const [, whole = '', fraction = '', exponent = '0'] = /^(\d+)(?:\.(\d+))?(?:e([+-]\d+))?$/.exec(String(abs)) ?? [];
  return { digits: whole + fraction, point: whole.length + Number(exponent) };
}

/** A string of decimal digits plus one in its last place ("0999" → "1000", "99" → "100"). */
function addOne(digits: string): string {
  let i = digits.length - 1;
  while (i >= 0 && digits[i] === '9') i--;
  return i < 0 ? `1${'0'.repeat(digits.length)}` : `${digits.slice(0, i)}${Number(digits[i]) + 1}${'0'.repeat(digits.length - i - 1)}`;
}

/** `value` rounded to `decimals` places as Intl rounds; a value that rounds to zero has no sign. */
function written(value: number, decimals: number, grouping: boolean, dropZeros: boolean): string {
  const { digits, point } = decimalDigits(Math.abs(value));
  // Digits before the cut, the point's place among them, and the first digit cut off.
  const keep = point + decimals;
  let kept = keep <= 0 ? '' : digits.slice(0, keep).padEnd(keep, '0');
  const cut = keep < 0 ? '0' : (digits[keep] ?? '0');
  if (cut >= '5') kept = addOne(kept.padStart(1, '0'));
  kept = kept.padStart(decimals + 1, '0');
  const whole = kept.slice(0, kept.length - decimals).replace(/^0+(?=\d)/, '');
  let fraction = kept.slice(kept.length - decimals);
  if (dropZeros) fraction = fraction.replace(/0+$/, '');
  const sign = value < 0 && /[1-9]/.test(kept) ? '-' : '';
  return `${sign}${grouping ? whole.replace(/\B(?=(\d{3})+$)/g, ',') : whole}${fraction ? `.${fraction}` : ''}`;
}

/** A number with exactly this many decimals and thousands separators: 12345.6 → "12,345.60" at 2. */
export function formatNumber(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return '—';
  return written(value, decimals, true, false);
}

/** A whole number with thousands separators: 10247 → "10,247". */
export function formatWhole(value: number): string {
  return formatNumber(value, 0);
}

/** How many decimals a figure gets by its size: ≥ 100 none, ≥ 10 one, else two. */
export function figureDecimals(value: number): number {
  const abs = Math.abs(value);
  return abs >= 99.5 ? 0 : abs >= 9.995 ? 1 : 2;
}

/**
 * A figure with sensible precision by its size, the one rule for every reading and result shown:
 * ≥ 1000 to the ten ("1,130"), ≥ 100 whole ("456"), ≥ 10 one decimal ("12.3"), else two ("0.35").
 */
export function formatFigure(value: number): string {
  if (!Number.isFinite(value)) return '—';
  if (Math.abs(value) >= 999.5) return formatWhole(Math.round(value / 10) * 10);
  return formatNumber(value, figureDecimals(value));
}

/** A number as typed into a field: no separators, at most this many decimals, trailing zeros dropped. */
export function formatTyped(value: number, maxDecimals: number): string {
  if (!Number.isFinite(value)) return '';
  return written(value, maxDecimals, false, true);
}

/** A 0…1 fraction as a whole percentage: 0.5 → "50 %". */
export function formatPercent(fraction: number): string {
  return `${formatWhole(fraction * 100)} %`;
}

/** A count with its noun, singular or plural: "1 station", "3 stations", "1,200 changes". */
export function formatCount(n: number, singular: string, plural = `${singular}s`): string {
  return `${formatWhole(n)} ${n === 1 ? singular : plural}`;
}

/** A size in bytes for people: "850 kB", "10 MB", "1.2 GB" (1 kB = 1,000 bytes, as phones report them). */
export function formatBytes(bytes: number): string {
  if (bytes >= 1e9) return `${formatFigure(bytes / 1e9)} GB`;
  if (bytes >= 1e6) return `${formatWhole(bytes / 1e6)} MB`;
  return `${formatWhole(Math.max(bytes / 1e3, 0))} kB`;
}
