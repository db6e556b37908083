// The queue behind screening after a push: one visit at a time, after the request, never twice
// for one wait, once more when queued during its own run, and a failure does not stop the rest.
import { describe, expect, it } from 'vitest';
import { visitQueue } from '@/lib/server/services/visit-queue';

function recorder(fail: string[] = []) {
  const runs: string[] = [];
  const errors: string[] = [];
  let active = 0;
  let maxActive = 0;
  const hooks: Record<string, () => void> = {};
  const queue = visitQueue(async (visitId, actorId) => {
    active++;
    maxActive = Math.max(maxActive, active);
    runs.push(`${visitId}:${actorId}`);
    hooks[visitId]?.();
    await new Promise((resolve) => setTimeout(resolve, 1));
    active--;
    if (fail.includes(visitId)) throw new Error(`${visitId} failed`);
  }, (visitId) => errors.push(visitId));
  return { queue, runs, errors, hooks, maxActive: () => maxActive };
}

describe('visitQueue', () => {
  it('starts after the current turn and works each waiting visit once, with the latest actor', async () => {
    const r = recorder();
    r.queue.add(['a', 'b'], 'u1');
    r.queue.add(['a'], 'u2');
    r.queue.add(['c', 'b'], 'u3');
    expect(r.runs).toEqual([]);
    await r.queue.settled();
    expect(r.runs).toEqual(['a:u2', 'b:u3', 'c:u3']);
    expect(r.maxActive()).toBe(1);
  });

  it('runs a visit again when it is queued during its own run', async () => {
    const r = recorder();
    r.hooks.a = () => { delete r.hooks.a; r.queue.add(['a'], 'again'); };
    r.queue.add(['a'], 'first');
    await r.queue.settled();
    expect(r.runs).toEqual(['a:first', 'a:again']);
  });

  it('reports a failing visit and goes on with the others', async () => {
    const r = recorder(['b']);
    r.queue.add(['a', 'b', 'c'], null);
    await r.queue.settled();
    expect(r.runs).toEqual(['a:null', 'b:null', 'c:null']);
    expect(r.errors).toEqual(['b']);
  });

  it('settles at once when nothing is queued, and queues again after settling', async () => {
    const r = recorder();
    await r.queue.settled();
    r.queue.add([], 'x');
    await r.queue.settled();
    expect(r.runs).toEqual([]);
    r.queue.add(['d'], 'x');
    await r.queue.settled();
    expect(r.runs).toEqual(['d:x']);
  });
});
