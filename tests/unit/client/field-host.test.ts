// The field host: the worker's API runs the real loop and answers the shared field queries; the
// page reaches it through Comlink, and does the same work itself when there is no worker or it dies.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { stubWorker } from './fake-worker';

afterEach(() => {
  vi.unstubAllGlobals();
});

/**
 * Fresh modules for one test (the page module keeps one worker per page), all sharing one fresh
 * phone database: a fake server, a way to queue a change, the worker's API and the page's side.
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
  return {
    db,
    source,
    fakeServer: helpers.fakeServer,
    workerApi: async () => (await import('@/lib/client/sync/worker-api')).fieldWorkerApi,
    host: () => import('@/lib/client/field-host'),
  };
}

/** Watches the sync bar's count of changes waiting; every answer is kept in `seen`. */
function watchWaiting(watchFieldQuery: typeof import('@/lib/client/field-host').watchFieldQuery) {
  const seen: number[] = [];
  const stop = watchFieldQuery(
    'syncSummary',
    (value) => seen.push(value.waiting),
    (error) => {
      throw error;
    },
  );
  return { seen, stop };
}

describe("the field worker's API", () => {
  it('runs the loop and answers with its outcome', async () => {
    const { db, source, fakeServer, workerApi } = await load();
    const server = fakeServer();
    await source(1);
    await source(2);
    const api = await workerApi();
    expect(await api.sync(false)).toMatchObject({ ok: true, pushed: 2 });
    expect(server.pushed.flat()).toHaveLength(2);
    expect(await db.outbox.count()).toBe(0);
  });

  it('answers a watch with the summary, again after a change, and not after unwatch', async () => {
    const { source, workerApi } = await load();
    const api = await workerApi();
    const values: number[] = [];
    const id = api.watch(
      'syncSummary',
      (value) => values.push((value as { waiting: number }).waiting),
      (message) => {
        throw new Error(message);
      },
    );
    await vi.waitFor(() => expect(values).toEqual([0]));
    await source(5);
    await vi.waitFor(() => expect(values).toEqual([0, 1]));
    api.unwatch(id);
    await source(6);
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(values).toEqual([0, 1]);
  });

  it('answers who is remembered on this phone', async () => {
    const { db, workerApi } = await load();
    await db.meta.put({ key: 'user', value: { id: 'u1', name: 'Tobias' } });
    expect(await (await workerApi()).remembered()).toEqual({ id: 'u1', name: 'Tobias' });
  });
});

