import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { ServiceWorkerRegister } from '@/components/service-worker-register';
import './globals.css';

// Fonts ship in fonts/ (OFL); nothing is fetched from outside the machine.
// The faces every page draws with are preloaded, the figures' monospaced one included: the first
// layout then uses them. Drawn in a fallback and swapped, a long sheet reflows and shifts; and a
// phone that met its first figure (the home's planned days, a capture screen's readings) before
// the face was asked for laid the page out with the fetch starting, 60 to 200 ms at 4× slower CPU,
// and again when it arrived. The italic face is only used by <em> (office tables): a family of its
// own (globals.css) that loads when used, never preloaded.
const sans = localFont({
  src: [
    { path: '../fonts/atkinson-hyperlegible-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/atkinson-hyperlegible-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-sans',
  display: 'swap',
});

const sansItalic = localFont({
  src: [{ path: '../fonts/atkinson-hyperlegible-latin-400-italic.woff2', weight: '400', style: 'italic' }],
  variable: '--font-sans-italic',
  display: 'swap',
  preload: false,
});

const mono = localFont({
  src: [
    { path: '../fonts/ibm-plex-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/ibm-plex-mono-latin-600-normal.woff2', weight: '600', style: 'normal' },
  ],
  variable: '--font-mono',
  display: 'swap',
  preload: true,
});

export const metadata: Metadata = {
  title: { default: 'Fallbook', template: '%s · Fallbook' },
  description: 'Screen small-farm sites for hydraulic ram pumps: field readings offline, a plain go / no-go sheet.',
  applicationName: 'Fallbook',
  appleWebApp: { capable: true, title: 'Fallbook', statusBarStyle: 'default' },
  // Named here because `icons` set in metadata replaces the app/icon.svg convention: without a
  // rel=icon link the browser asks for /favicon.ico, a 404 in every page's console.
  icons: { icon: [{ url: '/icon.svg', type: 'image/svg+xml' }], apple: '/icons/apple-touch-icon.png' },
};

export const viewport: Viewport = {
  themeColor: '#1E3A4C',
  width: 'device-width',
  initialScale: 1,
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${sansItalic.variable} ${mono.variable}`}>
      <body className="bg-paper text-ink antialiased">
        {children}
        <ServiceWorkerRegister />
      </body>
    </html>
  );
}
