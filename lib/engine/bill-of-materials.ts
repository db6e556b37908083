// Bill of materials from the screened design: pipes by length and size, ram, valves, intake and tank.
import { fmt } from './format';
import { NOMINAL_SIZES, type NominalSize } from './materials';
import type { DeliveryDesign, DriveDesign } from './pipe-design';
import type { BillOfMaterialsLine } from './screening-types';

export interface BomInput {
  drive: DriveDesign;
  delivery: DeliveryDesign;
  deliveryLengthM: number;
  ramDriveIn: number;
  ramMinLpm: number;
  ramMaxLpm: number;
  tankL: number;
  tankRuleLabel: string;
  standPipe: boolean;
}

function sizeLabel(nominalIn: number): string {
  return (NOMINAL_SIZES.find((s) => s.nominalIn === nominalIn) as NominalSize | undefined)?.label ?? `${nominalIn}″`;
}

/** Lines of the bill of materials; pipe lengths rounded up to whole metres. */
export function billOfMaterials(b: BomInput): BillOfMaterialsLine[] {
  const lines: BillOfMaterialsLine[] = [
    {
      item: 'Hydraulic ram',
      size: `for ${sizeLabel(b.ramDriveIn)} drive pipe`,
      quantity: 1,
      unit: 'each',
      note: `Drive flow ${fmt(b.ramMinLpm, 'L/min')}–${fmt(b.ramMaxLpm, 'L/min')} (Ogden 1911, Table XI)`,
    },
    {
      item: `Drive pipe, ${b.drive.material.label}, ${b.drive.cls.label}`,
      size: b.drive.size.label,
      quantity: Math.ceil(b.drive.lengthM),
      unit: 'm',
      note: 'Rigid, one diameter, long sweeps only, no elbows',
    },
    {
      item: `Delivery pipe, ${b.delivery.material.label}, ${b.delivery.cls.label}`,
      size: b.delivery.size.label,
      quantity: Math.ceil(b.deliveryLengthM),
      unit: 'm',
      note: 'Length as walked; fittings allowance is in the friction, not the order',
    },
    { item: 'Full-bore valve (gate or ball) on the drive pipe at the ram', size: b.drive.size.label, quantity: 1, unit: 'each', note: 'For stopping the ram' },
    { item: 'Valve on the delivery pipe at the ram', size: b.delivery.size.label, quantity: 1, unit: 'each', note: 'For starting against a closed delivery' },
    { item: 'Intake screen and settling drum or basin', size: '—', quantity: 1, unit: 'each', note: 'Keeps trash and sand out; keep the inlet well under water' },
    { item: 'Storage tank', size: fmt(b.tankL, 'L'), quantity: 1, unit: 'each', note: `Sized by the rule: ${b.tankRuleLabel}` },
  ];
  if (b.standPipe) {
    lines.push({ item: 'Open stand pipe or header tank on the drive line', size: b.drive.size.label, quantity: 1, unit: 'each', note: `About ${fmt(b.drive.bandMaxM, 'm')} up the drive pipe from the ram` });
  }
  return lines;
}
