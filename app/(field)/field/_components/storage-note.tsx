'use client';

import { useEffect, useState } from 'react';

/** How much of the phone's storage Fallbook uses, and whether the browser may evict it. */
export function StorageNote() {
  const [text, setText] = useState<string | null>(null);
  useEffect(() => {
    void (async () => {
      const estimate = await navigator.storage?.estimate?.();
      const persisted = await navigator.storage?.persisted?.();
      if (!estimate?.quota) return;
      const mb = (n: number) => `${Math.round(n / 1024 / 1024)} MB`;
      setText(`Stored on this phone: ${mb(estimate.usage ?? 0)} of ${mb(estimate.quota)}${persisted ? ' (kept)' : ' — the browser may clear it if space runs low; install the app to keep it'}.`);
    })();
  }, []);
  if (!text) return null;
  return <p className="mx-auto max-w-3xl px-4 pb-6 text-stone">{text}</p>;
}
