// Serwist in configurator mode: runs after `next build`, precaches the build and prerendered pages.
import { generateGlobPatterns, serwist } from '@serwist/next/config';

export default serwist({
  swSrc: 'worker/sw.ts',
  swDest: 'public/sw.js',
  // The default patterns leave out fonts; the field screens must render offline in our own type.
  globPatterns: [...generateGlobPatterns('.next/'), '.next/static/media/*.woff2'],
  // The tile template is compiled in, as Next does for the pages (the build stamp includes it).
  esbuildOptions: { define: { 'process.env.NEXT_PUBLIC_TILE_URL': JSON.stringify(process.env.NEXT_PUBLIC_TILE_URL ?? '') } },
});
