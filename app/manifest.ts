import type { MetadataRoute } from 'next';

// The installable app: opens on the advisor's field book, standalone, in our own colours.
export default function manifest(): MetadataRoute.Manifest {
  return {
    name: 'Fallbook — ram pump site screening',
    short_name: 'Fallbook',
    description: 'Field book for screening creeks and springs for hydraulic ram pumps, offline.',
    id: '/',
    start_url: '/field',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    background_color: '#F6F4EE',
    theme_color: '#1E3A4C',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
      { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  };
}
