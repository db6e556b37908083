// Sign-in limits: failures slow an account (and a known address) down with a growing wait, capped,
// never a long lockout of the owner; X-Forwarded-For is read only as far as configured proxies
// wrote it; an unknown e-mail costs the same bcrypt work as a known one.
import { randomUUID } from 'node:crypto';
import { afterEach, describe, expect, it } from 'vitest';
import { MAX_WAIT_MS, assertSignInAllowed, recordSignIn, waitAfter, FREE_FAILURES_PER_ACCOUNT } from '@/lib/server/auth/rate-limit';
import { hashPassword } from '@/lib/server/auth/passwords';
import { AppError } from '@/lib/server/errors';
import { authOptions } from '@/lib/server/auth/options';
import { SignInAttempt, User } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';

const email = () => `limit-${randomUUID().slice(0, 8)}@fixtures.test`;
const address = () => `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
const later = (ms: number) => new Date(Date.now() + ms);

async function refusal(promise: Promise<unknown>): Promise<AppError | null> {
  try {
    await promise;
    return null;
  } catch (error) {
    return error instanceof AppError ? error : null;
  }
}

afterEach(() => {
  delete process.env.TRUSTED_PROXIES;
});

describe('the wait after failed sign-ins (stored in MariaDB)', () => {
  it('grows with the failures and never exceeds the cap', () => {
    expect(waitAfter(FREE_FAILURES_PER_ACCOUNT - 1, FREE_FAILURES_PER_ACCOUNT)).toBe(0);
    const waits = [0, 1, 2, 3, 4, 10, 100].map((n) => waitAfter(FREE_FAILURES_PER_ACCOUNT + n, FREE_FAILURES_PER_ACCOUNT));
    for (let i = 1; i < waits.length; i += 1) expect(waits[i]).toBeGreaterThanOrEqual(waits[i - 1]!);
    expect(waits[0]).toBeGreaterThan(0);
    expect(waits[waits.length - 1]).toBe(MAX_WAIT_MS);
    expect(MAX_WAIT_MS).toBeLessThanOrEqual(60_000);
  });

  it('after many failures the owner is asked to wait seconds, not locked out: once the wait is over the account is open', async () => {
    const who = email();
    for (let i = 0; i < 40; i++) await recordSignIn(who, address(), false);
    const error = await refusal(assertSignInAllowed(who, address()));
    expect(error?.status).toBe(429);
    expect(error?.message).toMatch(/Wait \d+ seconds?, then try again/);
    expect(await refusal(assertSignInAllowed(who, address(), later(MAX_WAIT_MS + 1000)))).toBeNull();
  });

  it('successful sign-ins do not count', async () => {
    const who = email();
    for (let i = 0; i < FREE_FAILURES_PER_ACCOUNT + 5; i++) await recordSignIn(who, address(), true);
    expect(await refusal(assertSignInAllowed(who, address()))).toBeNull();
  });
});

describe('the limits through the sign-in itself (the next-auth credentials check)', () => {
  type Authorize = (credentials: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
  const provider = authOptions.providers[0] as unknown as { options: { authorize: Authorize } };
  const signIn = (who: string, password: string, forwardedFor?: string) =>
    provider.options.authorize({ email: who, password }, { headers: forwardedFor ? { 'x-forwarded-for': forwardedFor } : {} }).then(
      () => null,
      (e: Error) => e.message,
    );

  it('with a proxy configured, made-up X-Forwarded-For entries in front of the real address do not dodge the per-address limit', async () => {
    process.env.TRUSTED_PROXIES = '1';
    const real = address();
    let refused = 0;
    for (let i = 0; i < 40; i++) {
      if (/from this network/.test((await signIn(email(), 'wrong', `${address()}, ${real}`)) ?? '')) refused += 1;
    }
    expect(refused).toBeGreaterThan(0);
  });

  it('without a configured proxy, a new X-Forwarded-For value per try does not give a fresh account limit', async () => {
    const who = email();
    const messages: string[] = [];
    for (let i = 0; i < FREE_FAILURES_PER_ACCOUNT + 2; i++) messages.push((await signIn(who, `wrong-${i}`, address())) ?? '');
    expect(messages.at(-1)).toMatch(/for this account\. Wait/);
  });

  it('the right password of a throttled account is accepted once the short wait is over', async () => {
    const o = await makeOrganisation('throttle');
    await User.update({ passwordHash: await hashPassword('the right password') }, { where: { id: o.advisor.id } });
    for (let i = 0; i < 30; i++) await recordSignIn(o.advisor.email, address(), false);
    expect(await signIn(o.advisor.email, 'the right password')).toMatch(/Wait \d+ seconds?/);
    // The same failures, the cap's length ago: the owner's right password now signs in.
    await SignInAttempt.update({ createdAt: new Date(Date.now() - MAX_WAIT_MS - 1000) }, { where: { email: o.advisor.email } });
    expect(await signIn(o.advisor.email, 'the right password')).toBeNull();
  });

  it('an unknown e-mail answers in about the time of a known one (bcrypt runs for both)', async () => {
    process.env.TRUSTED_PROXIES = '1';
    const o = await makeOrganisation('timing');
    await User.update({ passwordHash: await hashPassword('the right password') }, { where: { id: o.coordinator.id } });
    const time = async (who: string) => {
      const start = performance.now();
      await signIn(who, 'a wrong password', address());
      return performance.now() - start;
    };
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 3; i++) {
      known.push(await time(o.coordinator.email));
      unknown.push(await time(email()));
    }
    console.log(`[sign-in timing] median of 3: known e-mail ${median(known).toFixed(0)} ms, unknown e-mail ${median(unknown).toFixed(0)} ms`);
    expect(median(unknown)).toBeGreaterThan(median(known) * 0.6);
  });
});
