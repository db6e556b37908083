'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { questionProblem } from '@/lib/shared/sheet/question-rules';

async function post(url: string, body?: unknown): Promise<void> {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body ?? {}) });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'That did not go through; try again.');
}

/**
 * For the farmer: say the sheet was read, or ask the advisor a question. A small island on a
 * server-rendered sheet, so it checks the one field by hand (question-rules, the limits the route's
 * schema uses) rather than load a form library and zod onto the farmer's phone.
 */
export function FarmerReply({ visitId, acknowledged }: { visitId: string; acknowledged: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

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
  const ask = (event: React.FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const found = questionProblem(text);
    setProblem(found);
    if (found) return;
    void run(async () => {
      await post(`/api/visits/${visitId}/sheet/questions`, { text });
      setText('');
    });
  };

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
        <textarea id="question" name="text" rows={3} value={text}
          onChange={(e) => { setText(e.target.value); if (problem) setProblem(questionProblem(e.target.value)); }}
          className="w-full rounded-md border-2 border-stone bg-paper p-3 text-lg"
          aria-invalid={!!problem} aria-describedby="question-error" />
        {problem && <p id="question-error" className="text-clay">{problem}</p>}
        <button type="submit" disabled={busy} className="min-h-12 rounded-md border-2 border-slate px-4 font-bold text-slate">Send question</button>
      </form>
      {error && <p role="alert" className="font-bold text-clay">{error}</p>}
    </section>
  );
}
