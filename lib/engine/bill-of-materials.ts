// Bill of materials from the screened design: rams, pipes by length and size, valves, intake and tank.
import { amount, renderMessage, say, type Message } from '@/lib/shared/display/message';
import { NOMINAL_SIZES, type NominalSize } from './materials';
import type { DeliveryDesign, DriveDesign } from './pipe-design';
import type { FeedDesign } from './ram-plan';
import { ramParts } from './ram-parts';
import type { BillOfMaterialsLine } from './screening-types';

export interface BomInput {
  drive: DriveDesign;
  delivery: DeliveryDesign;
  deliveryLengthM: number;
  ramDriveIn: number;
  ramCount: number;
  ramMinLpm: number;
  ramMaxLpm: number;
  tankL: number;
  tankRuleLabel: string;
  standPipe: boolean;
  /** The pressures call for a relief valve at the ram. */
  reliefValve: boolean;
  /** A feed pipe to an open stand pipe at the head of the drive pipe. */
  feed?: FeedDesign | null;
  /** One ram's delivery, L/min (sizes the air vessel). */
  deliveryLpm: number;
}

export interface GravityBomInput {
  pipe: { material: string; classLabel: string; sizeLabel: string; materialId: string; boreMm: number };
  lengthM: number;
  tankL: number;
  tankRuleLabel: string;
}

// Common dial gauge ranges, bar (trade catalogues; common practice, no source).
const GAUGE_RANGES_BAR = [4, 6, 10, 16, 25, 40, 60, 100];

/** The smallest common gauge range that reads the head with half again to spare. */
function gaugeRangeBar(headM: number): number {
  const bar = (headM * 1.5 * 9.80665) / 100;
  return GAUGE_RANGES_BAR.find((r) => r >= bar) ?? (GAUGE_RANGES_BAR[GAUGE_RANGES_BAR.length - 1] as number);
}

/** A gauge range as sold (most dials carry bar and psi scales side by side). */
function gaugeLabel(bar: number): string {
  return `0–${bar} bar`;
}

function sizeLabel(nominalIn: number): string {
  return (NOMINAL_SIZES.find((s) => s.nominalIn === nominalIn) as NominalSize | undefined)?.label ?? `${nominalIn}″`;
}

/** A line as written here: its size and note may carry figures. */
type Line = Omit<BillOfMaterialsLine, 'size' | 'note' | 'sizeMessage' | 'noteMessage'> & { size: Message | string; note: Message | string };

/** The line with metric text, and its messages for each reader's units. */
function finished(line: Line): BillOfMaterialsLine {
  const { size, note, ...rest } = line;
  const out: BillOfMaterialsLine = {
    ...rest,
    size: typeof size === 'string' ? size : renderMessage(size, 'metric'),
    note: typeof note === 'string' ? note : renderMessage(note, 'metric'),
  };
  if (typeof size !== 'string') out.sizeMessage = size;
  if (typeof note !== 'string') out.noteMessage = note;
  return out;
}

function commonLines(tankL: number, tankRuleLabel: string): Line[] {
  return [
    {
      item: 'Intake screen and settling drum or basin',
      size: '—',
      quantity: 1,
      unit: 'each',
      note: 'Keeps trash, sand and fish out; keep the inlet well under water',
      priceKey: 'intake',
      shared: true,
    },
    {
      item: 'Storage tank with a lid and an overflow',
      size: say`${amount('volume', tankL)}`,
      quantity: 1,
      unit: 'each',
      note: `Sized by the rule: ${tankRuleLabel}`,
      priceKey: 'tank',
      litres: tankL,
      shared: true,
    },
  ];
}

