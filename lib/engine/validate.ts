import { EngineInputError } from './errors';

// Guards that throw EngineInputError with the field path; they return the checked value.

/** A finite number (rejects NaN, ±Infinity and non-numbers). */
export function finite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new EngineInputError(field, 'must be a finite number');
  }
  return value;
}

/** A finite number greater than 0. */
export function positive(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v <= 0) throw new EngineInputError(field, 'must be more than 0');
  return v;
}

/** A finite number of 0 or more. */
export function nonNegative(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v < 0) throw new EngineInputError(field, 'must not be negative');
  return v;
}

/** A finite number within [min, max] (inclusive). */
export function inRange(value: unknown, field: string, min: number, max: number): number {
  const v = finite(value, field);
  if (v < min || v > max) {
    throw new EngineInputError(field, `must be between ${min} and ${max}`);
  }
  return v;
}

/** A positive whole number. */
export function positiveInteger(value: unknown, field: string): number {
  const v = positive(value, field);
  if (!Number.isInteger(v)) throw new EngineInputError(field, 'must be a whole number');
  return v;
}

/** A non-empty array. */
export function nonEmptyArray<T>(value: readonly T[] | undefined, field: string): readonly T[] {
  if (!Array.isArray(value) || value.length === 0) {
    throw new EngineInputError(field, 'must hold at least one entry');
  }
  return value;
}

/** An object (not null, not an array). */
export function record(value: unknown, field: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new EngineInputError(field, 'must be an object');
  }
  return value as Record<string, unknown>;
}
