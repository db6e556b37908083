'use client';

import { useEffect, useRef, useState } from 'react';
import { Card } from '@/components/ui/card';

/** Tap when the bucket goes under, tap again when it is full; hands back the seconds. */
export function Stopwatch({ onLap }: { onLap: (seconds: number) => void }) {
  const [startedAt, setStartedAt] = useState<number | null>(null);
  const [now, setNow] = useState(0);
  const frame = useRef<number | null>(null);

  useEffect(() => {
    if (startedAt === null) return;
    const tick = () => {
      setNow(performance.now());
      frame.current = requestAnimationFrame(tick);
    };
    frame.current = requestAnimationFrame(tick);
    return () => {
      if (frame.current !== null) cancelAnimationFrame(frame.current);
    };
  }, [startedAt]);

  const running = startedAt !== null;
  const elapsed = running ? Math.max(0, (now - startedAt) / 1000) : 0;
  function press() {
    if (!running) {
      const t = performance.now();
      setStartedAt(t);
      setNow(t);
      return;
    }
    const seconds = Math.round(((performance.now() - startedAt) / 1000) * 10) / 10;
    setStartedAt(null);
    if (seconds > 0) onLap(seconds);
  }
  return (
    <Card tone="field" padding="md" className="text-center">
      <p className="figure text-5xl" aria-live="off">
        {elapsed.toFixed(1)} s
      </p>
      <button type="button" onClick={press} className={`mt-3 min-h-20 w-full rounded-md text-2xl font-bold text-white ${running ? 'bg-clay' : 'bg-moss'}`}>
        {running ? 'Stop — bucket full' : 'Start — bucket under'}
      </button>
    </Card>
  );
}
