import { describe, expect, it } from "vitest";
import { cableCatalogue, characteristicImpedance, eSeriesValues, recommendSeriesResistance, SimInputError, simulateRun, sweepSeriesResistance, type SimInput } from "@/lib/sim";
import { buffer5v, controllerPin3v3 } from "@/lessons/drivers";
import { simulatedValues } from "@/lessons/numbers/simulated-values";
import { PIN_3V3_WINDOW } from "@/lessons/source-window";

/** The lessons' runs (lessons/numbers/simulations.ts): 10 m into a 5 V pixel, 16 bits, E24 from 10 Ω to 1 kΩ. */
const E24 = eSeriesValues("E24", 10, 1000);
const BITS = "0100110101100010";

function runOf(driver: { highVoltage: number; outputResistance: number; edgeTime: number }, kind: "lone-lead" | "beside-ground", length = 10): SimInput {
  const { highVoltage, outputResistance, edgeTime } = driver;
  return { driver: { highVoltage, outputResistance, edgeTime }, cable: { kind, length }, receiver: { supplyVoltage: 5 }, signal: { bits: BITS } };
}

describe("sweepSeriesResistance", () => {
  it("gives each value the outcome of its own full run and its margins within 1 % of VDD (bit replays)", () => {
    const input = runOf(controllerPin3v3, "lone-lead");
    const values = [10, 100, 240, 1000];
    const points = sweepSeriesResistance(input, values);
    expect(points.map((p) => p.resistance)).toEqual(values);
    for (const point of points) {
      const { verdict } = simulateRun({ ...input, seriesResistance: point.resistance });
      expect(point.outcome).toBe(verdict.outcome);
      for (const judgement of ["guaranteed", "typical"] as const) {
        expect(point[judgement].pass).toBe(verdict[judgement].pass);
        expect(Math.abs(point[judgement].voltageMargin - verdict[judgement].voltageMargin)).toBeLessThan(0.01 * 5);
      }
    }
  });

  it("finds lesson 6's windows: the E24 values that work on typical pixels with 0.3 V to spare", () => {
    for (const [kind, lowest, highest] of [
      ["lone-lead", simulatedValues["seriesTermination.loneLowest"], simulatedValues["seriesTermination.loneHighest"]],
      ["beside-ground", simulatedValues["seriesTermination.besideLowest"], simulatedValues["seriesTermination.besideHighest"]],
    ] as const) {
      const points = sweepSeriesResistance(runOf(controllerPin3v3, kind), E24);
      const withMargin = points.filter((p) => p.typical.pass && p.typical.voltageMargin >= 0.3).map((p) => p.resistance);
      expect(withMargin).toEqual(E24.filter((r) => r >= lowest && r <= highest));
    }
  });

  it("rejects values outside a resistor's range, naming the entry", () => {
    expect(() => sweepSeriesResistance(runOf(buffer5v, "lone-lead"), [])).toThrow(SimInputError);
    expect(() => sweepSeriesResistance(runOf(buffer5v, "lone-lead"), [47, -1])).toThrow(/values\.1/);
  });
});

describe("recommendSeriesResistance", () => {
  it("a 3.3 V pin into a 5 V pixel is never guaranteed: the widest typical margin, labelled typical, inside the bounce arithmetic's window", () => {
    const points = sweepSeriesResistance(runOf(controllerPin3v3, "lone-lead"), E24);
    expect(points.some((p) => p.guaranteed.pass)).toBe(false);
    const recommended = recommendSeriesResistance(points);
    expect(recommended.judgement).toBe("typical");
    const widest = Math.max(...points.filter((p) => p.typical.pass).map((p) => p.typical.voltageMargin));
    expect(recommended.voltageMargin).toBe(widest);
    // Lesson 5's arithmetic (lessons/source-window.ts): the source, driver included, between these fractions of Z0.
    const z0 = characteristicImpedance(cableCatalogue["lone-lead"].perMetre);
    const source = recommended.resistance! + controllerPin3v3.outputResistance;
    expect(source).toBeGreaterThanOrEqual(PIN_3V3_WINDOW.lower * z0);
    expect(source).toBeLessThanOrEqual(PIN_3V3_WINDOW.upper * z0);
    expect(recommended.window).toEqual(points.filter((p) => p.typical.pass).map((p) => p.resistance));
  });

  it("a 5 V buffer reaches the guarantee: the widest guaranteed margin, labelled guaranteed", () => {
    const points = sweepSeriesResistance(runOf(buffer5v, "beside-ground"), E24);
    const recommended = recommendSeriesResistance(points);
    expect(recommended.judgement).toBe("guaranteed");
    const chosen = points.find((p) => p.resistance === recommended.resistance)!;
    expect(chosen.outcome).toBe("guaranteed");
    for (const point of points.filter((p) => p.guaranteed.pass)) expect(point.guaranteed.voltageMargin).toBeLessThanOrEqual(chosen.guaranteed.voltageMargin);
  });

  it("recommends nothing when no value works on typical pixels (a 2 V driver into a 5 V pixel)", () => {
    const points = sweepSeriesResistance({ ...runOf(buffer5v, "beside-ground"), driver: { highVoltage: 2 } }, [10, 47, 220]);
    expect(points.every((p) => p.outcome === "fails")).toBe(true);
    expect(recommendSeriesResistance(points)).toEqual({ resistance: null, judgement: null, voltageMargin: null, timingMargin: null, window: [] });
  });
});
