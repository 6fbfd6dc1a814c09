/**
 * Line constants, wire resistance and preferred values against published formulas and tables:
 * - two-wire line and coax: standard transmission-line textbook formulas (support/cable-geometry.ts)
 *   against worked values of the radio handbooks; figures quoted from memory are marked so;
 * - the catalogue of lib/sim against the table of docs/simulator.md and against the geometry
 *   recomputed here, independently of lib/sim/cables.ts;
 * - wire gauge: ASTM B258 diameters; resistance from annealed copper, 1.7241e-8 Ω·m at 20 °C (IEC 60028);
 * - E-series: IEC 60063 tables written out as published.
 */
import { describe, expect, it } from "vitest";
import {
  ANNEALED_COPPER_RESISTIVITY as LIB_RESISTIVITY,
  awgDiameter as libAwgDiameter,
  awgResistancePerMetre,
  cableCatalogue,
  characteristicImpedance,
  eSeries,
  eSeriesValues,
  perMetreFromGeometry,
} from "@/lib/sim";
import {
  ANNEALED_COPPER_RESISTIVITY,
  awgDiameter,
  catalogueFromGeometry,
  coaxialLine,
  copperResistancePerMetre,
  REFERENCE_CABLE_KINDS,
  twoWireLine,
  VACUUM_PERMEABILITY,
  VACUUM_PERMITTIVITY,
} from "./support/cable-geometry";

const INCH = 25.4e-3;
const FOOT = 0.3048;
const SPEED_OF_LIGHT = 299_792_458;
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("two-wire line (standard textbook formulas; worked values from the radio handbooks)", () => {
  it("600 Ω open-wire line: No. 12 AWG wires 6 in apart in air (worked value, from memory)", () => {
    const line = twoWireLine(awgDiameter(12), awgDiameter(12), 6 * INCH, 1);
    expect(relative(line.z0, 600)).toBeLessThan(0.01);
  });

  it("the exact acosh form and the handbook's Z0 = 276·log10(2D/d) agree for widely spaced wires", () => {
    for (const ratio of [20, 74.25, 200]) {
      const exact = twoWireLine(1e-3, 1e-3, ratio * 1e-3, 1).z0;
      const handbook = 276 * Math.log10(2 * ratio);
      expect(relative(exact, handbook)).toBeLessThan(0.002);
    }
  });

  it("L'·C' = μ0·ε0·εr for any spacing (TEM line), so the delay is sqrt(εr)/c per metre", () => {
    for (const [spacing, permittivity] of [[1.2e-3, 2.8], [10e-3, 1.2], [50e-3, 1]]) {
      const line = twoWireLine(0.8e-3, 1.0e-3, spacing, permittivity);
      expect(relative(line.inductance * line.capacitance, VACUUM_PERMEABILITY * VACUUM_PERMITTIVITY * permittivity)).toBeLessThan(1e-12);
      expect(relative(Math.sqrt(line.inductance * line.capacitance), Math.sqrt(permittivity) / SPEED_OF_LIGHT)).toBeLessThan(1e-6);
    }
  });

  it("lib/sim's geometry formula gives the same 600 Ω line", () => {
    const perMetre = perMetreFromGeometry({
      type: "two-wire",
      signalGauge: 12,
      returnGauge: 12,
      centreSpacing: 6 * INCH,
      returnConductors: 1,
      effectivePermittivity: 1,
    });
    expect(relative(characteristicImpedance(perMetre), 600)).toBeLessThan(0.01);
  });
});

