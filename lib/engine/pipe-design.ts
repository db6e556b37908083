// Drive and delivery pipe choices: sizes, bores, wave speed, surge and pressure ratings.
import { driveLengthBandM, DRIVE_LD_BAND, minimumDriveVelocityMps, type DriveLengthRuleId, type RamSizeRow } from './drive-pipe';
import { pressureHeadM } from './heads';
import {
  boreMm,
  classMadeIn,
  isPlastic,
  materialOrThrow,
  NOMINAL_SIZES,
  PLASTIC_CYCLIC_RATING_FACTOR,
  pressureClassOrThrow,
  sizeForBore,
  wallMm,
  type NominalSize,
  type PipeMaterial,
  type PressureClass,
} from './materials';
import { G, waterDensityKgM3, waterViscosityPaS } from './physics';
import { hazenWilliamsCoefficient, joukowskySurgeM, pipeVelocityMps, waveSpeedMps } from './pipes';

/** Closure velocity ≈ 2 × mean drive velocity: the flow accelerates from near rest each beat (common practice, no source). */
export const CLOSURE_TO_MEAN_VELOCITY = 2;
/** Delivery pipe rated for at least 1.25 × the total lift (common practice, no source). */
export const DELIVERY_RATING_FACTOR = 1.25;
/** Delivery friction kept within 10 % of the static lift (common practice, no source). */
export const DELIVERY_FRICTION_LIMIT = 0.1;

/** Working peak head over the total lift while the ram runs: the pulse overshoots as the delivery valve lifts (common practice, no source). */
export const WORKING_PEAK_ALLOWANCE = 0.2;
/** Square-edged entrance 0.5 + open gate valve 0.15 + open waste valve 2 (handbook values and an estimate; from memory). */
export const DRIVE_MINOR_LOSS_K = 0.5 + 0.15 + 2;

export type DriveLengthConflict = null | 'fall-band-above-ld' | 'fall-band-below-ld';

export interface DriveDesign {
  material: PipeMaterial;
  cls: PressureClass;
  size: NominalSize;
  boreMm: number;
  wallMm: number;
  lengthM: number;
  lengthGiven: boolean;
  bandMinM: number;
  bandMaxM: number;
  bandRuleLabel: string;
  bandSourceId: ReturnType<typeof driveLengthBandM>['rule']['sourceId'];
  /** Set when no length satisfies both the fall band and L/D 150–1000; the length then follows L/D. */
  lengthConflict: DriveLengthConflict;
  lengthToDiameter: number;
  /** Drive flow the ram takes, L/min: as asked, but never more than the fall can push through the pipe. */
  driveLpm: number;
  /** The fall, not the ram size or the water, limits the drive flow. */
  limitedByFall: boolean;
  /** Steady velocity through the open waste valve, √(2gH/(1 + ΣK + fL/D)): closure velocity stays below it (Iversen 1975). */
  attainableVelocityMps: number;
  velocityMps: number;
  closureVelocityMps: number;
  minimumClosureVelocityMps: number;
  waveSpeedMps: number;
  surgeHeadM: number;
  /** Head in the ram body in normal running: the total lift plus an allowance. */
  workingPeakHeadM: number;
  /** Head when the delivery is blocked (shut valve, float valve, waterlogged air vessel): fall + Joukowsky rise. */
  blockedDeliveryHeadM: number;
  /** Static rating of the class, m. */
  ratingM: number;
  /** Rating the drive pipe may be used to: plastic halved for cycling. */
  allowedHeadM: number;
  cyclicDerated: boolean;
  /** A higher class of the same material and size that holds both pressures, when the chosen one does not. */
  higherClass: PressureClass | null;
  /** Whether fittings of the class are made in the size. */
  fittingsMade: boolean;
  smallerThanRam: boolean;
}

export interface DriveDesignInput {
  fallM: number;
  totalLiftM: number;
  driveLpm: number;
  ram: RamSizeRow;
  pipe: { lengthM?: number | undefined; diameterMm?: number | undefined; material: string; pressureClass?: string | undefined };
  ruleId: DriveLengthRuleId;
}

function ratingHeadM(cls: PressureClass): number {
  return pressureHeadM(cls.ratingKPa);
}

function allowedHeadFor(material: PipeMaterial, cls: PressureClass): number {
  return ratingHeadM(cls) * (isPlastic(material) ? PLASTIC_CYCLIC_RATING_FACTOR : 1);
}

const KINEMATIC_VISCOSITY_15C = waterViscosityPaS(15) / waterDensityKgM3(15);

/**
 * Steady velocity, m/s, of the drive pipe discharging through the open waste valve: Darcy–Weisbach with the
 * Swamee–Jain friction factor (Swamee & Jain 1976, within about 1 % of Colebrook in turbulent flow; laminar 64/Re).
 */
