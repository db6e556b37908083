// HTTP helpers of the benches: requests to the served app (signed in) or the floor app on loopback, timed.
import { sessionCookie, type TestUser } from '../../integration/support/fixtures';
import { appUrl } from './report';

/** GET and POST JSON against `base`, each timed; `headers` go with every request. */
export function clientAt(base: string, headers: Record<string, string> = {}) {
  const send = async (path: string, init: RequestInit = {}) => {
    const t0 = performance.now();
    const res = await fetch(`${base}${path}`, { ...init, headers: { ...headers, ...(init.headers ?? {}) } });
    const body = await res.text();
    return { status: res.status, body, ms: performance.now() - t0 };
  };
  return {
    get: (path: string) => send(path),
    post: (path: string, json: unknown) => send(path, { method: 'POST', body: JSON.stringify(json), headers: { 'content-type': 'application/json' } }),
  };
}

/** A signed-in client for one user against the served app. */
export async function clientFor(user: TestUser) {
  const base = appUrl();
  return clientAt(base, { cookie: await sessionCookie(user), origin: base });
}

/** Runs `task(i)` for i in 0..count-1 with at most `concurrency` at once; stops starting new ones after `deadlineMs`. */
export async function pool<T>(count: number, concurrency: number, deadlineMs: number, task: (i: number) => Promise<T>): Promise<T[]> {
  const out: T[] = [];
  const until = Date.now() + deadlineMs;
  let next = 0;
  const worker = async () => {
    while (next < count && Date.now() < until) out.push(await task(next++));
  };
  await Promise.all(Array.from({ length: Math.min(concurrency, count) }, worker));
  return out;
}
