// POST /api/sync/push – apply the phone's queued ops in order; one result per op (applied, replayed, conflict, rejected).
import { readJson } from '@/lib/server/http/body';
import { withAuth } from '@/lib/server/http/with-auth';
import { pushOps } from '@/lib/server/sync/push';
import { MAX_PUSH_BYTES, pushRequestSchema } from '@/lib/shared/schemas/sync';

export const runtime = 'nodejs';

export const POST = withAuth('sync:use', async ({ req, user }) => {
  // A malformed envelope or any malformed op is a 422 for the whole batch: nothing is applied.
  const { ops } = pushRequestSchema.parse(await readJson(req, MAX_PUSH_BYTES));
  return Response.json({ results: await pushOps(user, ops) });
});
