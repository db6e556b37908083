import { describe, expect, it } from 'vitest';
import { dailyDemandL, DEMAND_CATALOGUE, driveLengthBandM, PIPE_MATERIALS, ramSizeForFlow, tankSizeL } from '@/lib/engine';
import { kPaToPsi } from '@/lib/shared/units';
import { expectWithin } from './helpers';

describe('demand catalogue (per head per day)', () => {
  it('nursing beef cow 62 L (NDSU: 16.5 gal at 88 °F); horse 38 L (K-State LWH: ~10 gal)', () => {
    expectWithin(DEMAND_CATALOGUE['beef-cow-nursing'].litresPerHeadPerDay, 62, 0.6);
    expectWithin(DEMAND_CATALOGUE.horse.litresPerHeadPerDay, 38, 0.2);
  });
  it('person, basic access 20 L (WHO Howard & Bartram 2003, from memory; JMP ≥ 20 L found); Sphere minimum 15 L', () => {
    expect(DEMAND_CATALOGUE['person-basic'].litresPerHeadPerDay).toBe(20);
    expect(DEMAND_CATALOGUE['person-emergency'].litresPerHeadPerDay).toBe(15);
  });
  it('sums lines, uses a line figure before an organisation override before the catalogue', () => {
    const lines = [
      { kind: 'person-basic' as const, count: 4 },
      { kind: 'sheep' as const, count: 10, litresPerHeadPerDay: 5 },
      { kind: 'horse' as const, count: 2 },
    ];
    expectWithin(dailyDemandL(lines, { horse: 40 }), 4 * 20 + 10 * 5 + 2 * 40, 1e-9);
  });
  it('rejects a negative count, naming the line', () => {
    expect(() => dailyDemandL([{ kind: 'sheep', count: -1 }])).toThrow(/lines\.0\.count/);
  });
});

describe('tank rules', () => {
  it('low-yield source: 36,000 L/day with 175 L/min peak gives max(72,000, 63,000) = 72,000 L (storage fact sheet example)', () => {
    expect(tankSizeL(36000, 'low-yield-two-day-or-peak', 175 * 60).requiredL).toBe(72000);
  });
  it('undependable supply: 3 days (NRCS SD2006-1); group watering 25 % (Ohio State ANR-12)', () => {
    expect(tankSizeL(1000, 'undependable-three-day').requiredL).toBe(3000);
    expect(tankSizeL(1000, 'group-watering-quarter-day').requiredL).toBe(250);
  });
  it('rounds up to a common tank size', () => {
    expect(tankSizeL(1200, 'one-day').sizeL).toBe(1500);
  });
});

describe('drive pipe rules', () => {
  it('3–7 × fall (Perkin via Wikipedia): 2 m fall gives 6–14 m', () => {
    const band = driveLengthBandM(2);
    expectWithin(band.minM, 6, 1e-9);
    expectWithin(band.maxM, 14, 1e-9);
  });
  it('Ogden (1911) Table XI: 15 L/min → 1¼″ drive with ¾″ delivery; 100 L/min → 3″ with 1¼″', () => {
    expect(ramSizeForFlow(15).row?.driveIn).toBe(1.25);
    expect(ramSizeForFlow(15).row?.deliveryIn).toBe(0.75);
    expect(ramSizeForFlow(100).row?.driveIn).toBe(3);
    expect(ramSizeForFlow(100).row?.deliveryIn).toBe(1.25);
  });
  it('below 2.5 gpm (9.5 L/min) no size in the table fits', () => {
    expect(ramSizeForFlow(5).status).toBe('below-table');
  });
  it('in the gap above the 4″ ram (75 gpm) the ram is capped at its maximum, 284 L/min', () => {
    const r = ramSizeForFlow(400);
    expect(r.status).toBe('capped');
    expectWithin(r.usedLpm, 284, 0.5);
  });
});

describe('pipe pressure classes (P = 2·HDS/(SDR − 1); ASTM D2241 classes, from memory)', () => {
  it('PVC SDR 21 is 200 psi and SDR 26 is 160 psi; PE4710 DR 11 is 200 psi', () => {
    const pvc = PIPE_MATERIALS.pvc.classes;
    expectWithin(kPaToPsi(pvc.find((c) => c.id === 'sdr-21')?.ratingKPa ?? 0), 200, 0.01);
    expectWithin(kPaToPsi(pvc.find((c) => c.id === 'sdr-26')?.ratingKPa ?? 0), 160, 0.01);
    expectWithin(kPaToPsi(PIPE_MATERIALS.hdpe.classes.find((c) => c.id === 'sdr-11')?.ratingKPa ?? 0), 200, 0.01);
  });
});
