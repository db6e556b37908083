// useFieldQuery as the field frame uses it: shared queries answered by the field worker through
// Comlink, drawn once for the first burst of answers; a page's own read runs in the page, live.
// @vitest-environment happy-dom
import { Profiler, type ReactNode } from 'react';
import { createRoot } from 'react-dom/client';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { stubWorker } from './fake-worker';

afterEach(() => {
  vi.unstubAllGlobals();
});

/** Mounts `node` under a profiler; returns the page's text and how many commits React made. */
function mount(node: ReactNode) {
  const host = document.createElement('div');
  document.body.append(host);
  const root = createRoot(host);
  let commits = 0;
  root.render(
    <Profiler id="frame" onRender={() => commits++}>
      {node}
    </Profiler>,
  );
  return { text: () => host.textContent ?? '', commits: () => commits, unmount: () => root.unmount() };
}

describe('useFieldQuery', () => {
  it('draws the sync bar and the list in one commit when their answers arrive 20 ms apart', async () => {
    vi.resetModules();
    stubWorker(() => ({
      watch(query: string, onValue: (value: unknown) => void) {
        if (query === 'syncSummary') void onValue({ waiting: 2, parked: 0, photos: 0, refusedPhotos: 0, paused: false });
        else setTimeout(() => void onValue({ synced: true, rows: [{ id: 'v1' }] }), 20);
        return 1;
      },
      unwatch() {},
    }));
    const { useFieldQuery } = await import('@/app/(field)/field/_components/use-field-query');
    function Frame() {
      const summary = useFieldQuery('syncSummary');
      const list = useFieldQuery('homeVisits');
      return (
        <p>
          {summary ? `${summary.waiting} waiting` : 'counting'} / {list ? `${list.rows.length} visits` : 'loading'}
        </p>
      );
    }
    const page = mount(<Frame />);
    await vi.waitFor(() => expect(page.text()).toBe('2 waiting / 1 visits'));
    await new Promise((resolve) => setTimeout(resolve, 100));
    // The first draw (nothing yet), then one draw for both answers.
    expect(page.commits()).toBe(2);
    page.unmount();
  });

  it('asks the worker a named query about the visit on screen, and asks again (stopping the old watch) when the visit changes', async () => {
    vi.resetModules();
    const asked: string[] = [];
    const stopped: number[] = [];
    stubWorker(() => ({
      watch(query: string, onValue: (value: unknown) => void, _onError: unknown, arg?: string) {
        asked.push(`${query} ${arg}`);
        void onValue({ name: `source of ${arg}` });
        return asked.length;
      },
      unwatch(id: number) {
        stopped.push(id);
      },
    }));
    const { useFieldQuery } = await import('@/app/(field)/field/_components/use-field-query');
    function Source({ visitId }: { visitId: string }) {
      const source = useFieldQuery('flowSource', visitId);
      return <p>{source ? source.name : 'reading'}</p>;
    }
    const host = document.createElement('div');
    document.body.append(host);
    const root = createRoot(host);
    root.render(<Source visitId="v1" />);
    await vi.waitFor(() => expect(host.textContent).toBe('source of v1'));
    root.render(<Source visitId="v2" />);
    await vi.waitFor(() => expect(host.textContent).toBe('source of v2'));
    expect(asked).toEqual(['flowSource v1', 'flowSource v2']);
    await vi.waitFor(() => expect(stopped).toEqual([1]));
    root.unmount();
  });

  it("runs a page's own read in the page, again after each change it read, and reads nothing while null", async () => {
    vi.resetModules();
    const { freshDb } = await import('./helpers');
    const db = freshDb();
    const { fieldDb } = await import('@/lib/client/db');
    const { useFieldQuery } = await import('@/app/(field)/field/_components/use-field-query');
    function Count({ on }: { on: boolean }) {
      const n = useFieldQuery(on ? () => fieldDb().meta.count() : null, [], -1);
      return <p>{n}</p>;
    }
    const off = mount(<Count on={false} />);
    const on = mount(<Count on />);
    await vi.waitFor(() => expect(on.text()).toBe('0'));
    await db.meta.put({ key: 'lastSuccess', value: 'now' });
    await vi.waitFor(() => expect(on.text()).toBe('1'));
    expect(off.text()).toBe('-1');
    on.unmount();
    off.unmount();
  });

  it("draws a page's own read again only when its answer changed: a rewrite of the same rows draws nothing, a new photo always draws", async () => {
    vi.resetModules();
    const { freshDb } = await import('./helpers');
    const db = freshDb();
    const { fieldDb } = await import('@/lib/client/db');
    const { useFieldQuery } = await import('@/app/(field)/field/_components/use-field-query');
    await db.meta.put({ key: 'lastSuccess', value: 'then' });
    function Meta() {
      const rows = useFieldQuery(() => fieldDb().meta.toArray(), []);
      return <p>{rows ? rows.map((r) => `${r.key}=${r.value instanceof Blob ? `blob ${r.value.size}` : String(r.value)}`).join(',') : 'reading'}</p>;
    }
    const page = mount(<Meta />);
    await vi.waitFor(() => expect(page.text()).toBe('lastSuccess=then'));
    const settled = page.commits();
    // The sync writes the same row back, twice: the read runs again and finds nothing new.
    await db.meta.put({ key: 'lastSuccess', value: 'then' });
    await db.meta.put({ key: 'lastSuccess', value: 'then' });
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(page.commits()).toBe(settled);
    await db.meta.put({ key: 'lastSuccess', value: 'now' });
    await vi.waitFor(() => expect(page.text()).toBe('lastSuccess=now'));
    expect(page.commits()).toBe(settled + 1);
    // Bytes JSON cannot show are never taken for the same answer.
    await db.meta.put({ key: 'photo', value: new Blob(['ab']) as never });
    await vi.waitFor(() => expect(page.text()).toContain('photo=blob'));
    const withPhoto = page.commits();
    await db.meta.put({ key: 'photo', value: new Blob(['ab']) as never });
    await vi.waitFor(() => expect(page.commits()).toBe(withPhoto + 1));
    page.unmount();
  });
});
