// Formula injection: whatever separator a spreadsheet's locale uses (comma, semicolon, tab), no
// field it reads from our CSV may start with a character that makes it a formula.
import { describe, expect, it } from 'vitest';
import { csvRow } from '@/lib/shared/csv';

/** Splits one CSV line as a spreadsheet would with the given separator (RFC 4180 quotes). */
function fields(line: string, separator: string): string[] {
  const out: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i += 1) {
    const ch = line[i]!;
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i += 1;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === separator) {
      out.push(cell);
      cell = '';
    } else cell += ch;
  }
  out.push(cell);
  return out;
}

const TRIGGER = /^[\s]*[=+\-@＝＋－＠]/;
const HOSTILE = [
  '=1+1',
  ';=1+1',
  'a;=1+1',
  'a,=1+1',
  'a\t=1+1',
  ' =1+1',
  '"=1+1',
  '@SUM(A1)',
  '-2+3',
  '+1',
  '\t=1',
  '\r=1',
  'x;+cmd|calc',
  '＝1+1',
  'farm; -1',
  'a|=1',
];

describe('csvRow', () => {
  it.each([',', ';', '\t'])('no field read with separator %j starts like a formula', (separator) => {
    const line = csvRow(['Brandt Hollow', ...HOSTILE, 12, -3]).replace(/\r\n$/, '');
    // Plain numbers (the numeric cells we write) are values, not formulas.
    for (const field of fields(line, separator).filter((f) => !/^-?\d+(\.\d+)?$/.test(f))) {
      expect(TRIGGER.test(field), `${JSON.stringify(field)} from ${JSON.stringify(line)}`).toBe(false);
    }
  });

  it('ordinary text and numbers pass unchanged (negative numbers stay numbers)', () => {
    expect(csvRow(['Brandt Hollow', 12, -3, 'go'])).toBe('Brandt Hollow,12,-3,go\r\n');
  });
});
