// Bench: 12-megapixel JPEGs uploaded over HTTP to the served app (PUT /api/photos/:id, as the phone
// sends them) and one read back (GET /api/photos/:id): one camera-sized photo (5.6 MB), then four of
// 13 MB at once; time, and the server process's peak memory during the uploads. Linux: the kernel's high-water mark (VmHWM) is reset before each upload
// (/proc/PID/clear_refs), so the peak is the upload's own; the figure is the peak over the resident
// size just before. Median of 3 runs, each with new photos. Run with npm run bench.
import { createHash, randomUUID } from 'node:crypto';
import { spawn } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { makeOrganisation, sessionCookie } from '../integration/support/fixtures';
import { putOp } from '../integration/support/sync';
import { clientFor } from './support/http';
import { processTree } from './support/proc';
import { budget, median, round } from './support/budgets';
import { report } from './support/report';
import { closeSequelize } from '@/lib/server/db';

const RUNS = 3;
const MIB = 1024 * 1024;

/** kB figures of /proc/PID/status, summed over the tree, in bytes. */
function memory(pids: number[]): { rss: number; hwm: number; anon: number } {
  const sum = { rss: 0, hwm: 0, anon: 0 };
  for (const pid of pids) {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    const kb = (field: string) => Number(new RegExp(`${field}:\\s+(\\d+)`).exec(status)?.[1] ?? 0) * 1024;
    sum.rss += kb('VmRSS');
    sum.hwm += kb('VmHWM');
    sum.anon += kb('RssAnon');
  }
  return sum;
}

/**
 * Samples the tree's anonymous resident memory (heap, buffers: what the process itself holds) every
 * few ms until stopped; the kernel keeps no peak of it. The total's peak (VmHWM) also counts file
 * pages libvips maps while it reads a photo from disk: page cache the kernel may drop at will.
 */
function sampleAnon(pids: number[]) {
  let peak = 0;
  const timer = setInterval(() => {
    peak = Math.max(peak, memory(pids).anon);
  }, 3);
  return () => {
    clearInterval(timer);
    return Math.max(peak, memory(pids).anon);
  };
}

/** Resets the peak to the current size (Linux ≥ 4.0, own or root's processes). */
const resetPeak = (pids: number[]) => pids.forEach((pid) => writeFileSync(`/proc/${pid}/clear_refs`, '5'));

/** A 4000 × 3000 JPEG of sensor-like noise: at quality 87 about 5.6 MB (what a phone writes at 12 Mpx), at 100 about 13 MB. */
async function cameraJpeg(quality: number): Promise<Buffer> {
  const noise = await sharp({ create: { width: 4000, height: 3000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 120, sigma: 28 } } })
    .raw().toBuffer();
  return sharp(noise, { raw: { width: 4000, height: 3000, channels: 3 } }).jpeg({ quality }).toBuffer();
}

/**
 * A `next start` of the same build of its own for one run, so memory an earlier run left behind
 * (the heap grows and keeps its pages) does not hide the next run's peak; one small upload warms it.
 */
