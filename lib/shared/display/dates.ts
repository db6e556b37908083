// One date style for pages, e-mail and the phone: the day with its weekday and year ("Wed, 9 Sept 2026"),
// a moment with its time zone ("Wed, 9 Sept 2026, 14:05 UTC"), a clock for "last synced". All are
// written out by hand, as Intl writes them for British English (the unit tests hold the two to the
// same output): building a phone's first Intl date formatter loads locale data, a task of 50 to 180 ms
// on a mid-range phone's first look at its visit list.
import type { UnitSystem } from '../domain';

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
// British English abbreviates September to four letters.
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sept', 'Oct', 'Nov', 'Dec'];

// Planned days are calendar days with no zone ("2026-09-09"): read and shown in UTC, so no reader's
// zone moves them to the day before.
const utcDay = (date: Date) => `${WEEKDAYS[date.getUTCDay()]}, ${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()}`;

const twoDigits = (n: number) => String(n).padStart(2, '0');

/** "14:05": a 24-hour time of day, both parts of two digits. */
const hoursMinutes = (hours: number, minutes: number) => `${twoDigits(hours)}:${twoDigits(minutes)}`;

function toDate(at: Date | string): Date | null {
  const date = typeof at === 'string' ? new Date(at) : at;
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "Tue, 8 Dec 2026" from "2026-12-08" (or a full timestamp's day in UTC); an em dash when there is none. */
export function formatDay(isoDay: string | null | undefined): string {
  if (!isoDay) return '—';
  const date = toDate(`${isoDay.slice(0, 10)}T00:00:00Z`);
  return date ? utcDay(date) : '—';
}

/** "Tue, 8 Dec 2026, 14:05 UTC": a moment, in one time zone for every reader. */
export function formatDateTime(at: Date | string | null | undefined): string {
  if (!at) return '—';
  const date = toDate(at);
  // Moments read in more than one place (the office, e-mail, the farmer) say their zone: UTC for everyone.
  return date ? `${utcDay(date)}, ${hoursMinutes(date.getUTCHours(), date.getUTCMinutes())} UTC` : '—';
}

/** A time of day on this device's clock: "14:05" (metric users) or "2:05 PM" (US customary users). */
export function formatClock(date: Date, units: UnitSystem): string {
  const hours = date.getHours();
  if (units === 'metric') return hoursMinutes(hours, date.getMinutes());
  return `${hours % 12 || 12}:${twoDigits(date.getMinutes())} ${hours < 12 ? 'AM' : 'PM'}`;
}

/** A calendar day as stored and exported (ISO 8601, "2026-12-08"), for files and machines. */
export function isoDay(at: Date): string {
  return at.toISOString().slice(0, 10);
}

/** A moment as exported for spreadsheets: "2026-12-08 14:05" (UTC, named in the column header). */
export function isoMinute(at: Date | string): string {
  const iso = (typeof at === 'string' ? new Date(at) : at).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}
