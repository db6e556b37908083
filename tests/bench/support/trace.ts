// Reading a Chromium performance trace (the JSON `browser.stopTracing()` returns): the page's own
// main-thread tasks, as a phone's CPU would run them.

interface TraceEvent {
  name: string;
  ph: string;
  pid: number;
  tid: number;
  ts: number;
  dur?: number;
  args?: { name?: string; beginData?: { url?: string } };
}

/** The trace holds no page load, or not all of it: Chromium lost its events (the load is worth measuring again). */
export class TraceWithoutPage extends Error {}

/** Chromium counts a task of 50 ms or more as a long task (the Long Tasks API's threshold). */
export const LONG_TASK_MS = 50;

export interface MainThreadWork {
  /** Time in tasks of 50 ms or more (each task counted whole), ms. */
  longTaskMs: number;
  /** Time in every task, ms. */
  taskMs: number;
  /** The longest task, ms. */
  longestMs: number;
  tasks: number;
}

/**
 * The main-thread work of the page the trace loaded: every top-level task (RunTask) on the main
 * thread of the renderer process that parsed the page's HTML (the process that drew about:blank
 * before it was idle). Throws when the trace holds no page load or no load event (the measurement
 * would be empty or cut short).
 */
export function mainThreadWork(trace: { traceEvents?: TraceEvent[] } | TraceEvent[]): MainThreadWork {
  const events = Array.isArray(trace) ? trace : (trace.traceEvents ?? []);
  const parse = events.find((e) => e.name === 'ParseHTML' && e.args?.beginData?.url?.startsWith('http'));
  if (!parse) throw new TraceWithoutPage('the trace holds no page load (no HTML parsed from http)');
  // The load event is in the window the bench waits for: a trace without it lost its later events.
  if (!events.some((e) => e.name === 'MarkLoad' && e.pid === parse.pid)) throw new TraceWithoutPage('the trace holds no load event of the page');
  const main = events.find((e) => e.ph === 'M' && e.name === 'thread_name' && e.pid === parse.pid && e.args?.name === 'CrRendererMain');
  if (!main) throw new Error('the trace names no renderer main thread for the page');
  const durations = events.filter((e) => e.ph === 'X' && e.name === 'RunTask' && e.pid === parse.pid && e.tid === main.tid).map((e) => (e.dur ?? 0) / 1000);
  const long = durations.filter((d) => d >= LONG_TASK_MS);
  return {
    longTaskMs: long.reduce((a, b) => a + b, 0),
    taskMs: durations.reduce((a, b) => a + b, 0),
    longestMs: durations.reduce((a, b) => Math.max(a, b), 0),
    tasks: durations.length,
  };
}
