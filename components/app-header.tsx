import Link from 'next/link';
import { HOME_BY_ROLE, type SessionUser } from '@/lib/shared/domain';
import { SignOutButton } from './sign-out-button';
import { SignOutEverywhereButton } from './sign-out-everywhere-button';

const ROLE_NAMES = { coordinator: 'Coordinator', advisor: 'Field advisor', farmer: 'Farmer' } as const;

export function AppHeader({ user }: { user: SessionUser }) {
  return (
    <header className="border-b border-rule bg-paper">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-3 px-4 py-3">
        <Link href={HOME_BY_ROLE[user.role]} className="text-2xl font-bold text-slate no-underline">
          Fallbook
        </Link>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
          <p className="text-right leading-tight">
            <span className="block font-bold">{user.name}</span>
            <span className="block text-stone">{ROLE_NAMES[user.role]}</span>
          </p>
          <SignOutButton />
          <SignOutEverywhereButton />
        </div>
      </div>
    </header>
  );
}
