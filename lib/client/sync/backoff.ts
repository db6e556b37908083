// Retry delays for failed sync attempts: exponential with jitter, capped, so a hundred phones
// coming back into coverage at once don't all knock at the same second.
export const BASE_DELAY_MS = 2_000;
export const MAX_DELAY_MS = 5 * 60_000;

/** Delay before attempt number `attempts` (1 = first retry); `random` in [0, 1). */
export function backoffMs(attempts: number, random: number = Math.random()): number {
  const ceiling = Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** Math.max(0, attempts - 1));
  return Math.round(ceiling / 2 + (ceiling / 2) * random);
}
