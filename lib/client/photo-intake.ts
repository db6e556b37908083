// A photo taken on site: its bytes, their sha-256, and where and when it was taken (EXIF GPS
// read on the phone with exifr, falling back to the current fix).
import type { EntityFields } from '@/lib/shared/schemas/sync';
import { MAX_PHOTO_BYTES, PHOTO_MIME_TYPES } from '@/lib/shared/reading-limits';

export type PhotoIntake = { data: ArrayBuffer; fields: Omit<EntityFields<'photo'>, 'visitId' | 'pointId' | 'caption'> };

async function sha256Hex(data: ArrayBuffer): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', data);
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
}

function currentFix(timeoutMs = 5000): Promise<{ lat: number; lon: number } | null> {
  if (!('geolocation' in navigator)) return Promise.resolve(null);
  return new Promise((resolve) => {
    navigator.geolocation.getCurrentPosition(
      (p) => resolve({ lat: p.coords.latitude, lon: p.coords.longitude }),
      () => resolve(null),
      { enableHighAccuracy: true, timeout: timeoutMs, maximumAge: 60_000 },
    );
  });
}

/** Reads a picked file; throws an Error with a plain message when it cannot be used. */
export async function readPhoto(file: File): Promise<PhotoIntake> {
  if (!(PHOTO_MIME_TYPES as readonly string[]).includes(file.type)) {
    throw new Error(
      `${file.name}: only JPEG, PNG or WebP photos can be kept (this is ${file.type || 'an unknown type'}). On an iPhone, set the camera to "Most compatible".`,
    );
  }
  if (file.size > MAX_PHOTO_BYTES) throw new Error(`${file.name} is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`);
  const data = await file.arrayBuffer();
  let lat: number | null = null;
  let lon: number | null = null;
  let takenAt: string | null = null;
  try {
    // Loaded when a photo is read: the server's prerender of the photo screen never runs it (its
    // Node branch reaches for fs and zlib), and the chunk is precached with the rest of the build.
    const { default: exifr } = await import('exifr');
    const gps = (await exifr.gps(data)) as { latitude?: number; longitude?: number } | undefined;
    if (gps && Number.isFinite(gps.latitude) && Number.isFinite(gps.longitude)) {
      lat = gps.latitude ?? null;
      lon = gps.longitude ?? null;
    }
    const tags = (await exifr.parse(data, ['DateTimeOriginal'])) as { DateTimeOriginal?: Date } | undefined;
    if (tags?.DateTimeOriginal instanceof Date && !Number.isNaN(tags.DateTimeOriginal.getTime())) takenAt = tags.DateTimeOriginal.toISOString();
  } catch {
    // No EXIF (screenshots, some galleries strip it): fall back below.
  }
  if (lat === null) {
    const fix = await currentFix();
    if (fix) ({ lat, lon } = fix);
  }
  return {
    data,
    fields: {
      mime: file.type as EntityFields<'photo'>['mime'],
      bytes: data.byteLength,
      sha256: await sha256Hex(data),
      width: null,
      height: null,
      lat,
      lon,
      takenAt: takenAt ?? new Date(file.lastModified || Date.now()).toISOString(),
    },
  };
}
