// The bill of materials priced from the organisation's price list, line by line, with the basis of each price.
import type { BillOfMaterialsLine } from '@/lib/engine/screening-types';
import type { PriceList } from './price-list';

export interface PipePrice {
  material: string;
  diameterMm: number;
  pricePerM: number;
  currency: string;
}

export type PriceBasis =
  | { kind: 'pipe-list'; perM: number; diameterMm: number }
  | { kind: 'pipe-estimate'; perM: number; perMmM: number; boreMm: number; steel: boolean }
  | { kind: 'ram'; perInch: number; driveIn: number }
  | { kind: 'tank'; perL: number; litres: number }
  | { kind: 'each'; each: number }
  | { kind: 'with-ram' }
  | { kind: 'not-priced' };

export interface PricedLine {
  line: BillOfMaterialsLine;
  unitPrice: number | null;
  total: number;
  basis: PriceBasis;
}

export interface PricedBill {
  currency: string;
  lines: PricedLine[];
  /** Fittings (elbows, tees, sockets, clips) as a share of the pipe cost. */
  fittings: number;
  labour: { days: number; cost: number };
  total: number;
  /** The part of the total a pump would need too (delivery pipe and valve, intake, tank, their fittings and laying). */
  sharedTotal: number;
}

const isSteel = (material: string) => /steel|iron|galv/i.test(material);

/** A pipe price row for this material and bore in the list's currency: same material word, bore within 10 %. */
function listedPipePrice(prices: readonly PipePrice[], currency: string, material: string, boreMm: number): PipePrice | null {
  const word = material.toLowerCase().split(/[\s-]/)[0] ?? '';
  const matches = prices.filter(
    (p) =>
      p.currency.trim().toUpperCase() === currency &&
      (p.material.toLowerCase().includes(word) || word.includes(p.material.toLowerCase().split(/[\s-]/)[0] ?? '\u0000')) &&
      Math.abs(p.diameterMm - boreMm) <= 0.1 * boreMm,
  );
  matches.sort((a, b) => Math.abs(a.diameterMm - boreMm) - Math.abs(b.diameterMm - boreMm));
  return matches[0] ?? null;
}

function priceLine(line: BillOfMaterialsLine, list: PriceList, pipes: readonly PipePrice[]): PricedLine {
  const each = (price: number): PricedLine => ({ line, unitPrice: price, total: price * line.quantity, basis: { kind: 'each', each: price } });
  switch (line.priceKey) {
    case 'pipe': {
      if (!line.pipe) break;
      const listed = listedPipePrice(pipes, list.currency, line.pipe.material, line.pipe.boreMm);
      if (listed)
        return {
          line,
          unitPrice: listed.pricePerM,
          total: listed.pricePerM * line.quantity,
          basis: { kind: 'pipe-list', perM: listed.pricePerM, diameterMm: listed.diameterMm },
        };
      const steel = isSteel(line.pipe.material);
      const perMmM = steel ? list.steelPipePerMmM : list.plasticPipePerMmM;
      const perM = perMmM * line.pipe.boreMm;
      return { line, unitPrice: perM, total: perM * line.quantity, basis: { kind: 'pipe-estimate', perM, perMmM, boreMm: line.pipe.boreMm, steel } };
    }
    case 'ram': {
      const unit = list.ramPerInch * (line.driveIn ?? 0);
      return { line, unitPrice: unit, total: unit * line.quantity, basis: { kind: 'ram', perInch: list.ramPerInch, driveIn: line.driveIn ?? 0 } };
    }
    case 'tank': {
      const unit = list.tankPerL * (line.litres ?? 0);
      return { line, unitPrice: unit, total: unit * line.quantity, basis: { kind: 'tank', perL: list.tankPerL, litres: line.litres ?? 0 } };
    }
    case 'with-ram':
      return { line, unitPrice: 0, total: 0, basis: { kind: 'with-ram' } };
    case 'valve':
      return each(list.valve);
    case 'gauge':
      return each(list.gauge);
    case 'unions':
      return each(list.unions);
    case 'base':
      return each(list.base);
    case 'intake':
      return each(list.intake);
    case 'relief-valve':
      return each(list.reliefValve);
    case 'stand-pipe':
      return each(list.standPipe);
    default:
      break;
  }
  return { line, unitPrice: null, total: 0, basis: { kind: 'not-priced' } };
}

/**
 * Prices every line; adds fittings (a share of the pipe cost) and labour: days to set up each ram plus the pipe laid
 * at the list's metres a day, at the day rate. Rams counted from the 'ram' line.
 */
export function priceBill(lines: readonly BillOfMaterialsLine[], list: PriceList, pipes: readonly PipePrice[] = []): PricedBill {
  const priced = lines.map((l) => priceLine(l, list, pipes));
  const pipeLines = priced.filter((p) => p.line.priceKey === 'pipe');
  const pipeCost = pipeLines.reduce((s, p) => s + p.total, 0);
  const sharedPipeCost = pipeLines.filter((p) => p.line.shared).reduce((s, p) => s + p.total, 0);
  const pipeMetres = pipeLines.reduce((s, p) => s + p.line.quantity, 0);
  const sharedMetres = pipeLines.filter((p) => p.line.shared).reduce((s, p) => s + p.line.quantity, 0);
  const rams = priced.find((p) => p.line.priceKey === 'ram')?.line.quantity ?? 0;
  const days = rams * list.labourDaysPerPump + pipeMetres / list.pipeMetresPerDay;
  const labour = { days, cost: days * list.labourDayRate };
  const fittings = pipeCost * list.fittingsShare;
  const total = priced.reduce((s, p) => s + p.total, 0) + fittings + labour.cost;
  const sharedLines = priced.filter((p) => p.line.shared).reduce((s, p) => s + p.total, 0);
  const sharedTotal = sharedLines + sharedPipeCost * list.fittingsShare + (sharedMetres / list.pipeMetresPerDay) * list.labourDayRate;
  return { currency: list.currency, lines: priced, fittings, labour, total, sharedTotal };
}
