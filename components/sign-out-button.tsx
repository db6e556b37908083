'use client';

import { signOutTo } from '@/lib/client/sign-out';

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => void signOutTo('/login')}
      className="min-h-12 whitespace-nowrap rounded-md border-2 border-slate px-4 font-bold text-slate hover:bg-slate hover:text-white"
    >
      Sign out
    </button>
  );
}
