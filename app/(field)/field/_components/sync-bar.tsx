'use client';

import { useLiveQuery } from 'dexie-react-hooks';
import Link from 'next/link';
import { useState } from 'react';
import { fieldDb } from '@/lib/client/db';
import { getMeta, type SyncRecord } from '@/lib/client/sync/meta';
import { requestSync } from '@/lib/client/sync/triggers';

function timeOf(iso: string | undefined): string {
  if (!iso) return 'never';
  return new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** What waits on the phone, in words and counts, always in the same place (never an icon alone). */
export function SyncBar() {
  const [progress, setProgress] = useState<{ sent: number; total: number } | null>(null);
  const [busy, setBusy] = useState(false);
  const state = useLiveQuery(async () => {
    const db = fieldDb();
    const outbox = await db.outbox.toArray();
    // One pass over the photo queue, entry by entry (each carries its bytes): what waits, what was refused.
    let photos = 0;
    let refusedPhotos = 0;
    await db.photoBlobs.filter((b) => b.uploadedAt === null).each((b) => {
      photos += 1;
      if (b.lastError) refusedPhotos += 1;
    });
    return {
      waiting: outbox.filter((e) => e.status === 'pending').length,
      parked: outbox.filter((e) => e.status !== 'pending').length,
      photos,
      refusedPhotos,
      lastSuccess: await getMeta<string>('lastSuccess'),
      lastRun: await getMeta<SyncRecord>('lastRun'),
      paused: (await getMeta<boolean>('authPaused')) ?? false,
    };
  });

  async function syncNow() {
    setBusy(true);
    try {
      await requestSync((_, sent, total) => setProgress({ sent, total }), true);
    } finally {
      setBusy(false);
      setProgress(null);
    }
  }

  if (!state) return null;
  // A change parked for a decision is not on the server either: never claim everything is.
  const summary = state.waiting + state.photos + state.parked === 0
    ? 'Everything is on the server'
    : state.waiting + state.photos === 0
      ? 'Not everything is on the server'
      : `${plural(state.waiting, 'change', 'changes')}, ${plural(state.photos, 'photo', 'photos')} waiting`;
  return (
    <section aria-label="Sync status" className="border-b border-rule bg-white">
      <div className="mx-auto flex max-w-3xl flex-wrap items-center justify-between gap-2 px-4 py-2">
        <div role="status" aria-live="polite" className="leading-tight">
          <span className="block font-bold" data-testid="sync-summary">{summary}</span>
          <span className="block text-stone">Last sync {timeOf(state.lastSuccess)}</span>
          {state.paused && (
            <a href="/login?callbackUrl=/field" className="block font-bold text-clay">Sign in again to send what is waiting</a>
          )}
          {state.parked > 0 && (
            <Link href="/field/sync" className="block font-bold text-clay">{plural(state.parked, 'change needs', 'changes need')} your decision</Link>
          )}
          {state.refusedPhotos > 0 && (
            <Link href="/field/sync" className="block font-bold text-clay">The server did not take {plural(state.refusedPhotos, 'photo', 'photos')}: see why</Link>
          )}
          {!state.lastRun?.ok && state.lastRun?.message && !state.paused && <span className="block text-stone">{state.lastRun.message}</span>}
        </div>
        <button type="button" onClick={syncNow} disabled={busy}
          className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate disabled:opacity-60">
          {busy ? 'Syncing…' : 'Sync now'}
        </button>
      </div>
      {progress && (
        <div className="mx-auto max-w-3xl px-4 pb-2">
          <progress className="h-3 w-full" max={progress.total} value={progress.sent} aria-label="Photo upload" />
        </div>
      )}
    </section>
  );
}
