// The security headers every response carries (next.config.mjs `headers()`), built from the env at
// build time. Plain JS so next.config.mjs can import it; types in security-headers.d.mts.

/** The origin of the map tile template (NEXT_PUBLIC_TILE_URL), or null when no tiles are used. */
export function tileOrigin(tileUrl) {
  if (!tileUrl) return null;
  try {
    // The template carries {s}/{z}/{x}/{y}; only scheme, host and port matter here.
    const url = new URL(tileUrl.replace(/\{s\}/g, 'a').replace(/\{[a-z]+\}/g, '0'));
    if (url.protocol !== 'https:' && url.protocol !== 'http:') return null;
    // A {s} sub-domain template means any sub-domain of the tile host.
    return tileUrl.includes('{s}.') ? `${url.protocol}//*.${url.host.split('.').slice(1).join('.')}` : url.origin;
  } catch {
    return null;
  }
}

/** The Content-Security-Policy value (see DEVELOPERS.md, "Security headers", for each choice). */
export function contentSecurityPolicy({ dev = false, tileUrl = '' } = {}) {
  const tiles = tileOrigin(tileUrl);
  const directives = {
    'default-src': ["'self'"],
    // 'unsafe-inline': the prerendered (static) pages carry Next's inline bootstrap and RSC payload
    // scripts, whose text changes every build, and static HTML cannot carry a per-request nonce.
    // The field pages must stay static to be precached for use with no signal. Dev adds eval
    // (React's dev tooling); production never does.
    'script-src': ["'self'", "'unsafe-inline'", ...(dev ? ["'unsafe-eval'"] : [])],
    // Next inlines style tags for fonts and CSS; Leaflet and React style props set style attributes.
    'style-src': ["'self'", "'unsafe-inline'"],
    // Photo thumbnails are made from local bytes (blob:); Leaflet's default icons are data: URIs.
    'img-src': ["'self'", 'data:', 'blob:', ...(tiles ? [tiles] : [])],
    'font-src': ["'self'"],
    // The tile host too: the phone's workers fetch the tiles around its visits to keep them offline.
    'connect-src': ["'self'", ...(tiles ? [tiles] : [])],
    'worker-src': ["'self'"],
    'manifest-src': ["'self'"],
    'frame-ancestors': ["'none'"],
    'base-uri': ["'self'"],
    'form-action': ["'self'"],
    'object-src': ["'none'"],
  };
  return Object.entries(directives)
    .map(([name, values]) => `${name} ${values.join(' ')}`)
    .join('; ');
}

/** Every security header as Next's `headers()` wants them; HSTS only in production behind https. */
export function securityHeaders({ nodeEnv = 'production', nextAuthUrl = '', tileUrl = '' } = {}) {
  const headers = [
    { key: 'Content-Security-Policy', value: contentSecurityPolicy({ dev: nodeEnv === 'development', tileUrl }) },
    { key: 'X-Content-Type-Options', value: 'nosniff' },
    { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
    { key: 'X-Frame-Options', value: 'DENY' },
    // The field book needs the phone's position and camera; nothing else, and never for a frame.
    { key: 'Permissions-Policy', value: 'geolocation=(self), camera=(self), microphone=(), payment=(), usb=()' },
    { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  ];
  if (nodeEnv === 'production' && nextAuthUrl.startsWith('https://')) {
    headers.push({ key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' });
  }
  return headers;
}
