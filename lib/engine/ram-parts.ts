// The ram's own parts, sized from the chosen ram and its operating point, each with its basis.
import { amount, say, type Message } from '@/lib/shared/display/message';
import { G, WATER_DENSITY } from './physics';

/** Beats per minute assumed for sizing per-beat volumes: the middle of the 40–90 quoted (CAT tipsheet; NITK notes give 40–120). */
export const ASSUMED_BEATS_PER_MINUTE = 60;
/** Air vessel at least this many times the water delivered per beat (from memory: 20–50 × quoted). */
export const AIR_VESSEL_BEATS = 20;

// Air vessels of home-made rams (Clemson, Smith): 1¼″ ram 4″ × 24″ chamber ≈ 5.0 L; 3″ ram 6″ × 24″ ≈ 11 L (found).
const CLEMSON_AIR_VESSELS: readonly (readonly [driveIn: number, litres: number])[] = [
  [1.25, 5.0],
  [3, 11.1],
];

/** Air vessel volume, L: the Clemson home-made sizes by drive size (linear between, by drive area beyond 3″), never under 20 beats' delivery. */
export function airVesselL(driveIn: number, deliveryLpm: number, beatsPerMinute = ASSUMED_BEATS_PER_MINUTE): number {
  const [[d0, v0], [d1, v1]] = CLEMSON_AIR_VESSELS as [[number, number], [number, number]];
  const byTable = driveIn <= d1 ? v0 + ((driveIn - d0) / (d1 - d0)) * (v1 - v0) : v1 * (driveIn / d1) ** 2;
  const byBeats = AIR_VESSEL_BEATS * (deliveryLpm / beatsPerMinute);
  return Math.max(byTable, byBeats);
}

/** Force, N, the surge pushes along the drive pipe at the ram when the delivery is blocked: ρ·g·H·A (hydrostatics). */
export function surgeThrustN(blockedHeadM: number, boreMm: number): number {
  const area = (Math.PI * (boreMm / 1000) ** 2) / 4;
  return WATER_DENSITY * G * blockedHeadM * area;
}

export interface RamPartsInput {
  driveIn: number;
  driveBoreMm: number;
  deliveryBoreMm: number;
  deliveryLpm: number;
  blockedDeliveryHeadM: number;
}

export interface RamPart {
  item: string;
  size: Message | string;
  note: Message | string;
  priceKey: 'with-ram' | 'unions' | 'base';
}

/** The ram's parts for one ram: waste valve, delivery valve, air vessel, snifter, unions, base and anchoring. */
export function ramParts(p: RamPartsInput): RamPart[] {
  const vessel = airVesselL(p.driveIn, p.deliveryLpm);
  const thrustKn = surgeThrustN(p.blockedDeliveryHeadM, p.driveBoreMm) / 1000;
  const mm = (x: number) => amount('diameter', x);
  return [
    {
      item: 'Waste valve',
      size: say`port at least ${mm(p.driveBoreMm)}`,
      note: say`Opening no smaller than the drive pipe\u2019s bore, stroke adjustable (about ${amount('diameter', 10)}–${amount('diameter', 25)}) with a lock nut, weights to tune the beat (common practice, no source)`,
      priceKey: 'with-ram',
    },
    {
      item: 'Delivery (check) valve into the air vessel',
      size: say`port at least ${mm(p.deliveryBoreMm)}`,
      note: 'A rubber flap or ball seat, replaceable (common practice, no source)',
      priceKey: 'with-ram',
    },
    {
      item: 'Air vessel',
      size: say`${amount('volume', Math.ceil(vessel))} or more`,
      note: say`Home-made sizes ${amount('volume', 5)} for 1¼″, ${amount('volume', 11)} for 3″ (Clemson, Smith), and at least ${AIR_VESSEL_BEATS} beats\u2019 delivery at ${ASSUMED_BEATS_PER_MINUTE} beats a minute (from memory)`,
      priceKey: 'with-ram',
    },
    {
      item: 'Snifter valve (air inlet just below the delivery valve)',
      size: say`about ${amount('diameter', 1)} hole`,
      note: 'Keeps the air vessel charged; clear it if the ram knocks hard (NITK notes; hole size from memory)',
      priceKey: 'with-ram',
    },
    {
      item: 'Unions on the drive and delivery pipes at the ram',
      size: say`${mm(p.driveBoreMm)} and ${mm(p.deliveryBoreMm)}`,
      note: 'So the ram lifts out for service',
      priceKey: 'unions',
    },
    {
      item: 'Concrete base and anchor for the ram and the lower drive pipe',
      size: `for ${thrustKn.toFixed(1)} kN`,
      note: 'Each beat and any blocked delivery push the ram along the pipe: fall plus surge on the bore\u2019s area (ρ·g·H·A)',
      priceKey: 'base',
    },
  ];
}
