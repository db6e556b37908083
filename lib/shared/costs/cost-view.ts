// The sheet's costs in words and money: the priced bill's columns and the ten-year comparison, in the organisation's currency.
import type { BillOfMaterialsLine } from '@/lib/engine/screening-types';
import { priceBill, type PipePrice, type PriceBasis } from './bill-prices';
import type { PriceList } from './price-list';
import { tenYearComparison } from './ten-year';

export interface SheetCosts {
  currency: string;
  /** Basis and price for each bill line, in the bill's order. */
  lines: { basis: string; price: string }[];
  extras: { item: string; basis: string; price: string }[];
  total: string;
  comparison: { option: string; capital: string; replacements: string; running: string; total: string }[] | null;
  assumptions: string[];
}

/** Money in the organisation's currency, whole units (Intl currency formatting). */
export function moneyFormatter(currency: string, locale = 'en-GB'): (x: number) => string {
  const f = new Intl.NumberFormat(locale, { style: 'currency', currency, maximumFractionDigits: 0, minimumFractionDigits: 0 });
  return (x: number) => f.format(Math.round(x));
}

/** Unit prices keep their pence: "£0.35" a mm per metre. */
function unitFormatter(currency: string, locale: string): (x: number) => string {
  const f = new Intl.NumberFormat(locale, { style: 'currency', currency, maximumFractionDigits: 2 });
  return (x: number) => f.format(x);
}

/** A price per metre as the reader measures pipe: a metre, or a foot (0.3048 m) for US readers. */
function perLength(perM: number, unit: (x: number) => string, us: boolean): string {
  return us ? `${unit(perM * 0.3048)} a foot` : `${unit(perM)} a metre`;
}

function basisWords(b: PriceBasis, unit: (x: number) => string, us: boolean): string {
  switch (b.kind) {
    case 'pipe-list':
      return `${perLength(b.perM, unit, us)} (your pipe prices, ${Math.round(b.diameterMm)} mm)`;
    case 'pipe-estimate':
      return `${perLength(b.perM, unit, us)} (estimate from the bore, ${b.steel ? 'steel' : 'plastic'})`;
    case 'ram':
      return `${unit(b.perInch)} per inch of drive pipe × ${b.driveIn}″`;
    case 'tank':
      return `${unit(b.perL)} a litre`;
    case 'each':
      return `${unit(b.each)} each`;
    case 'with-ram':
      return 'Comes with a bought ram';
    default:
      return 'Not on the price list';
  }
}

const OPTION_WORDS = { ram: 'Ram (this design)', solar: 'Small solar pump with panels', petrol: 'Petrol pump' } as const;

/**
 * Prices the bill and compares ten years of the three ways to lift the same water (the farm's daily need, over the
 * ram's total lift). No comparison for a gravity supply or without a need or a lift.
 */
export function sheetCosts(
  bill: readonly BillOfMaterialsLine[],
  list: PriceList,
  pipes: readonly PipePrice[],
  water: { dailyL: number | null; liftM: number | null; pumped: boolean },
  locale = 'en-GB',
): SheetCosts {
  const money = moneyFormatter(list.currency, locale);
  const unit = unitFormatter(list.currency, locale);
  const priced = priceBill(bill, list, pipes);
  const lines = priced.lines.map((p) => ({
    basis: basisWords(p.basis, unit, locale === 'en-US'),
    price: p.basis.kind === 'not-priced' ? '—' : money(p.total),
  }));
  const extras = [
    { item: 'Fittings (elbows, tees, sockets, clips)', basis: `${Math.round(list.fittingsShare * 100)} % of the pipe`, price: money(priced.fittings) },
    { item: 'Labour', basis: `${priced.labour.days.toFixed(1)} days at ${unit(list.labourDayRate)} a day`, price: money(priced.labour.cost) },
  ];
  const canCompare = water.pumped && water.dailyL !== null && water.dailyL > 0 && water.liftM !== null && water.liftM > 0;
  const cmp = canCompare ? tenYearComparison(priced, list, water.dailyL as number, water.liftM as number) : null;
  const assumptions = [
    'Prices are the organisation\u2019s list; items not on it are estimates (common practice, no source). Ask a supplier before you buy.',
    ...(cmp
      ? [
          `Ten years, not discounted. The same water for all three: ${Math.round(water.dailyL as number).toLocaleString('en-GB')} L a day lifted ${Math.round(water.liftM as number)} m.`,
          `Every option needs the delivery pipe, tank and intake (${money(priced.sharedTotal)} with fittings and laying); a pump takes ${list.labourDaysPerPump} day${list.labourDaysPerPump === 1 ? '' : 's'} to set up.`,
          `Ram: lasts ${list.ramLifeYears} years, upkeep ${unit(list.ramMaintenancePerYear)} a year; it needs no fuel or power.`,
          `Solar: ${Math.ceil(cmp.panelW)} W of panels at ${unit(list.solarPanelPerW)} a watt (${list.solarSunHours} full-sun hours a day, ${Math.round(list.solarWireToWater * 100)} % panel to water), pump ${unit(list.solarPumpCapital)} lasting ${list.solarLifeYears} years, upkeep ${unit(list.solarMaintenancePerYear)} a year; panels outlast the ten years.`,
          `Petrol: pump ${unit(list.fuelPumpCapital)} lasting ${list.fuelPumpLifeYears} years, delivering ${list.fuelPumpLpm} L a minute, so ${cmp.petrolHoursPerDay.toFixed(1)} hours a day burning ${list.fuelLitresPerHour} L an hour: ${Math.round(cmp.petrolLitresPerYear)} L a year at ${unit(list.fuelPricePerL)} a litre, upkeep ${unit(list.fuelMaintenancePerYear)} a year.`,
        ]
      : []),
  ];
  return {
    currency: list.currency,
    lines,
    extras,
    total: money(priced.total),
    comparison: cmp
      ? cmp.options.map((o) => ({
          option: OPTION_WORDS[o.option],
          capital: money(o.capital),
          replacements: money(o.replacements),
          running: money(o.running),
          total: money(o.total),
        }))
      : null,
    assumptions,
  };
}
