// Display formatting shared by pages (dates are stored as ISO strings).

const dateFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** "Tue 8 Dec 2026" from "2026-12-08"; an em dash when there is no date. */
export function formatDay(isoDay: string | null | undefined): string {
  if (!isoDay) return '—';
  const date = new Date(`${isoDay.slice(0, 10)}T00:00:00Z`);
  return Number.isNaN(date.getTime()) ? '—' : dateFormat.format(date);
}

/** Litres per day with thousands separators, e.g. "2,300 L/day". */
export function formatLitresPerDay(litres: number): string {
  return `${Math.round(litres).toLocaleString('en-GB')} L/day`;
}
