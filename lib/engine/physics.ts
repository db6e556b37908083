// Physical constants and water properties used across the engine (SI).

/** Standard gravity, m/s² (CGPM 1901 conventional value). */
export const G = 9.80665;

/** Bulk modulus of water, Pa: 2.2 GPa at ~20 °C (from memory; 2.07–2.2 GPa quoted). */
export const WATER_BULK_MODULUS_PA = 2.2e9;

/** Density of water, kg/m³, nominal for heads and wave speed. */
export const WATER_DENSITY = 1000;

/** Water density vs temperature, kg/m³: Tanaka et al. (2001)-type fit (from memory); 999.1 at 15 °C. */
export function waterDensityKgM3(temperatureC: number): number {
  const t = temperatureC;
  return 1000 * (1 - ((t + 288.9414) / (508929.2 * (t + 68.12963))) * (t - 3.9863) ** 2);
}

/** Dynamic viscosity of water, Pa·s: Vogel equation A·10^(B/(T−C)) (from memory); 1.138e-3 at 15 °C. */
export function waterViscosityPaS(temperatureC: number): number {
  const kelvin = temperatureC + 273.15;
  return 2.414e-5 * 10 ** (247.8 / (kelvin - 140));
}
