'use client';

import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { answerProblem } from '@/lib/shared/sheet/question-rules';

/** For the assigned advisor and the office: answer one open question; the farmer is e-mailed it. */
export function AnswerForm({ visitId, questionId }: { visitId: string; questionId: string }) {
  const router = useRouter();
  const id = useId();
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const found = answerProblem(text);
    setProblem(found);
    if (found) return;
    setBusy(true);
    try {
      const res = await fetch(`/api/visits/${visitId}/sheet/answers`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ questionId, text }),
      });
      if (!res.ok)
        throw new Error(
          ((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'The answer did not go through; try again.',
        );
      setText('');
      router.refresh();
    } catch (e) {
      setProblem(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} noValidate className="mt-2 space-y-2" aria-label="Answer this question">
      <label htmlFor={id} className="block font-bold">
        Your answer
      </label>
      <textarea
        id={id}
        rows={3}
        value={text}
        onChange={(e) => setText(e.target.value)}
        className="w-full rounded-md border-2 border-stone bg-paper p-3 text-lg"
        aria-invalid={!!problem}
        aria-describedby={`${id}-error`}
      />
      {problem && (
        <p id={`${id}-error`} role="alert" className="text-clay">
          {problem}
        </p>
      )}
      <Button type="submit" disabled={busy} className="disabled:opacity-60">
        {busy ? 'Sending…' : 'Send answer to the farmer'}
      </Button>
    </form>
  );
}
