// POST /api/visits/assignments – assign many visits to one advisor at once (all or none); one e-mail.
import { bulkAssign } from '@/lib/server/data/visit-planning';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { bulkAssignSchema } from '@/lib/shared/schemas/office';

export const POST = withAuth('visit:plan', async ({ req, user }) => {
  const input = await parseJsonBody(req, bulkAssignSchema);
  return Response.json(await bulkAssign(user, input));
});
