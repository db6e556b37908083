import { describe, expect, it } from 'vitest';
import {
  darcyWeisbachLossM,
  EngineInputError,
  frictionFactor,
  hazenWilliamsLossM,
  headToKPa,
  joukowskySurgeM,
  minimumDriveVelocityMps,
  waterDensityKgM3,
  waterViscosityPaS,
  waveSpeedMps,
} from '@/lib/engine';
import { gpmToLps, inToMm } from '@/lib/shared/units';
import { expectRelative, expectWithin } from './helpers';

describe('Hazen–Williams (Rossman 2000, EPANET 2 Users Manual, Table 3.1)', () => {
  it('0.5 L/s through 300 m of 25 mm pipe, C = 150, loses 14.6 m; C = 140 loses 16.6 m (REFERENCES §4)', () => {
    expectWithin(hazenWilliamsLossM({ lengthM: 300, flowLps: 0.5, diameterMm: 25, c: 150 }), 14.6, 0.1);
    expectWithin(hazenWilliamsLossM({ lengthM: 300, flowLps: 0.5, diameterMm: 25, c: 140 }), 16.6, 0.1);
  });
  it('Engineering ToolBox worked example: 200 gpm, 3.048 in bore, C = 140 gives about 9 ft per 100 ft (within 3 %)', () => {
    const loss = hazenWilliamsLossM({ lengthM: 100, flowLps: gpmToLps(200), diameterMm: inToMm(3.048), c: 140 });
    expectRelative(loss, 9, 0.03); // per 100 length units: ft/100 ft equals m/100 m
  });
  it('no flow, no loss', () => {
    expect(hazenWilliamsLossM({ lengthM: 300, flowLps: 0, diameterMm: 25, c: 150 })).toBe(0);
  });
});

describe('Darcy–Weisbach with Colebrook (Çengel & Cimbala, Fluid Mechanics, Example 8-3)', () => {
  it('water properties at 15 °C match the example inputs: ρ = 999 kg/m³, μ = 1.138e-3 Pa·s', () => {
    expectWithin(waterDensityKgM3(15), 999.1, 0.2);
    expectRelative(waterViscosityPaS(15), 1.138e-3, 0.005);
  });
  it('6 L/s, 5 cm stainless (ε = 0.002 mm), 60 m: f ≈ 0.0172 and h_L ≈ 9.8 m (printed 9.84 m, from memory)', () => {
    expectWithin(frictionFactor(1.34e5, 0.002 / 50), 0.0172, 0.0002);
    expectWithin(darcyWeisbachLossM({ lengthM: 60, flowLps: 6, diameterMm: 50, roughnessMm: 0.002 }), 9.84, 0.1);
  });
  it('laminar flow uses 64/Re (Hagen–Poiseuille, standard)', () => {
    expectWithin(frictionFactor(1000, 0.001), 0.064, 1e-12);
  });
  it('rejects a zero diameter, naming the field', () => {
    expect(() => darcyWeisbachLossM({ lengthM: 60, flowLps: 6, diameterMm: 0, roughnessMm: 0.002 })).toThrow(/diameterMm/);
  });
});

describe('Korteweg wave speed (Wylie & Streeter 1993; Chaudhry 2014)', () => {
  it('a rigid pipe tends to √(K/ρ) = √(2.2e9/1000) = 1483 m/s', () => {
    expectWithin(waveSpeedMps({ diameterMm: 50, wallMm: 5, pipeModulusGPa: 1e9 }), 1483, 1);
  });
  it('4″ ductile iron class 52 (bore 107 mm, wall 7.4 mm, E 165 GPa, dimensions from memory) lies in Moser Table 4.1: 1,110–1,390 m/s', () => {
    const a = waveSpeedMps({ diameterMm: 107.2, wallMm: 7.4, pipeModulusGPa: 165 });
    expect(a).toBeGreaterThanOrEqual(1110);
    expect(a).toBeLessThanOrEqual(1390);
  });
  it('2″ Sch 40 steel (bore 52.5, wall 3.91, E 207 GPa) ≈ 1,390 m/s; PVC with D/e = 19 and E 3.0 GPa ≈ 384 m/s (REFERENCES §3, computed)', () => {
    expectWithin(waveSpeedMps({ diameterMm: 52.5, wallMm: 3.91, pipeModulusGPa: 207 }), 1390, 10);
    expectWithin(waveSpeedMps({ diameterMm: 19, wallMm: 1, pipeModulusGPa: 3.0 }), 384, 3);
  });
});

describe('Joukowsky surge (Joukowsky 1900; ΔH = a·Δv/g, Wylie & Streeter 1993)', () => {
  it('v = 1.5 m/s, a = 1200 m/s gives ΔH = 183.5 m, Δp = 1.80 MPa (REFERENCES §3)', () => {
    const dh = joukowskySurgeM({ waveSpeedMps: 1200, velocityChangeMps: 1.5 });
    expectWithin(dh, 183.5, 0.2);
    expectWithin(headToKPa(dh), 1800, 2);
  });
  it('least drive velocity to open the delivery valve: h = 50 m, a = 1300 m/s gives 0.38 m/s (Thomas 1994 concept)', () => {
    expectWithin(minimumDriveVelocityMps(50, 1300), 0.38, 0.005);
  });
  it('rejects a zero wave speed', () => {
    expect(() => joukowskySurgeM({ waveSpeedMps: 0, velocityChangeMps: 1 })).toThrow(EngineInputError);
  });
});
