// JPEGs with EXIF GPS made by the test itself (sharp writes the tags; exifr reads them back).
import { createHash } from 'node:crypto';
import sharp from 'sharp';

function dms(value: number): string {
  const abs = Math.abs(value);
  const d = Math.floor(abs);
  const m = Math.floor((abs - d) * 60);
  const s = Math.round(((abs - d) * 60 - m) * 60 * 100);
  return `${d}/1 ${m}/1 ${s}/100`;
}

export async function gpsJpeg(lat: number, lon: number, colour: string): Promise<{ buffer: Buffer; sha256: string }> {
  const buffer = await sharp({ create: { width: 640, height: 480, channels: 3, background: colour } })
    .jpeg({ quality: 80 })
    .withExif({ IFD3: { GPSLatitudeRef: lat >= 0 ? 'N' : 'S', GPSLatitude: dms(lat), GPSLongitudeRef: lon >= 0 ? 'E' : 'W', GPSLongitude: dms(lon) } })
    .toBuffer();
  return { buffer, sha256: createHash('sha256').update(buffer).digest('hex') };
}
