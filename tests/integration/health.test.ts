import { describe, expect, it } from 'vitest';
import { GET } from '@/app/api/health/route';

describe('GET /api/health against the real MariaDB', () => {
  it('answers 200 with the server version and the applied migrations', async () => {
    const res = await GET();
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.ok).toBe(true);
    expect(body.database.version).toMatch(/MariaDB/i);
    expect(body.migrations).toContain('0001-people-and-farms.ts');
    expect(body.migrations.length).toBeGreaterThanOrEqual(3);
  });
});
