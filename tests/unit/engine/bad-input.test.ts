import { describe, expect, it } from 'vitest';
import {
  allowedMisclosureMm,
  clinometerFallM,
  daubuissonEfficiency,
  dailyDemandL,
  darcyWeisbachLossM,
  EngineInputError,
  floatFlowLps,
  hazenWilliamsLossM,
  hoseLevelFallM,
  joukowskySurgeM,
  levelRun,
  pressureHeadM,
  ramDeliveryLpm,
  ramEfficiency,
  rankineEfficiency,
  rectangularWeirFlowLps,
  screenSite,
  velocityHeadM,
  vNotchFlowLps,
  volumetricFlowLps,
  waveSpeedMps,
  type SiteReadingsInput,
} from '@/lib/engine';
import { clearGo } from './fixtures/demo-sites';

function throwsNaming(fn: () => unknown, field: string): void {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught, `expected EngineInputError for ${field}`).toBeInstanceOf(EngineInputError);
  expect((caught as EngineInputError).field).toBe(field);
}

describe('each function throws EngineInputError naming the bad field', () => {
  const cases: [string, () => unknown, string][] = [
    ['volumetric: zero seconds', () => volumetricFlowLps([{ volumeL: 20, seconds: 0 }]), 'trials.0.seconds'],
    [
      'volumetric: NaN volume',
      () =>
        volumetricFlowLps([
          { volumeL: 20, seconds: 5 },
          { volumeL: Number.NaN, seconds: 5 },
        ]),
      'trials.1.volumeL',
    ],
    ['volumetric: no trials', () => volumetricFlowLps([]), 'trials'],
    ['v-notch: negative head', () => vNotchFlowLps(-0.1), 'headM'],
    ['v-notch: NaN angle', () => vNotchFlowLps(0.1, Number.NaN), 'notchAngleDeg'],
    ['weir: zero width', () => rectangularWeirFlowLps({ crestWidthM: 0, headM: 0.1 }), 'crestWidthM'],
    ['weir: infinite head', () => rectangularWeirFlowLps({ crestWidthM: 0.5, headM: Infinity }), 'headM'],
    ['float: zero seconds', () => floatFlowLps({ distanceM: 10, seconds: 0, areaM2: 0.2 }), 'seconds'],
    ['float: coefficient above 1', () => floatFlowLps({ distanceM: 10, seconds: 5, areaM2: 0.2, coefficient: 1.5 }), 'coefficient'],
    ['level: negative foresight', () => levelRun([{ backsightM: 1 }, { foresightM: -1 }]), 'rows.1.foresightM'],
    ['level: one station', () => levelRun([{ backsightM: 1 }]), 'rows'],
    ['clinometer: negative distance', () => clinometerFallM([{ slopeDistanceM: -5, angleBelowHorizontalDeg: 3 }]), 'legs.0.slopeDistanceM'],
    ['clinometer: vertical sight', () => clinometerFallM([{ slopeDistanceM: 5, angleBelowHorizontalDeg: 90 }]), 'legs.0.angleBelowHorizontalDeg'],
    ['hose: negative reading', () => hoseLevelFallM([{ upperReadingM: -0.1, lowerReadingM: 1 }]), 'steps.0.upperReadingM'],
    ['misclosure: negative loop', () => allowedMisclosureMm(-1, 'first'), 'loopKm'],
    ['Hazen–Williams: negative length', () => hazenWilliamsLossM({ lengthM: -1, flowLps: 1, diameterMm: 25, c: 150 }), 'lengthM'],
    ['Hazen–Williams: C of 0', () => hazenWilliamsLossM({ lengthM: 1, flowLps: 1, diameterMm: 25, c: 0 }), 'c'],
    ['Darcy: frozen water', () => darcyWeisbachLossM({ lengthM: 1, flowLps: 1, diameterMm: 25, roughnessMm: 0.01, temperatureC: -5 }), 'temperatureC'],
    ['wave speed: zero wall', () => waveSpeedMps({ diameterMm: 50, wallMm: 0, pipeModulusGPa: 200 }), 'wallMm'],
    ['Joukowsky: NaN velocity', () => joukowskySurgeM({ waveSpeedMps: 1000, velocityChangeMps: Number.NaN }), 'velocityChangeMps'],
    ['velocity head: NaN', () => velocityHeadM(Number.NaN), 'velocityMps'],
    ['pressure head: Infinity', () => pressureHeadM(Infinity), 'pressureKPa'],
    ['efficiency: negative ratio', () => ramEfficiency(-2), 'liftRatio'],
    ['delivery: efficiency above 1', () => ramDeliveryLpm({ supplyLpm: 60, fallM: 3, liftM: 30, efficiency: 1.2 }), 'efficiency'],
    ['delivery: zero fall', () => ramDeliveryLpm({ supplyLpm: 60, fallM: 0, liftM: 30, efficiency: 0.5 }), 'fallM'],
    ["D'Aubuisson: negative delivery", () => daubuissonEfficiency({ supplyLpm: 60, deliveryLpm: -1, fallM: 3, liftM: 30 }), 'deliveryLpm'],
    ['Rankine: zero supply', () => rankineEfficiency({ supplyLpm: 0, deliveryLpm: 1, fallM: 3, liftM: 30 }), 'supplyLpm'],
    ['demand: negative figure', () => dailyDemandL([{ kind: 'horse', count: 2, litresPerHeadPerDay: -3 }]), 'lines.0.litresPerHeadPerDay'],
  ];
  it.each(cases)('%s', (_label, fn, field) => throwsNaming(fn, field));
});

describe('screenSite rejects nonsense readings, naming the field path', () => {
  const bad = (patch: Record<string, unknown>) => ({ ...structuredClone(clearGo), ...patch }) as SiteReadingsInput;
  it.each<[string, SiteReadingsInput, string]>([
    [
      'zero seconds in a bucket trial',
      bad({ flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 0 }] }] }),
      'flowMeasurements.0.trials.0.seconds',
    ],
    ['negative delivery pipe length', bad({ deliveryPipe: { lengthM: -300, material: 'hdpe' } }), 'deliveryPipe.lengthM'],
    ['NaN static lift', bad({ lift: { kind: 'direct', staticLiftM: Number.NaN, method: 'level' } }), 'lift.staticLiftM'],
    ['no fall runs', bad({ fallRuns: [] }), 'fallRuns'],
    [
      'a level run with a foresight on its first station',
      bad({ fallRuns: [{ method: 'level', rows: [{ backsightM: 1, foresightM: 1 }, { foresightM: 2 }] }] }),
      'fallRuns.0.rows.0.foresightM',
    ],
    ['an unknown demand kind', bad({ demand: [{ kind: 'unicorn', count: 2 }] }), 'demand.0.kind'],
    ['a design fraction above 1', bad({ settings: { designFractionOfLowest: 1.5 } }), 'settings.designFractionOfLowest'],
  ])('%s', (_label, input, field) => throwsNaming(() => screenSite(input), field));

  it('rejects an unknown pressure class of the chosen material', () => {
    throwsNaming(() => screenSite(bad({ drivePipe: { material: 'pvc', pressureClass: 'sdr-99' } })), 'drivePipe.pressureClass');
  });
});
