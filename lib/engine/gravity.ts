// Gravity supply: when the tank sits below the intake a pipe fills it; size the pipe for the need.
import { hazenWilliamsCoefficient } from './pipes';
import {
  boreMm,
  materialOrThrow,
  NOMINAL_SIZES,
  pressureClassOrThrow,
  sizeForBore,
  type NominalSize,
  type PipeMaterial,
  type PressureClass,
} from './materials';

/** Friction may take at most this share of the difference in level, leaving the rest as a reserve (common practice, no source). */
export const GRAVITY_FRICTION_SHARE = 0.9;

export interface GravityDesign {
  material: PipeMaterial;
  cls: PressureClass;
  /** Null when no size carries the need within the head. */
  size: NominalSize | null;
  boreMm: number | null;
  lengthM: number;
  headM: number;
  /** Most the chosen pipe carries with the whole head, L/day. */
  capacityLpd: number | null;
  /** Capacity of a recorded pipe that is too small, L/day (the design then uses the recommended size). */
  givenShortLpd: number | null;
}

export interface GravityInput {
  headM: number;
  lengthM: number;
  needLpd: number;
  fittingsAllowance: number;
  pipe: { material: string; pressureClass?: string | undefined; diameterMm?: number | undefined };
}

/** The smallest size whose Hazen–Williams friction at the need stays within the reserve of the head (EPANET 2 manual, Table 3.1). */
export function designGravityPipe(input: GravityInput): GravityDesign {
  const material = materialOrThrow(input.pipe.material, 'deliveryPipe.material');
  const cls = pressureClassOrThrow(material, input.pipe.pressureClass, 'deliveryPipe.pressureClass');
  const effective = input.lengthM * (1 + input.fittingsAllowance);
  const q = input.needLpd / 1440 / 60000;
  const capacity = (bore: number) => (input.headM / hazenWilliamsCoefficient(effective, bore, material.hazenC)) ** (1 / 1.852) * 60000 * 1440;
  const fits = (bore: number) => hazenWilliamsCoefficient(effective, bore, material.hazenC) * q ** 1.852 <= GRAVITY_FRICTION_SHARE * input.headM;
  const size = NOMINAL_SIZES.find((s) => fits(boreMm(s, cls))) ?? null;
  const recommended = { size, boreMm: size ? boreMm(size, cls) : null };
  const given = input.pipe.diameterMm;
  if (given && fits(given)) {
    return {
      material,
      cls,
      size: sizeForBore(given, cls),
      boreMm: given,
      lengthM: input.lengthM,
      headM: input.headM,
      capacityLpd: capacity(given),
      givenShortLpd: null,
    };
  }
  return {
    material,
    cls,
    size: recommended.size,
    boreMm: recommended.boreMm,
    lengthM: input.lengthM,
    headM: input.headM,
    capacityLpd: recommended.boreMm ? capacity(recommended.boreMm) : null,
    givenShortLpd: given ? capacity(given) : null,
  };
}
