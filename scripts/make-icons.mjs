// node scripts/make-icons.mjs – renders the app icons (public/icons/*.png) from app/icon.svg.
// Run after changing the icon; the PNGs are committed.
import { readFileSync } from 'node:fs';
import sharp from 'sharp';

const svg = readFileSync(new URL('../app/icon.svg', import.meta.url));
for (const size of [192, 512]) {
  await sharp(svg, { density: 300 }).resize(size, size).png().toFile(`public/icons/icon-${size}.png`);
}
// Maskable: the drawing inside the central 80 % safe zone, on the slate ground.
const inner = await sharp(svg, { density: 300 }).resize(400, 400).png().toBuffer();
await sharp({ create: { width: 512, height: 512, channels: 4, background: '#1E3A4C' } })
  .composite([{ input: inner, gravity: 'center' }])
  .png()
  .toFile('public/icons/maskable-512.png');
await sharp(svg, { density: 300 }).resize(180, 180).png().toFile('public/icons/apple-touch-icon.png');
console.log('icons written to public/icons/');
