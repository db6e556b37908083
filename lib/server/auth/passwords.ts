import 'server-only';
import bcrypt from 'bcryptjs';

// bcryptjs: pure JS, no native build; cost 10 ≈ 100 ms per hash on this class of machine.
const COST = 10;

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);
export const verifyPassword = (plain: string, hash: string) => bcrypt.compare(plain, hash);
