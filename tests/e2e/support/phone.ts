// The advisor's phone in the fault tests: a day captured offline through the app's own modules
// (records) and the photo page (photos), the sync button pressed until nothing waits, and what
// the phone's database holds, read through page.evaluate.
import { createHash, randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { expect, request as apiRequest, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import sharp from 'sharp';
import type { FallbookTestHooks } from '../../../lib/client/test-hooks';
import { mulberry32 } from '../../../lib/engine/random';
import { query } from './db';
import { signInAs } from './sign-in';

export const SOURCES = 90;
export const POINTS = 90;
export const PHOTOS = 20;

export interface Captured {
  visitId: string;
  sources: string[];
  points: string[];
  photos: Map<string, string>;
  seconds: { records: number; photos: number };
}

// Inside page.evaluate (which runs in the page, so no closures): `(window as unknown as Hooked).__fallbookTest`.
type Hooked = { __fallbookTest: FallbookTestHooks };

/** The coordinator (Maren) signed in through the sign-in page, as an API context for planning visits. */
export async function coordinatorApi(browser: Browser, baseURL: string): Promise<APIRequestContext> {
  const desk = await browser.newContext({ baseURL });
  await signInAs(await desk.newPage(), 'maren@wenlow-water.test', /\/office$/);
  const office = await apiRequest.newContext({ baseURL, storageState: await desk.storageState() });
  await desk.close();
  return office;
}

/** A coordinator plans a new visit for the advisor on a new farm; returns the visit id. */
export async function newVisit(office: APIRequestContext, advisorId: string, name: string): Promise<string> {
  const farm = await office.post('/api/farms', { data: { name, area: 'Fault valley', lat: 52.41, lon: -3.6, notes: '' } });
  expect(farm.status(), await farm.text()).toBe(201);
  const farmId = ((await farm.json()) as { farm: { id: string } }).farm.id;
  const visit = await office.post('/api/visits', { data: { farmId, advisorId, plannedOn: new Date().toISOString().slice(0, 10), notes: '' } });
  expect(visit.status(), await visit.text()).toBe(201);
  return ((await visit.json()) as { visit: { id: string } }).visit.id;
}

/** A 400 × 300 JPEG of seeded noise (about 100 kB: noise does not compress) with EXIF GPS. */
async function noiseJpeg(seed: number): Promise<Buffer> {
  const random = mulberry32(seed);
  const pixels = Buffer.alloc(400 * 300 * 3);
  for (let i = 0; i < pixels.length; i++) pixels[i] = Math.floor(random() * 256);
  return sharp(pixels, { raw: { width: 400, height: 300, channels: 3 } })
    .jpeg({ quality: 70 })
    .withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: `52/1 24/1 ${1000 + (seed % 1000)}/100`, GPSLongitudeRef: 'W', GPSLongitude: '3/1 36/1 0/100' } })
    .toBuffer();
}

export const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex');

/** Waits for the test hooks of the field shell (test build only). */
export async function waitForHooks(page: Page): Promise<void> {
  await expect
    .poll(() => page.evaluate(() => typeof (window as unknown as { __fallbookTest?: unknown }).__fallbookTest === 'object'), { timeout: 15_000 })
    .toBe(true);
}

/**
 * With no signal: 90 water sources and 90 stations saved through the app's saveRecord, and 20
 * photos picked on the photo page (read, hashed and kept by the page itself): 200 ops waiting.
 */
export async function captureOffline(page: Page, visitId: string, seed: number): Promise<Captured> {
  await page.context().setOffline(true);
  await page.goto(`/field/visit/photos?id=${visitId}`);
  await waitForHooks(page);
  const started = Date.now();
  const ids = Array.from({ length: SOURCES + POINTS }, () => randomUUID());
  await page.evaluate(
    async ({ visitId, ids, sources }) => {
      const t = (window as unknown as Hooked).__fallbookTest;
      for (let i = 0; i < ids.length; i++) {
        const id = ids[i] as string;
        if (i < sources) await t.saveRecord('waterSource', id, { visitId, name: `Seep ${i}`, kind: 'seep', notes: `walked at ${i}` });
        else
          await t.saveRecord('point', id, {
            visitId,
            role: 'station',
            label: `Station ${i}`,
            lat: 52.41 + i / 1e4,
            lon: -3.61,
            accuracyM: 5,
            altitudeM: 230 - i / 10,
            altitudeAccuracyM: 8,
            chainageM: i * 5,
            capturedAt: new Date().toISOString(),
          });
      }
    },
    { visitId, ids, sources: SOURCES },
  );
  const records = (Date.now() - started) / 1000;
  const files = await Promise.all(Array.from({ length: PHOTOS }, (_, i) => noiseJpeg(seed * 100 + i)));
  await page.getByTestId('photo-input').setInputFiles(files.map((buffer, i) => ({ name: `walk-${i}.jpg`, mimeType: 'image/jpeg', buffer })));
  await expect(page.getByText(`${PHOTOS} photos kept on this phone.`)).toBeVisible({ timeout: 20_000 });
  const kept = await page.evaluate(
    async (visitId) =>
      (await (window as unknown as Hooked).__fallbookTest.fieldDb().photos.where('visitId').equals(visitId).toArray()).map((p) => [p.id, p.sha256] as const),
    visitId,
  );
  // The phone hashed the very bytes the test made.
  expect(kept.map(([, s]) => s).sort()).toEqual(files.map(sha256).sort());
  const state = await phoneState(page);
  expect(state.pending).toBe(SOURCES + POINTS + PHOTOS);
  expect(state.photosWaiting).toBe(PHOTOS);
  const seconds = { records, photos: (Date.now() - started) / 1000 - records };
  return { visitId, sources: ids.slice(0, SOURCES), points: ids.slice(SOURCES), photos: new Map(kept), seconds };
}

