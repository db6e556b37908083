'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { questionBody } from '@/lib/shared/schemas/sheet';

async function post(url: string, body?: unknown): Promise<void> {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body ?? {}) });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'That did not go through; try again.');
}

/** For the farmer: say the sheet was read, or ask the advisor a question. */
export function FarmerReply({ visitId, acknowledged }: { visitId: string; acknowledged: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const form = useForm<z.infer<typeof questionBody>>({ resolver: zodResolver(questionBody), defaultValues: { text: '' } });

  const run = async (fn: () => Promise<void>) => {
    setBusy(true);
    setError(null);
    try {
      await fn();
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };
  const ask = form.handleSubmit((values) => run(async () => {
    await post(`/api/visits/${visitId}/sheet/questions`, values);
    form.reset();
  }));

  return (
    <section aria-labelledby="reply-heading" className="space-y-4 rounded-md border border-rule bg-white p-4 print:hidden">
      <h2 id="reply-heading" className="text-xl font-bold text-slate">Your answer</h2>
      {acknowledged ? (
        <p className="font-bold text-moss">You acknowledged this sheet. Your advisor has been told.</p>
      ) : (
        <button type="button" disabled={busy} onClick={() => run(() => post(`/api/visits/${visitId}/sheet/acknowledge`))}
          className="min-h-12 w-full rounded-md bg-slate px-4 text-lg font-bold text-white disabled:opacity-60">
          I have read this sheet
        </button>
      )}
      <form onSubmit={ask} noValidate className="space-y-2" aria-label="Ask a question">
        <label htmlFor="question" className="block font-bold">Ask your advisor a question</label>
        <textarea id="question" rows={3} {...form.register('text')} className="w-full rounded-md border-2 border-stone bg-paper p-3 text-lg"
          aria-invalid={!!form.formState.errors.text} aria-describedby="question-error" />
        {form.formState.errors.text && <p id="question-error" className="text-clay">{form.formState.errors.text.message}</p>}
        <button type="submit" disabled={busy} className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate">Send question</button>
      </form>
      {error && <p role="alert" className="font-bold text-clay">{error}</p>}
    </section>
  );
}
