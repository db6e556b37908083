import { Card } from '@/components/ui/card';
import { TapLink } from '@/components/ui/tap-link';
import type { OpenQuestion } from '@/lib/shared/conversation';
import { formatDateTime } from '@/lib/shared/display/dates';

/** Farmers' questions still waiting for an answer, each linking to its sheet's conversation. */
export function OpenQuestions({ questions, empty }: { questions: OpenQuestion[]; empty?: string }) {
  return (
    <section aria-labelledby="open-questions" className="space-y-3">
      <h2 id="open-questions" className="text-xl font-bold">
        Open questions{questions.length > 0 && <span className="figure"> ({questions.length})</span>}
      </h2>
      {questions.length === 0 ? (
        <p className="text-stone">{empty ?? 'No question is waiting for an answer.'}</p>
      ) : (
        <ul className="space-y-2" aria-label="Questions waiting for an answer">
          {questions.map((q) => (
            <Card as="li" key={q.id} tone="caution" padding="md">
              <span className="block text-stone">
                <span className="figure">{formatDateTime(q.at)}</span> · {q.farmerName} · {q.farmName}
              </span>
              <span className="block line-clamp-3 whitespace-pre-line">{q.text}</span>
              <TapLink href={`/sheets/${q.visitId}#conversation`} className="mt-1">
                Answer on the sheet for {q.farmName}
              </TapLink>
            </Card>
          ))}
        </ul>
      )}
    </section>
  );
}
