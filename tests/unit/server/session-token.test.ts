import { encode } from 'next-auth/jwt';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { decodeSessionToken } from '@/lib/server/auth/session-token';

vi.mock('server-only', () => ({}));

const secret = 'a test secret that is long enough for the key';

describe('decodeSessionToken', () => {
  afterEach(() => vi.useRealTimers());

  it("reads next-auth's own tokens, again and again alike, and a changed token is refused", async () => {
    const token = await encode({
      token: { sub: 'u1', uid: 'u1', name: 'Ana', role: 'advisor', organisationId: 'o1', sessionVersion: 1 },
      secret,
      maxAge: 3600,
    });
    const first = await decodeSessionToken({ token, secret });
    const second = await decodeSessionToken({ token, secret });
    expect(first).toMatchObject({ sub: 'u1', name: 'Ana', role: 'advisor' });
    expect(second).toEqual(first);
    // Each caller gets its own copy: changing one changes no later answer.
    (second as Record<string, unknown>).role = 'coordinator';
    expect(await decodeSessionToken({ token, secret })).toMatchObject({ role: 'advisor' });
    const tampered = `${token.slice(0, -4)}${token.slice(-4) === 'AAAA' ? 'BBBB' : 'AAAA'}`;
    await expect(decodeSessionToken({ token: tampered, secret })).rejects.toThrow();
    await expect(decodeSessionToken({ token, secret: `${secret}, another` })).rejects.toThrow();
  });

  it('refuses a token once it has expired (past the 15 s tolerance), even one it read before', async () => {
    vi.useFakeTimers({ now: new Date('2026-12-01T10:00:00Z') });
    const token = await encode({ token: { sub: 'u2', uid: 'u2', role: 'farmer', organisationId: 'o1', sessionVersion: 1 }, secret, maxAge: 60 });
    expect(await decodeSessionToken({ token, secret })).toMatchObject({ sub: 'u2' });
    vi.setSystemTime(new Date('2026-12-01T10:01:10Z')); // 70 s on: within the tolerance
    expect(await decodeSessionToken({ token, secret })).toMatchObject({ sub: 'u2' });
    vi.setSystemTime(new Date('2026-12-01T10:01:20Z')); // 80 s on: past it
    await expect(decodeSessionToken({ token, secret })).rejects.toThrow(/exp/);
  });
});
