import { describe, expect, it } from 'vitest';
import { formatClock, formatDateTime, formatDay, formatBytes } from '@/lib/shared/format';

// formatDay is written out by hand (no Intl formatter on the phone's hot path): it must say what the
// en-GB formatter says, for every weekday and month.
const reference = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

describe('formatDay', () => {
  it('matches the en-GB formatter for every day of two years', () => {
    const start = Date.UTC(2026, 0, 1);
    for (let day = 0; day < 731; day++) {
      const date = new Date(start + day * 86_400_000);
      const iso = date.toISOString().slice(0, 10);
      expect(formatDay(iso), iso).toBe(reference.format(date));
    }
  });

  it('reads the day from a full timestamp and shows a dash for none or nonsense', () => {
    expect(formatDay('2026-12-08T23:30:00Z')).toBe('Tue, 8 Dec 2026');
    expect(formatDay(null)).toBe('—');
    expect(formatDay('')).toBe('—');
    expect(formatDay('not a day')).toBe('—');
  });
});

describe('formatClock', () => {
  it('writes a 24-hour clock for metric users and AM/PM for US customary users', () => {
    const at = (h: number, m: number) => new Date(2026, 11, 2, h, m);
    expect(formatClock(at(4, 5), 'metric')).toBe('04:05');
    expect(formatClock(at(14, 30), 'metric')).toBe('14:30');
    expect(formatClock(at(0, 7), 'us')).toBe('12:07 AM');
    expect(formatClock(at(12, 0), 'us')).toBe('12:00 PM');
    expect(formatClock(at(23, 59), 'us')).toBe('11:59 PM');
  });
});

describe('formatDateTime', () => {
  it('says the day with its year, the time and the zone (UTC), from a Date or an ISO string', () => {
    expect(formatDateTime(new Date('2026-12-04T19:05:42Z'))).toBe('Fri, 4 Dec 2026, 19:05 UTC');
    expect(formatDateTime('2027-01-01T00:00:00.000Z')).toBe('Fri, 1 Jan 2027, 00:00 UTC');
    expect(formatDateTime(null)).toBe('—');
    expect(formatDateTime('not a time')).toBe('—');
  });
});

describe('formatBytes', () => {
  it('gives kB below a megabyte and MB with one decimal above', () => {
    expect(formatBytes(0)).toBe('0 kB');
    expect(formatBytes(300)).toBe('1 kB');
    expect(formatBytes(655_360)).toBe('640 kB');
    expect(formatBytes(4.1 * 1024 * 1024)).toBe('4.1 MB');
    expect(formatBytes(250 * 1024 * 1024)).toBe('250 MB');
  });
});
