import { describe, expect, it } from 'vitest';
import { onReplicas, onWriter, readsGoToWriter, wroteRecently } from '@/lib/server/db/read-routing';

describe('read routing with replicas', () => {
  it('a wrote mark counts inside its window only, and nonsense never counts', () => {
    const now = 1_800_000_000_000;
    expect(wroteRecently(String(now - 9_000), 10, now)).toBe(true);
    expect(wroteRecently(String(now - 10_000), 10, now)).toBe(false);
    expect(wroteRecently(String(now + 60_000), 10, now)).toBe(false);
    expect(wroteRecently('soon', 10, now)).toBe(false);
    expect(wroteRecently(undefined, 10, now)).toBe(false);
  });

  it('onWriter pins the reads inside it (and only those); onReplicas releases them', async () => {
    expect(await readsGoToWriter(10)).toBe(false);
    expect(await onWriter(() => readsGoToWriter(10))).toBe(true);
    expect(await onWriter(() => onReplicas(() => readsGoToWriter(10)))).toBe(false);
    expect(await readsGoToWriter(10)).toBe(false);
  });
});
