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

/** The processes whose command name is `name` (as in /proc/PID/comm). */
export function processesNamed(name: string): number[] {
  return readdirSync('/proc').filter((entry) => /^\d+$/.test(entry)).map(Number).filter((pid) => {
    try {
      return readFileSync(`/proc/${pid}/comm`, 'utf8').trim() === name;
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
