'use client';

import { Button } from '@/components/ui/button';
import { signOutTo } from '@/lib/client/sign-out';

export function SignOutButton() {
  return (
    <Button variant="secondary" onClick={() => void signOutTo('/login')} className="whitespace-nowrap hover:bg-slate hover:text-white">
      Sign out
    </Button>
  );
}
