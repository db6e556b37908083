// Display formatting shared by pages (dates are stored as ISO strings).
import type { UnitSystem } from './domain';

// Written out rather than Intl.DateTimeFormat: building a formatter loads locale data, which costs a
// phone tens of milliseconds in the middle of drawing a list. Same words as en-GB ("Wed, 9 Sept 2026").
const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sept', 'Oct', 'Nov', 'Dec'];

/** "Tue, 8 Dec 2026" from "2026-12-08"; an em dash when there is no date. */
export function formatDay(isoDay: string | null | undefined): string {
  if (!isoDay) return '—';
  const date = new Date(`${isoDay.slice(0, 10)}T00:00:00Z`);
  if (Number.isNaN(date.getTime())) return '—';
  return `${WEEKDAYS[date.getUTCDay()]}, ${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()}`;
}

/** "Tue, 8 Dec 2026, 14:05 UTC": a moment for pages and e-mail read in more than one place (one time zone for all). */
export function formatDateTime(at: Date | string | null | undefined): string {
  if (!at) return '—';
  const date = typeof at === 'string' ? new Date(at) : at;
  if (Number.isNaN(date.getTime())) return '—';
  const iso = date.toISOString();
  return `${formatDay(iso)}, ${iso.slice(11, 16)} UTC`;
}

/**
 * A time of day on this device's clock, "14:05" (metric users) or "2:05 PM" (US customary users),
 * written out for the same reason as formatDay: toLocaleTimeString builds a formatter on every call.
 */
export function formatClock(date: Date, units: UnitSystem): string {
  const minutes = String(date.getMinutes()).padStart(2, '0');
  if (units === 'metric') return `${String(date.getHours()).padStart(2, '0')}:${minutes}`;
  const hour = date.getHours() % 12 || 12;
  return `${hour}:${minutes} ${date.getHours() < 12 ? 'AM' : 'PM'}`;
}

/** Litres per day with thousands separators, e.g. "2,300 L/day". */
export function formatLitresPerDay(litres: number): string {
  return `${Math.round(litres).toLocaleString('en-GB')} L/day`;
}

/** A size on the phone: "640 kB" below a megabyte, "4.1 MB" above (1 MB = 1024 × 1024 bytes). */
export function formatBytes(bytes: number): string {
  const mb = bytes / 1024 / 1024;
  if (mb < 1) return `${Math.max(bytes > 0 ? 1 : 0, Math.round(bytes / 1024))} kB`;
  return `${mb < 100 ? mb.toFixed(1) : Math.round(mb)} MB`;
}
