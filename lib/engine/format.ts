// Number formatting for plain-language texts: sensible rounding, metric units, no locale dependence.

function group(intText: string): string {
  return intText.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** Rounds for reading: ≥ 1000 to tens, ≥ 100 to units, ≥ 10 to one decimal, else two decimals. */
export function fmt(value: number, unit = ''): string {
  const abs = Math.abs(value);
  let text: string;
  if (!Number.isFinite(value)) text = '—';
  else if (abs >= 1000) text = group(String(Math.round(value / 10) * 10));
  else if (abs >= 100) text = String(Math.round(value));
  else if (abs >= 10) text = value.toFixed(1);
  else text = value.toFixed(2);
  return unit ? `${text} ${unit}` : text;
}

/** A 0…1 fraction as a whole percentage. */
export function pct(fraction: number): string {
  return `${Math.round(fraction * 100)} %`;
}

/** A length rounded to the millimetre, so a threshold compares what the text shows. */
export function roundMm(m: number): number {
  return Math.round(m * 1000) / 1000;
}

/** A length to the millimetre, for texts that compare a reading with a threshold ("0.499 m"). */
export function fmtMm(valueM: number): string {
  return `${(Math.round(valueM * 1000) / 1000).toFixed(3)} m`;
}
