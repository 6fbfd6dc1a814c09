import { awgDiameter, awgResistancePerMetre } from "./awg";

/**
 * The cable catalogue, computed from geometry with the textbook formulas for a two-wire line
 * and a coaxial line (quasi-TEM, perfect conductors for L' and C'; DC resistance for R'):
 *   two unequal round wires, radii a and b, centres D apart:
 *     Λ = acosh((D² − a² − b²) / 2ab)   (equal wires: Λ = 2·acosh(D/d))
 *     L' = (μ0/2π)·Λ,  C' = 2π·ε0·εeff / Λ,  Z0 = (60/√εeff)·Λ
 *   coax, centre diameter d, dielectric diameter D:
 *     Λ = ln(D/d),  L' = (μ0/2π)·Λ,  C' = 2π·ε0·εr / Λ,  Z0 = (60/√εr)·Λ
 * A data conductor touching two returns (three-core cable) has, by the thin-wire image
 * method, 3/4 of the logarithmic term of one return: 4/3 of the capacitance, 3/4 of the
 * inductance of the pair.
 */
export const CABLE_KINDS = ["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"] as const;
export type CableKind = (typeof CABLE_KINDS)[number];

export type PerMetre = { resistance: number; inductance: number; capacitance: number; conductance: number };

export type TwoWireGeometry = {
  type: "two-wire";
  signalGauge: number;
  returnGauge: number;
  /** Centre-to-centre spacing of the data conductor and its return (m). */
  centreSpacing: number;
  /** Two returns touching the data conductor (three-core round cable) instead of one. */
  returnConductors: 1 | 2;
  /** Effective permittivity of insulation plus air around the pair: an estimate. */
  effectivePermittivity: number;
};

export type CoaxGeometry = {
  type: "coax";
  centreGauge: number;
  /** Outer diameter of the dielectric = inner diameter of the shield (m). */
  dielectricDiameter: number;
  relativePermittivity: number;
  /** Resistance of the braid per metre (Ω/m): an estimate, not from the AWG table. */
  shieldResistance: number;
};

export type CableGeometry = TwoWireGeometry | CoaxGeometry;

export type CableEntry = {
  label: string;
  description: string;
  geometry: CableGeometry;
  perMetre: PerMetre;
  z0: number;
  delayPerMetre: number;
};

export const VACUUM_PERMEABILITY = 4e-7 * Math.PI;
export const VACUUM_PERMITTIVITY = 8.8541878128e-12;

const PVC_WALL = 0.4e-3;

function twoWireLogTerm(geometry: TwoWireGeometry): number {
  const a = awgDiameter(geometry.signalGauge) / 2;
  const b = awgDiameter(geometry.returnGauge) / 2;
  const d = geometry.centreSpacing;
  const pair = Math.acosh((d * d - a * a - b * b) / (2 * a * b));
  return geometry.returnConductors === 2 ? 0.75 * pair : pair;
}

/** Per-metre constants of a line from its geometry. */
export function perMetreFromGeometry(geometry: CableGeometry): PerMetre {
  if (geometry.type === "coax") {
    const logTerm = Math.log(geometry.dielectricDiameter / awgDiameter(geometry.centreGauge));
    return {
      resistance: awgResistancePerMetre(geometry.centreGauge) + geometry.shieldResistance,
      inductance: (VACUUM_PERMEABILITY / (2 * Math.PI)) * logTerm,
      capacitance: (2 * Math.PI * VACUUM_PERMITTIVITY * geometry.relativePermittivity) / logTerm,
      conductance: 0,
    };
  }
  const logTerm = twoWireLogTerm(geometry);
  return {
    resistance:
      awgResistancePerMetre(geometry.signalGauge) +
      awgResistancePerMetre(geometry.returnGauge) / geometry.returnConductors,
    inductance: (VACUUM_PERMEABILITY / (2 * Math.PI)) * logTerm,
    capacitance: (2 * Math.PI * VACUUM_PERMITTIVITY * geometry.effectivePermittivity) / logTerm,
    conductance: 0,
  };
}

export function characteristicImpedance(perMetre: PerMetre): number {
  return Math.sqrt(perMetre.inductance / perMetre.capacitance);
}

export function delayPerMetre(perMetre: PerMetre): number {
  return Math.sqrt(perMetre.inductance * perMetre.capacitance);
}

const touchingPairSpacing = (gauge: number) => awgDiameter(gauge) + 2 * PVC_WALL;

const geometries: Record<CableKind, { label: string; description: string; geometry: CableGeometry }> = {
  "lone-lead": {
    label: "Data lead on its own",
    description:
      "A 22 AWG data lead run by itself; its return, an 18 AWG ground wire, lies about 10 mm away. Thin PVC, mostly air between them.",
    geometry: {
      type: "two-wire",
      signalGauge: 22,
      returnGauge: 18,
      centreSpacing: 10e-3,
      returnConductors: 1,
      effectivePermittivity: 1.2,
    },
  },
  "beside-ground": {
    label: "Data beside ground",
    description:
      "20 AWG data and 20 AWG ground conductors touching, 0.4 mm PVC walls, in one jacket: the return is right beside the data.",
    geometry: {
      type: "two-wire",
      signalGauge: 20,
      returnGauge: 20,
      centreSpacing: touchingPairSpacing(20),
      returnConductors: 1,
      effectivePermittivity: 2.8,
    },
  },
  "twisted-pair": {
    label: "Twisted pair",
    description:
      "One pair of a data-network cable (Cat5e type), 24 AWG: data on one conductor, ground on its partner.",
    geometry: {
      type: "two-wire",
      signalGauge: 24,
      returnGauge: 24,
      centreSpacing: 1.0e-3,
      returnConductors: 1,
      effectivePermittivity: 2.43,
    },
  },
  "coax-75": {
    label: "75 Ω coax",
    description: "Coaxial cable with a 0.64 mm solid copper centre in solid polyethylene under a braided shield.",
    geometry: {
      type: "coax",
      centreGauge: 22,
      dielectricDiameter: 4.2e-3,
      relativePermittivity: 2.25,
      shieldResistance: 0.012,
    },
  },
  "three-core": {
    label: "Round three-core cable",
    description:
      "Three 20 AWG cores (data, ground, supply) in a round jacket; the data core touches both others, and both carry its return current at the edges.",
    geometry: {
      type: "two-wire",
      signalGauge: 20,
      returnGauge: 20,
      centreSpacing: touchingPairSpacing(20),
      returnConductors: 2,
      effectivePermittivity: 2.8,
    },
  },
};

function buildCatalogue(): Record<CableKind, CableEntry> {
  const entries = CABLE_KINDS.map((kind) => {
    const { label, description, geometry } = geometries[kind];
    const perMetre = perMetreFromGeometry(geometry);
    const entry: CableEntry = {
      label,
      description,
      geometry,
      perMetre,
      z0: characteristicImpedance(perMetre),
      delayPerMetre: delayPerMetre(perMetre),
    };
    return [kind, entry] as const;
  });
  return Object.fromEntries(entries) as Record<CableKind, CableEntry>;
}

export const cableCatalogue: Record<CableKind, CableEntry> = buildCatalogue();
