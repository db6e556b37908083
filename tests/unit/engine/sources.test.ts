import { describe, expect, it } from 'vitest';
import { SOURCES, sourceUrl } from '@/lib/engine/sources';

const all = Object.values(SOURCES);
const linked = all.filter((s) => s.url !== undefined);

describe('the source registry and its addresses', () => {
  it('gives an address to the sources that have a stable public one, and leaves the rest without', () => {
    expect(linked.length).toBeGreaterThanOrEqual(19);
    expect(linked.length).toBeLessThan(all.length);
  });

  it('every address is a well-formed https URL with a host and no spaces', () => {
    for (const s of linked) {
      const url = s.url ?? '';
      expect(url, s.id).toMatch(/^https:\/\/[^\s]+$/);
      const parsed = new URL(url);
      expect(parsed.protocol, s.id).toBe('https:');
      expect(parsed.hostname, s.id).toMatch(/^[a-z0-9-]+(\.[a-z0-9-]+)+$/);
      expect(parsed.username + parsed.password, s.id).toBe('');
    }
  });

  it('no two sources share an address', () => {
    const seen = new Map<string, string>();
    for (const s of linked) {
      const url = s.url ?? '';
      expect(seen.get(url), `${s.id} repeats ${seen.get(url)}'s address`).toBeUndefined();
      seen.set(url, s.id);
    }
  });

  it('a DOI is written as its doi.org address', () => {
    for (const s of linked.filter((x) => /doi/i.test(x.url ?? ''))) expect(s.url, s.id).toMatch(/^https:\/\/doi\.org\/10\.\d{4,}\/\S+$/);
  });

  it('sourceUrl reads the address by id: the one registered, null for a source without one or an unknown id', () => {
    expect(sourceUrl('iversen-1975')).toBe(SOURCES['iversen-1975'].url);
    expect(sourceUrl('iversen-1975')).toMatch(/^https:\/\/doi\.org\//);
    expect(sourceUrl('eytelwein-1805')).toBeNull();
    expect(sourceUrl('no-such-source')).toBeNull();
  });
});
