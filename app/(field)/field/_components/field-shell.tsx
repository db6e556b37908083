'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { startTransition, useEffect, useState } from 'react';
import { guardUnsavedInput } from '@/lib/client/dirty';
import type { LocalSession } from '@/lib/client/session';
import { FieldUserContext } from './field-session';
import { StorageNote } from './storage-note';
import { SyncBar } from './sync-bar';

/**
 * Frame of the advisor's pages: who is signed in (remembered offline), the sync bar, the triggers.
 * The frame and the page's own headings are drawn at once (they are in the static HTML, so a slow
 * phone shows them before any script runs); the person's name, counts and lists follow once the
 * phone or the server says who is signed in.
 */
export function FieldShell({ children }: { children: React.ReactNode }) {
  const [session, setSession] = useState<LocalSession | null>(null);
  const router = useRouter();

  // Trials timed, rows booked and not saved yet are never lost to a stray tap on a link.
  useEffect(() => guardUnsavedInput(), []);

  useEffect(() => {
    // Test builds only (the condition is compiled in): the fault tests drive the app's own modules.
    if (process.env.NEXT_PUBLIC_FALLBOOK_TEST_HOOKS === '1') void import('@/lib/client/test-hooks').then((m) => m.installTestHooks());
  }, []);

  useEffect(() => {
    let stop: (() => void) | undefined;
    let cancelled = false;
    // Open at once as the advisor remembered on this phone: a weak signal must not hold the field
    // book shut. Sync starts only once the server (or no network) confirms who is signed in, so a
    // remembered person's changes are never sent under someone else's session. The field host
    // (lib/client/field-host.ts) reads the phone's database and runs the sync off the main thread:
    // the frame evaluates no Dexie of its own. The triggers' code is asked for with the host's, in
    // the same task: one round of script loading.
    const triggers = import('@/lib/client/sync/triggers');
    void import('@/lib/client/field-host').then(async ({ fieldSession, rememberedOnPhone }) => {
      void rememberedOnPhone().then((user) => {
        if (!cancelled && user) startTransition(() => setSession((s) => s ?? { state: 'ready', user, online: navigator.onLine }));
      });
      const s = await fieldSession();
      if (cancelled) return;
      // Drawn as a transition: React may pause the redraw of the frame for the person's input. The
      // server confirming the person the phone remembered draws nothing: a new but equal session
      // would redraw the frame and everything that reads the person.
      startTransition(() => setSession((shown) => (JSON.stringify(shown) === JSON.stringify(s) ? shown : s)));
      if (s.state === 'signed-out') router.replace(`/login?callbackUrl=${encodeURIComponent(location.pathname + location.search)}`);
      if (s.state === 'ready' && s.user.role !== 'farmer') {
        const { startSyncTriggers } = await triggers;
        if (cancelled) return;
        stop = startSyncTriggers();
        void navigator.storage?.persist?.();
      }
    });
    return () => {
      cancelled = true;
      stop?.();
    };
  }, [router]);

  useEffect(() => {
    // The header's "offline" follows the network, not just how the page first opened.
    const follow = () => setSession((s) => (s?.state === 'ready' ? { ...s, online: navigator.onLine } : s));
    window.addEventListener('online', follow);
    window.addEventListener('offline', follow);
    return () => {
      window.removeEventListener('online', follow);
      window.removeEventListener('offline', follow);
    };
  }, []);

  if (session?.state === 'signed-out') return <p className="p-6 text-lg">Opening your field book…</p>;
  if (session?.state === 'other-user-waiting') {
    return (
      <main className="mx-auto max-w-xl p-6">
        <h1 className="text-2xl font-bold text-clay">Changes of {session.waitingFor.name} still wait on this phone</h1>
        <p className="mt-3 text-lg">
          They have not reached the server yet. Sign in as {session.waitingFor.name} once with a signal to send them; nothing has been deleted.
        </p>
      </main>
    );
  }
  if (session?.user.role === 'farmer') {
    return (
      <main className="mx-auto max-w-xl p-6">
        <h1 className="text-2xl font-bold text-slate">The field book is for advisors</h1>
        <p className="mt-3 text-lg">
          <Link href="/farm">Go to your farm page</Link>
        </p>
      </main>
    );
  }
  const user = session?.user ?? null;
  // A column as tall as the screen: the storage note sits at its foot, so lists filling in above it
  // never push it about. Before the session is known, the name lines hold their place with a blank.
  return (
    <FieldUserContext.Provider value={user}>
      <div className="field-frame flex min-h-dvh flex-col">
        <header className="border-b border-rule">
          <div className="mx-auto flex w-full max-w-3xl items-center justify-between px-4 py-3">
            <Link href="/field" prefetch={false} className="text-2xl font-bold text-slate no-underline">
              Fallbook
            </Link>
            <span className="text-right leading-tight">
              <span className="block font-bold">{user?.name ?? '\u00a0'}</span>
              <span className="block text-stone">{!session ? '\u00a0' : session.online ? 'Field advisor' : 'Field advisor · offline'}</span>
            </span>
          </div>
        </header>
        <SyncBar />
        <main className="mx-auto w-full max-w-3xl px-4 py-5">{children}</main>
        <StorageNote />
      </div>
    </FieldUserContext.Provider>
  );
}
