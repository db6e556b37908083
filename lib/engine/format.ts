// Rounding the rules compare at: a threshold compares what a sentence shows. Sentences themselves
// are messages (lib/shared/display/message.ts), rendered in each reader's units.

/** A length rounded to the millimetre, so a threshold compares what the text shows. */
export function roundMm(m: number): number {
  return Math.round(m * 1000) / 1000;
}
