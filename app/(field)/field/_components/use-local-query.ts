'use client';

import { startTransition, useEffect, useRef, useState, type DependencyList } from 'react';
import type { FieldDatabase } from '@/lib/client/db';

/**
 * A live read of the phone's database, like dexie-react-hooks' useLiveQuery, except that Dexie is
 * imported only once the page has hydrated, an answer equal to the last one draws nothing (a sync
 * rewrites the tables these small summaries read without changing them), and each new answer is
 * drawn as a transition (React may pause it for input). Undefined until the first answer; a failed
 * read is thrown to the error boundary. For small results: equality is by their JSON.
 */
export function useLocalQuery<T>(querier: (db: FieldDatabase) => Promise<T>, deps: DependencyList): T | undefined {
  const [state, setState] = useState<{ value?: T; error?: unknown }>({});
  // The JSON of what is on screen: nothing (undefined) at first.
  const shown = useRef('undefined');
  useEffect(() => {
    let stop: (() => void) | undefined;
    let cancelled = false;
    const show = (value: T) => {
      const json = JSON.stringify(value) ?? 'undefined';
      if (json === shown.current) return;
      shown.current = json;
      startTransition(() => setState({ value }));
    };
    void import('@/lib/client/live-query').then(({ watchLocal }) => {
      if (cancelled) return;
      stop = watchLocal(querier, show, (error) => setState({ error }));
    });
    return () => {
      cancelled = true;
      stop?.();
    };
    // The caller's deps decide when the query starts over, as with useLiveQuery.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, deps);
  if (state.error !== undefined) throw state.error;
  return state.value;
}
