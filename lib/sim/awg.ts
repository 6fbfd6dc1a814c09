/**
 * American Wire Gauge: solid-conductor diameters by the defining formula of ASTM B258
 * (36 AWG = 0.005 in, 0000 AWG = 0.46 in, geometric steps in between) and DC resistance
 * from the resistivity of annealed copper (International Annealed Copper Standard,
 * 1.7241e-8 Ω·m at 20 °C).
 */
export const ANNEALED_COPPER_RESISTIVITY = 1.7241e-8;

const INCH = 0.0254;

/** Diameter in metres of a solid conductor of the given gauge (ASTM B258). */
export function awgDiameter(gauge: number): number {
  return 0.005 * INCH * 92 ** ((36 - gauge) / 39);
}

/** DC resistance per metre (Ω/m) of one solid annealed-copper conductor at 20 °C. */
export function awgResistancePerMetre(gauge: number): number {
  const diameter = awgDiameter(gauge);
  return ANNEALED_COPPER_RESISTIVITY / ((Math.PI * diameter * diameter) / 4);
}
