// npm run storage:migrate [-- --limit N] – copies photos from PHOTO_DIR to the S3 bucket (S3_* in .env),
// verifying each sha-256; safe to stop and run again (what is already there is skipped).
import { closeSequelize } from '@/lib/server/db/connection';
import { copyPhotos } from '@/lib/server/storage/copy-photos';
import { localPhotoStorage, s3SettingsFromEnv } from '@/lib/server/storage';
import { s3Storage } from '@/lib/server/storage/s3';

async function main(args: string[]) {
  const at = args.indexOf('--limit');
  const limit = at >= 0 ? Number(args[at + 1]) : undefined;
  if (limit !== undefined && !(Number.isInteger(limit) && limit > 0)) throw new Error('--limit needs a whole number above 0');
  const settings = s3SettingsFromEnv();
  if (settings.bucket.length < 3) throw new Error('Set S3_BUCKET (and S3_ENDPOINT, S3_REGION, keys) in .env first.');
  console.log(`[fallbook] copying photos from ${process.env.PHOTO_DIR ?? '.data/photos'} to bucket ${settings.bucket}…`);
  const report = await copyPhotos(localPhotoStorage(), s3Storage(settings), {
    limit,
    onPhoto: (n) => {
      if (n % 100 === 0) console.log(`[fallbook] ${n} photos done`);
    },
  });
  console.log(`[fallbook] ${report.photos} photos: ${report.copied} objects copied, ${report.present} already there`);
  for (const problem of report.problems) console.warn(`[fallbook] not copied: ${problem}`);
  if (report.problems.length) process.exitCode = 2;
  else console.log('[fallbook] every object verified; set STORAGE_DRIVER=s3 in .env and restart the app');
}

main(process.argv.slice(2))
  .catch((error: unknown) => {
    console.error('[fallbook] storage migration failed:', error);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
