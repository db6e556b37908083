import { afterEach, describe, expect, it, vi } from 'vitest';
import { loadLocalSession, rememberedUser } from '@/lib/client/session';
import { setMeta } from '@/lib/client/sync/meta';
import type { SessionUser } from '@/lib/shared/domain';
import { freshDb } from './helpers';

const ADVISOR = { id: 'u-1', name: 'Tobias', email: 't@example.test', role: 'advisor', organisationId: 'o-1', units: 'metric' } as unknown as SessionUser;

/** A fetch that never answers until aborted, as on a weak signal. */
function hangingFetch() {
  return vi.fn(
    (_url: string, init?: RequestInit) =>
      new Promise<Response>((_resolve, reject) => {
        init?.signal?.addEventListener('abort', () => reject(init.signal?.reason));
      }),
  );
}

afterEach(() => vi.unstubAllGlobals());

describe('the field book opens on a weak signal', () => {
  it('reads the remembered advisor without the network', async () => {
    freshDb();
    expect(await rememberedUser()).toBeNull();
    await setMeta('user', ADVISOR);
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    expect((await rememberedUser())?.id).toBe('u-1');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('a session check that hangs falls back to the remembered advisor, offline', async () => {
    freshDb();
    await setMeta('user', ADVISOR);
    vi.stubGlobal('fetch', hangingFetch());
    const session = await loadLocalSession(50);
    expect(session).toEqual({ state: 'ready', user: ADVISOR, online: false });
  });

  it('with nobody remembered, a hanging check means signed out (never a made-up user)', async () => {
    freshDb();
    vi.stubGlobal('fetch', hangingFetch());
    expect(await loadLocalSession(50)).toEqual({ state: 'signed-out' });
  });

  it('a 401 signs out even with a remembered advisor', async () => {
    freshDb();
    await setMeta('user', ADVISOR);
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('{}', { status: 401 })),
    );
    expect(await loadLocalSession(50)).toEqual({ state: 'signed-out' });
  });
});
