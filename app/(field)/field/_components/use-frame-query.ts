'use client';

import { startTransition, useEffect, useRef, useState } from 'react';
import type { FrameAnswer, FrameQuery } from '@/lib/client/frame-queries';

/**
 * A live read of the frame's summaries (lib/client/frame-queries.ts), answered by the field worker:
 * the page evaluates no Dexie for it. An answer equal to the one on screen draws nothing (a sync
 * rewrites the tables these summaries read without changing them); a new one is drawn as a
 * transition (React may pause it for input). Undefined until the first answer, and while not
 * `enabled`; a failed read is thrown to the error boundary.
 */
export function useFrameQuery<Q extends FrameQuery>(query: Q, enabled: boolean): FrameAnswer<Q> | undefined {
  const [state, setState] = useState<{ value?: FrameAnswer<Q>; error?: unknown }>({});
  // The JSON of what is on screen: nothing (undefined) at first.
  const shown = useRef('undefined');
  useEffect(() => {
    if (!enabled) return;
    let stop: (() => void) | undefined;
    let cancelled = false;
    const show = (value: FrameAnswer<Q>) => {
      const json = JSON.stringify(value) ?? 'undefined';
      if (json === shown.current) return;
      shown.current = json;
      startTransition(() => setState({ value }));
    };
    void import('@/lib/client/sync/in-worker').then(({ watchFrame }) => {
      if (!cancelled) stop = watchFrame(query, show, (error) => setState({ error }));
    });
    return () => {
      cancelled = true;
      stop?.();
    };
  }, [query, enabled]);
  if (state.error !== undefined) throw state.error;
  return enabled ? state.value : undefined;
}
