'use client';

import { useEffect } from 'react';

/** Registers the service worker built into /sw.js (production builds only; dev has none). */
export function ServiceWorkerRegister() {
  useEffect(() => {
    if (process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
    void import('workbox-window').then(({ Workbox }) => new Workbox('/sw.js', { scope: '/' }).register());
  }, []);
  return null;
}
