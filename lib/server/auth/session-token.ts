import 'server-only';
import hkdf from '@panva/hkdf';
import { jwtDecrypt } from 'jose';
import type { JWT, JWTDecodeParams } from 'next-auth/jwt';

// The session cookie is next-auth's encrypted JWT (A256GCM under a key derived from NEXTAUTH_SECRET
// with HKDF). next-auth derives that key again for every token it reads, and on a busy server the
// derivation cost more than the decryption: here it is derived once per secret and salt.
const keys = new Map<string, Promise<Uint8Array>>();

function encryptionKey(secret: string, salt: string): Promise<Uint8Array> {
  const id = `${salt}\u0000${secret}`;
  let key = keys.get(id);
  if (!key) {
    key = hkdf('sha256', secret, salt, `NextAuth.js Generated Encryption Key${salt ? ` (${salt})` : ''}`, 32);
    keys.set(id, key);
  }
  return key;
}

const CLOCK_TOLERANCE_S = 15;

// A syncing phone sends the same cookie with every request: the claims a token decrypted to are
// kept, by the token's exact text, while the token is valid, so it is decrypted once rather than
// once per request. The same text always decrypts to the same claims, so this answers as a fresh
// decryption would; whether the account may still use them (signed out, disabled) is checked
// against the database on every request, as before. Bounded: the oldest entry goes first.
const DECODED_MAX = 2000;
const decoded = new Map<string, JWT>();

const stillValid = (claims: JWT, nowS: number) =>
  (typeof claims.exp !== 'number' || claims.exp > nowS - CLOCK_TOLERANCE_S) && (typeof claims.nbf !== 'number' || claims.nbf <= nowS + CLOCK_TOLERANCE_S);

/** Reads a session token exactly as next-auth's own decode does (same key, same 15 s clock tolerance). */
export async function decodeSessionToken({ token, secret, salt = '' }: JWTDecodeParams): Promise<JWT | null> {
  if (!token) return null;
  const id = `${salt}\u0000${String(secret)}\u0000${token}`;
  const known = decoded.get(id);
  if (known && stillValid(known, Date.now() / 1000)) return { ...known };
  decoded.delete(id);
  const { payload } = await jwtDecrypt(token, await encryptionKey(String(secret), salt), { clockTolerance: CLOCK_TOLERANCE_S });
  if (decoded.size >= DECODED_MAX) decoded.delete(decoded.keys().next().value as string);
  decoded.set(id, payload as JWT);
  return { ...(payload as JWT) };
}
