'use client';

import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import type { SyncRecord } from '@/lib/client/sync/meta';
import type { UnitSystem } from '@/lib/shared/domain';
import { formatClock } from '@/lib/shared/display/dates';
import { formatCount } from '@/lib/shared/display/numbers';
import { useFieldUser } from './field-session';
import { decisionWords, waitingWords } from './sync-words';
import { useFieldQuery } from './use-field-query';

function timeOf(iso: string | undefined, units: UnitSystem): string {
  return iso ? formatClock(new Date(iso), units) : 'never';
}

/**
 * What waits on the phone, in words and counts, always in the same place (never an icon alone).
 * Until the session is known it holds its place with the same two lines, and the button waits: a
 * sync may only start once the server or the phone has said who is signed in.
 */
export function SyncBar() {
  const user = useFieldUser();
  const ready = user !== null;
  const [progress, setProgress] = useState<{ sent: number; total: number } | null>(null);
  const [busy, setBusy] = useState(false);
  const state = useFieldQuery(ready ? 'syncSummary' : null);

  async function syncNow() {
    setBusy(true);
    try {
      const { requestSync } = await import('@/lib/client/sync/triggers');
      await requestSync((_, sent, total) => setProgress({ sent, total }), true);
    } finally {
      setBusy(false);
      setProgress(null);
    }
  }

  // A change parked for a decision is not on the server either: never claim everything is.
  const summary = !ready || !state ? 'Checking the phone…' : waitingWords(state);
  return (
    <section aria-label="Sync status" className="border-b border-rule bg-white">
      <div className="mx-auto flex max-w-3xl flex-wrap items-center justify-between gap-2 px-4 py-2">
        <div role="status" aria-live="polite" className="leading-tight">
          <span className="block font-bold" data-testid="sync-summary">
            {summary}
          </span>
          <span className="block text-stone">{ready && state ? `Last sync ${timeOf(state.lastSuccess, user?.units ?? 'metric')}` : 'Last sync …'}</span>
          {ready && state && <Notices state={state} />}
        </div>
        <Button variant="secondary" className="disabled:opacity-60" onClick={syncNow} disabled={busy || !ready}>
          {busy ? 'Syncing…' : 'Sync now'}
        </Button>
      </div>
      {progress && (
        <div className="mx-auto max-w-3xl px-4 pb-2">
          <progress className="h-3 w-full" max={progress.total} value={progress.sent} aria-label="Photo upload" />
        </div>
      )}
    </section>
  );
}

type BarState = { parked: number; refusedPhotos: number; paused: boolean; lastRun: SyncRecord | undefined };

/** What needs the person: signing in again, parked changes, refused photos, the last failure. */
function Notices({ state }: { state: BarState }) {
  return (
    <>
      {state.paused && (
        <a href="/login?callbackUrl=/field" className="block font-bold text-clay">
          Sign in again to send what is waiting
        </a>
      )}
      {state.parked > 0 && (
        <Link href="/field/sync" className="block font-bold text-clay">
          {decisionWords(state.parked)}
        </Link>
      )}
      {state.refusedPhotos > 0 && (
        <Link href="/field/sync" className="block font-bold text-clay">
          The server did not take {formatCount(state.refusedPhotos, 'photo')}: see why
        </Link>
      )}
      {!state.lastRun?.ok && state.lastRun?.message && !state.paused && <span className="block text-stone">{state.lastRun.message}</span>}
    </>
  );
}
