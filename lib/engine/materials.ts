import { EngineInputError } from './errors';
import type { SourceId } from './sources';

export type PipeMaterialId = 'galvanized-steel' | 'pvc' | 'hdpe';

export interface PressureClass {
  id: string;
  label: string;
  ratingKPa: number;
  /** Wall thickness for a nominal size: plastic from SDR, steel from the schedule table. */
  sdr?: number;
  /** Largest nominal size, inches, the class is made in (threaded malleable fittings); no limit when absent. */
  maxNominalIn?: number;
  sourceId: SourceId;
}

export interface PipeMaterial {
  id: PipeMaterialId;
  label: string;
  modulusGPa: number;
  hazenC: number;
  roughnessMm: number;
  classes: readonly PressureClass[];
}

export interface NominalSize {
  /** Trade size, inches, as sold. */
  nominalIn: number;
  label: string;
  outsideMm: number;
  /** Schedule 40 steel wall, mm. */
  steelWallMm: number;
}

// IPS outside diameters and Schedule 40 walls (ASME B36.10, from memory; the 2″ bore 52.5 mm and wall 3.91 mm confirmed).
export const NOMINAL_SIZES: readonly NominalSize[] = [
  { nominalIn: 0.5, label: '½″ (15 mm)', outsideMm: 21.3, steelWallMm: 2.77 },
  { nominalIn: 0.75, label: '¾″ (20 mm)', outsideMm: 26.7, steelWallMm: 2.87 },
  { nominalIn: 1, label: '1″ (25 mm)', outsideMm: 33.4, steelWallMm: 3.38 },
  { nominalIn: 1.25, label: '1¼″ (32 mm)', outsideMm: 42.2, steelWallMm: 3.56 },
  { nominalIn: 1.5, label: '1½″ (40 mm)', outsideMm: 48.3, steelWallMm: 3.68 },
  { nominalIn: 2, label: '2″ (50 mm)', outsideMm: 60.3, steelWallMm: 3.91 },
  { nominalIn: 2.5, label: '2½″ (65 mm)', outsideMm: 73.0, steelWallMm: 5.16 },
  { nominalIn: 3, label: '3″ (80 mm)', outsideMm: 88.9, steelWallMm: 5.49 },
  { nominalIn: 4, label: '4″ (100 mm)', outsideMm: 114.3, steelWallMm: 6.02 },
  { nominalIn: 6, label: '6″ (150 mm)', outsideMm: 168.3, steelWallMm: 7.11 },
  { nominalIn: 8, label: '8″ (200 mm)', outsideMm: 219.1, steelWallMm: 8.18 },
  { nominalIn: 12, label: '12″ (300 mm)', outsideMm: 323.8, steelWallMm: 10.31 },
];

const PSI_KPA = 6.894757;

// Plastic rating P = 2·HDS/(SDR − 1) (ISO 161 / ASTM); HDS 2000 psi PVC 1120, 1000 psi PE4710 (from memory).
function sdrClass(sdr: number, hdsPsi: number, prefix: string): PressureClass {
  const ratingPsi = (2 * hdsPsi) / (sdr - 1);
  return {
    id: `sdr-${sdr}`,
    label: `${prefix} SDR ${sdr} (${Math.round(ratingPsi)} psi)`,
    ratingKPa: ratingPsi * PSI_KPA,
    sdr,
    sourceId: 'pressure-rating-sdr',
  };
}

export const PIPE_MATERIALS: Readonly<Record<PipeMaterialId, PipeMaterial>> = {
  'galvanized-steel': {
    id: 'galvanized-steel',
    label: 'Galvanized steel',
    modulusGPa: 207,
    hazenC: 120,
    roughnessMm: 0.15,
    // Threaded joints: the malleable-iron fittings, not the pipe, set the rating (from memory).
    classes: [
      // ASME B16.3 makes class 150 malleable fittings to 6″ and class 300 to 3″ (from memory).
      { id: 'sch40-class150', label: 'Schedule 40, class 150 fittings (300 psi)', ratingKPa: 300 * PSI_KPA, maxNominalIn: 6, sourceId: 'steel-pipe-sizes' },
      { id: 'sch40-class300', label: 'Schedule 40, class 300 fittings (600 psi)', ratingKPa: 600 * PSI_KPA, maxNominalIn: 3, sourceId: 'steel-pipe-sizes' },
    ],
  },
  pvc: {
    id: 'pvc',
    label: 'PVC',
    modulusGPa: 2.9,
    hazenC: 150,
    roughnessMm: 0.0015,
    classes: [26, 21, 17, 13.5].map((s) => sdrClass(s, 2000, 'PVC')),
  },
  hdpe: {
    id: 'hdpe',
    label: 'Polyethylene (HDPE)',
    modulusGPa: 0.9,
    hazenC: 150,
    roughnessMm: 0.007,
    classes: [17, 11, 9, 7].map((s) => sdrClass(s, 1000, 'PE')),
  },
};

/** Material by id, or EngineInputError naming the field. */
export function materialOrThrow(id: string, field: string): PipeMaterial {
  const m = (PIPE_MATERIALS as Record<string, PipeMaterial | undefined>)[id];
  if (!m) throw new EngineInputError(field, 'is not a known pipe material');
  return m;
}

/** Pressure class by id (default: the material's lowest class). */
export function pressureClassOrThrow(material: PipeMaterial, classId: string | undefined, field: string): PressureClass {
  const first = material.classes[0];
  if (!first) throw new EngineInputError(field, 'material has no pressure classes');
  if (classId === undefined) return first;
  const c = material.classes.find((k) => k.id === classId);
  if (!c) throw new EngineInputError(field, `is not a class of ${material.label}`);
  return c;
}

/** Wall thickness, mm, of a nominal size in a class. */
export function wallMm(size: NominalSize, cls: PressureClass): number {
  return cls.sdr ? size.outsideMm / cls.sdr : size.steelWallMm;
}

/** Bore (inside diameter), mm, of a nominal size in a class. */
export function boreMm(size: NominalSize, cls: PressureClass): number {
  return size.outsideMm - 2 * wallMm(size, cls);
}

/** The nominal size whose bore is closest to a stated inside diameter (for a pipe the advisor already has). */
export function sizeForBore(diameterMm: number, cls: PressureClass): NominalSize {
  let best = NOMINAL_SIZES[0] as NominalSize;
  for (const s of NOMINAL_SIZES) {
    if (Math.abs(boreMm(s, cls) - diameterMm) < Math.abs(boreMm(best, cls) - diameterMm)) best = s;
  }
  return best;
}

/** Whether a class is made in a nominal size (malleable fittings stop at 6″ for class 150, 3″ for class 300). */
export function classMadeIn(cls: PressureClass, size: NominalSize): boolean {
  return cls.maxNominalIn === undefined || size.nominalIn <= cls.maxNominalIn;
}

/** Share of the static rating a plastic pipe keeps under a ram's 10⁷–10⁸ pressure cycles a year (from memory). */
export const PLASTIC_CYCLIC_RATING_FACTOR = 0.5;

/** Whether a material is a plastic whose rating is derated for cycling. */
export function isPlastic(material: PipeMaterial): boolean {
  return material.id !== 'galvanized-steel';
}
