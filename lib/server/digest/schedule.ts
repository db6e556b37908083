import 'server-only';
import { Cron } from 'croner';
import { z } from 'zod';
import { sendDailyDigests } from './daily-digest';

/** DIGEST_HOUR from .env: the hour (0–23, UTC, the app's one time zone) the digest goes out, or `off`. */
export const digestHourSchema = z
  .string()
  .trim()
  .default('6')
  .refine((v) => v === 'off' || (/^\d{1,2}$/.test(v) && Number(v) <= 23), 'DIGEST_HOUR must be an hour from 0 to 23 (UTC), or off')
  .transform((v) => (v === 'off' ? null : Number(v)));

/** The cron pattern for the digest at that hour, on the hour, every day. */
export const digestPattern = (hour: number) => `0 ${hour} * * *`;

/** Schedules the daily digest (croner, in UTC; a run still going blocks the next). Null when switched off. */
export function scheduleDailyDigest(hourSetting: string | undefined, log = console.log): Cron | null {
  const hour = digestHourSchema.parse(hourSetting ?? '6');
  if (hour === null) return null;
  const job = new Cron(digestPattern(hour), { timezone: 'UTC', protect: true, name: 'daily-digest' }, async () => {
    try {
      const { sent, failed } = await sendDailyDigests();
      log(`[fallbook] daily digest: ${sent} sent${failed ? `, ${failed} refused by the mail server` : ''}`);
    } catch (error) {
      console.error('[fallbook] daily digest failed:', error);
    }
  });
  return job;
}
