// Drive and delivery pipe choices: sizes, bores, wave speed, surge and pressure ratings.
import { driveLengthBandM, DRIVE_LD_BAND, minimumDriveVelocityMps, type DriveLengthRuleId, type RamSizeRow } from './drive-pipe';
import { pressureHeadM } from './heads';
import {
  boreMm, materialOrThrow, NOMINAL_SIZES, pressureClassOrThrow, sizeForBore, wallMm,
  type NominalSize, type PipeMaterial, type PressureClass,
} from './materials';
import { hazenWilliamsCoefficient, joukowskySurgeM, pipeVelocityMps, waveSpeedMps } from './pipes';

/** Closure velocity ≈ 2 × mean drive velocity: the flow accelerates from near rest each beat (common practice, no source). */
export const CLOSURE_TO_MEAN_VELOCITY = 2;
/** Delivery pipe rated for at least 1.25 × the total lift (common practice, no source). */
export const DELIVERY_RATING_FACTOR = 1.25;
/** Delivery friction kept within 10 % of the static lift (REFERENCES §4, common practice). */
export const DELIVERY_FRICTION_LIMIT = 0.1;

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
  lengthToDiameter: number;
  velocityMps: number;
  closureVelocityMps: number;
  minimumClosureVelocityMps: number;
  waveSpeedMps: number;
  surgeHeadM: number;
  peakPressureHeadM: number;
  ratingM: number;
  /** A higher class of the same material and size that holds the peak, when the chosen one does not. */
  higherClass: PressureClass | null;
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

/** Designs the drive pipe: size from the ram table (or as given), length in band and L/D, surge against rating. */
export function designDrivePipe(input: DriveDesignInput): DriveDesign {
  const material = materialOrThrow(input.pipe.material, 'drivePipe.material');
  const cls = pressureClassOrThrow(material, input.pipe.pressureClass, 'drivePipe.pressureClass');
  const tableSize = NOMINAL_SIZES.find((s) => s.nominalIn === input.ram.driveIn) ?? (NOMINAL_SIZES[0] as NominalSize);
  const size = input.pipe.diameterMm ? sizeForBore(input.pipe.diameterMm, cls) : tableSize;
  const bore = input.pipe.diameterMm ?? boreMm(size, cls);
  const band = driveLengthBandM(input.fallM, input.ruleId);
  // Recommended: the middle of the band, pulled into the L/D band (NITK 150–1000) where possible.
  const mid = (band.minM + band.maxM) / 2;
  const ldMin = (DRIVE_LD_BAND.min * bore) / 1000;
  const ldMax = (DRIVE_LD_BAND.max * bore) / 1000;
  const recommended = Math.min(Math.max(mid, ldMin), ldMax);
  const lengthM = input.pipe.lengthM ?? Math.ceil(recommended * 2) / 2;
  const velocity = pipeVelocityMps(input.driveLpm / 60, bore);
  const closure = CLOSURE_TO_MEAN_VELOCITY * velocity;
  const a = waveSpeedMps({ diameterMm: bore, wallMm: wallMm(size, cls), pipeModulusGPa: material.modulusGPa });
  const surge = joukowskySurgeM({ waveSpeedMps: a, velocityChangeMps: closure });
  // REFERENCES §3: rate the ram body and drive pipe for the lift plus the surge.
  const peak = input.totalLiftM + surge;
  const rating = ratingHeadM(cls);
  const higherClass = peak > rating ? (material.classes.find((c) => c.ratingKPa > cls.ratingKPa && peakFor(c) <= ratingHeadM(c)) ?? null) : null;

  function peakFor(c: PressureClass): number {
    const b = boreMm(size, c);
    const v = CLOSURE_TO_MEAN_VELOCITY * pipeVelocityMps(input.driveLpm / 60, b);
    return input.totalLiftM + joukowskySurgeM({ waveSpeedMps: waveSpeedMps({ diameterMm: b, wallMm: wallMm(size, c), pipeModulusGPa: material.modulusGPa }), velocityChangeMps: v });
  }

  return {
    material, cls, size, boreMm: bore, wallMm: wallMm(size, cls), lengthM, lengthGiven: input.pipe.lengthM !== undefined,
    bandMinM: band.minM, bandMaxM: band.maxM, bandRuleLabel: band.rule.label, bandSourceId: band.rule.sourceId,
    lengthToDiameter: lengthM / (bore / 1000),
    velocityMps: velocity, closureVelocityMps: closure,
    minimumClosureVelocityMps: minimumDriveVelocityMps(input.totalLiftM, a),
    waveSpeedMps: a, surgeHeadM: surge, peakPressureHeadM: peak, ratingM: rating, higherClass,
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
}

export interface DeliveryDesignInput {
  pipe: { lengthM: number; diameterMm?: number | undefined; material: string; pressureClass?: string | undefined };
  fittingsAllowance: number;
  ram: RamSizeRow;
  staticLiftM: number;
  /** Delivery, L/min, for a given friction coefficient (so the size can be chosen at its own flow). */
  deliveryFor: (frictionK: number) => { deliveryLpm: number; frictionM: number };
}

/** Delivery pipe: as given, or the ram table's delivery size upsized until friction ≤ 10 % of the static lift. */
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
  if (input.pipe.diameterMm) {
    const bore = input.pipe.diameterMm;
    return { material, cls, size: sizeForBore(bore, cls), boreMm: bore, diameterGiven: true, frictionK: k(bore), ratingM: ratingHeadM(cls), classGiven: given };
  }
  const start = NOMINAL_SIZES.findIndex((s) => s.nominalIn >= input.ram.deliveryIn);
  const candidates = NOMINAL_SIZES.slice(Math.max(0, start)).filter((s) => s.nominalIn <= 4);
  let chosen = candidates[0] ?? (NOMINAL_SIZES[0] as NominalSize);
  for (const s of candidates) {
    chosen = s;
    if (input.deliveryFor(k(boreMm(s, cls))).frictionM <= DELIVERY_FRICTION_LIMIT * input.staticLiftM) break;
  }
  const bore = boreMm(chosen, cls);
  return { material, cls, size: chosen, boreMm: bore, diameterGiven: false, frictionK: k(bore), ratingM: ratingHeadM(cls), classGiven: given };
}
