'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { QueryProvider } from '@/components/query-provider';

interface SendRow { id: string; to: string; paper: string; status: string; error: string | null; at: string }

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

async function postSend(visitId: string, to?: string): Promise<void> {
  const res = await fetch(`/api/visits/${visitId}/sheet/send`, {
    method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(to ? { to } : {}),
  });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'The sheet was not sent.');
}

/** For the advisor and coordinator: send the sheet to the farmer, see every send, retry a failed one. */
export function SendPanel({ visitId, farmerName, farmerEmail }: { visitId: string; farmerName: string | null; farmerEmail: string | null }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const key = ['sheet-sends', visitId];
  const sends = useQuery({
    queryKey: key,
    queryFn: async () => ((await (await fetch(`/api/visits/${visitId}/sheet/sends`)).json()) as { sends: SendRow[] }).sends,
  });
  const send = useMutation({
    mutationFn: (to?: string) => postSend(visitId, to),
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: key });
      router.refresh();
    },
  });
  return (
    <section aria-labelledby="send-heading" className="space-y-3 rounded-md border border-rule bg-white p-4 print:hidden">
      <h2 id="send-heading" className="text-xl font-bold text-slate">Send this sheet</h2>
      {farmerEmail ? (
        <button type="button" disabled={send.isPending} onClick={() => send.mutate(undefined)}
          className="min-h-12 w-full rounded-md bg-slate px-4 text-lg font-bold text-white disabled:opacity-60 sm:w-auto">
          {send.isPending ? 'Sending…' : `Send to ${farmerName ?? 'the farmer'} (${farmerEmail})`}
        </button>
      ) : (
        <p>This farm has no farmer account yet; invite the farmer from the office first.</p>
      )}
      {send.isError && <p role="alert" className="font-bold text-clay">{send.error.message}</p>}
      <h3 className="font-bold">Sent so far</h3>
      {sends.isLoading && <p className="text-stone">Loading…</p>}
      {sends.data?.length === 0 && <p className="text-stone">Not sent yet.</p>}
      <ul className="divide-y divide-rule" aria-label="Sends of this sheet">
        {sends.data?.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <strong className={s.status === 'sent' ? 'text-moss' : 'text-clay'}>{s.status === 'sent' ? 'Sent' : 'Not sent'}</strong>{' '}
              to {s.to} · <span className="figure">{when(s.at)}</span> · {s.paper.toUpperCase()}
              {s.error && <span className="block text-clay">{s.error}</span>}
            </span>
            {s.status === 'failed' && (
              <button type="button" onClick={() => send.mutate(s.to)} disabled={send.isPending}
                className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate">Retry</button>
            )}
          </li>
        ))}
      </ul>
    </section>
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
