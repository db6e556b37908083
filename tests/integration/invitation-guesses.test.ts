// Guessed invitation tokens: looked up before any password is hashed (so guesses cost no bcrypt and
// cannot stall the server), and slowed down per address once they keep missing.
import { randomBytes } from 'node:crypto';
import { afterEach, describe, expect, it } from 'vitest';
import { POST as accept } from '@/app/api/invitations/[token]/accept/route';
import { GET as health } from '@/app/api/health/route';
import { params, request } from './support/fixtures';

const body = { password: 'a long enough password', confirm: 'a long enough password' };
const guess = () => randomBytes(32).toString('base64url');
const tryToken = async (token: string, forwardedFor?: string) =>
  accept(
    await request(`/api/invitations/${token}/accept`, undefined, { method: 'POST', body, headers: forwardedFor ? { 'x-forwarded-for': forwardedFor } : {} }),
    params({ token }),
  );

afterEach(() => {
  delete process.env.TRUSTED_PROXIES;
});

describe('guessed invitation tokens', () => {
  it('30 concurrent guesses hash nothing: they all answer 404 quickly and /api/health is not held up', async () => {
    process.env.TRUSTED_PROXIES = '1';
    const started = performance.now();
    const guesses = Array.from({ length: 30 }, (_, i) => tryToken(guess(), `192.0.2.${i + 1}`));
    const healthStarted = performance.now();
    const healthRes = await health(await request('/api/health'));
    const healthMs = performance.now() - healthStarted;
    const answers = await Promise.all(guesses);
    const totalMs = performance.now() - started;
    console.log(`[invitation guesses] 30 concurrent: all answered in ${totalMs.toFixed(0)} ms; /api/health meanwhile ${healthMs.toFixed(0)} ms`);
    expect(answers.map((r) => r.status)).toEqual(Array(30).fill(404));
    expect(healthRes.status).toBe(200);
    // 30 bcrypt hashes at cost 10 take about 3 s on one core; lookups alone take a small part of that.
    expect(totalMs).toBeLessThan(1500);
  });

  it('one address that keeps missing is slowed down with a 429 and a plain message', async () => {
    process.env.TRUSTED_PROXIES = '1';
    const from = '198.51.100.77';
    const statuses: number[] = [];
    let message = '';
    for (let i = 0; i < 15; i++) {
      const res = await tryToken(guess(), from);
      statuses.push(res.status);
      if (res.status === 429) message = (await res.json()).error.message;
    }
    expect(statuses.slice(0, 5)).toEqual(Array(5).fill(404));
    expect(statuses).toContain(429);
    expect(message).toMatch(/invitation links.*Wait \d+ seconds?/);
    // Another address is not affected.
    expect((await tryToken(guess(), '198.51.100.78')).status).toBe(404);
  });
});
