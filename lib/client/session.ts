// The advisor signed in on this phone, remembered so the field pages open offline.
import type { SessionUser } from '@/lib/shared/domain';
import { fieldDb } from './db';
import { getMeta, setMeta } from './sync/meta';

export type LocalSession =
  | { state: 'ready'; user: SessionUser; online: boolean }
  | { state: 'signed-out' }
  | { state: 'other-user-waiting'; user: SessionUser; waitingFor: SessionUser };

// A weak signal can leave a request hanging for minutes: past this, the phone counts as offline.
export const SESSION_CHECK_TIMEOUT_MS = 8_000;

/** The advisor last confirmed on this phone, read without touching the network (null if none). */
export async function rememberedUser(): Promise<SessionUser | null> {
  return (await getMeta<SessionUser>('user')) ?? null;
}

/** Checks /api/me when online; falls back to the remembered user offline or when the check hangs. */
export async function loadLocalSession(timeoutMs = SESSION_CHECK_TIMEOUT_MS): Promise<LocalSession> {
  const remembered = await getMeta<SessionUser>('user');
  let res: Response | undefined;
  try {
    res = await fetch('/api/me', { credentials: 'same-origin', cache: 'no-store', signal: AbortSignal.timeout(timeoutMs) });
  } catch {
    return remembered ? { state: 'ready', user: remembered, online: false } : { state: 'signed-out' };
  }
  if (res.status === 401) return { state: 'signed-out' };
  if (!res.ok) return remembered ? { state: 'ready', user: remembered, online: false } : { state: 'signed-out' };
  const { user } = (await res.json()) as { user: SessionUser };
  if (remembered && remembered.id !== user.id) {
    // Another person's changes still wait on this phone: keep them, never mix them up.
    if ((await fieldDb().outbox.count()) > 0) return { state: 'other-user-waiting', user, waitingFor: remembered };
    await clearPhone();
  }
  await setMeta('user', user);
  return { state: 'ready', user, online: true };
}

async function clearPhone(): Promise<void> {
  const db = fieldDb();
  await db.transaction('rw', db.tables, async () => {
    for (const table of db.tables) await table.clear();
  });
}