describe("coaxial line (standard textbook formulas; published cable data from memory)", () => {
  it("50 Ω coax, 0.81 mm centre in 2.95 mm solid PE: Z0 50 ± 2 Ω, C' ≈ 101 pF/m (30.8 pF/ft, from memory)", () => {
    const line = coaxialLine(0.81e-3, 2.95e-3, 2.25);
    expect(Math.abs(line.z0 - 50)).toBeLessThan(2);
    expect(relative(line.capacitance, 30.8e-12 / FOOT)).toBeLessThan(0.05);
  });

  it("75 Ω coax, 0.58 mm centre in 3.7 mm solid PE: Z0 75 ± 3 Ω, C' ≈ 67 pF/m (20.5 pF/ft, from memory)", () => {
    const line = coaxialLine(0.58e-3, 3.7e-3, 2.25);
    expect(Math.abs(line.z0 - 75)).toBeLessThan(3);
    expect(relative(line.capacitance, 20.5e-12 / FOOT)).toBeLessThan(0.03);
  });

  it("solid polyethylene gives a velocity factor of about 0.66 (handbook value, from memory)", () => {
    const line = coaxialLine(0.58e-3, 3.7e-3, 2.25);
    const velocityFactor = 1 / (Math.sqrt(line.inductance * line.capacitance) * SPEED_OF_LIGHT);
    expect(Math.abs(velocityFactor - 0.66)).toBeLessThan(0.01);
  });

  it("Z0 = (60/√εr)·ln(D/d)", () => {
    const line = coaxialLine(0.64e-3, 4.2e-3, 2.25);
    expect(relative(line.z0, (60 / 1.5) * Math.log(4.2 / 0.64))).toBeLessThan(0.001);
  });
});

/** docs/simulator.md, "The cable catalogue": Z0 (Ω), C' (pF/m), L' (nH/m), R' (mΩ/m), delay (ns/m). */
const DOC_TABLE = {
  "lone-lead": { z0: 350, capacitance: 10.5, inductance: 1280, resistance: 74, delay: 3.7 },
  "beside-ground": { z0: 94, capacitance: 60, inductance: 523, resistance: 67, delay: 5.6 },
  "twisted-pair": { z0: 100, capacitance: 52, inductance: 520, resistance: 168, delay: 5.2 },
  "coax-75": { z0: 75, capacitance: 67, inductance: 375, resistance: 65, delay: 5.0 },
} as const;
/** The table's figures are rounded estimates ("≈"): 5 %. */
const TABLE_TOLERANCE = 0.05;

describe("cable catalogue against docs/simulator.md's table and the geometry recomputed here", () => {
  it.each(REFERENCE_CABLE_KINDS)("%s", (kind) => {
    const row = DOC_TABLE[kind];
    for (const [name, entry] of [["recomputed", catalogueFromGeometry[kind]], ["lib/sim", cableCatalogue[kind]]] as const) {
      const got = {
        z0: entry.z0,
        capacitance: entry.perMetre.capacitance * 1e12,
        inductance: entry.perMetre.inductance * 1e9,
        resistance: entry.perMetre.resistance * 1e3,
        delay: entry.delayPerMetre * 1e9,
      };
      for (const key of Object.keys(row) as (keyof typeof row)[]) {
        expect(relative(got[key], row[key]), `${name} ${key}: ${got[key]} against ${row[key]}`).toBeLessThan(TABLE_TOLERANCE);
      }
    }
    const mine = catalogueFromGeometry[kind].perMetre;
    const theirs = cableCatalogue[kind].perMetre;
    expect(relative(theirs.inductance, mine.inductance)).toBeLessThan(0.02);
    expect(relative(theirs.capacitance, mine.capacitance)).toBeLessThan(0.02);
    expect(relative(theirs.resistance, mine.resistance)).toBeLessThan(0.02);
  });

  it("each entry's delay and Z0 follow from its own L' and C'", () => {
    for (const entry of Object.values(cableCatalogue)) {
      const { inductance, capacitance } = entry.perMetre;
      expect(relative(entry.delayPerMetre, Math.sqrt(inductance * capacitance))).toBeLessThan(1e-12);
      expect(relative(entry.z0, Math.sqrt(inductance / capacitance))).toBeLessThan(1e-12);
    }
  });

  it("three-core: about 4/3 of the two-core capacitance, Z0 ≈ 70 Ω (docs/simulator.md)", () => {
    const threeCore = cableCatalogue["three-core"];
    expect(relative(threeCore.perMetre.capacitance / cableCatalogue["beside-ground"].perMetre.capacitance, 4 / 3)).toBeLessThan(0.05);
    expect(relative(threeCore.z0, 70)).toBeLessThan(0.05);
  });
});

