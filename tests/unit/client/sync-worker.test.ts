// The field worker and the page's side of it: the worker runs the real loop and answers with its
// outcome, and answers the frame's live reads; the page does the same work itself when there is no
// worker or it dies.
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SyncWorkerReply, SyncWorkerRequest } from '@/lib/client/sync/sync-worker';

afterEach(() => {
  vi.unstubAllGlobals();
});

/**
 * Fresh modules for one test (the page module keeps one worker per page), all sharing one fresh
 * phone database: a fake server, a way to queue a change, and the page's side of the worker.
 */
async function load() {
  vi.resetModules();
  const helpers = await import('./helpers');
  const { saveRecord } = await import('@/lib/client/outbox');
  const db = helpers.freshDb();
  const source = (i: number) =>
    saveRecord('waterSource', `55555555-5555-4555-8555-${String(i).padStart(12, '0')}`, {
      visitId: helpers.VISIT,
      name: `source ${i}`,
      kind: 'creek',
      notes: '',
    });
  return { db, source, fakeServer: helpers.fakeServer, inWorker: () => import('@/lib/client/sync/in-worker') };
}

/** The worker module loaded under a stand-in global scope: what it posts, and a way to send it a request. */
async function workerScope() {
  const posted: SyncWorkerReply[] = [];
  let onMessage: ((event: MessageEvent<SyncWorkerRequest>) => void) | undefined;
  vi.stubGlobal('self', {
    postMessage: (m: SyncWorkerReply) => posted.push(m),
    addEventListener: (_: string, listener: typeof onMessage) => {
      onMessage = listener;
    },
  });
  await import('@/lib/client/sync/sync-worker');
  return { posted, request: (data: SyncWorkerRequest) => onMessage?.(new MessageEvent('message', { data })) };
}

/** A stand-in for `new Worker(...)`: hands each posted request to `answer`, which replies or fails. */
function stubWorker(answer: (request: SyncWorkerRequest, reply: (m: SyncWorkerReply) => void, fail: () => void) => void) {
  const started: string[] = [];
  class FakeWorker extends EventTarget {
    constructor(url: URL) {
      super();
      started.push(url.pathname);
    }
    postMessage(request: SyncWorkerRequest) {
      queueMicrotask(() =>
        answer(
          request,
          (m) => this.dispatchEvent(new MessageEvent('message', { data: m })),
          () => this.dispatchEvent(new Event('error')),
        ),
      );
    }
    terminate() {}
  }
  vi.stubGlobal('Worker', FakeWorker);
  return started;
}

describe('the sync worker', () => {
  it('runs the loop on a request and answers with its outcome under the same id', async () => {
    const { db, source, fakeServer } = await load();
    const server = fakeServer();
    await source(1);
    await source(2);
    const { posted, request } = await workerScope();
    request({ id: 7, type: 'sync', force: false });
    await vi.waitFor(() => expect(posted.some((m) => 'outcome' in m)).toBe(true));
    expect(posted.at(-1)).toMatchObject({ id: 7, outcome: { ok: true, pushed: 2 } });
    expect(server.pushed.flat()).toHaveLength(2);
    expect(await db.outbox.count()).toBe(0);
  });
});

describe("the field worker: the frame's reads", () => {
  it('answers a watch with the summary, again after a change, and not after unwatch', async () => {
    const { source } = await load();
    const { posted, request } = await workerScope();
    const values = () => posted.filter((m): m is { id: number; value: { waiting: number } } => m.id === 3 && 'value' in m).map((m) => m.value.waiting);
    request({ id: 3, type: 'watch', query: 'syncSummary' });
    await vi.waitFor(() => expect(values()).toEqual([0]));
    await source(5);
    await vi.waitFor(() => expect(values()).toEqual([0, 1]));
    request({ id: 3, type: 'unwatch' });
    await source(6);
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(values()).toEqual([0, 1]);
  });

  it('answers who is remembered on this phone', async () => {
    const { db } = await load();
    await db.meta.put({ key: 'user', value: { id: 'u1', name: 'Tobias' } });
    const { posted, request } = await workerScope();
    request({ id: 4, type: 'remembered' });
    await vi.waitFor(() => expect(posted).toContainEqual({ id: 4, user: { id: 'u1', name: 'Tobias' } }));
  });

  it('the page reads the frame itself where there is no Worker', async () => {
    const { source, inWorker } = await load();
    vi.stubGlobal('Worker', undefined);
    await source(7);
    const { watchFrame } = await inWorker();
    const seen: number[] = [];
    const stop = watchFrame(
      'syncSummary',
      (value) => seen.push(value.waiting),
      (error) => {
        throw error;
      },
    );
    await vi.waitFor(() => expect(seen).toEqual([1]));
    stop();
  });
});

