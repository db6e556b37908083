// Signing out without next-auth/react's client bundle: what its signOut does (the CSRF token, then a
// form POST to next-auth's sign-out endpoint), in a few lines, so every signed-in page stays light.

/** Ends the session (next-auth clears its cookie) and goes to `callbackUrl`. */
export async function signOutTo(callbackUrl: string): Promise<void> {
  const csrf = (await (await fetch('/api/auth/csrf', { credentials: 'same-origin' })).json()) as { csrfToken?: string };
  const res = await fetch('/api/auth/signout', {
    method: 'POST',
    credentials: 'same-origin',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken: csrf.csrfToken ?? '', callbackUrl, json: 'true' }),
  });
  if (!res.ok) throw new Error(`sign-out answered ${res.status}`);
  window.location.href = callbackUrl;
}
