// The queue behind screening after a push: one visit at a time, a moment after the first of a
// burst, never twice for one wait, once more when queued during its own run, and a failure does not
// stop the rest.
import { describe, expect, it } from 'vitest';
import { visitQueue } from '@/lib/server/services/visit-queue';

const nextTurn = () => new Promise((resolve) => setImmediate(resolve));

function recorder({ fail = [] as string[], delayMs = 0 } = {}) {
  const runs: string[] = [];
  const errors: string[] = [];
  let active = 0;
  let maxActive = 0;
  const hooks: Record<string, () => void> = {};
  const queue = visitQueue(
    async (visitId, actorId) => {
      active++;
      maxActive = Math.max(maxActive, active);
      runs.push(`${visitId}:${actorId}`);
      hooks[visitId]?.();
      await nextTurn();
      active--;
      if (fail.includes(visitId)) throw new Error(`${visitId} failed`);
    },
    (visitId) => errors.push(visitId),
    delayMs,
  );
  return { queue, runs, errors, hooks, maxActive: () => maxActive };
}

describe('visitQueue', () => {
  it('starts after the current turn and works each waiting visit once, with the latest actor', async () => {
    const r = recorder();
    r.queue.add(['a', 'b'], 'u1');
    r.queue.add(['a'], 'u2');
    r.queue.add(['c', 'b'], 'u3');
    expect(r.runs).toEqual([]);
    await r.queue.flush();
    expect(r.runs).toEqual(['a:u2', 'b:u3', 'c:u3']);
    expect(r.maxActive()).toBe(1);
  });

  it('waits its delay, so a burst queued over several turns is worked once, unless flushed', async () => {
    const r = recorder({ delayMs: 60_000 });
    r.queue.add(['a'], 'u1');
    await nextTurn();
    r.queue.add(['b', 'a'], 'u2');
    await nextTurn();
    await nextTurn();
    expect(r.runs).toEqual([]);
    await r.queue.flush();
    expect(r.runs).toEqual(['a:u2', 'b:u2']);
  });

  it('runs a visit again when it is queued during its own run', async () => {
    const r = recorder();
    r.hooks.a = () => {
      delete r.hooks.a;
      r.queue.add(['a'], 'again');
    };
    r.queue.add(['a'], 'first');
    await r.queue.flush();
    expect(r.runs).toEqual(['a:first', 'a:again']);
  });

  it('reports a failing visit and goes on with the others', async () => {
    const r = recorder({ fail: ['b'] });
    r.queue.add(['a', 'b', 'c'], null);
    await r.queue.flush();
    expect(r.runs).toEqual(['a:null', 'b:null', 'c:null']);
    expect(r.errors).toEqual(['b']);
  });

  it('flushes at once when nothing is queued, and queues again after a flush', async () => {
    const r = recorder({ delayMs: 60_000 });
    await r.queue.flush();
    r.queue.add([], 'x');
    await r.queue.flush();
    expect(r.runs).toEqual([]);
    r.queue.add(['d'], 'x');
    await r.queue.flush();
    expect(r.runs).toEqual(['d:x']);
  });
});
