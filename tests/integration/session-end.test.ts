// Sessions end on the server: signing out ends that session's token (other devices keep theirs),
// "sign out everywhere" ends them all, and a session lasts two weeks of inactivity, renewed as it is used.
import { encode } from 'next-auth/jwt';
import { randomUUID } from 'node:crypto';
import { describe, expect, it, vi } from 'vitest';
import { POST as signOutEverywhere } from '@/app/api/me/sessions/route';
import { GET as getMe } from '@/app/api/me/route';
import { authOptions } from '@/lib/server/auth/options';
import { SESSION_MAX_AGE_S, SESSION_RENEW_AFTER_S } from '@/lib/server/auth/session-policy';
import { makeOrganisation, params, request, type TestUser } from './support/fixtures';

async function cookieFor(user: TestUser, sid: string) {
  const token = await encode({
    secret: process.env.NEXTAUTH_SECRET ?? '',
    token: { uid: user.id, role: user.role, organisationId: user.organisationId, sessionVersion: user.sessionVersion, email: user.email, name: user.name, sid },
  });
  return `next-auth.session-token=${token}`;
}

const me = async (cookie: string) => getMe(await request('/api/me', undefined, { headers: { cookie } }), params({}));

describe('ending sessions on the server', () => {
  it('signing out ends that session at once; the same person’s other session goes on', async () => {
    const o = await makeOrganisation('sign-out');
    const laptop = await cookieFor(o.advisor, randomUUID());
    const phoneSid = randomUUID();
    const phone = await cookieFor(o.advisor, phoneSid);
    expect((await me(laptop)).status).toBe(200);
    const signOut = authOptions.events?.signOut as (message: { token: Record<string, unknown>; session: unknown }) => Promise<void>;
    await signOut({ token: { uid: o.advisor.id, sid: phoneSid, exp: Math.floor(Date.now() / 1000) + 3600 }, session: null });
    expect((await me(phone)).status).toBe(401);
    expect((await me(laptop)).status).toBe(200);
  });

  it('"sign out everywhere" ends every session of the person, including the one that asked', async () => {
    const o = await makeOrganisation('everywhere');
    const a = await cookieFor(o.coordinator, randomUUID());
    const b = await cookieFor(o.coordinator, randomUUID());
    const res = await signOutEverywhere(
      await request('/api/me/sessions', undefined, {
        method: 'POST',
        body: {},
        headers: { cookie: a, origin: 'http://127.0.0.1:3100', host: '127.0.0.1:3100' },
      }),
      params({}),
    );
    expect(res.status).toBe(200);
    expect((await me(a)).status).toBe(401);
    expect((await me(b)).status).toBe(401);
  });

  it('a session lasts two weeks, not 30 days, and a request a day after issue gets a renewed cookie', async () => {
    expect(authOptions.session?.maxAge).toBe(SESSION_MAX_AGE_S);
    expect(SESSION_MAX_AGE_S).toBeLessThanOrEqual(14 * 24 * 3600);
    const o = await makeOrganisation('renew');
    const fresh = await me(await cookieFor(o.farmer, randomUUID()));
    expect(fresh.headers.get('set-cookie')).toBeNull();
    const cookie = await cookieFor(o.farmer, randomUUID());
    // The same token, used a day and a minute after it was issued.
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.now() + (SESSION_RENEW_AFTER_S + 60) * 1000);
    let old: Response;
    try {
      old = await me(cookie);
    } finally {
      vi.useRealTimers();
    }
    expect(old.status).toBe(200);
    expect(old.headers.get('set-cookie') ?? '').toMatch(/next-auth\.session-token=.+HttpOnly/i);
  });
});
