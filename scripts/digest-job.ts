// tsx scripts/digest-job.ts – the scheduled jobs `npm start` runs beside the app: the daily digest
// at DIGEST_HOUR (UTC). `--now` sends today's digests once and exits.
import { closeSequelize } from '@/lib/server/db/connection';
import { sendDailyDigests } from '@/lib/server/digest/daily-digest';
import { scheduleDailyDigest } from '@/lib/server/digest/schedule';

if (process.argv.includes('--now')) {
  sendDailyDigests()
    .then(({ sent, failed }) => console.log(`[fallbook] daily digest: ${sent} sent${failed ? `, ${failed} refused` : ''}`))
    .catch((error: unknown) => {
      console.error('[fallbook] daily digest failed:', error);
      process.exitCode = 1;
    })
    .finally(() => closeSequelize());
} else {
  const job = scheduleDailyDigest(process.env.DIGEST_HOUR);
  if (job) console.log(`[fallbook] daily digest scheduled, next at ${job.nextRun()?.toISOString() ?? 'never'}`);
  else {
    console.log('[fallbook] daily digest off (DIGEST_HOUR=off)');
    void closeSequelize();
  }
  const stop = () => {
    job?.stop();
    void closeSequelize().finally(() => process.exit(0));
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}
