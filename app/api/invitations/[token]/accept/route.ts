// POST /api/invitations/:token/accept – set the invited person's password and spend the one-time link (public).
import { clientAddress } from '@/lib/server/auth/client-address';
import { acceptInvitation } from '@/lib/server/data/invitations';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { assertSameOrigin, withErrors } from '@/lib/server/http/with-auth';
import { acceptInvitationSchema } from '@/lib/shared/schemas/office';

export const POST = withErrors<{ token: string }>(async (req, { token }) => {
  // No session guards this route, so refuse cross-site posts here.
  assertSameOrigin(req);
  const input = await parseJsonBody(req, acceptInvitationSchema);
  const address = clientAddress(Object.fromEntries(req.headers));
  return Response.json({ account: await acceptInvitation(token, input, address) });
});
