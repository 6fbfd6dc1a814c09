/**
 * Per-metre line constants computed from conductor geometry, written independently of lib/sim:
 * - two round conductors of radii a1, a2 at centre spacing D (standard transmission-line textbook
 *   formulas, e.g. the two-wire line in any electromagnetics text; for a1 = a2 they reduce to
 *   C' = π·ε/acosh(D/d), L' = (μ0/π)·acosh(D/d), the forms quoted in docs/simulator.md):
 *   C' = 2π·ε0·εeff / acosh((D² − a1² − a2²) / (2·a1·a2)),  L' = (μ0/2π)·acosh(…);
 * - coax: C' = 2π·ε0·εr / ln(D/d), L' = (μ0/2π)·ln(D/d);
 * - solid copper wire: AWG diameter d(n) = 0.127 mm · 92^((36 − n)/39) (ASTM B258), annealed copper
 *   resistivity 1.7241e-8 Ω·m at 20 °C (IEC 60028).
 */
export const VACUUM_PERMITTIVITY = 8.8541878128e-12;
export const VACUUM_PERMEABILITY = 4 * Math.PI * 1e-7;
export const ANNEALED_COPPER_RESISTIVITY = 1.7241e-8;

export type CableKind = "lone-lead" | "beside-ground" | "twisted-pair" | "coax-75";
export const REFERENCE_CABLE_KINDS: CableKind[] = ["lone-lead", "beside-ground", "twisted-pair", "coax-75"];

export interface LineConstants {
  resistance: number;
  inductance: number;
  capacitance: number;
  conductance: number;
}

export function awgDiameter(gauge: number): number {
  return 0.127e-3 * 92 ** ((36 - gauge) / 39);
}

export function copperResistancePerMetre(diameter: number): number {
  return ANNEALED_COPPER_RESISTIVITY / ((Math.PI * diameter * diameter) / 4);
}

export function twoWireLine(diameterA: number, diameterB: number, spacing: number, permittivity: number) {
  const a1 = diameterA / 2;
  const a2 = diameterB / 2;
  const geometryFactor = Math.acosh((spacing * spacing - a1 * a1 - a2 * a2) / (2 * a1 * a2));
  const capacitance = (2 * Math.PI * VACUUM_PERMITTIVITY * permittivity) / geometryFactor;
  const inductance = (VACUUM_PERMEABILITY / (2 * Math.PI)) * geometryFactor;
  return { capacitance, inductance, z0: Math.sqrt(inductance / capacitance) };
}

export function coaxialLine(innerDiameter: number, dielectricDiameter: number, permittivity: number) {
  const geometryFactor = Math.log(dielectricDiameter / innerDiameter);
  const capacitance = (2 * Math.PI * VACUUM_PERMITTIVITY * permittivity) / geometryFactor;
  const inductance = (VACUUM_PERMEABILITY / (2 * Math.PI)) * geometryFactor;
  return { capacitance, inductance, z0: Math.sqrt(inductance / capacitance) };
}

interface CatalogueEntry {
  geometry: string;
  perMetre: LineConstants;
  z0: number;
  delayPerMetre: number;
}

function entry(geometry: string, line: { capacitance: number; inductance: number }, resistance: number): CatalogueEntry {
  return {
    geometry,
    perMetre: { resistance, inductance: line.inductance, capacitance: line.capacitance, conductance: 0 },
    z0: Math.sqrt(line.inductance / line.capacitance),
    delayPerMetre: Math.sqrt(line.inductance * line.capacitance),
  };
}

const PVC_WALL = 0.4e-3;
/** Assumed (an estimate, as docs/simulator.md says of εeff): thin PVC on a lead whose field is mostly in air. */
const LONE_LEAD_PERMITTIVITY = 1.2;
/** From docs/simulator.md's table: εeff ≈ 2.8 for two touching PVC-insulated cores in a jacket. */
const BESIDE_GROUND_PERMITTIVITY = 2.8;
/** From memory: a Cat5e-type pair has insulated cores about 1.0 mm across, εeff about 2.4 (insulation plus air). */
const TWISTED_PAIR_SPACING = 1.0e-3;
const TWISTED_PAIR_PERMITTIVITY = 2.4;
/** Solid polyethylene, εr ≈ 2.25 (handbook value); a 4.2 mm dielectric over a 0.64 mm centre. */
const POLYETHYLENE_PERMITTIVITY = 2.25;
const COAX_CENTRE = 0.64e-3;
const COAX_DIELECTRIC = 4.2e-3;
/** From memory: the copper braid of a 75 Ω video coax of this size is about 12 mΩ/m. */
const COAX_BRAID_RESISTANCE = 12e-3;

/** The four catalogue kinds of docs/simulator.md, rebuilt from the geometry its table describes. */
export const catalogueFromGeometry: Record<CableKind, CatalogueEntry> = {
  "lone-lead": entry(
    "22 AWG data lead, 18 AWG return 10 mm away, PVC in air",
    twoWireLine(awgDiameter(22), awgDiameter(18), 10e-3, LONE_LEAD_PERMITTIVITY),
    copperResistancePerMetre(awgDiameter(22)) + copperResistancePerMetre(awgDiameter(18)),
  ),
  "beside-ground": entry(
    "20 AWG data and ground touching, 0.4 mm PVC walls",
    twoWireLine(awgDiameter(20), awgDiameter(20), awgDiameter(20) + 2 * PVC_WALL, BESIDE_GROUND_PERMITTIVITY),
    2 * copperResistancePerMetre(awgDiameter(20)),
  ),
  "twisted-pair": entry(
    "24 AWG pair, insulated cores 1.0 mm across",
    twoWireLine(awgDiameter(24), awgDiameter(24), TWISTED_PAIR_SPACING, TWISTED_PAIR_PERMITTIVITY),
    2 * copperResistancePerMetre(awgDiameter(24)),
  ),
  "coax-75": entry(
    "0.64 mm solid copper centre, 4.2 mm solid PE dielectric, copper braid",
    coaxialLine(COAX_CENTRE, COAX_DIELECTRIC, POLYETHYLENE_PERMITTIVITY),
    copperResistancePerMetre(COAX_CENTRE) + COAX_BRAID_RESISTANCE,
  ),
};