export interface PhoneState {
  outbox: number;
  pending: number;
  parked: number;
  photosWaiting: number;
  lastRunAt: string | null;
}

/** What waits on the phone, from its own database. */
export async function phoneState(page: Page): Promise<PhoneState> {
  return page.evaluate(async () => {
    const db = (window as unknown as Hooked).__fallbookTest.fieldDb();
    const outbox = await db.outbox.toArray();
    const lastRun = (await db.meta.get('lastRun'))?.value as { at?: string } | undefined;
    return {
      outbox: outbox.length,
      pending: outbox.filter((e) => e.status === 'pending').length,
      parked: outbox.filter((e) => e.status !== 'pending').length,
      photosWaiting: await db.photoBlobs.filter((b) => b.uploadedAt === null).count(),
      lastRunAt: lastRun?.at ?? null,
    };
  });
}

/** Presses "Sync now" and waits for that run to end. */
export async function pressSync(page: Page): Promise<void> {
  // After a reload the hooks arrive a moment after the page (loaded once the session is read).
  await waitForHooks(page);
  const before = (await phoneState(page)).lastRunAt;
  await page.getByRole('button', { name: 'Sync now' }).click({ timeout: 30_000 });
  await expect
    .poll(async () => (await phoneState(page)).lastRunAt !== before && (await page.getByRole('button', { name: 'Sync now', disabled: false }).count()) === 1, {
      timeout: 30_000,
      intervals: [50, 100, 200],
    })
    .toBe(true);
}

/** Presses "Sync now" until nothing waits (or gives up after `maxRuns`); returns the number of runs. */
export async function syncUntilDone(page: Page, maxRuns = 40): Promise<number> {
  for (let run = 1; run <= maxRuns; run++) {
    await pressSync(page);
    const state = await phoneState(page);
    if (state.outbox === 0 && state.photosWaiting === 0) {
      await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server');
      return run;
    }
  }
  throw new Error(`still waiting after ${maxRuns} runs: ${JSON.stringify(await phoneState(page))}`);
}

const list = (ids: string[]) => ids.map(() => '?').join(',');

/**
 * Every record in MariaDB exactly once: one row per id, one applied op and one `created` audit line
 * per record, one `uploaded` line per photo, and the stored bytes of each photo match its sha-256.
 */
export async function assertExactlyOnce(c: Captured): Promise<void> {
  const all = [...c.sources, ...c.points, ...c.photos.keys()];
  const count = async (sql: string, ids: string[]) => Number((await query<{ n: number }>(sql, ids))[0]?.n);
  expect(await count(`SELECT COUNT(*) AS n FROM water_sources WHERE id IN (${list(c.sources)}) AND deleted_at IS NULL`, c.sources)).toBe(SOURCES);
  expect(await count(`SELECT COUNT(*) AS n FROM points WHERE id IN (${list(c.points)}) AND deleted_at IS NULL`, c.points)).toBe(POINTS);
  expect(await count(`SELECT COUNT(*) AS n FROM sync_ops WHERE entity_id IN (${list(all)})`, all)).toBe(all.length);
  const audit = await query<{ entityId: string; n: number }>(
    `SELECT entity_id AS entityId, COUNT(*) AS n FROM audit_log WHERE action = 'created' AND entity_id IN (${list(all)}) GROUP BY entity_id`,
    all,
  );
  expect(audit.length).toBe(all.length);
  expect(audit.filter((a) => Number(a.n) !== 1)).toEqual([]);
  const ids = [...c.photos.keys()];
  expect(await count(`SELECT COUNT(*) AS n FROM audit_log WHERE action = 'uploaded' AND entity_id IN (${list(ids)})`, ids)).toBe(PHOTOS);
  const rows = await query<{ id: string; sha256: string; storageKey: string | null; uploaded: number }>(
    `SELECT id, sha256, storage_key AS storageKey, uploaded_at IS NOT NULL AS uploaded FROM photos WHERE id IN (${list(ids)})`,
    ids,
  );
  expect(rows.length).toBe(PHOTOS);
  for (const row of rows) {
    expect(Number(row.uploaded)).toBe(1);
    expect(row.sha256).toBe(c.photos.get(row.id));
    const stored = await readFile(path.resolve(process.env.PHOTO_DIR ?? '.data/photos-test', ...(row.storageKey ?? '').split('/')));
    expect(sha256(stored)).toBe(row.sha256);
  }
}
