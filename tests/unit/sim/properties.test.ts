import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CABLE_KINDS, cableCatalogue, simulateRun, type SimInput } from "@/lib/sim";

/** Property tests of the whole run (issue 3, "property tests"), with modest run counts to keep the suite quick. */

const kind = fc.constantFrom(...CABLE_KINDS);
const bits = fc.stringMatching(/^[01]{1,4}$/);

const anyCase = fc.record({
  driver: fc.record({
    highVoltage: fc.double({ min: 1, max: 12, noNaN: true }),
    outputResistance: fc.double({ min: 0, max: 200, noNaN: true }),
    outputResistanceLow: fc.double({ min: 0, max: 200, noNaN: true }),
    edgeTime: fc.double({ min: 1e-9, max: 20e-9, noNaN: true }),
  }),
  seriesResistance: fc.double({ min: 0, max: 2000, noNaN: true }),
  cable: fc.oneof(
    fc.record({ kind, length: fc.double({ min: 0, max: 20, noNaN: true }) }),
    fc.record({
      perMetre: fc.record({
        resistance: fc.double({ min: 0, max: 0.5, noNaN: true }),
        inductance: fc.double({ min: 2e-7, max: 2e-6, noNaN: true }),
        capacitance: fc.double({ min: 5e-12, max: 150e-12, noNaN: true }),
        conductance: fc.double({ min: 0, max: 1e-4, noNaN: true }),
      }),
      length: fc.double({ min: 0, max: 20, noNaN: true }),
    }),
  ),
  receiver: fc.record({
    supplyVoltage: fc.constantFrom(3.3, 5),
    inputCapacitance: fc.double({ min: 0, max: 50e-12, noNaN: true }),
    clampDiodes: fc.boolean(),
    clampSeriesResistance: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 100, noNaN: true })),
  }),
  signal: fc.record({ bits, leadIn: fc.constant(0.2e-6) }),
});

function allFinite(values: ArrayLike<number>): boolean {
  for (let i = 0; i < values.length; i += 1) if (!Number.isFinite(values[i])) return false;
  return true;
}

describe("simulator properties", () => {
  it("never returns NaN or Infinity for a valid input", () => {
    fc.assert(
      fc.property(anyCase, (input) => {
        const result = simulateRun(input as SimInput);
        expect(allFinite(result.time) && allFinite(result.nearEnd) && allFinite(result.farEnd)).toBe(true);
        for (const value of Object.values(result.metrics)) {
          if (value !== null) expect(Number.isFinite(value)).toBe(true);
        }
        expect(result.decoded).toHaveLength(input.signal.bits.length);
      }),
      { numRuns: 40 },
    );
  });

  it("is causal: nothing reaches the far end sooner than length·sqrt(L'C') after the driver's edge", () => {
    fc.assert(
      fc.property(kind, fc.double({ min: 0.5, max: 20, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true }), (cableKind, length, resistance) => {
        const leadIn = 0.2e-6;
        const result = simulateRun(
          { seriesResistance: resistance, cable: { kind: cableKind, length }, signal: { bits: "1", leadIn } },
          { keepFullResolution: true },
        );
        const { perMetre } = cableCatalogue[cableKind];
        const arrival = leadIn + length * Math.sqrt(perMetre.inductance * perMetre.capacitance);
        const full = result.full!;
        for (let i = 0; i < full.time.length && full.time[i] < arrival * (1 - 1e-9); i += 1) {
          expect(Math.abs(full.farEnd[i])).toBeLessThan(1e-9);
        }
        const after = full.time.findIndex((t) => t > arrival + 2e-9);
        expect(full.farEnd[after]).toBeGreaterThan(1e-3);
      }),
      { numRuns: 20 },
    );
  });

  it("with the source matched to a lossless line and no clamps, settles to the drive level within one delay plus a few edge times", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 400, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 1e-9, max: 5e-9, noNaN: true }),
        fc.double({ min: 3.3, max: 12, noNaN: true }),
        (z0, length, edgeTime, highVoltage) => {
          const delayPerMetre = 5e-9;
          const perMetre = { resistance: 0, inductance: z0 * delayPerMetre, capacitance: delayPerMetre / z0, conductance: 0 };
          const inputCapacitance = 1e-12;
          const leadIn = 0.2e-6;
          const result = simulateRun(
            {
              driver: { highVoltage, outputResistance: z0, edgeTime },
              cable: { perMetre, length },
              receiver: { clampDiodes: false, inputCapacitance },
              signal: { bits: "1", leadIn },
            },
            { keepFullResolution: true },
          );
          const settled = leadIn + length * delayPerMetre + 3 * edgeTime + 5 * z0 * inputCapacitance;
          const until = leadIn + 0.8e-6;
          const full = result.full!;
          for (let i = 0; i < full.time.length; i += 1) {
            if (full.time[i] >= settled && full.time[i] < until) {
              expect(Math.abs(full.farEnd[i] - highVoltage)).toBeLessThan(0.01 * highVoltage);
            }
          }
        },
      ),
      { numRuns: 20 },
    );
  });

  it("with no cable length reduces to the lumped RC answer: 10–90 % rise = 2.2·R·C", () => {
    fc.assert(
      fc.property(fc.double({ min: 200, max: 2000, noNaN: true }), fc.double({ min: 20e-12, max: 50e-12, noNaN: true }), (resistance, capacitance) => {
        const result = simulateRun({
          driver: { outputResistance: resistance, edgeTime: 1e-9 },
          cable: { kind: "beside-ground", length: 0 },
          receiver: { inputCapacitance: capacitance, clampDiodes: false },
          signal: { bits: "1" },
        });
        // A 1 ns ramp instead of a step delays both crossings alike; the difference is far below 1 %.
        expect(result.metrics.riseTime).not.toBeNull();
        expect(result.metrics.riseTime! / (2.2 * resistance * capacitance)).toBeCloseTo(1, 1);
      }),
      { numRuns: 20 },
    );
  });

  it("with clamps keeps the far end within the rails plus a diode drop and the drop across the clamps' series resistance", () => {
    fc.assert(
      fc.property(
        kind,
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 5, max: 12, noNaN: true }),
        fc.constantFrom(3.3, 5),
        fc.constantFrom(0, 5, 50),
        (cableKind, length, highVoltage, supplyVoltage, clampSeriesResistance) => {
          const result = simulateRun(
            {
              driver: { highVoltage, outputResistance: 0, edgeTime: 1e-9 },
              cable: { kind: cableKind, length },
              receiver: { supplyVoltage, clampDiodes: true, clampSeriesResistance },
              signal: { bits: "10", leadIn: 0.2e-6 },
            },
            { keepFullResolution: true },
          );
          const far = result.full!.farEnd;
          let low = Infinity;
          let high = -Infinity;
          for (const v of far) {
            low = Math.min(low, v);
            high = Math.max(high, v);
          }
          // Past its rail the pin carries the junction's drop (under 1 V up to amperes) plus the resistor's, at most Rs times the peak current.
          const resistorDrop = clampSeriesResistance * result.metrics.clampCurrentPeak;
          expect(high).toBeLessThan(supplyVoltage + 1 + resistorDrop);
          expect(low).toBeGreaterThan(-1 - resistorDrop);
        },
      ),
      { numRuns: 20 },
    );
  });
});
