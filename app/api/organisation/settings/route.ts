// GET /api/organisation/settings – the organisation's settings; PUT replaces them (coordinators).
import { getSettings, updateSettings } from '@/lib/server/data/settings';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { settingsSchema } from '@/lib/shared/schemas/office';

export const GET = withAuth('organisation:settings', async ({ user }) => Response.json({ settings: await getSettings(user) }));

export const PUT = withAuth('organisation:settings', async ({ req, user }) => {
  const input = await parseJsonBody(req, settingsSchema);
  return Response.json({ settings: await updateSettings(user, input) });
});
