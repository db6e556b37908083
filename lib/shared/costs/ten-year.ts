// Ten years of owning a ram against a small solar pump with panels and a petrol pump, from the organisation's figures.
import { G } from '@/lib/engine/physics';
import type { PricedBill } from './bill-prices';
import type { PriceList } from './price-list';

export const YEARS = 10;

export interface OptionCost {
  option: 'ram' | 'solar' | 'petrol';
  /** Bought at the start: the option's own equipment plus what every option needs (delivery pipe, tank, intake, laying). */
  capital: number;
  /** Equipment bought again within the ten years, when its life is shorter. */
  replacements: number;
  /** Upkeep and fuel over the ten years. */
  running: number;
  total: number;
}

export interface TenYearComparison {
  years: number;
  options: OptionCost[];
  /** Panel size the solar pump needs for the daily water, W. */
  panelW: number;
  /** Hours a day the petrol pump runs, and petrol a year, L. */
  petrolHoursPerDay: number;
  petrolLitresPerYear: number;
}

/** Purchases after the first within the period: a 5-year life over 10 years buys once more. */
export function repurchases(lifeYears: number, years = YEARS): number {
  return Math.max(0, Math.ceil(years / lifeYears) - 1);
}

/**
 * Totals over ten years, not discounted. The water is the same for all three: `dailyL` lifted `liftM` (total lift).
 * Solar panel W = daily lifting energy ρ·g·h·V / (full-sun hours × panel-to-water efficiency). Petrol hours = daily
 * water / pump delivery; petrol = hours × litres an hour × 365. Ram equipment is the bill less its shared part.
 */
export function tenYearComparison(bill: PricedBill, list: PriceList, dailyL: number, liftM: number): TenYearComparison {
  const ramOwn = bill.total - bill.sharedTotal;
  const pumpSetUp = list.labourDaysPerPump * list.labourDayRate;
  const dailyWh = (G * liftM * dailyL) / 3600;
  const panelW = dailyWh / (list.solarSunHours * list.solarWireToWater);
  const petrolHoursPerDay = dailyL / list.fuelPumpLpm / 60;
  const petrolLitresPerYear = petrolHoursPerDay * list.fuelLitresPerHour * 365;
  const option = (o: OptionCost['option'], capital: number, replacements: number, running: number): OptionCost => ({
    option: o,
    capital,
    replacements,
    running,
    total: capital + replacements + running,
  });
  return {
    years: YEARS,
    panelW,
    petrolHoursPerDay,
    petrolLitresPerYear,
    options: [
      option('ram', bill.total, repurchases(list.ramLifeYears) * ramOwn, YEARS * list.ramMaintenancePerYear),
      option(
        'solar',
        bill.sharedTotal + pumpSetUp + list.solarPumpCapital + panelW * list.solarPanelPerW,
        repurchases(list.solarLifeYears) * list.solarPumpCapital,
        YEARS * list.solarMaintenancePerYear,
      ),
      option(
        'petrol',
        bill.sharedTotal + pumpSetUp + list.fuelPumpCapital,
        repurchases(list.fuelPumpLifeYears) * list.fuelPumpCapital,
        YEARS * (list.fuelMaintenancePerYear + petrolLitresPerYear * list.fuelPricePerL),
      ),
    ],
  };
}