async function freshServer(port: number) {
  const child = spawn(process.execPath, [path.join('node_modules', 'next', 'dist', 'bin', 'next'), 'start', '-H', '127.0.0.1', '-p', String(port)], {
    env: { ...process.env, NODE_ENV: 'production', PORT: String(port) }, stdio: ['ignore', 'ignore', 'inherit'],
  });
  const url = `http://127.0.0.1:${port}`;
  for (let i = 0; ; i++) {
    if (child.exitCode !== null || i > 240) throw new Error(`the bench server on ${port} did not start`);
    if (await fetch(`${url}/api/health`).then((r) => r.ok, () => false)) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  return {
    url, pid: child.pid as number,
    stop: async () => {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await exited;
    },
  };
}

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
interface Run { uploadMs: number; anonOverBaseMiB: number; peakOverBaseMiB: number; peakMiB: number; downloadMs: number }

/** `atOnce` uploads of the photo (each a new one) started together; time to the last answer and the server's peak. */
async function uploadRun(org: Org, jpeg: Buffer, atOnce: number, warmUp: Buffer): Promise<Run> {
  const server = await freshServer(Number(new URL(process.env.BENCH_APP_URL as string).port) + 6);
  try {
    return await measuredRun(org, jpeg, atOnce, warmUp, server.url, server.pid);
  } finally {
    await server.stop();
  }
}

async function upload(base: string, cookie: string, id: string, jpeg: Buffer) {
  const res = await fetch(`${base}/api/photos/${id}`, { method: 'PUT', body: new Uint8Array(jpeg), headers: { cookie, origin: base, 'content-type': 'image/jpeg' } });
  const body = await res.text();
  if (res.status !== 200) throw new Error(`upload answered ${res.status}: ${body.slice(0, 300)}`);
}

async function measuredRun(org: Org, jpeg: Buffer, atOnce: number, warmUp: Buffer, base: string, pid: number): Promise<Run> {
  const client = await clientFor(org.advisor);
  const cookie = await sessionCookie(org.advisor);
  const sha256 = createHash('sha256').update(jpeg).digest('hex');
  const ids = Array.from({ length: atOnce }, () => randomUUID());
  const warmId = randomUUID();
  const meta = (id: string, data: Buffer) => putOp('photo', id, {
    visitId: org.visit.id, pointId: null, caption: 'Bench', mime: 'image/jpeg', bytes: data.length, sha256: createHash('sha256').update(data).digest('hex'),
    width: null, height: null, lat: null, lon: null, takenAt: null,
  });
  const pushed = await client.post('/api/sync/push', { ops: [...ids.map((id) => meta(id, jpeg)), meta(warmId, warmUp)] });
  if (pushed.status !== 200) throw new Error(`push answered ${pushed.status}: ${pushed.body.slice(0, 300)}`);
  await upload(base, cookie, warmId, warmUp);
  // Let the collector settle so the baseline is the warm, idle server, then watch the uploads alone.
  await new Promise((r) => setTimeout(r, 1500));
  const pids = processTree(pid);
  resetPeak(pids);
  const before = memory(pids);
  const stopSampling = sampleAnon(pids);
  const t0 = performance.now();
  await Promise.all(ids.map((id) => upload(base, cookie, id, jpeg)));
  const uploadMs = performance.now() - t0;
  const anonPeak = stopSampling();
  const after = memory(pids);
  const t1 = performance.now();
  const back = Buffer.from(await (await fetch(`${base}/api/photos/${ids[0]}`, { headers: { cookie: await sessionCookie(org.coordinator) } })).arrayBuffer());
  const downloadMs = performance.now() - t1;
  if (createHash('sha256').update(back).digest('hex') !== sha256) throw new Error('the photo read back differs');
  return { uploadMs, downloadMs, anonOverBaseMiB: (anonPeak - before.anon) / MIB, peakOverBaseMiB: (after.hwm - before.rss) / MIB, peakMiB: after.hwm / MIB };
}

async function main() {
  if (!process.env.BENCH_APP_URL) throw new Error('BENCH_APP_URL is not set: run with npm run bench');
  const org = await makeOrganisation('bench-photo');
  const warmUp = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#6b8f5a' } }).jpeg().toBuffer();
  const rows: Record<string, unknown>[] = [];
  const peaks: number[] = [];
  for (const [quality, atOnce] of [[87, 1], [100, 4]] as const) {
    const jpeg = await cameraJpeg(quality);
    const runs: Run[] = [];
    for (let run = 0; run < RUNS; run++) runs.push(await uploadRun(org, jpeg, atOnce, warmUp));
    const figure = (k: keyof Run) => round(median(runs.map((r) => r[k])));
    const list = (k: keyof Run) => runs.map((r) => round(r[k])).join(' / ');
    const what = `${atOnce === 1 ? 'one' : `${atOnce} at once,`} 12 Mpx JPEG of ${round(jpeg.length / MIB, 1)} MB`;
    rows.push(
      { bench: 'photo', figure: `${what}: PUT over HTTP`, ms: figure('uploadMs'), runs: list('uploadMs') },
      { bench: 'photo', figure: `${what}: server peak own (anonymous) memory over before (MB)`, value: figure('anonOverBaseMiB'), runs: list('anonOverBaseMiB') },
      { bench: 'photo', figure: `${what}: server peak resident incl. mapped files over before (MB)`, value: figure('peakOverBaseMiB'), runs: list('peakOverBaseMiB') },
      { bench: 'photo', figure: `${what}: server peak resident size (MB)`, value: figure('peakMiB'), runs: list('peakMiB') },
      { bench: 'photo', figure: `${what}: GET one original back`, ms: figure('downloadMs'), runs: list('downloadMs') },
    );
    peaks.push(figure('anonOverBaseMiB'));
  }
  // Buffered, the four bodies took about 100 MB (each read whole, then joined: twice its size);
  // streamed, what is left is libvips' decoding and chunks not yet collected.
  report('photo', rows, [budget('4 photos of 13 MB at once: server peak own memory over before', peaks[1] ?? NaN, '<=', 64, 'MB')]);
  await closeSequelize();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
