// fast-check generators of hostile input: SQL metacharacters, markup, huge and non-finite numbers,
// deep nesting, odd unicode, wrong types; and a database fingerprint to prove nothing changed.
import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/lib/server/db';

const NASTY_STRINGS = [
  "' OR '1'='1",
  "'; DROP TABLE visits; --",
  '" OR ""="',
  "1' AND SLEEP(1)#",
  '\\',
  '%',
  '_%_',
  '`',
  '/*',
  '*/',
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  'javascript:alert(1)',
  '{{7*7}}',
  '${7*7}',
  '../../etc/passwd',
  '..%2F..%2F',
  '%00',
  '\u0000',
  '\uFEFF',
  '\u202Eevil',
  '\uD800',
  'Ｆａｌｌ',
  'ǅ',
  '𝔉𝔞𝔩𝔩',
  '🐐🐄💧',
  'null',
  'undefined',
  'NaN',
  'Infinity',
  '-0',
  '1e309',
  '0x1F',
  '1_000',
  ' 12 ',
  '12,5,3',
  '__proto__',
  'constructor',
  'toString',
  '9999-12-31T23:59:59-23:59',
  '0000-01-01T00:00:00Z',
  '0999-12-31T23:00:00Z',
  '+275760-09-13T00:00:00Z',
  '0000-01-01',
  '0999-12-31',
  '2101-01-01',
  '\uD83D',
  'a\uDC00b',
  'hasOwnProperty',
  'valueOf',
  'prototype',
  '',
  ' ',
  '\n\t',
  'a'.repeat(10_000),
  '1e300',
  '99999999999999999999',
  '9007199254740993',
  '2147483648',
  '-2147483649',
  '-1',
  '0',
  '1.5',
  '0001',
  '2026-02-30',
  '9999-12-31',
  '0000-00-00',
];

export const hostileString: fc.Arbitrary<string> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...NASTY_STRINGS) },
  { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 80 }) },
  { weight: 1, arbitrary: fc.integer({ min: 161, max: 70_000 }).map((n) => 'x'.repeat(n)) },
  { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...NASTY_STRINGS), fc.string({ maxLength: 20 })).map(([a, b]) => a + b) },
);

export const hostileNumber: fc.Arbitrary<number> = fc.oneof(
  fc.constantFrom(
    Number.NaN,
    Infinity,
    -Infinity,
    1e308,
    -1e308,
    2 ** 53 + 2,
    -(2 ** 53) - 2,
    1e-320,
    -0,
    0.1,
    -1,
    2 ** 31,
    2 ** 31 - 1,
    -(2 ** 31) - 1,
    2 ** 32,
    2 ** 63,
    1e15,
  ),
  fc.double(),
  fc.integer(),
);

/** Keys every plain object inherits: a lookup `key in table` finds them in any table. */
export const PROTOTYPE_KEYS = ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf', 'isPrototypeOf', '__defineGetter__'] as const;

/** Strings that are not text: a lone high or low surrogate, alone or inside ordinary text. */
export const loneSurrogateString: fc.Arbitrary<string> = fc
  .tuple(fc.string({ maxLength: 10 }), fc.constantFrom('\uD83D', '\uDC00', '\uD800', '\uDFFF'), fc.string({ maxLength: 10 }))
  .map(([a, lone, b]) => a + lone + b);

/** Date-times and days that parse but fall outside what the columns hold (past 9999 once the offset is applied, before 1000). */
export const extremeDate: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    '9999-12-31T23:59:59-23:59',
    '9999-12-31T23:59:59.999-12:00',
    '0000-01-01T00:00:00Z',
    '0001-01-01T00:00:00+14:00',
    '0999-12-31T23:59:59Z',
    '2101-01-01T00:00:00Z',
  ),
  fc.constantFrom('0000-01-01', '0999-12-31', '9999-12-31', '2101-01-01', '2026-02-30', '1899-12-31'),
);

/** Integers a JavaScript number holds exactly but a 32-bit column does not, and their neighbours. */
export const extremeInteger: fc.Arbitrary<number> = fc.constantFrom(2 ** 31, 2 ** 31 + 1, -(2 ** 31) - 1, 2 ** 32, 2 ** 53 - 1, -(2 ** 53) + 1, 1e15);

/** Deeply nested arrays or objects, as JSON text. */
export const deepJson: fc.Arbitrary<string> = fc
  .tuple(fc.constantFrom(100, 5_000, 200_000), fc.boolean())
  .map(([depth, arrays]) => (arrays ? '['.repeat(depth) + ']'.repeat(depth) : '{"a":'.repeat(depth) + '1' + '}'.repeat(depth)));

/** Any JSON-ish value, wrong-typed more often than not. */
export const hostileValue: fc.Arbitrary<unknown> = fc.letrec<{ value: unknown }>((tie) => ({
  value: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    hostileString,
    hostileNumber,
    fc.boolean(),
    fc.constant(null),
    fc.array(tie('value'), { maxLength: 4 }),
    fc.dictionary(fc.constantFrom(...PROTOTYPE_KEYS, 'id', 'a', 'ops', "'", '<b>'), tie('value'), { maxKeys: 3 }),
  ),
})).value;

/** Raw bodies that are not a JSON object the route expects. */
export const hostileRawBody: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    '',
    'null',
    '{',
    '{"a":',
    'NaN',
    '[1,2',
    "{'single':'quotes'}",
    '{"__proto__":{"admin":true}}',
    '\u0000',
    'undefined',
    '1e999',
    '"a string"',
    '[]',
    '{}',
  ),
  deepJson,
  hostileString,
);

/** Every path (keys and array indices) into a JSON value. */
export function pathsOf(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = prefix.length ? [prefix] : [];
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...pathsOf(v, [...prefix, i])));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) out.push(...pathsOf(v, [...prefix, k]));
  return out;
}

/** A copy of `value` with the thing at `path` replaced (or deleted when `replacement` is the DELETE marker). */
export const DELETE = Symbol('delete');
export function withAt(value: unknown, path: (string | number)[], replacement: unknown): unknown {
  if (path.length === 0) return replacement;
  const copy: unknown = structuredClone(value);
  let cursor = copy as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) cursor = cursor[key] as Record<string | number, unknown>;
  const last = path[path.length - 1] as string | number;
  if (replacement === DELETE) delete cursor[last];
  else cursor[last] = replacement;
  return copy;
}

/** Row counts and CHECKSUM TABLE of every table: equal fingerprints mean nothing was written. */
export async function databaseFingerprint(): Promise<Record<string, string>> {
  const sequelize = getSequelize();
  const tables = (await sequelize.query<Record<string, string>>('SHOW TABLES', { type: QueryTypes.SELECT })).map((row) => Object.values(row)[0] as string);
  const sums = await sequelize.query<{ Table: string; Checksum: string | number | null }>(`CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(', ')}`, {
    type: QueryTypes.SELECT,
  });
  const out: Record<string, string> = {};
  for (const t of tables) {
    const [row] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${t}\``, { type: QueryTypes.SELECT });
    out[t] = `${row?.n}`;
  }
  for (const s of sums) out[`${s.Table.split('.').pop()} checksum`] = `${s.Checksum}`;
  return out;
}