export function attainableDriveVelocityMps(fallM: number, lengthM: number, boreMm: number, roughnessMm: number, minorK = DRIVE_MINOR_LOSS_K): number {
  if (!(fallM > 0)) return 0;
  const d = boreMm / 1000;
  const relative = roughnessMm / boreMm / 3.7;
  let v = Math.sqrt((2 * G * fallM) / (1 + minorK));
  for (let i = 0; i < 40; i++) {
    const re = Math.max((v * d) / KINEMATIC_VISCOSITY_15C, 1);
    const f = re < 2300 ? 64 / re : 0.25 / Math.log10(relative + 5.74 / re ** 0.9) ** 2;
    const next = Math.sqrt((2 * G * fallM) / (1 + minorK + (f * lengthM) / d));
    if (Math.abs(next - v) < 1e-7 * next) return next;
    v = next;
  }
  return v;
}

/** A length inside both the fall band and L/D 150–1000, rounded to 0.5 m where it stays inside; else the L/D edge and the conflict. */
export function chooseDriveLength(bandMinM: number, bandMaxM: number, boreMm: number): { lengthM: number; conflict: DriveLengthConflict } {
  const ldMin = (DRIVE_LD_BAND.min * boreMm) / 1000;
  const ldMax = (DRIVE_LD_BAND.max * boreMm) / 1000;
  const lo = Math.max(bandMinM, ldMin);
  const hi = Math.min(bandMaxM, ldMax);
  if (lo <= hi) {
    const mid = (lo + hi) / 2;
    const up = Math.ceil(mid * 2) / 2;
    const down = Math.floor(mid * 2) / 2;
    return { lengthM: up <= hi ? up : down >= lo ? down : mid, conflict: null };
  }
  if (ldMax < bandMinM) return { lengthM: Math.max(ldMin, Math.floor(ldMax * 2) / 2), conflict: 'fall-band-above-ld' };
  return { lengthM: Math.min(ldMax, Math.ceil(ldMin * 2) / 2), conflict: 'fall-band-below-ld' };
}

/** Designs one ram's drive pipe: size from the ram table (or as given), length in both bands, flow the fall can push, pressures against rating. */
export function designDrivePipe(input: DriveDesignInput): DriveDesign {
  const material = materialOrThrow(input.pipe.material, 'drivePipe.material');
  const tableSize = NOMINAL_SIZES.find((s) => s.nominalIn === input.ram.driveIn) ?? (NOMINAL_SIZES[0] as NominalSize);
  const given = pressureClassOrThrow(material, input.pipe.pressureClass, 'drivePipe.pressureClass');
  const probeSize = input.pipe.diameterMm ? sizeForBore(input.pipe.diameterMm, given) : tableSize;
  // Unless a class is given, the lowest class made in the size.
  const cls = input.pipe.pressureClass !== undefined ? given : (material.classes.find((c) => classMadeIn(c, probeSize)) ?? given);
  const size = input.pipe.diameterMm ? sizeForBore(input.pipe.diameterMm, cls) : tableSize;
  const bore = input.pipe.diameterMm ?? boreMm(size, cls);
  const band = driveLengthBandM(input.fallM, input.ruleId);
  const chosen = chooseDriveLength(band.minM, band.maxM, bore);
  const lengthM = input.pipe.lengthM ?? chosen.lengthM;
  const attainable = attainableDriveVelocityMps(input.fallM, lengthM, bore, material.roughnessMm);
  const area = (Math.PI * (bore / 1000) ** 2) / 4;
  const capLpm = (attainable / CLOSURE_TO_MEAN_VELOCITY) * area * 60000;
  const driveLpm = Math.min(input.driveLpm, capLpm);
  const velocity = pipeVelocityMps(driveLpm / 60, bore);
  const closure = CLOSURE_TO_MEAN_VELOCITY * velocity;
  const pressuresFor = (c: PressureClass) => {
    const b = input.pipe.diameterMm ?? boreMm(size, c);
    const a = waveSpeedMps({ diameterMm: b, wallMm: wallMm(size, c), pipeModulusGPa: material.modulusGPa });
    const v = CLOSURE_TO_MEAN_VELOCITY * pipeVelocityMps(driveLpm / 60, b);
    const surge = joukowskySurgeM({ waveSpeedMps: a, velocityChangeMps: v });
    return { a, surge, working: input.totalLiftM * (1 + WORKING_PEAK_ALLOWANCE), blocked: input.fallM + surge };
  };
  const p = pressuresFor(cls);
  const allowed = allowedHeadFor(material, cls);
  const holds = (c: PressureClass) => {
    const q = pressuresFor(c);
    return Math.max(q.working, q.blocked) <= allowedHeadFor(material, c);
  };
  const higherClass =
    Math.max(p.working, p.blocked) > allowed ? (material.classes.find((c) => c.ratingKPa > cls.ratingKPa && classMadeIn(c, size) && holds(c)) ?? null) : null;

  return {
    material,
    cls,
    size,
    boreMm: bore,
    wallMm: wallMm(size, cls),
    lengthM,
    lengthGiven: input.pipe.lengthM !== undefined,
    bandMinM: band.minM,
    bandMaxM: band.maxM,
    bandRuleLabel: band.rule.label,
    bandSourceId: band.rule.sourceId,
    lengthConflict: input.pipe.lengthM !== undefined ? null : chosen.conflict,
    lengthToDiameter: lengthM / (bore / 1000),
    driveLpm,
    limitedByFall: capLpm < input.driveLpm,
    attainableVelocityMps: attainable,
    velocityMps: velocity,
    closureVelocityMps: closure,
    minimumClosureVelocityMps: minimumDriveVelocityMps(input.totalLiftM, p.a, input.fallM),
    waveSpeedMps: p.a,
    surgeHeadM: p.surge,
    workingPeakHeadM: p.working,
    blockedDeliveryHeadM: p.blocked,
    ratingM: ratingHeadM(cls),
    allowedHeadM: allowed,
    cyclicDerated: isPlastic(material),
    higherClass,
    fittingsMade: classMadeIn(cls, size),
    smallerThanRam: size.nominalIn < input.ram.driveIn,
  };
}

