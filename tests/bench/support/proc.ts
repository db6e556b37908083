// Linux /proc readings of the benches: a process with its children, and the CPU time they used.
import { readFileSync, readdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';

/** The process and its children, recursively (a `next start` may fork its server). */
export function processTree(pid: number): number[] {
  const children = readdirSync(`/proc/${pid}/task`).flatMap((task) => {
    try {
      return readFileSync(`/proc/${pid}/task/${task}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number);
    } catch {
      return [];
    }
  });
  return [pid, ...children.flatMap(processTree)];
}

/**
 * The processes whose command name is `name` (as in /proc/PID/comm) and, given `arg`, whose command
 * line holds that argument: another checkout's server of the same name on this machine is not ours.
 */
export function processesNamed(name: string, arg?: string): number[] {
  return readdirSync('/proc').filter((entry) => /^\d+$/.test(entry)).map(Number).filter((pid) => {
    try {
      if (readFileSync(`/proc/${pid}/comm`, 'utf8').trim() !== name) return false;
      return arg === undefined || readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').includes(arg);
    } catch {
      return false;
    }
  });
}

let ticksPerSecond: number | undefined;

/** CPU time (user + system) the processes have used so far, in seconds. */
export function cpuSeconds(pids: number[]): number {
  ticksPerSecond ??= Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;
  let ticks = 0;
  for (const pid of pids) {
    try {
      // Fields after the command name (which may hold spaces): utime and stime are the 12th and 13th.
      const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').replace(/^.*\) /s, '').split(' ');
      ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      // the process ended
    }
  }
  return ticks / ticksPerSecond;
}

/** Busy and total CPU ticks of the whole machine so far (/proc/stat's first line). */
function machineTicks(): { busy: number; total: number } {
  const [, ...values] = readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/);
  const ticks = values.map(Number);
  const idle = (ticks[3] ?? 0) + (ticks[4] ?? 0); // idle + iowait
  const total = ticks.reduce((a, b) => a + b, 0);
  return { busy: total - idle, total };
}

/**
 * Waits until the machine is quiet: two windows of `windowMs` in a row with under `busyShare` of
 * its CPU busy, or `maxMs` at most. Returns how long it waited and whether it got quiet.
 */
export async function waitForQuietMachine({ windowMs = 500, busyShare = 0.1, maxMs = 15_000 } = {}): Promise<{ waitedMs: number; quiet: boolean }> {
  const start = Date.now();
  let quietWindows = 0;
  let before = machineTicks();
  while (Date.now() - start < maxMs) {
    await new Promise((resolve) => setTimeout(resolve, windowMs));
    const now = machineTicks();
    const share = (now.busy - before.busy) / Math.max(1, now.total - before.total);
    before = now;
    quietWindows = share < busyShare ? quietWindows + 1 : 0;
    if (quietWindows >= 2) return { waitedMs: Date.now() - start, quiet: true };
  }
  return { waitedMs: Date.now() - start, quiet: false };
}
