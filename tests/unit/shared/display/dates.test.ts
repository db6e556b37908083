import { describe, expect, it } from 'vitest';
import { formatClock, formatDateTime, formatDay, isoDay } from '@/lib/shared/display/dates';

describe('one date style', () => {
  it('a day with its weekday and year, read in UTC so no zone moves it', () => {
    expect(formatDay('2026-12-08')).toBe('Tue, 8 Dec 2026');
    expect(formatDay('2026-12-08T23:30:00Z')).toBe('Tue, 8 Dec 2026');
    expect(formatDay('2027-01-01')).toBe('Fri, 1 Jan 2027');
  });

  it('a dash for no day or nonsense', () => {
    expect(formatDay(null)).toBe('—');
    expect(formatDay('')).toBe('—');
    expect(formatDay('not a day')).toBe('—');
    expect(formatDateTime(undefined)).toBe('—');
    expect(formatDateTime('not a time')).toBe('—');
  });

  it('a moment says the day, the time and the zone (UTC), from a Date or an ISO string', () => {
    expect(formatDateTime(new Date('2026-12-04T19:05:42Z'))).toBe('Fri, 4 Dec 2026, 19:05 UTC');
    expect(formatDateTime('2027-01-01T00:00:00.000Z')).toBe('Fri, 1 Jan 2027, 00:00 UTC');
  });

  it('a clock: 24-hour for metric users, AM/PM for US customary users', () => {
    const at = (h: number, m: number) => new Date(2026, 11, 2, h, m);
    expect(formatClock(at(4, 5), 'metric')).toBe('04:05');
    expect(formatClock(at(14, 30), 'metric')).toBe('14:30');
    expect(formatClock(at(0, 7), 'us')).toBe('12:07 AM');
    expect(formatClock(at(12, 0), 'us')).toBe('12:00 PM');
    expect(formatClock(at(23, 59), 'us')).toBe('11:59 PM');
  });

  it('writes the clock exactly as Intl does for en-GB (24-hour) and en-US (AM/PM), every minute of a day', () => {
    const metric = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
    const us = new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit', hour12: true });
    for (let minute = 0; minute < 24 * 60; minute++) {
      const at = new Date(2026, 11, 2, Math.floor(minute / 60), minute % 60);
      expect(formatClock(at, 'metric')).toBe(metric.format(at));
      expect(formatClock(at, 'us')).toBe(us.format(at).replace(/\u202f/g, ' '));
    }
  });

  it('writes the day exactly as Intl does for en-GB in UTC, every day of 1999 to 2031 and the first of each month back to 1600', () => {
    const intl = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
    const days: Date[] = [];
    for (let t = Date.UTC(1999, 0, 1); t < Date.UTC(2032, 0, 1); t += 86_400_000) days.push(new Date(t));
    for (let year = 1600; year < 1999; year++) for (let month = 0; month < 12; month++) days.push(new Date(Date.UTC(year, month, 1)));
    expect(days.length).toBeGreaterThan(16_000);
    for (const day of days) {
      const iso = day.toISOString();
      expect(formatDay(iso.slice(0, 10))).toBe(intl.format(day));
      // A moment late in the day: still that day in UTC.
      const late = new Date(day.getTime() + 23 * 3_600_000 + 59 * 60_000);
      expect(formatDateTime(late)).toBe(`${intl.format(day)}, 23:59 UTC`);
    }
  });

  it('files and machines get the ISO day', () => {
    expect(isoDay(new Date('2026-12-04T23:59:59Z'))).toBe('2026-12-04');
  });
});