export interface DeliveryDesign {
  material: PipeMaterial;
  cls: PressureClass;
  size: NominalSize;
  boreMm: number;
  diameterGiven: boolean;
  frictionK: number;
  ratingM: number;
  classGiven: boolean;
  /** Even the largest size loses more than 10 % of the static lift to friction. */
  frictionOverLimit: boolean;
}

export interface DeliveryDesignInput {
  pipe: { lengthM: number; diameterMm?: number | undefined; material: string; pressureClass?: string | undefined };
  fittingsAllowance: number;
  /** The smallest delivery size the ram takes, inches. */
  ramDeliveryIn: number;
  staticLiftM: number;
  /** Friction head, m, at the delivery the pipe would carry with this friction coefficient. */
  frictionFor: (frictionK: number) => number;
}

/** Delivery pipe: as given, or the ram's delivery size upsized until friction ≤ 10 % of the static lift. */
export function designDeliveryPipe(input: DeliveryDesignInput): DeliveryDesign {
  const material = materialOrThrow(input.pipe.material, 'deliveryPipe.material');
  const given = input.pipe.pressureClass !== undefined;
  let cls = pressureClassOrThrow(material, input.pipe.pressureClass, 'deliveryPipe.pressureClass');
  if (!given) {
    // Lowest class rated for 1.25 × (static lift + a 10 % friction allowance).
    const need = DELIVERY_RATING_FACTOR * input.staticLiftM * (1 + DELIVERY_FRICTION_LIMIT);
    cls = material.classes.find((c) => ratingHeadM(c) >= need) ?? (material.classes[material.classes.length - 1] as PressureClass);
  }
  const effectiveLength = input.pipe.lengthM * (1 + input.fittingsAllowance);
  const k = (bore: number) => hazenWilliamsCoefficient(effectiveLength, bore, material.hazenC);
  const limit = DELIVERY_FRICTION_LIMIT * input.staticLiftM;
  if (input.pipe.diameterMm) {
    const bore = input.pipe.diameterMm;
    return {
      material,
      cls,
      size: sizeForBore(bore, cls),
      boreMm: bore,
      diameterGiven: true,
      frictionK: k(bore),
      ratingM: ratingHeadM(cls),
      classGiven: given,
      frictionOverLimit: input.frictionFor(k(bore)) > limit,
    };
  }
  // Every size from the ram's delivery size up: a ram row above the largest listed size starts at the largest.
  const start = NOMINAL_SIZES.findIndex((s) => s.nominalIn >= input.ramDeliveryIn);
  const candidates = NOMINAL_SIZES.slice(start < 0 ? NOMINAL_SIZES.length - 1 : start);
  let chosen = candidates[0] as NominalSize;
  let over = true;
  for (const s of candidates) {
    chosen = s;
    if (input.frictionFor(k(boreMm(s, cls))) <= limit) {
      over = false;
      break;
    }
  }
  const bore = boreMm(chosen, cls);
  return {
    material,
    cls,
    size: chosen,
    boreMm: bore,
    diameterGiven: false,
    frictionK: k(bore),
    ratingM: ratingHeadM(cls),
    classGiven: given,
    frictionOverLimit: over,
  };
}
