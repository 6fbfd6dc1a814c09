import { describe, expect, it } from "vitest";
import { awgDiameter, awgResistancePerMetre, CABLE_KINDS, cableCatalogue } from "@/lib/sim";

/** The catalogue against the figures docs/simulator.md expects the geometry to land near. */
describe("cable catalogue", () => {
  const expected = {
    "lone-lead": { z0: 350, c: 10.5e-12, l: 1280e-9, r: 0.074 },
    "beside-ground": { z0: 94, c: 60e-12, l: 523e-9, r: 0.067 },
    "twisted-pair": { z0: 100, c: 52e-12, l: 520e-9, r: 0.168 },
    "coax-75": { z0: 75, c: 67e-12, l: 375e-9, r: 0.065 },
  } as const;

  for (const [kind, figures] of Object.entries(expected)) {
    it(`${kind} lands near the table`, () => {
      const entry = cableCatalogue[kind as keyof typeof expected];
      expect(entry.z0 / figures.z0).toBeCloseTo(1, 1);
      expect(entry.perMetre.capacitance / figures.c).toBeCloseTo(1, 1);
      expect(entry.perMetre.inductance / figures.l).toBeCloseTo(1, 1);
      expect(entry.perMetre.resistance / figures.r).toBeCloseTo(1, 1);
      expect(entry.delayPerMetre).toBeCloseTo(Math.sqrt(entry.perMetre.inductance * entry.perMetre.capacitance), 20);
    });
  }

  it("gives the three-core cable 4/3 of the two-core capacitance and about 70 Ω", () => {
    const three = cableCatalogue["three-core"];
    expect(three.perMetre.capacitance / cableCatalogue["beside-ground"].perMetre.capacitance).toBeCloseTo(4 / 3, 6);
    expect(three.z0).toBeGreaterThan(65);
    expect(three.z0).toBeLessThan(75);
  });

  it("has every kind", () => {
    expect(Object.keys(cableCatalogue).sort()).toEqual([...CABLE_KINDS].sort());
  });

  it("uses ASTM B258 diameters and annealed copper (20 AWG: 0.812 mm, 33.3 mΩ/m)", () => {
    expect(awgDiameter(20)).toBeCloseTo(0.812e-3, 5);
    expect(awgResistancePerMetre(20)).toBeCloseTo(0.0333, 4);
    expect(awgDiameter(36)).toBeCloseTo(0.127e-3, 9);
  });
});
