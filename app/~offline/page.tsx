import type { Metadata } from 'next';

export const metadata: Metadata = { title: 'Offline' };

// Served by the service worker when a page that was never opened online is asked for offline.
export default function OfflinePage() {
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <h1 className="text-3xl font-bold text-slate">No signal, and this page is not on the phone yet</h1>
      <p className="mt-3 text-lg">
        Readings you saved stay on this phone and go up as soon as there is coverage. Pages you opened while online work offline; this one will once you open it
        with a signal.
      </p>
      <p className="mt-6">
        {/* A full navigation on purpose: it lets the service worker answer from its cache. */}
        {/* eslint-disable-next-line @next/next/no-html-link-for-pages */}
        <a href="/" className="text-lg font-bold">
          Back to my home page
        </a>
      </p>
    </main>
  );
}
