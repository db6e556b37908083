// POST /api/people/invitations – invite a coordinator, advisor or farmer by e-mail (one-time link, 7 days).
import { invitePerson } from '@/lib/server/data/invitations';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { invitationSchema } from '@/lib/shared/schemas/office';

export const POST = withAuth('people:manage', async ({ req, user }) => {
  const input = await parseJsonBody(req, invitationSchema);
  return Response.json({ invitation: await invitePerson(user, input) }, { status: 201 });
});
