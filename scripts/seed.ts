// tsx scripts/seed.ts – loads the demo scenario (idempotent).
import { closeSequelize } from '@/lib/server/db/connection';
import { seedDemo } from '@/lib/server/demo/seed';

seedDemo()
  .then((outcome) => console.log(`[fallbook] demo scenario ${outcome === 'created' ? 'loaded' : 'already present'}`))
  .catch((error: unknown) => {
    console.error('[fallbook] seeding failed:', error);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
