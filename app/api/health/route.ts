// GET /api/health – is the app up and can it reach its database?
import { checkHealth } from '@/lib/server/health';

export const dynamic = 'force-dynamic';

export async function GET() {
  const health = await checkHealth();
  return Response.json(health, { status: health.ok ? 200 : 503 });
}
