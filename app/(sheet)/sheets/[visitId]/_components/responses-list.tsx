import type { SheetResponseView } from '@/lib/server/data/sheet-responses';
import { formatDateTime } from '@/lib/shared/display/dates';
import { AnswerForm } from './answer-form';

const ROLE_WORD = { farmer: 'farmer', advisor: 'advisor', coordinator: 'office' } as const;

function what(r: SheetResponseView): React.ReactNode {
  switch (r.kind) {
    case 'acknowledged':
      return <strong className="text-moss">Has read the sheet.</strong>;
    case 'go-ahead':
      return (
        <>
          <strong className="text-moss">Go ahead.</strong>
          {r.text && ` ${r.text}`}
        </>
      );
    case 'not-now':
      return (
        <>
          <strong className="text-clay">Not now:</strong> {r.text}
        </>
      );
    default:
      return r.text;
  }
}

/**
 * The sheet's thread for everyone who reads it: who said what, when. Questions still open carry
 * an answer box for those who may answer (the assigned advisor and the office).
 */
export function ResponsesList({ visitId, responses, canAnswer }: { visitId: string; responses: SheetResponseView[]; canAnswer: boolean }) {
  if (responses.length === 0) return null;
  const byId = new Map(responses.map((r) => [r.id, r]));
  return (
    <section id="conversation" aria-labelledby="responses-heading" className="space-y-2 print:hidden">
      <h2 id="responses-heading" className="text-xl font-bold text-slate">
        Questions and answers
      </h2>
      <ul className="divide-y divide-rule" aria-label="Conversation about this sheet">
        {responses.map((r) => {
          const question = r.replyToId ? byId.get(r.replyToId) : undefined;
          return (
            <li key={r.id} className={`py-3 ${r.kind === 'answer' ? 'pl-4 border-l-4 border-moss' : ''}`}>
              <span className="block text-stone">
                <span className="figure">{formatDateTime(r.at)}</span> · <strong className="text-ink">{r.author.name}</strong>
                {r.author.role && ` (${ROLE_WORD[r.author.role]})`}
                {r.kind === 'question' && (r.answered ? ' · answered' : ' · waiting for an answer')}
              </span>
              {question && (
                <span className="block text-sm text-stone">
                  In answer to: “{question.text.slice(0, 120)}
                  {question.text.length > 120 ? '…' : ''}”
                </span>
              )}
              <span className="block whitespace-pre-line">{what(r)}</span>
              {canAnswer && r.kind === 'question' && !r.answered && <AnswerForm visitId={visitId} questionId={r.id} />}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
