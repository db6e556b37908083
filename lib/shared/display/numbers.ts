// Numbers as people read them: thousands separators, sensible decimals, one set of cached formatters
// (building an Intl formatter loads locale data, so each shape is built once and kept).

const LOCALE = 'en-GB';
const formatters = new Map<string, Intl.NumberFormat>();

function formatter(minDecimals: number, maxDecimals: number, grouping: boolean): Intl.NumberFormat {
  const key = `${minDecimals}|${maxDecimals}|${grouping}`;
  let f = formatters.get(key);
  if (!f) {
    // signDisplay 'negative': a value that rounds to zero shows "0", never "-0".
    f = new Intl.NumberFormat(LOCALE, {
      minimumFractionDigits: minDecimals,
      maximumFractionDigits: maxDecimals,
      useGrouping: grouping,
      signDisplay: 'negative',
    });
    formatters.set(key, f);
  }
  return f;
}

/** A number with exactly this many decimals and thousands separators: 12345.6 → "12,345.60" at 2. */
export function formatNumber(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return '—';
  return formatter(decimals, decimals, true).format(value);
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
  return formatter(0, maxDecimals, false).format(value);
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
