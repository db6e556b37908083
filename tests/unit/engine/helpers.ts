import { expect } from 'vitest';

/** Asserts |actual − expected| ≤ tolerance, with both numbers in the failure message. */
export function expectWithin(actual: number, expected: number, tolerance: number): void {
  expect(Number.isFinite(actual), `expected a finite number, got ${actual}`).toBe(true);
  expect(Math.abs(actual - expected), `actual ${actual}, expected ${expected} ± ${tolerance}`).toBeLessThanOrEqual(tolerance);
}

/** Asserts a relative difference of at most `fraction`. */
export function expectRelative(actual: number, expected: number, fraction: number): void {
  expectWithin(actual, expected, Math.abs(expected) * fraction);
}

/**
 * A hose-level run that drops `fallM`, booked in steps a real hose level can read (each at most 5 m of
 * drop, inside the 6 m limit on one reading).
 */
export function hoseRunOf(fallM: number) {
  const n = Math.max(1, Math.ceil(fallM / 5));
  return { method: 'hose' as const, steps: Array.from({ length: n }, () => ({ upperReadingM: 0, lowerReadingM: fallM / n })) };
}

/** A demand line of `litresPerDay` in all, spread over enough people that no one takes over 2,000 L a day. */
export function demandOf(litresPerDay: number) {
  const count = Math.max(1, Math.ceil(litresPerDay / 2000));
  return { kind: 'person-basic' as const, count, litresPerHeadPerDay: litresPerDay / count };
}
