'use client';

import { startTransition, useEffect, useState } from 'react';
import { formatBytes } from '@/lib/shared/display/numbers';

type Storage = { usage: number; quota: number; persisted: boolean };

/**
 * How much of the phone's storage Fallbook uses, and whether the browser may evict it. The caution is
 * in the static page (drawn at once, even before scripts run); the figures join it once the browser
 * answers, and the caution gives way to "kept" when the browser has promised to keep the data.
 */
export function StorageNote() {
  const [storage, setStorage] = useState<Storage | null>(null);
  useEffect(() => {
    void (async () => {
      const estimate = await navigator.storage?.estimate?.();
      const persisted = (await navigator.storage?.persisted?.()) ?? false;
      const quota = estimate?.quota;
      if (!quota) return;
      startTransition(() => setStorage({ usage: estimate.usage ?? 0, quota, persisted }));
    })();
  }, []);
  // At the foot of the screen-high column (mt-auto): the figures' line keeps its place (blank until known).
  return (
    <footer className="mx-auto mt-auto w-full max-w-3xl px-4 pb-6 text-stone">
      <p>{storage ? `Stored on this phone: ${formatBytes(storage.usage)} of ${formatBytes(storage.quota)}` : '\u00a0'}</p>
      <p>
        {storage?.persisted
          ? 'The browser keeps it: it will not clear it to free space.'
          : 'The browser may clear what the field book keeps on this phone if space runs low; install the app to keep it.'}
      </p>
    </footer>
  );
}
