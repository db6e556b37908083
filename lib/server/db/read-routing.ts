import 'server-only';
import { AsyncLocalStorage } from 'node:async_hooks';

// With read replicas (DB_READ_HOSTS), plain SELECTs go to a replica, which may lag the primary by a
// moment. Work that must see its own writes runs "on the writer": every read in it goes to the primary.
// Kept on globalThis: Next may bundle this module more than once (one copy per server layer) while
// the Sequelize instance, which asks it, is shared.
const globalForRouting = globalThis as unknown as { fallbookOnWriter?: AsyncLocalStorage<boolean> };
const onWriterStore = (globalForRouting.fallbookOnWriter ??= new AsyncLocalStorage<boolean>());

/** The cookie that marks a person who wrote a moment ago; its value is the time of the write (ms). */
export const WROTE_COOKIE = 'fallbook-wrote';

/** Runs fn with every read inside it sent to the primary (writes and transactions always are). */
export function onWriter<T>(fn: () => Promise<T>): Promise<T> {
  return onWriterStore.run(true, fn);
}

/** Runs fn with reads going to the replicas again (the default), e.g. a list inside a long job. */
export function onReplicas<T>(fn: () => Promise<T>): Promise<T> {
  return onWriterStore.run(false, fn);
}

/** True when the value of the wrote cookie is younger than the window. */
export function wroteRecently(cookieValue: string | undefined, windowSeconds: number, now = Date.now()): boolean {
  const at = Number(cookieValue);
  return Number.isFinite(at) && at > 0 && now - at >= -5_000 && now - at < windowSeconds * 1000;
}

/**
 * Whether the current reads must go to the primary: inside onWriter, or (server components, where
 * nothing wrapped the render) the request carries a recent wrote cookie — the page after a save.
 */
export async function readsGoToWriter(windowSeconds: number): Promise<boolean> {
  const pinned = onWriterStore.getStore();
  if (pinned !== undefined) return pinned;
  try {
    const { cookies } = await import('next/headers');
    return wroteRecently((await cookies()).get(WROTE_COOKIE)?.value, windowSeconds);
  } catch {
    // Outside a Next request (scripts, tests): no cookie to honour.
    return false;
  }
}
