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
