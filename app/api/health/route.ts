// GET /api/health – is the app up and can it reach its database? Anyone gets that answer; a signed-in
// coordinator also gets the database server's version and the applied migrations.
import type { NextRequest } from 'next/server';
import { getRequestUser } from '@/lib/server/auth/current-user';
import { can } from '@/lib/server/auth/permissions';
import { checkHealth } from '@/lib/server/health';

export const dynamic = 'force-dynamic';

export async function GET(req: NextRequest) {
  const user = await getRequestUser(req).catch(() => null);
  const health = await checkHealth(!!user && can(user, 'organisation:settings'));
  return Response.json(health, { status: health.ok ? 200 : 503, headers: { 'cache-control': 'no-store' } });
}
