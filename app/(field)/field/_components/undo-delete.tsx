'use client';

// Deletes on the phone take one tap and can be taken back for a while: the delete waits a few seconds
// before it is offered to the server, and "Undo" brings the record back as long as it has not gone.
// The outbox (and Dexie with it) loads at the first delete, not with the screen.
import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { announceSave } from '@/lib/client/sync/triggers';
import type { SyncEntity } from '@/lib/shared/schemas/sync';

/** How long the delete waits before the phone offers it to the server. */
export const UNDO_WINDOW_MS = 10_000;

interface Pending {
  entity: SyncEntity;
  id: string;
  what: string;
}

export function useUndoableDelete() {
  const [pending, setPending] = useState<Pending | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const settle = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
  };
  // Leaving the page sends what was deleted (the delete is already queued; this only wakes the sync).
  useEffect(
    () => () => {
      if (timer.current) {
        clearTimeout(timer.current);
        announceSave();
      }
    },
    [],
  );

  async function remove(entity: SyncEntity, id: string, what: string) {
    settle();
    const { deleteRecord } = await import('@/lib/client/outbox');
    await deleteRecord(entity, id, UNDO_WINDOW_MS);
    setNote(null);
    setPending({ entity, id, what });
    timer.current = setTimeout(() => {
      timer.current = null;
      setPending(null);
      announceSave();
    }, UNDO_WINDOW_MS);
  }

  async function undo() {
    if (!pending) return;
    settle();
    const { undoDelete } = await import('@/lib/client/outbox');
    const back = await undoDelete(pending.entity, pending.id);
    const what = pending.what.charAt(0).toUpperCase() + pending.what.slice(1);
    setNote(back ? `${what} is back.` : `${what} had already gone to the server; add it again if you need it.`);
    setPending(null);
  }

  const bar =
    pending || note ? (
      <Card tone="strong" padding="md" className="flex items-center justify-between gap-3" role="status" data-testid="undo-bar">
        <p className="font-bold">{pending ? `Deleted: ${pending.what}.` : note}</p>
        {pending && (
          <Button className="min-w-24" onClick={undo}>
            Undo
          </Button>
        )}
      </Card>
    ) : null;

  return { remove, bar };
}
