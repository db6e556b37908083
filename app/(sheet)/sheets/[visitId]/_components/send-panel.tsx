'use client';

import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { QueryProvider } from '@/components/query-provider';
import { formatDateTime } from '@/lib/shared/display/dates';
import { NOTE_MAX } from '@/lib/shared/sheet/email';

interface SendRow {
  id: string;
  to: string;
  paper: string;
  status: string;
  error: string | null;
  at: string;
}

interface Preview {
  to: string;
  subject: string;
  text: string;
}

const errorOf = async (res: Response, fallback: string) =>
  ((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? fallback;

const bodyOf = (to: string | undefined, note: string) => JSON.stringify({ ...(to ? { to } : {}), ...(note.trim() ? { note } : {}) });

async function postSend(visitId: string, to: string | undefined, note: string): Promise<void> {
  const res = await fetch(`/api/visits/${visitId}/sheet/send`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: bodyOf(to, note) });
  if (!res.ok) throw new Error(await errorOf(res, 'The sheet was not sent.'));
}

async function postPreview(visitId: string, note: string): Promise<Preview> {
  const res = await fetch(`/api/visits/${visitId}/sheet/send/preview`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: bodyOf(undefined, note),
  });
  if (!res.ok) throw new Error(await errorOf(res, 'The preview could not be made.'));
  return ((await res.json()) as { preview: Preview }).preview;
}

/**
 * For the advisor and coordinator: add a personal note, preview the e-mail exactly as it will go,
 * send the sheet to the farmer, see every send, retry a failed one.
 */
export function SendPanel({ visitId, farmerName, farmerEmail }: { visitId: string; farmerName: string | null; farmerEmail: string | null }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const key = ['sheet-sends', visitId];
  const sends = useQuery({
    queryKey: key,
    queryFn: async () => ((await (await fetch(`/api/visits/${visitId}/sheet/sends`)).json()) as { sends: SendRow[] }).sends,
  });
  const [note, setNote] = useState('');
  const preview = useMutation({ mutationFn: () => postPreview(visitId, note) });
  const send = useMutation({
    mutationFn: (to?: string) => postSend(visitId, to, note),
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: key });
      router.refresh();
    },
  });
  return (
    <Card as="section" id="send-sheet" aria-labelledby="send-heading" className="scroll-mt-4 space-y-3 print:hidden">
      <h2 id="send-heading" className="text-xl font-bold text-slate">
        Send this sheet
      </h2>
      {farmerEmail ? (
        <>
          <label htmlFor="send-note" className="block font-bold">
            A personal note (optional)
          </label>
          <textarea
            id="send-note"
            value={note}
            maxLength={NOTE_MAX}
            rows={3}
            aria-describedby="send-note-hint"
            onChange={(e) => {
              setNote(e.target.value);
              preview.reset();
            }}
            className="w-full rounded-md border-2 border-stone p-2 text-lg"
          />
          <p id="send-note-hint" className="text-base text-stone">
            Goes at the top of the e-mail, after the greeting.
          </p>
          <div className="flex flex-wrap gap-3">
            <Button variant="secondary" disabled={preview.isPending} onClick={() => preview.mutate()} className="w-full disabled:opacity-60 sm:w-auto">
              {preview.isPending ? 'Making the preview…' : 'Preview the e-mail'}
            </Button>
            <Button disabled={send.isPending} onClick={() => send.mutate(undefined)} className="w-full text-lg disabled:opacity-60 sm:w-auto">
              {send.isPending ? 'Sending…' : `Send to ${farmerName ?? 'the farmer'} (${farmerEmail})`}
            </Button>
          </div>
          {preview.isError && (
            <p role="alert" className="font-bold text-clay">
              {preview.error.message}
            </p>
          )}
          {preview.data && (
            <div role="region" aria-label="E-mail preview" className="space-y-1 rounded-md border border-rule bg-paper p-3">
              <p>
                <span className="text-stone">To:</span> {preview.data.to}
              </p>
              <p>
                <span className="text-stone">Subject:</span> {preview.data.subject}
              </p>
              <p className="whitespace-pre-wrap break-words border-t border-rule pt-2 text-base">{preview.data.text}</p>
              <p className="text-base text-stone">The sheet goes with it as a PDF.</p>
            </div>
          )}
        </>
      ) : (
        <p>This farm has no farmer account yet; invite the farmer from the office first.</p>
      )}
      {send.isError && (
        <p role="alert" className="font-bold text-clay">
          {send.error.message}
        </p>
      )}
      <h3 className="font-bold">Sent so far</h3>
      {sends.isLoading && <p className="text-stone">Loading…</p>}
      {sends.data?.length === 0 && <p className="text-stone">Not sent yet.</p>}
      <ul className="divide-y divide-rule" aria-label="Sends of this sheet">
        {sends.data?.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <strong className={s.status === 'sent' ? 'text-moss' : 'text-clay'}>{s.status === 'sent' ? 'Sent' : 'Not sent'}</strong> to {s.to} ·{' '}
              <span className="figure">{formatDateTime(s.at)}</span> · {s.paper.toUpperCase()}
              {s.error && <span className="block text-clay">{s.error}</span>}
            </span>
            {s.status === 'failed' && (
              <Button variant="secondary" onClick={() => send.mutate(s.to)} disabled={send.isPending}>
                Retry
              </Button>
            )}
          </li>
        ))}
      </ul>
    </Card>
  );
}

/** The panel with its own query client, the module's default: what send-section.tsx loads on demand. */
export default function SendPanelWithClient(props: { visitId: string; farmerName: string | null; farmerEmail: string | null }) {
  return (
    <QueryProvider>
      <SendPanel {...props} />
    </QueryProvider>
  );
}
