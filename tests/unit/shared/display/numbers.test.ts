import { describe, expect, it } from 'vitest';
import { formatBytes, formatCount, formatFigure, formatNumber, formatPercent, formatTyped, formatWhole } from '@/lib/shared/display/numbers';

describe('numbers for people', () => {
  it('groups thousands and keeps the decimals asked for', () => {
    expect(formatNumber(12345.678, 2)).toBe('12,345.68');
    expect(formatNumber(6, 3)).toBe('6.000');
    expect(formatWhole(10247)).toBe('10,247');
    expect(formatWhole(1234567.4)).toBe('1,234,567');
  });

  it('rounds a figure by its size: tens above 1000, whole above 100, one decimal above 10, else two', () => {
    expect(formatFigure(1128.4)).toBe('1,130');
    expect(formatFigure(1125)).toBe('1,130');
    expect(formatFigure(5001130)).toBe('5,001,130');
    expect(formatFigure(456.4)).toBe('456');
    expect(formatFigure(12.345)).toBe('12.3');
    expect(formatFigure(0.3512)).toBe('0.35');
    // On the boundaries the rounded value picks the decimals: 99.96 is "100", not "100.0".
    expect(formatFigure(99.96)).toBe('100');
    expect(formatFigure(9.996)).toBe('10.0');
    expect(formatFigure(999.6)).toBe('1,000');
    expect(formatFigure(Number.NaN)).toBe('—');
  });

  it('never shows a negative zero', () => {
    expect(formatNumber(-0.001, 2)).toBe('0.00');
    expect(formatFigure(-0.0001)).toBe('0.00');
    expect(formatFigure(-12.34)).toBe('-12.3');
  });

  it('writes a typed value without separators or trailing zeros, ready to edit', () => {
    expect(formatTyped(5.283441, 2)).toBe('5.28');
    expect(formatTyped(1234.5, 2)).toBe('1234.5');
    expect(formatTyped(3, 3)).toBe('3');
  });

  it('percent, counts with their noun, and sizes in bytes', () => {
    expect(formatPercent(0.5)).toBe('50 %');
    expect(formatPercent(0.123)).toBe('12 %');
    expect(formatCount(1, 'station')).toBe('1 station');
    expect(formatCount(3, 'station')).toBe('3 stations');
    expect(formatCount(1200, 'change')).toBe('1,200 changes');
    expect(formatBytes(10_247_000_000)).toBe('10.2 GB');
    expect(formatBytes(850_000_000)).toBe('850 MB');
    expect(formatBytes(12_300)).toBe('12 kB');
  });

  it('writes every number exactly as Intl.NumberFormat does for en-GB (the oracle), ties and negatives included', () => {
    const grouped = (d: number) => new Intl.NumberFormat('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d, signDisplay: 'negative' });
    const typed = (d: number) => new Intl.NumberFormat('en-GB', { maximumFractionDigits: d, useGrouping: false, signDisplay: 'negative' });
    // A seeded generator: the same values every run, across magnitudes from 1e-6 to 1e15.
    let seed = 20261205;
    const random = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const values = [
      0,
      -0,
      0.5,
      1.5,
      2.5,
      -2.5,
      0.125,
      0.375,
      1.005,
      1.045,
      8.345,
      999.5,
      999.4999,
      1e-7,
      -1e-7,
      1234567.891,
      9.995,
      99.95,
      1e15 + 0.5,
      1e21,
      -1.5e22,
      5e-324,
      0.000049999,
      0.00005,
    ];
    for (let i = 0; i < 3000; i++) values.push((random() - 0.3) * 10 ** Math.floor(random() * 21 - 6));
    // Halves at every scale: exactly representable ties.
    for (let i = 0; i < 200; i++) values.push((Math.floor(random() * 2000) - 1000 + 0.5) / 10 ** Math.floor(random() * 4));
    for (const value of values) {
      for (const d of [0, 1, 2, 3, 4]) {
        expect(formatNumber(value, d), `${value} to ${d}`).toBe(grouped(d).format(value));
        expect(formatTyped(value, d), `${value} typed to ${d}`).toBe(typed(d).format(value));
      }
    }
  });
});