describe("the page's side (field-host)", () => {
  it('hands the run to the worker through Comlink: progress and outcome come back to the caller', async () => {
    const { host } = await load();
    const started = stubWorker(() => ({
      async sync(_force: boolean, onProgress?: (...args: [string, number, number]) => void) {
        await onProgress?.('photo-1', 512, 1024);
        return { at: 'now', ok: true, message: null, pushed: 3, pulled: 0, photos: 1 };
      },
    }));
    const { runFieldSync } = await host();
    const progress: unknown[] = [];
    const outcome = await runFieldSync((...args) => progress.push(args), true);
    expect(outcome).toMatchObject({ ok: true, pushed: 3 });
    expect(progress).toEqual([['photo-1', 512, 1024]]);
    expect(started).toHaveLength(1);
    expect(started[0]).toMatch(/sync-worker\.ts$/);
    // One worker serves every later run.
    await runFieldSync(undefined, false);
    expect(started).toHaveLength(1);
  });

  it('runs the real worker API behind Comlink: a watch answers, and answers again after a change', async () => {
    const { source, workerApi, host } = await load();
    const api = await workerApi();
    stubWorker(() => api);
    const { watchFieldQuery } = await host();
    const { seen, stop } = watchWaiting(watchFieldQuery);
    await vi.waitFor(() => expect(seen).toEqual([0]));
    await source(8);
    await vi.waitFor(() => expect(seen).toEqual([0, 1]));
    stop();
  });

  it('hands answers arriving close together to the page in one task, so React draws them in one pass', async () => {
    const { host } = await load();
    // The sync bar's counts answer at once, the list 20 ms later (its own read of the database).
    stubWorker(() => ({
      watch(query: string, onValue: (value: unknown) => void) {
        if (query === 'syncSummary') void onValue({ waiting: 2, parked: 0, photos: 0, refusedPhotos: 0, paused: false });
        else setTimeout(() => void onValue({ synced: true, rows: [] }), 20);
        return 1;
      },
      unwatch() {},
    }));
    const { watchFieldQuery } = await host();
    // Each task the page runs in bumps `task`: an answer records the task it arrived in.
    let task = 0;
    const ticker = setInterval(() => task++, 1);
    const arrived: [string, number][] = [];
    const fail = (error: unknown) => {
      throw error;
    };
    const stops = [
      watchFieldQuery('syncSummary', () => arrived.push(['summary', task]), fail),
      watchFieldQuery('homeVisits', () => arrived.push(['list', task]), fail),
    ];
    await vi.waitFor(() => expect(arrived).toHaveLength(2));
    clearInterval(ticker);
    stops.forEach((stop) => stop());
    expect(arrived.map(([what]) => what)).toEqual(['summary', 'list']);
    expect(arrived[0]![1]).toBe(arrived[1]![1]);
    // Neither waited past the batch window by much (a stalled flush would show here).
    expect(task).toBeLessThan(200);
  });

  it('reads a shared field query in the page where there is no Worker', async () => {
    const { source, host } = await load();
    vi.stubGlobal('Worker', undefined);
    await source(7);
    const { watchFieldQuery } = await host();
    const { seen, stop } = watchWaiting(watchFieldQuery);
    await vi.waitFor(() => expect(seen).toEqual([1]));
    stop();
  });

  it("reads a query about one visit with that visit's id in the worker, behind Comlink", async () => {
    const { source, workerApi, host } = await load();
    const { VISIT } = await import('./helpers');
    const OTHER = '22222222-2222-4222-8222-222222222222';
    await source(9);
    const api = await workerApi();
    stubWorker(() => api);
    const { watchFieldQuery } = await host();
    const names = (visitId: string, into: string[][]) =>
      watchFieldQuery(
        'flowSource',
        (value) => into.push(value ? [value.name] : []),
        (error) => {
          throw error;
        },
        visitId,
      );
    const here: string[][] = [];
    const there: string[][] = [];
    const stops = [names(VISIT, here), names(OTHER, there)];
    await vi.waitFor(() => expect(here).toEqual([['source 9']]));
    // No source on the other visit, and no sync run yet: "not fetched yet".
    await vi.waitFor(() => expect(there).toEqual([[]]));
    for (const stop of stops) stop();
  });

  it("reads a query about one visit with that visit's id in the page where there is no Worker", async () => {
    const { source, host } = await load();
    const { VISIT } = await import('./helpers');
    vi.stubGlobal('Worker', undefined);
    await source(10);
    const { watchFieldQuery } = await host();
    const seen: string[][] = [];
    const stop = watchFieldQuery(
      'flowSource',
      (value) => seen.push(value ? [value.name] : []),
      () => undefined,
      VISIT,
    );
    await vi.waitFor(() => expect(seen).toEqual([['source 10']]));
    stop();
  });

  it('runs the loop in the page where there is no Worker', async () => {
    const { source, fakeServer, host } = await load();
    vi.stubGlobal('Worker', undefined);
    const server = fakeServer();
    await source(3);
    const { runFieldSync } = await host();
    expect(await runFieldSync(undefined, false)).toMatchObject({ ok: true, pushed: 1 });
    expect(server.pushed.flat()).toHaveLength(1);
  });

  it('runs the loop in the page when the worker dies under a run: nothing waits for it', async () => {
    const { db, source, fakeServer, host } = await load();
    stubWorker((fail) => ({
      sync: () =>
        new Promise(() => {
          fail();
        }),
    }));
    const server = fakeServer();
    await source(4);
    const { runFieldSync } = await host();
    expect(await runFieldSync(undefined, false)).toMatchObject({ ok: true, pushed: 1 });
    expect(server.pushed.flat()).toHaveLength(1);
    expect(await db.outbox.count()).toBe(0);
  });
});
