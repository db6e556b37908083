'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { apiJson } from '@/lib/client/api';
import { formatDay } from '@/lib/shared/display/dates';

export interface DeletedVisit {
  id: string;
  farmName: string;
  advisorName: string | null;
  deletedAt: string;
}

/**
 * The organisation's deleted visits, each with a button that brings it back with its readings.
 * Shown while there are any, and after the last one is restored, for its message.
 */
export function DeletedVisits({ visits }: { visits: DeletedVisit[] }) {
  const router = useRouter();
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  async function restore(visit: DeletedVisit) {
    setBusy(visit.id);
    setMessage(null);
    try {
      await apiJson(`/api/visits/${visit.id}/restore`, { method: 'POST', body: {} });
      setMessage({ ok: true, text: `The visit to ${visit.farmName} is back, with its readings.` });
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: error instanceof Error ? error.message : 'Not restored.' });
    } finally {
      setBusy(null);
    }
  }
  if (visits.length === 0 && !message) return null;
  return (
    <section aria-labelledby="deleted-visits" className="space-y-3">
      <h2 id="deleted-visits" className="text-xl font-bold">
        Deleted visits
      </h2>
      {visits.length > 0 && (
        <Card as="ul" padding="none" className="divide-y divide-rule">
          {visits.map((v) => (
            <li key={v.id} className="flex flex-wrap items-center justify-between gap-3 p-3">
              <span>
                <strong>{v.farmName}</strong>
                {v.advisorName ? ` · ${v.advisorName}` : ''} · deleted {formatDay(v.deletedAt)}
              </span>
              <Button variant="secondary" onClick={() => restore(v)} disabled={busy !== null}>
                {busy === v.id ? 'Restoring…' : 'Restore'}
              </Button>
            </li>
          ))}
        </Card>
      )}
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={`font-bold ${message.ok ? 'text-moss' : 'text-clay'}`}>
          {message.text}
        </p>
      )}
    </section>
  );
}