/** Lines of the bill of materials for rams; pipe lengths rounded up to whole metres, one drive pipe per ram. */
export function billOfMaterials(b: BomInput): BillOfMaterialsLine[] {
  const n = b.ramCount;
  const lines: Line[] = [
    {
      item: 'Hydraulic ram',
      size: `for ${sizeLabel(b.ramDriveIn)} drive pipe`,
      quantity: n,
      unit: 'each',
      note: say`Drive flow ${amount('flowLpm', b.ramMinLpm)}–${amount('flowLpm', b.ramMaxLpm)} (Ogden 1911, Table XI); body rated for at least ${amount('length', b.drive.blockedDeliveryHeadM)} of head`,
      priceKey: 'ram',
      driveIn: b.ramDriveIn,
    },
    {
      item: `Drive pipe, ${b.drive.material.label}, ${b.drive.cls.label}`,
      size: b.drive.size.label,
      quantity: n * Math.ceil(b.drive.lengthM),
      unit: 'm',
      note:
        n > 1
          ? say`${amount('pipeLength', b.drive.lengthM)} for each ram; rigid, one diameter, long sweeps only`
          : 'Rigid, one diameter, long sweeps only, no elbows',
      priceKey: 'pipe',
      pipe: { material: b.drive.material.id, boreMm: b.drive.boreMm },
    },
    {
      item: `Delivery pipe, ${b.delivery.material.label}, ${b.delivery.cls.label}`,
      size: b.delivery.size.label,
      quantity: Math.ceil(b.deliveryLengthM),
      unit: 'm',
      note: n > 1 ? 'One pipe shared by the rams; length as walked' : 'Length as walked; fittings allowance is in the friction, not the order',
      priceKey: 'pipe',
      pipe: { material: b.delivery.material.id, boreMm: b.delivery.boreMm },
      shared: true,
    },
    {
      item: 'Full-bore valve (gate or ball) on the drive pipe at the ram',
      size: b.drive.size.label,
      quantity: n,
      unit: 'each',
      note: 'For stopping the ram',
      priceKey: 'valve',
    },
    n > 1
      ? {
          item: 'Non-return valve and isolating valve on the delivery at each ram',
          size: b.delivery.size.label,
          quantity: n,
          unit: 'each',
          note: 'So one ram can be stopped while the others run',
          priceKey: 'valve',
        }
      : {
          item: 'Valve on the delivery pipe at the ram',
          size: b.delivery.size.label,
          quantity: 1,
          unit: 'each',
          note: 'For stopping the delivery while the ram is serviced; never shut while the ram runs without a relief valve',
          priceKey: 'valve',
          shared: true,
        },
    {
      item: 'Pressure gauge on the ram',
      size: gaugeLabel(gaugeRangeBar(b.drive.blockedDeliveryHeadM)),
      quantity: n,
      unit: 'each',
      note: 'For setting up and commissioning; its range covers the blocked-delivery pressure with a margin',
      priceKey: 'gauge',
    },
    ...ramParts({
      driveIn: b.ramDriveIn,
      driveBoreMm: b.drive.boreMm,
      deliveryBoreMm: b.delivery.boreMm,
      deliveryLpm: b.deliveryLpm,
      blockedDeliveryHeadM: b.drive.blockedDeliveryHeadM,
    }).map((part) => ({ item: part.item, size: part.size, quantity: n, unit: 'each', note: part.note, priceKey: part.priceKey })),
    ...commonLines(b.tankL, b.tankRuleLabel),
  ];
  if (b.reliefValve) {
    lines.push({
      item: 'Pressure-relief valve at the ram',
      size: b.delivery.size.label,
      quantity: n,
      unit: 'each',
      note: say`Set below ${amount('length', b.drive.allowedHeadM)} of head (the drive pipe's usable rating)`,
      priceKey: 'relief-valve',
    });
  }
  if (b.feed) {
    lines.push(
      {
        item: `Feed pipe, ${b.feed.materialLabel}, ${b.feed.classLabel}`,
        size: b.feed.size.label,
        quantity: Math.ceil(b.feed.lengthM),
        unit: 'm',
        note: 'Intake to the stand pipe, one size up from the drive pipe; no surge reaches it',
        priceKey: 'pipe',
        pipe: { material: b.feed.materialLabel, boreMm: b.feed.boreMm },
      },
      {
        item: 'Open stand pipe at the head of the drive pipe',
        size: b.feed.size.label,
        quantity: 1,
        unit: 'each',
        note: 'Its top above the intake\u2019s water level, with a screened overflow back to the stream',
        priceKey: 'stand-pipe',
      },
    );
  }
  if (b.standPipe) {
    lines.push({
      item: 'Open stand pipe or header tank on the drive line',
      size: b.drive.size.label,
      quantity: n,
      unit: 'each',
      note: say`About ${amount('length', Math.min(b.drive.bandMaxM, b.drive.lengthM))} up the drive pipe from the ram`,
      priceKey: 'stand-pipe',
    });
  }
  return lines.map(finished);
}

/** Lines of the bill of materials for a gravity supply. */
export function gravityBillOfMaterials(b: GravityBomInput): BillOfMaterialsLine[] {
  const lines: Line[] = [
    {
      item: `Supply pipe, ${b.pipe.material}, ${b.pipe.classLabel}`,
      size: b.pipe.sizeLabel,
      quantity: Math.ceil(b.lengthM),
      unit: 'm',
      note: 'From the intake down to the tank; air valves at high points',
      priceKey: 'pipe',
      pipe: { material: b.pipe.materialId, boreMm: b.pipe.boreMm },
    },
    {
      item: 'Isolating valve at the intake and at the tank',
      size: b.pipe.sizeLabel,
      quantity: 2,
      unit: 'each',
      note: 'For flushing and repairs',
      priceKey: 'valve',
    },
    ...commonLines(b.tankL, b.tankRuleLabel),
  ];
  return lines.map(finished);
}
