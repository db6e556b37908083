// One date style for pages, e-mail and the phone: the day with its weekday and year ("Wed, 9 Sept 2026"),
// a moment with its time zone ("Wed, 9 Sept 2026, 14:05 UTC"), a clock for "last synced". Each Intl
// formatter is built on its first use and kept: building one loads locale data, which costs a phone
// tens of milliseconds, so a page that shows no date builds none (the clock needs none).
import type { UnitSystem } from '../domain';

function once<T>(build: () => T): () => T {
  let made: T | undefined;
  return () => (made ??= build());
}

// Planned days are calendar days with no zone ("2026-09-09"): read and shown in UTC, so no reader's
// zone moves them to the day before.
const DAY = once(() => new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }));
// Moments read in more than one place (the office, e-mail, the farmer) say their zone: UTC for everyone.
const UTC_TIME = once(() => new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone: 'UTC' }));

function toDate(at: Date | string): Date | null {
  const date = typeof at === 'string' ? new Date(at) : at;
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "Tue, 8 Dec 2026" from "2026-12-08" (or a full timestamp's day in UTC); an em dash when there is none. */
export function formatDay(isoDay: string | null | undefined): string {
  if (!isoDay) return '—';
  const date = toDate(`${isoDay.slice(0, 10)}T00:00:00Z`);
  return date ? DAY().format(date) : '—';
}

/** "Tue, 8 Dec 2026, 14:05 UTC": a moment, in one time zone for every reader. */
export function formatDateTime(at: Date | string | null | undefined): string {
  if (!at) return '—';
  const date = toDate(at);
  return date ? `${DAY().format(date)}, ${UTC_TIME().format(date)} UTC` : '—';
}

/**
 * A time of day on this device's clock: "14:05" (metric users) or "2:05 PM" (US customary users),
 * as Intl writes them for "en-GB" and "en-US" (the unit tests hold the two to the same output),
 * written out by hand: the clock is on every field screen, and building an Intl formatter for it
 * costs a phone's start-up tens of milliseconds.
 */
export function formatClock(date: Date, units: UnitSystem): string {
  const hours = date.getHours();
  const minutes = String(date.getMinutes()).padStart(2, '0');
  if (units === 'metric') return `${String(hours).padStart(2, '0')}:${minutes}`;
  return `${hours % 12 || 12}:${minutes} ${hours < 12 ? 'AM' : 'PM'}`;
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
