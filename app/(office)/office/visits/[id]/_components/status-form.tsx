'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Select } from '@/components/ui/control';
import { apiJson } from '@/lib/client/api';
import { VISIT_STATUS_LABELS, VISIT_STATUSES, type VisitStatus } from '@/lib/shared/domain';
import { JUMP_REASON_MIN, nextStates } from '@/lib/shared/visit-states';

/**
 * Moves the visit along its life: the choices are the moves the table of visit states allows the
 * office from here. A move outside it (a jump) is a separate, folded-away form that needs a reason;
 * both are audited on the server, which checks the same table.
 */
export function StatusForm({ visitId, status }: { visitId: string; status: VisitStatus }) {
  const router = useRouter();
  const allowed = nextStates(status, 'office');
  const others = VISIT_STATUSES.filter((s) => s !== status && !allowed.includes(s));
  const [value, setValue] = useState<VisitStatus | ''>(allowed[0] ?? '');
  const [jumpTo, setJumpTo] = useState<VisitStatus | ''>('');
  const [reason, setReason] = useState('');
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  async function move(to: VisitStatus, why?: string) {
    setBusy(true);
    try {
      if (why) await apiJson(`/api/visits/${visitId}/jump`, { method: 'POST', body: { status: to, reason: why } });
      else await apiJson(`/api/visits/${visitId}`, { method: 'PATCH', body: { status: to } });
      setMessage({ ok: true, text: `Now: ${VISIT_STATUS_LABELS[to]}.` });
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: error instanceof Error ? error.message : 'Not saved.' });
    } finally {
      setBusy(false);
    }
  }
  function jump(e: React.FormEvent) {
    e.preventDefault();
    if (!jumpTo) return setMessage({ ok: false, text: 'Choose the state to move it to.' });
    if (reason.trim().length < JUMP_REASON_MIN) return setMessage({ ok: false, text: 'Say in a few words why the visit moves outside the usual order.' });
    void move(jumpTo, reason.trim());
  }
  return (
    <div className="space-y-4">
      {allowed.length > 0 ? (
        <form
          aria-label="Change the state"
          onSubmit={(e) => {
            e.preventDefault();
            if (value) void move(value);
          }}
          className="flex flex-wrap items-end gap-3"
        >
          <label className="block font-bold">
            Next state
            <Select className="w-auto" value={value} onChange={(e) => setValue(e.target.value as VisitStatus)}>
              {allowed.map((s) => (
                <option key={s} value={s}>
                  {VISIT_STATUS_LABELS[s]}
                </option>
              ))}
            </Select>
          </label>
          <Button variant="secondary" type="submit" disabled={busy || !value}>
            Change state
          </Button>
        </form>
      ) : (
        <p className="text-stone">
          From “{VISIT_STATUS_LABELS[status]}” the office has no next step by hand; the visit moves on when the sheet is sent, the farmer decides or the ram is
          checked.
        </p>
      )}
      {others.length > 0 && (
        <Card as="details" padding="md">
          <summary className="cursor-pointer font-bold">Move outside the usual order…</summary>
          <form aria-label="Move outside the usual order" onSubmit={jump} className="mt-3 space-y-3">
            <p className="text-stone">
              Only when the record is wrong (a visit done on paper, a farmer who decided on the phone). Your reason goes into the visit’s history.
            </p>
            <label className="block font-bold">
              Move to
              <Select className="w-auto" value={jumpTo} onChange={(e) => setJumpTo(e.target.value as VisitStatus)}>
                <option value="">Choose…</option>
                {others.map((s) => (
                  <option key={s} value={s}>
                    {VISIT_STATUS_LABELS[s]}
                  </option>
                ))}
              </Select>
            </label>
            <label className="block font-bold">
              Why
              <textarea
                value={reason}
                onChange={(e) => setReason(e.target.value)}
                rows={2}
                className="mt-1 block w-full rounded-md border-2 border-stone bg-paper p-2 text-lg"
              />
            </label>
            <Button variant="danger" type="submit" disabled={busy}>
              Move with this reason
            </Button>
          </form>
        </Card>
      )}
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={`w-full font-bold ${message.ok ? 'text-moss' : 'text-clay'}`}>
          {message.text}
        </p>
      )}
    </div>
  );
}
