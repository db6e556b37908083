import { describe, expect, it } from 'vitest';
import { GET } from '@/app/api/health/route';
import { makeOrganisation, request } from './support/fixtures';

describe('GET /api/health against the real MariaDB', () => {
  it('answers anyone 200 with a bare liveness answer: no server version, no migration list', async () => {
    const res = await GET(await request('/api/health'));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.ok).toBe(true);
    expect(body.database.ok).toBe(true);
    expect(JSON.stringify(body)).not.toMatch(/MariaDB|migrations|\d+\.\d+\.\d+/i);
  });

  it('gives a signed-in coordinator the server version and the applied migrations; an advisor gets the bare answer', async () => {
    const o = await makeOrganisation('health');
    const body = await (await GET(await request('/api/health', o.coordinator))).json();
    expect(body.database.version).toMatch(/MariaDB/i);
    expect(body.migrations).toContain('0001-people-and-farms.ts');
    const advisor = await (await GET(await request('/api/health', o.advisor))).json();
    expect(advisor.migrations).toBeUndefined();
  });
});
