'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { decisionProblem, questionProblem } from '@/lib/shared/sheet/question-rules';

async function post(url: string, body?: unknown): Promise<void> {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body ?? {}) });
  if (!res.ok)
    throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'That did not go through; try again.');
}

export type FarmerDecision = 'go-ahead' | 'not-now' | null;

/**
 * For the farmer: say the sheet was read, decide (go ahead / not now, with a reason), or ask a
 * question. Reading is not agreeing: the two are separate buttons, records and visit states. A small
 * island on a server-rendered sheet, so it checks by hand (question-rules, the limits the routes'
 * schemas use) rather than load a form library and zod onto the farmer's phone.
 */
export function FarmerReply({
  visitId,
  acknowledged,
  decision,
  canDecide,
}: {
  visitId: string;
  acknowledged: boolean;
  decision: FarmerDecision;
  canDecide: boolean;
}) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [choice, setChoice] = useState<'go-ahead' | 'not-now' | null>(null);
  const [reason, setReason] = useState('');
  const [reasonProblem, setReasonProblem] = useState<string | null>(null);

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
  const decide = (event: React.FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (!choice) return;
    const found = decisionProblem(choice, reason);
    setReasonProblem(found);
    if (found) return;
    void run(async () => {
      await post(`/api/visits/${visitId}/sheet/decision`, { decision: choice, reason });
      setChoice(null);
      setReason('');
    });
  };

  return (
    <Card as="section" aria-labelledby="reply-heading" className="space-y-5 print:hidden">
      <h2 id="reply-heading" className="text-xl font-bold text-slate">
        Your answer
      </h2>
      <div className="space-y-2">
        <h3 className="font-bold">1. Reading it</h3>
        {acknowledged ? (
          <p className="font-bold text-moss">You have told us you read this sheet. That is not a yes: say below whether to go ahead.</p>
        ) : (
          <Button
            variant="secondary"
            size="wide"
            disabled={busy}
            onClick={() => run(() => post(`/api/visits/${visitId}/sheet/acknowledge`))}
            className="px-4 text-lg disabled:opacity-60"
          >
            I have read this sheet
          </Button>
        )}
      </div>
      <div className="space-y-2">
        <h3 className="font-bold">2. Your decision</h3>
        {decision && <p className="font-bold">{decision === 'go-ahead' ? 'You said: go ahead.' : 'You said: not now.'} You can change your mind below.</p>}
        {canDecide ? (
          <form onSubmit={decide} noValidate aria-label="Your decision" className="space-y-3">
            <fieldset className="space-y-2">
              <legend className="sr-only">Go ahead or not now</legend>
              <label className="flex min-h-12 items-center gap-3 rounded-md border-2 border-rule px-3 text-lg">
                <input
                  type="radio"
                  name="decision"
                  value="go-ahead"
                  checked={choice === 'go-ahead'}
                  onChange={() => setChoice('go-ahead')}
                  className="h-6 w-6"
                />
                Go ahead with the ram
              </label>
              <label className="flex min-h-12 items-center gap-3 rounded-md border-2 border-rule px-3 text-lg">
                <input type="radio" name="decision" value="not-now" checked={choice === 'not-now'} onChange={() => setChoice('not-now')} className="h-6 w-6" />
                Not now
              </label>
            </fieldset>
            {choice && (
              <>
                <label htmlFor="decision-reason" className="block font-bold">
                  {choice === 'not-now' ? 'Why not now?' : 'Anything to add? (optional)'}
                </label>
                <textarea
                  id="decision-reason"
                  rows={2}
                  value={reason}
                  onChange={(e) => {
                    setReason(e.target.value);
                    if (reasonProblem) setReasonProblem(decisionProblem(choice, e.target.value));
                  }}
                  className="w-full rounded-md border-2 border-stone bg-paper p-3 text-lg"
                  aria-invalid={!!reasonProblem}
                  aria-describedby="decision-error"
                />
                {reasonProblem && (
                  <p id="decision-error" className="text-clay">
                    {reasonProblem}
                  </p>
                )}
                <Button type="submit" size="wide" disabled={busy} className="px-4 text-lg disabled:opacity-60">
                  Send my decision
                </Button>
              </>
            )}
          </form>
        ) : (
          !decision && <p className="text-stone">The visit has moved on; ask your advisor below if something changed.</p>
        )}
      </div>
      <form onSubmit={ask} noValidate className="space-y-2" aria-label="Ask a question">
        <label htmlFor="question" className="block font-bold">
          Ask your advisor a question
        </label>
        <textarea
          id="question"
          name="text"
          rows={3}
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            if (problem) setProblem(questionProblem(e.target.value));
          }}
          className="w-full rounded-md border-2 border-stone bg-paper p-3 text-lg"
          aria-invalid={!!problem}
          aria-describedby="question-error"
        />
        {problem && (
          <p id="question-error" className="text-clay">
            {problem}
          </p>
        )}
        <Button type="submit" variant="secondary" disabled={busy}>
          Send question
        </Button>
      </form>
      {error && (
        <p role="alert" className="font-bold text-clay">
          {error}
        </p>
      )}
    </Card>
  );
}
