// Types for security-headers.mjs (plain JS so next.config.mjs can import it).
export interface HeaderPair {
  key: string;
  value: string;
}
/** The origin of the map tile template, or null. */
export function tileOrigin(tileUrl: string | undefined): string | null;
/** The Content-Security-Policy value. */
export function contentSecurityPolicy(options?: { dev?: boolean; tileUrl?: string }): string;
/** Every security header; HSTS only in production behind https. */
export function securityHeaders(options?: { nodeEnv?: string; nextAuthUrl?: string; tileUrl?: string }): HeaderPair[];
