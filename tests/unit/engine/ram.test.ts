import { describe, expect, it } from 'vitest';
import { daubuissonEfficiency, EngineInputError, rankineEfficiency, ramDeliveryLpm, ramEfficiency } from '@/lib/engine';
import { expectWithin } from './helpers';

describe("delivered flow q = η·Q·H/h (D'Aubuisson; Water for the World RWS.4.D.5)", () => {
  it('Q = 60 L/min, H = 3 m, h = 30 m, η = 0.6 gives 3.6 L/min = 5,184 L/day (REFERENCES §1, Wikipedia 60 %)', () => {
    const q = ramDeliveryLpm({ supplyLpm: 60, fallM: 3, liftM: 30, efficiency: 0.6 });
    expectWithin(q, 3.6, 1e-9);
    expectWithin(q * 1440, 5184, 1e-6);
  });
  it('Water for the World: S = 20, F = 3, E = 0.66, L = 25 gives 1.584 L/min = 2,281 L/day', () => {
    const q = ramDeliveryLpm({ supplyLpm: 20, fallM: 3, liftM: 25, efficiency: 0.66 });
    expectWithin(q, 1.584, 1e-9);
    expectWithin(q * 1440, 2281, 0.5);
  });
  it('Wikipedia: 2 m supply to 10 m at 70 % delivers 14 % of the supply', () => {
    expectWithin(ramDeliveryLpm({ supplyLpm: 100, fallM: 2, liftM: 10, efficiency: 0.7 }), 14, 1e-9);
  });
  it('refuses a lift at or below the fall (the tank would fill by gravity)', () => {
    expect(() => ramDeliveryLpm({ supplyLpm: 60, fallM: 3, liftM: 3, efficiency: 0.6 })).toThrow(/liftM/);
  });
});

describe('efficiencies of a ram test (NITK lab notes; textbook example Q 30 L/s, q 3 L/s, H 4 m, h 18 m)', () => {
  const test = { supplyLpm: 1800, deliveryLpm: 180, fallM: 4, liftM: 18 };
  it("D'Aubuisson η = q·h/(Q·H) = 0.450", () => {
    expectWithin(daubuissonEfficiency(test), 0.45, 1e-9);
  });
  it('Rankine η = q·(h − H)/((Q − q)·H) = 0.389, and equals (η_D − r)/(1 − r) with r = q/Q', () => {
    const r = test.deliveryLpm / test.supplyLpm;
    expectWithin(rankineEfficiency(test), 0.389, 0.0005);
    expectWithin(rankineEfficiency(test), (daubuissonEfficiency(test) - r) / (1 - r), 1e-12);
  });
  it('rejects a delivery larger than the supply', () => {
    expect(() => daubuissonEfficiency({ ...test, deliveryLpm: 2000 })).toThrow(EngineInputError);
  });
});

describe('efficiency curves against lift ratio', () => {
  it('Building Trades Pocketbook table: r = 4 → 72 %, 10 → 44 %, 16 → 25 %, 20 → 14 %', () => {
    expectWithin(ramEfficiency(4).efficiency, 0.72, 1e-9);
    expectWithin(ramEfficiency(10).efficiency, 0.44, 1e-9);
    expectWithin(ramEfficiency(16).efficiency, 0.25, 1e-9);
    expectWithin(ramEfficiency(20).efficiency, 0.14, 1e-9);
  });
  it('between rows it interpolates linearly: r = 11 → (44 + 37)/2 = 40.5 %', () => {
    expectWithin(ramEfficiency(11).efficiency, 0.405, 1e-9);
    expect(ramEfficiency(11).status).toBe('in-range');
  });
  it('outside the table it reports the range instead of extrapolating (table runs r = 4…26)', () => {
    expect(ramEfficiency(3).status).toBe('below-range');
    // Below the table the delivered share q/Q = η/r is held at the first row's 0.72/4 = 0.18, so η = 0.18 × 3.
    expectWithin(ramEfficiency(3).efficiency, 0.54, 1e-9);
    expectWithin(ramEfficiency(1.07).efficiency / 1.07, 0.18, 1e-9);
    expect(ramEfficiency(28).status).toBe('above-range');
    expect(ramEfficiency(28).efficiency).toBe(0);
  });
  it('Eytelwein η = 1.12 − 0.2·√r (from memory): r = 4 → 0.72, 10 → 0.49, 20 → 0.23', () => {
    expectWithin(ramEfficiency(4, 'eytelwein').efficiency, 0.72, 0.005);
    expectWithin(ramEfficiency(10, 'eytelwein').efficiency, 0.49, 0.005);
    expectWithin(ramEfficiency(20, 'eytelwein').efficiency, 0.23, 0.005);
  });
  it('Water for the World constants: 0.66 commercial, 0.33 home-built', () => {
    expect(ramEfficiency(10, 'wftw-commercial').efficiency).toBe(0.66);
    expect(ramEfficiency(10, 'wftw-home-built').efficiency).toBe(0.33);
  });
});
