import 'server-only';
import { Op } from 'sequelize';
import { SignInAttempt } from '@/lib/server/db';
import { rateLimited } from '../errors';

// Failed sign-ins allowed in the window, per account and per address. Kept in the database so
// the limit holds across app servers and restarts.
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_ADDRESS = 20;

async function failuresSince(where: { email: string } | { address: string }, since: Date) {
  return SignInAttempt.count({ where: { ...where, succeeded: false, createdAt: { [Op.gte]: since } } });
}

/** Throws a 429 AppError when the account or the address has failed too often recently. */
export async function assertSignInAllowed(email: string, address: string, now = new Date()) {
  const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
  if ((await failuresSince({ email }, since)) >= MAX_FAILURES_PER_ACCOUNT) {
    throw rateLimited('Too many failed sign-ins for this account. Wait 15 minutes, then try again.');
  }
  if ((await failuresSince({ address }, since)) >= MAX_FAILURES_PER_ADDRESS) {
    throw rateLimited('Too many failed sign-ins from this network. Wait 15 minutes, then try again.');
  }
}

export async function recordSignIn(email: string, address: string, succeeded: boolean) {
  await SignInAttempt.create({ email, address: address.slice(0, 64), succeeded });
}
