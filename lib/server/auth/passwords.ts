import 'server-only';
import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';

// bcryptjs: pure JS, no native build; cost 10 ≈ 100 ms per hash on this class of machine.
const COST = 10;

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);
export const verifyPassword = (plain: string, hash: string) => bcrypt.compare(plain, hash);

let dummy: Promise<string> | undefined;

/** A hash of a random password, made once, for comparing against when there is no account. */
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword(randomBytes(18).toString('base64'));
  return dummy;
}
