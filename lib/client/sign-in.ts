// Signing in without next-auth/react's client bundle: what its signIn('credentials', { redirect: false })
// does (the CSRF token, a form POST to the credentials callback, the error read from the answer's URL).

/** Signs in with e-mail and password; the error code next-auth gave (e.g. CredentialsSignin), or null. */
export async function signInWithPassword(email: string, password: string, callbackUrl: string): Promise<string | null> {
  const csrf = (await (await fetch('/api/auth/csrf', { credentials: 'same-origin' })).json()) as { csrfToken?: string };
  const res = await fetch('/api/auth/callback/credentials', {
    method: 'POST',
    credentials: 'same-origin',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ email, password, csrfToken: csrf.csrfToken ?? '', callbackUrl, json: 'true' }),
  });
  const data = (await res.json().catch(() => ({}))) as { url?: string };
  const error = data.url ? new URL(data.url, window.location.href).searchParams.get('error') : 'Sign-in did not answer.';
  if (!res.ok && !error) return `Sign-in answered ${res.status}.`;
  return error;
}
