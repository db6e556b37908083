'use client';

import { useEffect, useRef, useState } from 'react';
import type { Workbox } from 'workbox-window';
import { Button } from '@/components/ui/button';
import { hasUnsavedInput } from '@/lib/client/dirty';

/**
 * Registers the service worker built into /sw.js (production builds only) and offers updates:
 * a new version waits until the person agrees, and never while a form holds unsaved input.
 */
export function ServiceWorkerRegister() {
  const workbox = useRef<Workbox | null>(null);
  const updateAccepted = useRef(false);
  const [waiting, setWaiting] = useState(false);
  const [blocked, setBlocked] = useState(false);

  useEffect(() => {
    if (process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
    let idle = 0;
    const register = () =>
      void import('workbox-window').then(({ Workbox }) => {
        const wb = new Workbox('/sw.js', { scope: '/' });
        wb.addEventListener('waiting', () => setWaiting(true));
        // Reload only for an update the person accepted: the first install also takes control
        // (clientsClaim), and reloading then would throw away whatever they were typing.
        wb.addEventListener('controlling', () => {
          if (updateAccepted.current) window.location.reload();
        });
        workbox.current = wb;
        void wb.register();
      });
    // Once the page has loaded and the main thread is free: the first install downloads the whole
    // app for offline use, which must not compete with the page's own first requests and rendering.
    const afterLoad = () => {
      // Safari has no requestIdleCallback.
      idle = typeof window.requestIdleCallback === 'function' ? window.requestIdleCallback(register, { timeout: 5_000 }) : window.setTimeout(register, 1_000);
    };
    if (document.readyState === 'complete') afterLoad();
    else window.addEventListener('load', afterLoad, { once: true });
    return () => {
      window.removeEventListener('load', afterLoad);
      if (typeof window.cancelIdleCallback === 'function') window.cancelIdleCallback(idle);
      else window.clearTimeout(idle);
    };
  }, []);

  if (!waiting) return null;
  return (
    <div role="status" className="fixed inset-x-0 bottom-0 z-[1000] border-t-2 border-slate bg-white p-3">
      <div className="mx-auto flex max-w-3xl flex-wrap items-center justify-between gap-2">
        <p className="font-bold">{blocked ? 'Save or finish the reading you are typing first, then update.' : 'A new version of Fallbook is ready.'}</p>
        <Button
          onClick={() => {
            if (hasUnsavedInput()) return setBlocked(true);
            updateAccepted.current = true;
            workbox.current?.messageSkipWaiting();
          }}
        >
          Update now
        </Button>
      </div>
    </div>
  );
}
