// Bench: one 12-megapixel camera JPEG uploaded over HTTP to the served app (PUT /api/photos/:id, as
// the phone sends it) and read back (GET /api/photos/:id): time, and the server process's peak
// memory during the upload. Linux: the kernel's high-water mark (VmHWM) is reset before each upload
// (/proc/PID/clear_refs), so the peak is the upload's own; the figure is the peak over the resident
// size just before. Median of 3 uploads, each a new photo. Run with npm run bench.
import { createHash, randomUUID } from 'node:crypto';
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import sharp from 'sharp';
import { makeOrganisation, sessionCookie } from '../integration/support/fixtures';
import { putOp } from '../integration/support/sync';
import { clientFor } from './support/http';
import { budget, median, report, round } from './support/report';
import { closeSequelize } from '@/lib/server/db';

const RUNS = 3;
const MIB = 1024 * 1024;

/** The served app's process and its children (a `next start` may fork its server). */
function processTree(pid: number): number[] {
  const children = readdirSync(`/proc/${pid}/task`).flatMap((task) => {
    try {
      return readFileSync(`/proc/${pid}/task/${task}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number);
    } catch {
      return [];
    }
  });
  return [pid, ...children.flatMap(processTree)];
}

/** kB figures of /proc/PID/status, summed over the tree. */
function memory(pids: number[]): { rss: number; hwm: number } {
  let rss = 0;
  let hwm = 0;
  for (const pid of pids) {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    rss += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
    hwm += Number(/VmHWM:\s+(\d+)/.exec(status)?.[1] ?? 0);
  }
  return { rss: rss * 1024, hwm: hwm * 1024 };
}

/** Resets the peak to the current size (Linux ≥ 4.0, own or root's processes). */
const resetPeak = (pids: number[]) => pids.forEach((pid) => writeFileSync(`/proc/${pid}/clear_refs`, '5'));

/** A 4000 × 3000 JPEG with sensor-like noise: about 5–6 MB, what a phone camera writes at 12 Mpx. */
async function cameraJpeg(): Promise<Buffer> {
  const noise = await sharp({ create: { width: 4000, height: 3000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 120, sigma: 28 } } })
    .raw().toBuffer();
  return sharp(noise, { raw: { width: 4000, height: 3000, channels: 3 } }).jpeg({ quality: 87 }).toBuffer();
}

async function main() {
  const base = process.env.BENCH_APP_URL as string;
  const pid = Number(process.env.BENCH_APP_PID);
  if (!base || !pid) throw new Error('BENCH_APP_URL/BENCH_APP_PID are not set: run with npm run bench');
  const org = await makeOrganisation('bench-photo');
  const client = await clientFor(org.advisor);
  const cookie = await sessionCookie(org.advisor);
  const staffCookie = await sessionCookie(org.coordinator);
  const jpeg = await cameraJpeg();
  const sha256 = createHash('sha256').update(jpeg).digest('hex');
  const runs: { uploadMs: number; peakOverBaseMiB: number; peakMiB: number; downloadMs: number }[] = [];
  for (let run = 0; run < RUNS; run++) {
    const id = randomUUID();
    const pushed = await client.post('/api/sync/push', { ops: [putOp('photo', id, {
      visitId: org.visit.id, pointId: null, caption: 'Bench', mime: 'image/jpeg', bytes: jpeg.length, sha256,
      width: null, height: null, lat: null, lon: null, takenAt: null,
    })] });
    if (pushed.status !== 200) throw new Error(`push answered ${pushed.status}: ${pushed.body.slice(0, 300)}`);
    // Let the collector settle so the baseline is the idle server, then watch the upload alone.
    await new Promise((r) => setTimeout(r, 1500));
    const pids = processTree(pid);
    resetPeak(pids);
    const before = memory(pids);
    const t0 = performance.now();
    const res = await fetch(`${base}/api/photos/${id}`, { method: 'PUT', body: new Uint8Array(jpeg), headers: { cookie, origin: base, 'content-type': 'image/jpeg' } });
    const body = await res.text();
    const uploadMs = performance.now() - t0;
    const after = memory(pids);
    if (res.status !== 200) throw new Error(`upload answered ${res.status}: ${body.slice(0, 300)}`);
    const t1 = performance.now();
    const back = Buffer.from(await (await fetch(`${base}/api/photos/${id}`, { headers: { cookie: staffCookie } })).arrayBuffer());
    const downloadMs = performance.now() - t1;
    if (createHash('sha256').update(back).digest('hex') !== sha256) throw new Error('the photo read back differs');
    runs.push({ uploadMs, downloadMs, peakOverBaseMiB: (after.hwm - before.rss) / MIB, peakMiB: after.hwm / MIB });
  }
  const figure = (k: keyof (typeof runs)[number]) => round(median(runs.map((r) => r[k])));
  const list = (k: keyof (typeof runs)[number]) => runs.map((r) => round(r[k])).join(' / ');
  const rows = [
    { bench: 'photo', figure: `12 Mpx JPEG (${round(jpeg.length / MIB, 2)} MB): PUT over HTTP`, ms: figure('uploadMs'), runs: list('uploadMs') },
    { bench: 'photo', figure: 'server peak memory during the PUT, over its size before (MB)', value: figure('peakOverBaseMiB'), runs: list('peakOverBaseMiB') },
    { bench: 'photo', figure: 'server peak resident size during the PUT (MB)', value: figure('peakMiB'), runs: list('peakMiB') },
    { bench: 'photo', figure: 'GET the original back', ms: figure('downloadMs'), runs: list('downloadMs') },
  ];
  // Streaming keeps the upload's own memory well under the photo's size (buffering needed several copies).
  report('photo', rows, [budget('12 Mpx photo upload: server peak over its size before', figure('peakOverBaseMiB'), '<=', 64, 'MB')]);
  await closeSequelize();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
