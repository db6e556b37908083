'use client';

import { signOutTo } from '@/lib/client/sign-out';
import { Button } from '@/components/ui/button';

export function SignOutButton() {
  return (
    <Button variant="secondary" onClick={() => void signOutTo('/login')} className="whitespace-nowrap hover:bg-slate hover:text-white">
      Sign out
    </Button>
  );
}
