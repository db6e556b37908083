// The start-up bench's reading of a Chromium trace: the page's own main-thread tasks, and a trace
// that lost the page (or its later part) refused so the load is measured again.
import { describe, expect, it } from 'vitest';
import { mainThreadWork, TraceWithoutPage } from '../../bench/support/trace';

const PAGE = 7;
const OTHER = 9;
const MAIN = 1;

function trace({ withLoad = true } = {}) {
  return [
    { name: 'thread_name', ph: 'M', pid: PAGE, tid: MAIN, ts: 0, args: { name: 'CrRendererMain' } },
    { name: 'thread_name', ph: 'M', pid: OTHER, tid: MAIN, ts: 0, args: { name: 'CrRendererMain' } },
    { name: 'ParseHTML', ph: 'X', pid: PAGE, tid: MAIN, ts: 1_000, dur: 5_000, args: { beginData: { url: 'http://127.0.0.1:3100/login' } } },
    // 80 ms and 50 ms are long tasks; 49 ms is not; the other renderer's 300 ms is not the page's.
    { name: 'RunTask', ph: 'X', pid: PAGE, tid: MAIN, ts: 10_000, dur: 80_000 },
    { name: 'RunTask', ph: 'X', pid: PAGE, tid: MAIN, ts: 100_000, dur: 49_000 },
    { name: 'RunTask', ph: 'X', pid: PAGE, tid: MAIN, ts: 200_000, dur: 50_000 },
    { name: 'RunTask', ph: 'X', pid: PAGE, tid: 2, ts: 200_000, dur: 90_000 },
    { name: 'RunTask', ph: 'X', pid: OTHER, tid: MAIN, ts: 10_000, dur: 300_000 },
    ...(withLoad ? [{ name: 'MarkLoad', ph: 'I', pid: PAGE, tid: MAIN, ts: 240_000 }] : []),
  ];
}

describe('mainThreadWork', () => {
  it("sums the page's main-thread tasks of 50 ms or more, and all of them", () => {
    expect(mainThreadWork({ traceEvents: trace() })).toEqual({ longTaskMs: 130, taskMs: 179, longestMs: 80, tasks: 3 });
  });

  it('refuses a trace without the page, or without its load event (cut short)', () => {
    expect(() => mainThreadWork(trace().filter((e) => e.name !== 'ParseHTML'))).toThrow(TraceWithoutPage);
    expect(() => mainThreadWork(trace({ withLoad: false }))).toThrow(TraceWithoutPage);
  });
});
