// HTTP for the sync loop. Runs in the page and in the service worker (fetch only, same origin,
// the session cookie goes along).

export class SyncHttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
    this.name = 'SyncHttpError';
  }
}

/** Offline, DNS failure, connection reset: fetch itself threw. */
export class OfflineError extends Error {
  constructor() {
    super('No connection to the server.');
    this.name = 'OfflineError';
  }
}

export async function requestJson<T>(url: string, init: RequestInit = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { credentials: 'same-origin', cache: 'no-store', ...init });
  } catch {
    throw new OfflineError();
  }
  if (!res.ok) {
    // A gateway's page (502/503/504 while the app restarts) says nothing useful to the person.
    let message =
      res.status >= 500
        ? `The server is not answering properly (${res.status}). Everything stays on this phone and goes up on a later try.`
        : `The server answered ${res.status}.`;
    try {
      const body = (await res.json()) as { error?: { message?: string } };
      if (body.error?.message) message = body.error.message;
    } catch {
      // not JSON
    }
    throw new SyncHttpError(res.status, message);
  }
  return (await res.json()) as T;
}
