import { describe, expect, it } from 'vitest';
import { sameOriginPath } from '@/lib/shared/return-path';

const ORIGIN = 'https://fallbook.example.org';

describe('sameOriginPath: the return address after sign-in', () => {
  it.each([
    ['/\\evil.example/phish'],
    ['/\t/evil.example'],
    ['//evil.example/x'],
    ['https://evil.example/x'],
    ['http://fallbook.example.org/office'],
    ['javascript:alert(1)'],
    ['\\\\evil.example'],
    ['/%5Cevil.example'.replace('%5C', '\\')],
    [' //evil.example'],
  ])('refuses %j (another origin, or a scheme)', (value) => {
    const kept = sameOriginPath(value, ORIGIN);
    if (kept === undefined) return expect(kept).toBeUndefined();
    // Anything kept must resolve to this origin in a browser too.
    expect(new URL(kept, ORIGIN).origin).toBe(ORIGIN);
    expect(kept.startsWith('/') && !kept.startsWith('//') && !kept.startsWith('/\\')).toBe(true);
  });

  it('the absolute forms off-site are refused outright', () => {
    expect(sameOriginPath('/\\evil.example/phish', ORIGIN)).toBeUndefined();
    expect(sameOriginPath('/\t/evil.example', ORIGIN)).toBeUndefined();
    expect(sameOriginPath('https://evil.example/x', ORIGIN)).toBeUndefined();
  });

  it('keeps the whole path and query string of a same-origin address', () => {
    expect(sameOriginPath('/sheets/3f1c2a9e-0000-4000-8000-000000000001?paper=letter&from=mail', ORIGIN)).toBe(
      '/sheets/3f1c2a9e-0000-4000-8000-000000000001?paper=letter&from=mail',
    );
    expect(sameOriginPath('/field/visit/flow?id=abc', ORIGIN)).toBe('/field/visit/flow?id=abc');
    expect(sameOriginPath(`${ORIGIN}/office?status=scheduled`, ORIGIN)).toBe('/office?status=scheduled');
  });

  it('a same-origin URL whose path starts with two slashes is not turned into a protocol-relative one', () => {
    expect(sameOriginPath(`${ORIGIN}//evil.example/x`, ORIGIN)).toBe('/evil.example/x');
  });

  it('nothing, an array of nothing or a non-path gives undefined', () => {
    expect(sameOriginPath(undefined, ORIGIN)).toBeUndefined();
    expect(sameOriginPath('', ORIGIN)).toBeUndefined();
    expect(sameOriginPath(['/office', '/evil'], ORIGIN)).toBe('/office');
  });
});