describe('the page side (runSyncInWorker)', () => {
  it('hands the run to the worker: progress and outcome come back to the caller', async () => {
    const { inWorker } = await load();
    const started = stubWorker((request, reply) => {
      reply({ id: request.id, progress: ['photo-1', 512, 1024] });
      reply({ id: request.id, outcome: { at: 'now', ok: true, message: null, pushed: 3, pulled: 0, photos: 1 } });
    });
    const { runSyncInWorker } = await inWorker();
    const progress: unknown[] = [];
    const outcome = await runSyncInWorker((...args) => progress.push(args), true);
    expect(outcome).toMatchObject({ ok: true, pushed: 3 });
    expect(progress).toEqual([['photo-1', 512, 1024]]);
    expect(started).toHaveLength(1);
    expect(started[0]).toMatch(/sync-worker\.ts$/);
    // One worker serves every later run.
    await runSyncInWorker(undefined, false);
    expect(started).toHaveLength(1);
  });

  it('hands replies arriving close together to the page in one task, so React draws them in one pass', async () => {
    const { inWorker } = await load();
    // The sync bar's counts answer at once, the list 20 ms later (its own read of the database).
    stubWorker((request, reply) => {
      if (request.type !== 'watch') return;
      if (request.query === 'syncSummary') reply({ id: request.id, value: { waiting: 2, parked: 0, photos: 0, refusedPhotos: 0, paused: false } });
      else setTimeout(() => reply({ id: request.id, value: { synced: true, rows: [] } }), 20);
    });
    const { watchFrame } = await inWorker();
    // Each task the page runs in bumps `task`: an answer records the task it arrived in.
    let task = 0;
    const ticker = setInterval(() => task++, 1);
    const arrived: [string, number][] = [];
    const fail = (error: unknown) => {
      throw error;
    };
    const stops = [watchFrame('syncSummary', () => arrived.push(['summary', task]), fail), watchFrame('homeVisits', () => arrived.push(['list', task]), fail)];
    await vi.waitFor(() => expect(arrived).toHaveLength(2));
    clearInterval(ticker);
    stops.forEach((stop) => stop());
    expect(arrived.map(([what]) => what)).toEqual(['summary', 'list']);
    expect(arrived[0]![1]).toBe(arrived[1]![1]);
    // Neither waited past the batch window by much (a stalled flush would show here).
    expect(task).toBeLessThan(200);
  });

  it('runs the loop in the page where there is no Worker', async () => {
    const { source, fakeServer, inWorker } = await load();
    vi.stubGlobal('Worker', undefined);
    const server = fakeServer();
    await source(3);
    const { runSyncInWorker } = await inWorker();
    expect(await runSyncInWorker(undefined, false)).toMatchObject({ ok: true, pushed: 1 });
    expect(server.pushed.flat()).toHaveLength(1);
  });

  it('runs the loop in the page when the worker dies under a run: nothing waits for it', async () => {
    const { db, source, fakeServer, inWorker } = await load();
    stubWorker((_request, _reply, fail) => fail());
    const server = fakeServer();
    await source(4);
    const { runSyncInWorker } = await inWorker();
    expect(await runSyncInWorker(undefined, false)).toMatchObject({ ok: true, pushed: 1 });
    expect(server.pushed.flat()).toHaveLength(1);
    expect(await db.outbox.count()).toBe(0);
  });
});
