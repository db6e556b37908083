import 'server-only';
import sharp, { type Metadata } from 'sharp';
import { invalid, unsupportedType } from '../errors';

/** Largest decoded size accepted: ~40 Mpx (sharp's default, 268 Mpx, lets a tiny PNG cost gigabytes). */
export const MAX_PHOTO_PIXELS = 40_000_000;
export const THUMBNAIL_PX = 480;

const FORMATS = { jpeg: { mime: 'image/jpeg', ext: 'jpg' }, png: { mime: 'image/png', ext: 'png' }, webp: { mime: 'image/webp', ext: 'webp' } } as const;
type Format = keyof typeof FORMATS;

export interface CheckedPhoto {
  mime: string;
  ext: string;
  /** Size as displayed (after the EXIF orientation). */
  width: number;
  height: number;
  /** ≤ 480 px JPEG, upright, with no metadata at all (no GPS in shared copies). */
  thumbnail: Buffer;
}

const NOT_A_PHOTO = 'This file is not a JPEG, PNG or WebP photo.';
const HEIC = 'HEIC photos cannot be read here; set the camera to JPEG (most compatible).';

// Staged uploads are deleted right after the check: libvips must not keep them open in its file cache.
sharp.cache({ files: 0 });

/**
 * Refuses an upload by its first bytes, before the rest arrives: JPEG, PNG and WebP signatures pass
 * (the full check below still decodes them); HEIF/HEIC gets its own advice; anything else is not a photo.
 */
export function checkPhotoHead(head: Buffer): void {
  const at = (offset: number, text: string) => head.subarray(offset, offset + text.length).toString('latin1') === text;
  if (head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return;
  if (at(0, '\x89PNG\r\n\x1a\n')) return;
  if (at(0, 'RIFF') && at(8, 'WEBP')) return;
  if (at(4, 'ftyp')) throw unsupportedType(HEIC);
  throw unsupportedType(NOT_A_PHOTO);
}

/**
 * Checks the bytes (or the file, read by libvips without loading it whole) are a readable JPEG, PNG or
 * WebP by their content (never the announced type), refuses decompression bombs, and makes the
 * thumbnail (decoding the whole image finds damage).
 */
export async function checkPhotoImage(data: Buffer | string): Promise<CheckedPhoto> {
  let meta: Metadata;
  try {
    // The header only (no decode), so the pixel count can be refused with a clear message below.
    meta = await sharp(data, { limitInputPixels: false }).metadata();
  } catch {
    throw unsupportedType(NOT_A_PHOTO);
  }
  if (meta.format === 'heif') throw unsupportedType(HEIC);
  if (!meta.format || !Object.hasOwn(FORMATS, meta.format)) throw unsupportedType(NOT_A_PHOTO);
  const width = meta.width ?? 0;
  const height = meta.height ?? 0;
  if (width * height > MAX_PHOTO_PIXELS) {
    throw invalid(`The image is ${width} × ${height} pixels; photos may have at most ${MAX_PHOTO_PIXELS / 1_000_000} million.`);
  }
  let thumbnail: Buffer;
  try {
    thumbnail = await sharp(data, { limitInputPixels: MAX_PHOTO_PIXELS, failOn: 'warning' })
      .rotate()
      .resize({ width: THUMBNAIL_PX, height: THUMBNAIL_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 78 })
      .toBuffer();
  } catch {
    throw invalid('The image is damaged or incomplete and cannot be read.');
  }
  const { mime, ext } = FORMATS[meta.format as Format];
  return { mime, ext, width: meta.autoOrient?.width ?? width, height: meta.autoOrient?.height ?? height, thumbnail };
}
