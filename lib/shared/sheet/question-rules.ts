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
