import { AppHeader } from '@/components/app-header';
import type { SessionUser } from '@/lib/shared/domain';

/** Header plus a centred column: the frame of every signed-in page. */
export function PageShell({ user, children }: { user: SessionUser; children: React.ReactNode }) {
  return (
    <>
      <AppHeader user={user} />
      <main className="mx-auto max-w-5xl px-4 py-6">{children}</main>
    </>
  );
}
