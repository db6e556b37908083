import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_ADDRESS, assertSignInAllowed, recordSignIn } from '@/lib/server/auth/rate-limit';
import { AppError } from '@/lib/server/errors';
import { authOptions } from '@/lib/server/auth/options';

const email = () => `limit-${randomUUID().slice(0, 8)}@fixtures.test`;
const address = () => `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;

async function refusal(promise: Promise<unknown>): Promise<AppError | null> {
  try {
    await promise;
    return null;
  } catch (error) {
    return error instanceof AppError ? error : null;
  }
}

describe('sign-in rate limit (stored in MariaDB)', () => {
  it(`allows ${MAX_FAILURES_PER_ACCOUNT - 1} failures, refuses after ${MAX_FAILURES_PER_ACCOUNT} for the account with a 429 and a clear message`, async () => {
    const who = email();
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT - 1; i++) await recordSignIn(who, address(), false);
    expect(await refusal(assertSignInAllowed(who, address()))).toBeNull();
    await recordSignIn(who, address(), false);
    const error = await refusal(assertSignInAllowed(who, address()));
    expect(error?.status).toBe(429);
    expect(error?.message).toMatch(/wait 15 minutes/i);
  });

  it('forgets failures older than the window', async () => {
    const who = email();
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) await recordSignIn(who, address(), false);
    const later = new Date(Date.now() + 16 * 60 * 1000);
    expect(await refusal(assertSignInAllowed(who, address(), later))).toBeNull();
  });

  it('limits one address trying many accounts', async () => {
    const from = address();
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) await recordSignIn(email(), from, false);
    const error = await refusal(assertSignInAllowed(email(), from));
    expect(error?.status).toBe(429);
    expect(error?.message).toMatch(/network/i);
  });

  it('successful sign-ins do not count against the limit', async () => {
    const who = email();
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT + 2; i++) await recordSignIn(who, address(), true);
    expect(await refusal(assertSignInAllowed(who, address()))).toBeNull();
  });
});

describe('the limit through the sign-in itself (the next-auth credentials check)', () => {
  type Authorize = (credentials: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
  const provider = authOptions.providers[0] as unknown as { options: { authorize: Authorize } };
  const signIn = (who: string, password: string, forwardedFor: string) =>
    provider.options.authorize({ email: who, password }, { headers: { 'x-forwarded-for': forwardedFor } }).then(() => null, (e: Error) => e.message);

  it(`${MAX_FAILURES_PER_ACCOUNT} wrong passwords lock the account: the next try gets the wait message`, async () => {
    const who = email();
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) expect(await signIn(who, `wrong-${i}`, address())).toMatch(/do not match/);
    expect(await signIn(who, 'wrong-again', address())).toMatch(/Too many failed sign-ins for this account\. Wait 15 minutes/);
  });

  it('made-up X-Forwarded-For entries in front of the real address do not dodge the per-address limit', async () => {
    const real = address();
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) {
      expect(await signIn(email(), 'wrong', `${address()}, ${real}`)).toMatch(/do not match/);
    }
    expect(await signIn(email(), 'wrong', `${address()}, ${real}`)).toMatch(/from this network/);
  });
});
