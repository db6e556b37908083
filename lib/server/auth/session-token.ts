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

/** Reads a session token exactly as next-auth's own decode does (same key, same 15 s clock tolerance). */
export async function decodeSessionToken({ token, secret, salt = '' }: JWTDecodeParams): Promise<JWT | null> {
  if (!token) return null;
  const { payload } = await jwtDecrypt(token, await encryptionKey(String(secret), salt), { clockTolerance: 15 });
  return payload as JWT;
}
