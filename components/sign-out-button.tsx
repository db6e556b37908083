'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: '/login' })}
      className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate hover:bg-slate hover:text-white"
    >
      Sign out
    </button>
  );
}
