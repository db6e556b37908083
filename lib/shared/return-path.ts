// Where to go after sign-in: only a path of this origin. Browsers read `/\host`, `/<tab>/host` and
// `//host` as other sites, so the value is resolved the way a browser would (WHATWG URL) and kept
// only when it lands on the same origin; its path and query string are kept whole.

/** The same-origin path + query of `value` resolved against `origin`, or undefined. */
export function sameOriginPath(value: string | string[] | undefined | null, origin: string): string | undefined {
  const raw = Array.isArray(value) ? value[0] : value;
  if (!raw) return undefined;
  let url: URL;
  let base: URL;
  try {
    base = new URL(origin);
    url = new URL(raw, base);
  } catch {
    return undefined;
  }
  if (url.origin !== base.origin || (url.protocol !== 'http:' && url.protocol !== 'https:')) return undefined;
  // `https://this.origin//evil.example` is same-origin, but its path alone would read as `//evil.example`.
  const path = url.pathname.replace(/^\/+/, '/');
  return `${path}${url.search}`;
}
