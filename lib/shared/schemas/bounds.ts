// Limits every boundary shares: what the database columns can hold and what a field book can mean.
// Dates outside these years and integers past a 32-bit column look valid but cannot be stored.
import * as z from '@/lib/shared/zod';

export const MIN_YEAR = 1900;
export const MAX_YEAR = 2100;
/** The largest value of a signed 32-bit INT column. */
export const MAX_INT32 = 2_147_483_647;
/** Photos larger than this on a side are not photos a phone takes. */
export const MAX_PHOTO_SIDE_PX = 100_000;

const YEARS_MESSAGE = `Must be a date between ${MIN_YEAR} and ${MAX_YEAR}.`;
const MIN_MS = Date.UTC(MIN_YEAR, 0, 1);
const MAX_MS = Date.UTC(MAX_YEAR + 1, 0, 1);

/** A date-time with its offset (ISO 8601) that falls, in UTC, within the years above. */
export const isoDateTime = z
  .string()
  .datetime({ offset: true, message: 'Must be an ISO 8601 date-time.' })
  .refine((v) => {
    const ms = Date.parse(v);
    return ms >= MIN_MS && ms < MAX_MS;
  }, YEARS_MESSAGE);

/** A calendar day (YYYY-MM-DD) that exists and falls within the years above. */
export const isoDay = (message: string) =>
  z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, message)
    .refine((v) => {
      const ms = Date.parse(`${v}T00:00:00Z`);
      return Number.isFinite(ms) && new Date(ms).toISOString().slice(0, 10) === v;
    }, message)
    .refine((v) => {
      const ms = Date.parse(`${v}T00:00:00Z`);
      return ms >= MIN_MS && ms < MAX_MS;
    }, YEARS_MESSAGE);

/** A lone UTF-16 surrogate: half of a character (an emoji cut in two), which is not text at all. */
export const hasLoneSurrogate = (value: string) => /\p{Cs}/u.test(value);

export const BROKEN_CHARACTER = 'Contains a broken character (half of an emoji, perhaps). Delete it and type it again.';

type Step = { value: unknown; key: string | number | null; parent: Step | null };

const pathOf = (step: Step) => {
  const path: (string | number)[] = [];
  for (let at: Step | null = step; at && at.key !== null; at = at.parent) path.unshift(at.key);
  return path;
};

export const PROTOTYPE_NAME = 'This name is not allowed here.';

/**
 * The first thing in a JSON value that no field can take: a string or key holding a lone surrogate,
 * or a `__proto__` key (JSON.parse keeps it as an own key, but any copy into an object drops it or
 * changes the copy's prototype). Its path and the message to show, or null.
 */
export function unusableJson(value: unknown): { path: (string | number)[]; message: string } | null {
  const broken = loneSurrogatePath(value, true);
  if (!broken) return null;
  const last = broken[broken.length - 1];
  return { path: broken, message: last === '__proto__' ? PROTOTYPE_NAME : BROKEN_CHARACTER };
}

/**
 * The path of the first string (or key) in a JSON value that holds a lone surrogate (or, with
 * `prototypeKeys`, the first `__proto__` key), or null. Walks with its own stack and parent links:
 * a body nested 200,000 deep must not overflow the call stack, nor copy its path at every level.
 */
export function loneSurrogatePath(value: unknown, prototypeKeys = false): (string | number)[] | null {
  const stack: Step[] = [{ value, key: null, parent: null }];
  while (stack.length > 0) {
    const step = stack.pop() as Step;
    const current = step.value;
    if (typeof current === 'string') {
      if (hasLoneSurrogate(current)) return pathOf(step);
    } else if (Array.isArray(current)) {
      for (let i = current.length - 1; i >= 0; i -= 1) stack.push({ value: current[i], key: i, parent: step });
    } else if (current && typeof current === 'object') {
      const entries = Object.entries(current);
      for (let i = entries.length - 1; i >= 0; i -= 1) {
        const [key, inner] = entries[i] as [string, unknown];
        if (hasLoneSurrogate(key) || (prototypeKeys && key === '__proto__')) return pathOf({ value: inner, key, parent: step });
        stack.push({ value: inner, key, parent: step });
      }
    }
  }
  return null;
}
