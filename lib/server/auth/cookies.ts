import 'server-only';
import type { CookiesOptions } from 'next-auth';

/** True when the app is served over https (NEXTAUTH_URL), so cookies must be Secure. */
export function servedOverHttps(nextAuthUrl: string): boolean {
  return nextAuthUrl.trim().toLowerCase().startsWith('https://');
}

/** The session cookie's name: `__Secure-` prefixed over https (browsers then insist on Secure). */
export function sessionCookieName(nextAuthUrl: string): string {
  return `${servedOverHttps(nextAuthUrl) ? '__Secure-' : ''}next-auth.session-token`;
}

/**
 * next-auth's cookie settings, spelled out rather than left to its defaults so the tests can hold
 * them: the session JWT is HttpOnly (scripts never read it), SameSite=Lax (not sent on cross-site
 * POSTs, still sent when a farmer follows an e-mailed link) and Secure whenever the app is on https.
 */
export function authCookieOptions(nextAuthUrl: string): { useSecureCookies: boolean; cookies: Partial<CookiesOptions> } {
  const secure = servedOverHttps(nextAuthUrl);
  return {
    useSecureCookies: secure,
    cookies: {
      sessionToken: {
        name: sessionCookieName(nextAuthUrl),
        options: { httpOnly: true, sameSite: 'lax', path: '/', secure },
      },
    },
  };
}
