// The bench's comparison logic on figures recorded by real runs of `npm run bench` on the project's
// 2-core machine (tests/unit/bench/recorded-runs.json): the good code as measured, and deliberate
// regressions made on branches and measured the same way (a sleep in the push, 200 kB more
// JavaScript on the sheet), each read by the same budgets. The statistics are checked by hand-worked
// examples.
import { describe, expect, it } from 'vitest';
import {
  budget,
  lighthouseBudgets,
  median,
  pairedExtra,
  pairedRatio,
  quantile,
  startupBudgets,
  syncBudgets,
  verdict,
  type LighthouseFigures,
  type StartupFigures,
  type SyncFigures,
} from '../../bench/support/budgets';
import recorded from './recorded-runs.json';

interface Recorded {
  what: string;
  sync?: SyncFigures;
  startup?: StartupFigures;
  lighthouse?: LighthouseFigures;
}
const runs = recorded.runs as Recorded[];
const run = (what: string) => {
  const found = runs.find((r) => r.what === what);
  if (!found) throw new Error(`no recorded run "${what}"`);
  return found;
};
const budgetsOf = (r: Recorded) => [
  ...(r.sync ? syncBudgets(r.sync) : []),
  ...(r.startup ? startupBudgets(r.startup) : []),
  ...(r.lighthouse ? lighthouseBudgets(r.lighthouse) : []),
];
const missed = (r: Recorded) => budgetsOf(r).filter((b) => !b.met).map((b) => b.name);

describe('statistics', () => {
  it('takes the median of an odd and an even count, and the nearest-rank quantile', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([])).toBeNaN();
    // Nearest rank: the 99th percentile of 1..100 is 99, of 1..10 is 10.
    expect(quantile(Array.from({ length: 100 }, (_, i) => i + 1), 0.99)).toBe(99);
    expect(quantile(Array.from({ length: 10 }, (_, i) => i + 1), 0.99)).toBe(10);
  });

  it('compares each app sample with the floor sample taken beside it, not the medians of the two', () => {
    // The machine slows down over the run: each pair is 2× however slow, the medians' ratio is not.
    const p = { app: [200, 400, 1200], floor: [100, 200, 600] };
    expect(pairedRatio(p)).toBe(2);
    expect(pairedExtra({ app: [300, 500, 900], floor: [250, 400, 820] })).toBe(80);
    expect(() => pairedRatio({ app: [1, 2], floor: [1] })).toThrow(/unpaired/);
  });

  it('never counts a missing figure as met, and calls a run with no budgets or a failed bench red', () => {
    expect(budget('x', NaN, '<=', 2).met).toBe(false);
    expect(budget('x', 2, '<=', 2).met).toBe(true);
    expect(budget('x', 0.49, '>=', 0.5).met).toBe(false);
    expect(verdict([budget('x', 1, '<=', 2)], 0)).toBe(0);
    expect(verdict([budget('x', 1, '<=', 2)], 1)).toBe(1);
    expect(verdict([], 0)).toBe(1);
  });

  it('refuses a page that has no start-up allowance rather than letting it pass', () => {
    expect(() => startupBudgets({ pages: [{ name: 'office', longTaskMs: { app: [1], floor: [1] } }] })).toThrow(/allowance/);
  });
});

const value = (r: Recorded, name: string) => {
  const found = budgetsOf(r).find((b) => b.name === name);
  if (!found) throw new Error(`no budget "${name}"`);
  return found.value;
};

describe('recorded runs of npm run bench', () => {
  it('reads the good code as measured: start-up of sign-in, sheet and field home within their allowance; capture and the push budgets not yet', () => {
    const good = run('good code');
    expect(missed(good).sort()).toEqual(
      [
        '50 devices: CPU per request',
        '50 devices: p99 of a 50-op push',
        'capture: long-task time at 4× slower CPU',
        'push route / raw insert rate',
      ].sort(),
    );
    expect(verdict(budgetsOf(good), 0)).toBe(1);
    // Green once those hold: the same figures with the missed ones at their limits.
    const met = budgetsOf(good).filter((b) => b.met);
    expect(verdict(met, 0)).toBe(0);
  });

  it('turns green to red on 200 kB more JavaScript loaded by the sheet, on the sheet only', () => {
    const good = run('good code');
    const heavy = run('200 kB more JavaScript on the sheet');
    const sheet = 'sheet: long-task time at 4× slower CPU';
    expect(missed(good)).not.toContain(sheet);
    expect(missed(heavy)).toEqual([sheet]);
    expect(value(heavy, sheet)).toBeGreaterThan(value(good, sheet) + 100);
    expect(verdict(budgetsOf(heavy), 0)).toBe(1);
  });

  it('sees a 100 ms sleep in the push: a slower p99 beside the floor and a push/raw rate cut to a fraction', () => {
    const good = run('good code');
    const slow = run('sleep 100 ms in the push');
    expect(value(slow, '50 devices: p99 of a 50-op push')).toBeGreaterThan(value(good, '50 devices: p99 of a 50-op push'));
    expect(value(slow, 'push route / raw insert rate')).toBeLessThan(value(good, 'push route / raw insert rate') / 3);
    expect(missed(slow)).toContain('push route / raw insert rate');
    // A sleep costs no CPU: that ratio does not move with it, and no request fails.
    expect(Math.abs(value(slow, '50 devices: CPU per request') - value(good, '50 devices: CPU per request'))).toBeLessThan(0.5);
    expect(value(slow, '50 devices: errors')).toBe(0);
  });
});
