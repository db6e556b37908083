'use client';

import { startTransition, useEffect, useRef, useState } from 'react';
import type { FrameAnswer, FrameArg, FrameQuery } from '@/lib/client/frame-queries';

/** What a field page reads: a shared field query by name (frame-queries.ts), or its own read of the phone's database. */
export type FieldQuery<T> = FrameQuery | (() => T | Promise<T>);
type Answer<Q, T> = Q extends FrameQuery ? FrameAnswer<Q> : T;

// Objects whose contents JSON cannot show (a photo's bytes) get a token of their own, so that two
// answers holding them are never taken for equal unless they hold the very same objects.
const opaque = new WeakMap<object, number>();
let lastToken = 0;

function answerKey(value: unknown): string {
  return (
    JSON.stringify(value, (_key, v: unknown) => {
      if (v instanceof Map) return { map: [...v] };
      if (v instanceof Set) return { set: [...v] };
      if (v instanceof Blob || v instanceof ArrayBuffer || ArrayBuffer.isView(v)) {
        let token = opaque.get(v);
        if (token === undefined) opaque.set(v, (token = ++lastToken));
        return { opaque: token };
      }
      return v;
    }) ?? 'undefined'
  );
}

/**
 * The one way a field page reads the phone's database, live: the answer now and again after every
 * change it read. The hook decides where the read runs. A named field query (frame-queries.ts, with
 * its argument) runs where the sync does (lib/client/field-host.ts: the field worker, else the
 * page), so it is not read again on the page's main thread as the sync writes (on a phone's first
 * sync such reads were tasks of 50 to 110 ms); a page's own read (a function) runs in the page.
 * Either way an answer equal to the one on screen draws nothing (a sync rewrites the tables pages
 * read, mostly without changing them: on a phone's first sync every batch would redraw the page),
 * and a new one is drawn as a transition (React may pause it for input, and draws it in slices
 * between tasks).
 * `initial` until the first answer, and while the query is null (nothing to read yet); an answer is
 * kept on screen until the next one when `deps` change; a failed read is thrown to the error boundary.
 */
export function useFieldQuery<Q extends FrameQuery>(query: Q | null, arg?: FrameArg<Q>): FrameAnswer<Q> | undefined;
export function useFieldQuery<T>(query: (() => T | Promise<T>) | null, deps?: readonly unknown[]): T | undefined;
export function useFieldQuery<T, I>(query: (() => T | Promise<T>) | null, deps: readonly unknown[], initial: I): T | I;
export function useFieldQuery<T, Q extends FieldQuery<T>, I>(query: Q | null, second?: unknown, initial?: I): Answer<Q, T> | I | undefined {
  const [state, setState] = useState<{ value?: Answer<Q, T>; has?: boolean; error?: unknown }>({});
  // The key (answerKey) of the answer on screen: nothing at first.
  const shown = useRef<string | undefined>(undefined);
  const name = typeof query === 'string' ? (query as FrameQuery) : null;
  // A named query's second argument is what it is asked about; a function's, its deps.
  const arg = name !== null ? second : undefined;
  const argKey = name !== null ? JSON.stringify(second ?? null) : '';
  const deps = name === null ? ((second as readonly unknown[] | undefined) ?? []) : [];
  const active = query !== null;
  useEffect(() => {
    if (!active) return;
    let stop: (() => void) | undefined;
    let cancelled = false;
    const fail = (error: unknown) => setState({ error });
    const show = (value: unknown) => {
      const key = answerKey(value);
      if (key === shown.current) return;
      shown.current = key;
      startTransition(() => setState({ value: value as Answer<Q, T>, has: true }));
    };
    if (name !== null) {
      void import('@/lib/client/field-host').then(({ watchFieldQuery }) => {
        if (!cancelled) stop = watchFieldQuery(name, show, fail, arg as FrameArg<typeof name>);
      });
    } else {
      const read = query as () => T | Promise<T>;
      void import('@/lib/client/live-query').then(({ watchLocal }) => {
        if (!cancelled) stop = watchLocal(read, show, fail);
      });
    }
    return () => {
      cancelled = true;
      stop?.();
    };
    // The read is named by `name` and its argument, or by the caller's `deps` for a function (as React's own hooks take them).
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [name, argKey, active, ...deps]);
  if (state.error !== undefined) throw state.error;
  return active && state.has ? state.value : initial;
}
