import 'server-only';
import { Op, fn, col } from 'sequelize';
import { SignInAttempt } from '@/lib/server/db';
import { rateLimited } from '../errors';
import { UNKNOWN_ADDRESS } from './client-address';

// Failed sign-ins slow an account (and a known address) down rather than lock it: after the free
// failures in the window, each try must wait a little longer after the last failure, up to a cap,
// so a stranger's wrong passwords cost the owner seconds at most, never a lockout. Kept in the
// database so the limit holds across app servers and restarts.
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const FREE_FAILURES_PER_ACCOUNT = 3;
export const FREE_FAILURES_PER_ADDRESS = 20;
const FIRST_WAIT_MS = 1000;
export const MAX_WAIT_MS = 30_000;

/** How long after the last failure the next try must wait, given the failures in the window. */
export function waitAfter(failures: number, free: number): number {
  if (failures < free) return 0;
  return Math.min(MAX_WAIT_MS, FIRST_WAIT_MS * 2 ** Math.min(failures - free, 20));
}

async function failuresSince(where: { email?: string; address?: string }, since: Date) {
  const [row] = (await SignInAttempt.findAll({
    attributes: [
      [fn('COUNT', col('id')), 'n'],
      [fn('MAX', col('created_at')), 'last'],
    ],
    where: { ...where, succeeded: false, createdAt: { [Op.gte]: since } },
    raw: true,
  })) as unknown as { n: number | string; last: Date | string | null }[];
  return { count: Number(row?.n ?? 0), last: row?.last ? new Date(row.last) : null };
}

function secondsLeft(failures: { count: number; last: Date | null }, free: number, now: Date): number {
  if (!failures.last) return 0;
  const left = failures.last.getTime() + waitAfter(failures.count, free) - now.getTime();
  return left > 0 ? Math.ceil(left / 1000) : 0;
}

const plural = (n: number) => `${n} second${n === 1 ? '' : 's'}`;

/** Throws a 429 AppError (how many seconds to wait) while the account or the address must wait. */
export async function assertSignInAllowed(email: string, address: string, now = new Date()) {
  const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
  const account = secondsLeft(await failuresSince({ email }, since), FREE_FAILURES_PER_ACCOUNT, now);
  if (account > 0) throw rateLimited(`Too many failed sign-ins for this account. Wait ${plural(account)}, then try again.`);
  // The unknown address is everyone's when no proxy is configured: slowing it would slow every person.
  if (address === UNKNOWN_ADDRESS) return;
  const network = secondsLeft(await failuresSince({ address }, since), FREE_FAILURES_PER_ADDRESS, now);
  if (network > 0) throw rateLimited(`Too many failed sign-ins from this network. Wait ${plural(network)}, then try again.`);
}

export async function recordSignIn(email: string, address: string, succeeded: boolean) {
  await SignInAttempt.create({ email, address: address.slice(0, 64), succeeded });
}

// Invitation links that do not exist, recorded beside sign-ins under this marker in place of an e-mail.
const LINK_MISS = 'invitation-link-miss';
export const FREE_LINK_MISSES_PER_ADDRESS = 10;

/**
 * For a token that matched no invitation: throws a 429 while the address must wait, else records
 * the miss. Only misses are counted, so a real link is never slowed down by someone else's guesses.
 */
export async function recordLinkMiss(address: string, now = new Date()) {
  const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
  const left = secondsLeft(await failuresSince({ email: LINK_MISS, address }, since), FREE_LINK_MISSES_PER_ADDRESS, now);
  if (left > 0) throw rateLimited(`Too many tries with invitation links that do not work. Wait ${plural(left)}, then try again.`);
  await recordSignIn(LINK_MISS, address, false);
}
