import 'server-only';

type Headers = Record<string, string | string[] | undefined> | undefined;

/** What the per-address limit records when the address is not known. */
export const UNKNOWN_ADDRESS = 'unknown';

/** TRUSTED_PROXIES: how many proxies in front of the app append to X-Forwarded-For (default 0). */
export function trustedProxyCount(): number {
  const n = Number(process.env.TRUSTED_PROXIES ?? 0);
  return Number.isInteger(n) && n > 0 ? Math.min(n, 10) : 0;
}

/**
 * The address a sign-in came from, for the per-address limit. Next writes X-Forwarded-For from the
 * socket only when the request has none, so without a proxy the header is whatever the client sent
 * and is not read (the unknown address). Each configured proxy appends the peer it saw, so with N
 * proxies the N-th entry from the end is the first one written by something other than the client.
 */
export function clientAddress(headers: Headers, proxies = trustedProxyCount()): string {
  if (proxies === 0) return UNKNOWN_ADDRESS;
  const forwarded = headers?.['x-forwarded-for'];
  const list = (Array.isArray(forwarded) ? forwarded.join(',') : (forwarded ?? ''))
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  if (list.length < proxies) return UNKNOWN_ADDRESS;
  return list[list.length - proxies]?.slice(0, 64) || UNKNOWN_ADDRESS;
}
