'use client';

import { useState } from 'react';
import { signOutTo } from '@/lib/client/sign-out';

/** Ends every session of the person (other browsers and phones too), then this one. */
export function SignOutEverywhereButton() {
  const [failed, setFailed] = useState(false);
  async function endAll() {
    setFailed(false);
    const res = await fetch('/api/me/sessions', {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'content-type': 'application/json' },
      body: '{}',
    }).catch(() => null);
    if (!res || (!res.ok && res.status !== 401)) {
      setFailed(true);
      return;
    }
    await signOutTo('/login');
  }
  return (
    <span className="flex flex-col items-start">
      <button type="button" onClick={() => void endAll()} className="min-h-12 whitespace-nowrap px-1 text-sm font-bold text-slate underline">
        Sign out everywhere
      </button>
      {failed && (
        <span role="alert" className="text-sm font-bold text-clay">
          Not done: check the connection and try again.
        </span>
      )}
    </span>
  );
}
