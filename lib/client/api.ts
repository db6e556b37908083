// Fetch helpers for the browser: JSON in and out, and the server's error shape as a typed error.

/** An error answer from an API route: status, code, message and per-field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** Calls an API route with a JSON body (if any); resolves with the JSON answer or throws ApiError. */
export async function apiJson<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: init.method ?? 'GET',
      headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'offline', 'The server could not be reached. Check the connection and try again.');
  }
  const data = (await res.json().catch(() => ({}))) as { error?: { code?: string; message?: string; fieldErrors?: Record<string, string[]> } };
  if (!res.ok) {
    throw new ApiError(res.status, data.error?.code ?? 'error', data.error?.message ?? `The server answered ${res.status}.`, data.error?.fieldErrors ?? {});
  }
  return data as T;
}

/** Puts the server's field errors onto a react-hook-form form; returns whether any matched a field. */
export function applyFieldErrors(error: unknown, setError: (name: never, e: { message: string }) => void, fields: readonly string[]): boolean {
  if (!(error instanceof ApiError)) return false;
  let matched = false;
  for (const [name, messages] of Object.entries(error.fieldErrors)) {
    if (fields.includes(name) && messages[0]) {
      setError(name as never, { message: messages[0] });
      matched = true;
    }
  }
  return matched;
}
