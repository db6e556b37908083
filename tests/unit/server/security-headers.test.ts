// The security headers next.config.mjs sends: what each directive allows, and when HSTS is sent.
import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, securityHeaders, tileOrigin } from '@/lib/config/security-headers.mjs';

const directives = (csp: string) =>
  new Map(
    csp.split('; ').map((d) => {
      const [name = '', ...values] = d.split(' ');
      return [name, values] as const;
    }),
  );

const header = (list: { key: string; value: string }[], key: string) => list.find((h) => h.key === key)?.value;

describe('Content-Security-Policy', () => {
  it('allows only this origin, with the exceptions Next, Tailwind and Leaflet need', () => {
    const csp = directives(contentSecurityPolicy());
    expect(csp.get('default-src')).toEqual(["'self'"]);
    expect(csp.get('script-src')).toEqual(["'self'", "'unsafe-inline'"]);
    expect(csp.get('style-src')).toEqual(["'self'", "'unsafe-inline'"]);
    expect(csp.get('img-src')).toEqual(["'self'", 'data:', 'blob:']);
    for (const name of ['connect-src', 'worker-src', 'manifest-src', 'base-uri', 'form-action', 'font-src']) expect(csp.get(name), name).toEqual(["'self'"]);
    expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
    expect(csp.get('object-src')).toEqual(["'none'"]);
  });

  it('never allows eval in production, only in development', () => {
    expect(contentSecurityPolicy({ dev: false })).not.toContain('unsafe-eval');
    expect(directives(contentSecurityPolicy({ dev: true })).get('script-src')).toContain("'unsafe-eval'");
  });

  it('adds the map tile host to img-src and connect-src when tiles are configured, and nothing else', () => {
    expect(tileOrigin('https://tiles.example.org/{z}/{x}/{y}.png')).toBe('https://tiles.example.org');
    expect(tileOrigin('https://{s}.tile.example.net/{z}/{x}/{y}.png')).toBe('https://*.tile.example.net');
    expect(tileOrigin('javascript:alert(1)')).toBeNull();
    expect(tileOrigin('')).toBeNull();
    const csp = directives(contentSecurityPolicy({ tileUrl: 'https://tiles.example.org:8443/{z}/{x}/{y}.png' }));
    expect(csp.get('img-src')).toEqual(["'self'", 'data:', 'blob:', 'https://tiles.example.org:8443']);
    // The workers fetch tiles to keep them for offline use.
    expect(csp.get('connect-src')).toEqual(["'self'", 'https://tiles.example.org:8443']);
    expect(csp.get('script-src')).not.toContain('https://tiles.example.org:8443');
    expect(directives(contentSecurityPolicy({})).get('connect-src')).toEqual(["'self'"]);
  });
});

describe('the other headers', () => {
  it('forbid sniffing and framing, trim the referrer, and allow position and camera for this origin only', () => {
    const list = securityHeaders({ nodeEnv: 'production', nextAuthUrl: 'http://127.0.0.1:3100' });
    expect(header(list, 'X-Content-Type-Options')).toBe('nosniff');
    expect(header(list, 'X-Frame-Options')).toBe('DENY');
    expect(header(list, 'Referrer-Policy')).toBe('strict-origin-when-cross-origin');
    expect(header(list, 'Permissions-Policy')).toMatch(/^geolocation=\(self\), camera=\(self\), microphone=\(\)/);
  });

  it('send HSTS only in production behind https', () => {
    const hsts = (nodeEnv: string, nextAuthUrl: string) => header(securityHeaders({ nodeEnv, nextAuthUrl }), 'Strict-Transport-Security');
    expect(hsts('production', 'https://fallbook.example.org')).toMatch(/^max-age=31536000/);
    expect(hsts('production', 'http://localhost:3000')).toBeUndefined();
    expect(hsts('development', 'https://fallbook.example.org')).toBeUndefined();
  });
});