/** ASTM B258 solid-conductor diameters in inches, as tabulated (rounded to 0.1 mil). */
const ASTM_B258_DIAMETER_INCHES: Record<number, number> = {
  10: 0.1019, 12: 0.0808, 14: 0.0641, 16: 0.0508, 18: 0.0403, 20: 0.032, 22: 0.0253, 24: 0.0201, 26: 0.0159, 28: 0.0126, 30: 0.01, 36: 0.005,
};
/** Published DC resistance of solid annealed copper at 20 °C, Ω per 1000 ft (wire tables, from memory). */
const RESISTANCE_OHMS_PER_KFT: Record<number, number> = {
  10: 0.9989, 12: 1.588, 14: 2.525, 16: 4.016, 18: 6.385, 20: 10.15, 22: 16.14, 24: 25.67, 26: 40.81,
};

describe("wire gauge: ASTM B258 diameters, annealed copper 1.7241e-8 Ω·m (IEC 60028)", () => {
  it("1.7241e-8 Ω·m is 100 % IACS, 1/58 Ω·mm²/m, and lib/sim uses it", () => {
    expect(relative(ANNEALED_COPPER_RESISTIVITY, 1e-6 / 58)).toBeLessThan(1e-4);
    expect(LIB_RESISTIVITY).toBe(ANNEALED_COPPER_RESISTIVITY);
  });

  it.each(Object.entries(ASTM_B258_DIAMETER_INCHES))("AWG %s diameter", (gauge, inches) => {
    const tabulated = inches * INCH;
    // The table rounds to 0.1 mil, up to 1 % on the finest gauge listed.
    const tolerance = (0.00005 * INCH) / tabulated + 1e-6;
    expect(relative(awgDiameter(Number(gauge)), tabulated)).toBeLessThan(tolerance);
    expect(relative(libAwgDiameter(Number(gauge)), tabulated)).toBeLessThan(tolerance);
  });

  it.each(Object.entries(RESISTANCE_OHMS_PER_KFT))("AWG %s resistance per metre", (gauge, ohmsPerKft) => {
    const published = ohmsPerKft / (1000 * FOOT);
    expect(relative(copperResistancePerMetre(awgDiameter(Number(gauge))), published)).toBeLessThan(0.003);
    expect(relative(awgResistancePerMetre(Number(gauge)), published)).toBeLessThan(0.003);
  });
});

/** IEC 60063 tables as published. */
const E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
const E96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158, 162, 165, 169, 174,
  178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255, 261, 267, 274, 280, 287, 294, 301, 309,
  316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549,
  562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976,
].map((v) => v / 100);

describe("E-series preferred values (IEC 60063)", () => {
  it("the tables written here are complete: 12, 24 and 96 values per decade", () => {
    expect([E12.length, E24.length, E96.length]).toEqual([12, 24, 96]);
  });

  it("E96 is 10^(i/96) to three figures; E24 departs from 10^(i/24) at the eight values the standard keeps", () => {
    E96.forEach((v, i) => expect(v).toBe(Math.round(100 * 10 ** (i / 96)) / 100));
    const departures = E24.filter((v, i) => v !== Math.round(10 * 10 ** (i / 24)) / 10);
    expect(departures).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it("lib/sim's E12, E24 and E96 match the published tables", () => {
    expect(eSeries("E12")).toEqual(E12);
    expect(eSeries("E24")).toEqual(E24);
    expect(eSeries("E96")).toEqual(E96);
  });

  it("E6 is every second E12 value and E48 every second E96 value (IEC 60063)", () => {
    expect(eSeries("E6")).toEqual(E12.filter((_, i) => i % 2 === 0));
    expect(eSeries("E48")).toEqual(E96.filter((_, i) => i % 2 === 0));
  });

  it("resistor values in ohms are exact numbers across decades", () => {
    expect(eSeriesValues("E12", 33, 470)).toEqual([33, 39, 47, 56, 68, 82, 100, 120, 150, 180, 220, 270, 330, 390, 470]);
    expect(eSeriesValues("E24", 1, 10)).toEqual([...E24, 10]);
    const e96 = eSeriesValues("E96", 100, 1000);
    expect(e96).toEqual([...E96.map((v) => Math.round(v * 100)), 1000]);
    expect(e96).toContain(249);
    expect(eSeriesValues("E96", 2, 3)).toEqual(E96.filter((v) => v >= 2 && v <= 3));
  });
});
