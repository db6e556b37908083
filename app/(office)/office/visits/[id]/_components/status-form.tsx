'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiJson } from '@/lib/client/api';
import { VISIT_STATUS_LABELS, VISIT_STATUSES, type VisitStatus } from '@/lib/shared/domain';

/** Moves the visit along its life (or cancels it); the change is audited on the server. */
export function StatusForm({ visitId, status }: { visitId: string; status: VisitStatus }) {
  const router = useRouter();
  const [value, setValue] = useState<VisitStatus>(status);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  async function save(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    try {
      await apiJson(`/api/visits/${visitId}`, { method: 'PATCH', body: { status: value } });
      setMessage({ ok: true, text: `Now: ${VISIT_STATUS_LABELS[value]}.` });
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: error instanceof Error ? error.message : 'Not saved.' });
    } finally {
      setBusy(false);
    }
  }
  return (
    <form aria-label="Change the state" onSubmit={save} className="flex flex-wrap items-end gap-3">
      <label className="block font-bold">State
        <select value={value} onChange={(e) => setValue(e.target.value as VisitStatus)} className="mt-1 block min-h-12 rounded-md border-2 border-stone bg-white px-2 text-lg">
          {VISIT_STATUSES.map((s) => <option key={s} value={s}>{VISIT_STATUS_LABELS[s]}</option>)}
        </select>
      </label>
      <button type="submit" disabled={busy || value === status} className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate disabled:opacity-50">Change state</button>
      {message && <p role={message.ok ? 'status' : 'alert'} className={`w-full font-bold ${message.ok ? 'text-moss' : 'text-clay'}`}>{message.text}</p>}
    </form>
  );
}
