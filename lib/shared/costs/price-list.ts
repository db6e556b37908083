// The organisation's price list for costing a sheet: one currency, prices of the parts, labour, and the figures for
// the ten-year comparison with a solar and a petrol pump. Every default is invented (common practice, no source).
import * as z from '@/lib/shared/zod';

const number = (what: string, min: number, max: number) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'))) : v),
    z
      .number({ message: `${what} must be a number.` })
      .min(min, `${what}: at least ${min}.`)
      .max(max, `${what}: at most ${max.toLocaleString('en-US')}.`),
  );
const money = (what: string) => number(what, 0, 10_000_000);

/** ISO 4217 codes the runtime formats (Intl accepts any three letters, so the list is asked; kept when it cannot be). */
function knownCurrency(code: string): boolean {
  const supported = (Intl as { supportedValuesOf?: (key: 'currency') => string[] }).supportedValuesOf;
  return supported ? supported('currency').includes(code) : true;
}

export const priceListSchema = z.object({
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, 'Give a three-letter currency code such as GBP, EUR, USD or KES.')
    .refine(knownCurrency, 'Not a currency code this app knows.'),
  ramPerInch: money('Ram price per inch of drive pipe'),
  steelPipePerMmM: money('Steel pipe price per mm of bore per metre'),
  plasticPipePerMmM: money('Plastic pipe price per mm of bore per metre'),
  fittingsShare: number('Fittings as a share of the pipe cost', 0, 1),
  valve: money('Valve price'),
  gauge: money('Pressure gauge price'),
  unions: money('Pair of unions price'),
  base: money('Concrete base and anchor price'),
  intake: money('Intake screen and drum price'),
  tankPerL: money('Tank price per litre'),
  reliefValve: money('Relief valve price'),
  standPipe: money('Stand pipe price'),
  labourDayRate: money('Labour per day'),
  labourDaysPerPump: number('Days to set up a ram or pump', 0, 100),
  pipeMetresPerDay: number('Metres of pipe laid per day', 1, 10_000),
  ramMaintenancePerYear: money('Ram upkeep per year'),
  ramLifeYears: number('Life of a ram, years', 1, 100),
  solarPumpCapital: money('Solar pump and controller price'),
  solarPanelPerW: money('Solar panel price per watt'),
  solarSunHours: number('Full-sun hours a day', 0.5, 12),
  solarWireToWater: number('Solar pump efficiency, panel to water', 0.05, 0.9),
  solarLifeYears: number('Life of a solar pump, years', 1, 50),
  solarMaintenancePerYear: money('Solar pump upkeep per year'),
  fuelPumpCapital: money('Petrol pump price'),
  fuelPumpLifeYears: number('Life of a petrol pump, years', 1, 50),
  fuelPricePerL: money('Petrol price per litre'),
  fuelLitresPerHour: number('Petrol burnt per hour', 0.01, 50),
  fuelPumpLpm: number('Petrol pump delivery at the lift, L/min', 1, 10_000),
  fuelMaintenancePerYear: money('Petrol pump upkeep per year'),
});
export type PriceList = z.output<typeof priceListSchema>;
export type PriceListInput = z.input<typeof priceListSchema>;

/** Invented prices in pounds sterling for a new organisation (common practice, no source): change them in the settings. */
export const DEFAULT_PRICE_LIST: PriceList = {
  currency: 'GBP',
  ramPerInch: 300,
  steelPipePerMmM: 0.35,
  plasticPipePerMmM: 0.06,
  fittingsShare: 0.1,
  valve: 35,
  gauge: 30,
  unions: 20,
  base: 90,
  intake: 60,
  tankPerL: 0.2,
  reliefValve: 55,
  standPipe: 80,
  labourDayRate: 160,
  labourDaysPerPump: 1,
  pipeMetresPerDay: 150,
  ramMaintenancePerYear: 30,
  ramLifeYears: 25,
  solarPumpCapital: 700,
  solarPanelPerW: 0.9,
  solarSunHours: 3,
  solarWireToWater: 0.35,
  solarLifeYears: 8,
  solarMaintenancePerYear: 40,
  fuelPumpCapital: 300,
  fuelPumpLifeYears: 5,
  fuelPricePerL: 1.45,
  fuelLitresPerHour: 0.6,
  fuelPumpLpm: 60,
  fuelMaintenancePerYear: 80,
};

/** The stored list over the defaults (a field never saved takes its default). */
export function priceListOf(stored: Partial<PriceList> | null | undefined): PriceList {
  return { ...DEFAULT_PRICE_LIST, ...(stored ?? {}) };
}
