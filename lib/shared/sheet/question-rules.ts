// The farmer's question on a sheet: its limits and messages, without zod, so the sheet's small
// reply form checks as the route's schema (questionBody) does without shipping the schema library.
export const QUESTION_MIN = 3;
export const QUESTION_MAX = 2000;
export const QUESTION_TOO_SHORT = 'Write your question (at least a few words).';
export const QUESTION_TOO_LONG = 'Keep the question under 2,000 characters.';

/** The message for a question the route would refuse, or null when it would take it. */
export function questionProblem(text: string): string | null {
  const trimmed = text.trim();
  if (trimmed.length < QUESTION_MIN) return QUESTION_TOO_SHORT;
  if (trimmed.length > QUESTION_MAX) return QUESTION_TOO_LONG;
  return null;
}

export const ANSWER_TOO_SHORT = 'Write your answer (at least a few words).';
export const ANSWER_TOO_LONG = 'Keep the answer under 2,000 characters.';
export const REASON_MAX = 1000;
export const REASON_NEEDED = 'Say in a few words why not now, so your advisor knows.';
export const REASON_TOO_LONG = 'Keep the reason under 1,000 characters.';

/** The message for an answer the route would refuse, or null. */
export function answerProblem(text: string): string | null {
  const trimmed = text.trim();
  if (trimmed.length < QUESTION_MIN) return ANSWER_TOO_SHORT;
  if (trimmed.length > QUESTION_MAX) return ANSWER_TOO_LONG;
  return null;
}

/** The message for a decision the route would refuse: "not now" needs a reason; or null. */
export function decisionProblem(decision: 'go-ahead' | 'not-now', reason: string): string | null {
  const trimmed = reason.trim();
  if (decision === 'not-now' && trimmed.length < QUESTION_MIN) return REASON_NEEDED;
  if (trimmed.length > REASON_MAX) return REASON_TOO_LONG;
  return null;
}
