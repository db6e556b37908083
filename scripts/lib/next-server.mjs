// Starts `next start` for a built app folder and waits until it answers; returns a stopper.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { root } from './env.mjs';
import { nodeBin } from './proc.mjs';

async function waitFor(url, timeoutMs) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}

/** Serves the built app in `cwd` on 127.0.0.1:port; `probe` is a path that answers once it is up. */
export async function startNext({ cwd, port, probe = '/', label = 'app' }) {
  const child = spawn(
    process.execPath,
    [
      ...(process.env.BENCH_CPU_PROF ? ['--cpu-prof', '--cpu-prof-dir=' + process.env.BENCH_CPU_PROF] : []),
      '--import',
      pathToFileURL(path.join(root, 'scripts/lib/refuse-trace.mjs')).href,
      nodeBin('next/dist/bin/next'),
      'start',
      '-H',
      '127.0.0.1',
      '-p',
      String(port),
    ],
    {
      cwd,
      env: { ...process.env, NODE_ENV: 'production' },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  // Server errors stay visible in the bench output.
  child.stderr.on('data', (chunk) => process.stderr.write(`[${label}] ${chunk}`));
  child.stdout.on('data', () => {});
  const exited = new Promise((resolve) => child.on('exit', resolve));
  await Promise.race([
    waitFor(`http://127.0.0.1:${port}${probe}`, 60_000),
    exited.then((code) => {
      throw new Error(`${label} server exited with ${code}`);
    }),
  ]);
  return {
    url: `http://127.0.0.1:${port}`,
    pid: child.pid,
    async stop() {
      if (child.exitCode !== null) return;
      child.kill('SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    },
  };
}
