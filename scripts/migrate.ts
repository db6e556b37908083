// tsx scripts/migrate.ts up|down|down-all|status – runs the umzug migrations against DB_* from the env.
import { closeSequelize, getSequelize } from '@/lib/server/db/connection';
import { createMigrator } from '@/lib/server/db/migrator';

async function main(command: string) {
  const migrator = createMigrator(getSequelize());
  if (command === 'up') {
    const done = await migrator.up();
    console.log(`[fallbook] migrations applied: ${done.length ? done.map((m) => m.name).join(', ') : 'none pending'}`);
  } else if (command === 'down') {
    const done = await migrator.down();
    console.log(`[fallbook] reverted: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (command === 'down-all') {
    await migrator.down({ to: 0 });
    console.log('[fallbook] all migrations reverted');
  } else if (command === 'status') {
    const executed = (await migrator.executed()).map((m) => m.name);
    const pending = (await migrator.pending()).map((m) => m.name);
    console.log({ executed, pending });
  } else {
    throw new Error('usage: tsx scripts/migrate.ts up|down|down-all|status');
  }
}

main(process.argv[2] ?? 'up')
  .catch((error: unknown) => {
    console.error('[fallbook] migration failed:', error);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
