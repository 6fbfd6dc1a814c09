import { describe, expect, it } from "vitest";
import { CLAMP_DIODE_MODEL, parseSimInput, SimInputError, simInputSchema } from "@/lib/sim";

const valid = { cable: { kind: "beside-ground", length: 10 }, signal: { bits: "0101" } };

function issuesOf(input: unknown) {
  try {
    parseSimInput(input);
  } catch (error) {
    if (error instanceof SimInputError) return error.issues;
    throw error;
  }
  throw new Error("the input was accepted");
}

describe("the simulator input schema", () => {
  it("fills the defaults docs/simulator.md gives", () => {
    const resolved = parseSimInput(valid);
    expect(resolved.receiver).toMatchObject({ highThreshold: 0.7, lowThreshold: 0.3, minPulse: 0.15e-6, decisionTime: 0.6e-6 });
    expect(resolved.receiver.clampSeriesResistance).toBe(CLAMP_DIODE_MODEL.seriesResistance);
    expect(resolved.signal).toMatchObject({ bitPeriod: 1.25e-6, zeroHigh: 0.4e-6, oneHigh: 0.8e-6, leadIn: 1e-6, byteOrder: "GRB" });
  });

  it("accepts its own output again unchanged", () => {
    const resolved = parseSimInput(valid);
    expect(parseSimInput(resolved)).toEqual(resolved);
  });

  it("names a negative clamp series resistance", () => {
    expect(issuesOf({ ...valid, receiver: { clampSeriesResistance: -1 } })).toEqual([{ path: "receiver.clampSeriesResistance", message: "must be at least 0 Ω" }]);
  });

  it("names the field of a negative length", () => {
    expect(issuesOf({ ...valid, cable: { kind: "lone-lead", length: -3 } })).toEqual([{ path: "cable.length", message: "must be at least 0 m" }]);
  });

  it("names a resistor out of range", () => {
    expect(issuesOf({ ...valid, seriesResistance: 1e6 })).toEqual([{ path: "seriesResistance", message: "must be at most 10000 Ω" }]);
  });

  it("names an unknown cable and lists the known ones", () => {
    const [issue] = issuesOf({ ...valid, cable: { kind: "garden-hose", length: 3 } });
    expect(issue.path).toBe("cable.kind");
    expect(issue.message).toContain("unknown cable kind");
    expect(issue.message).toContain("twisted-pair");
  });

  it("names an empty pattern", () => {
    expect(issuesOf({ ...valid, signal: { bits: "" } })).toEqual([{ path: "signal.bits", message: "the bit pattern is empty" }]);
    expect(issuesOf({ ...valid, signal: { colours: [] } })).toEqual([{ path: "signal.colours", message: "the colour list is empty" }]);
  });

  it("refuses both or neither of bits and colours, and of kind and perMetre", () => {
    expect(issuesOf({ ...valid, signal: { bits: "01", colours: [[1, 2, 3]] } })[0].path).toBe("signal.bits");
    expect(issuesOf({ ...valid, cable: { length: 2 } })[0].path).toBe("cable.kind");
  });

  it("refuses thresholds in the wrong order and unknown fields", () => {
    expect(issuesOf({ ...valid, receiver: { lowThreshold: 0.8 } })).toEqual([{ path: "receiver.lowThreshold", message: "must be below highThreshold" }]);
    expect(issuesOf({ ...valid, seriesResistence: 33 })[0].message).toContain("seriesResistence");
  });

  it("refuses an edge slower than the shortest high time", () => {
    expect(issuesOf({ ...valid, driver: { edgeTime: 0.5e-6 } })).toEqual([
      { path: "driver.edgeTime", message: "must be shorter than the shortest high or low time of the signal" },
    ]);
  });

  it("accepts per-metre constants instead of a catalogue kind", () => {
    const parsed = simInputSchema.parse({ ...valid, cable: { perMetre: { resistance: 0.05, inductance: 5.2e-7, capacitance: 5.2e-11 }, length: 10 } });
    expect(parsed.cable.perMetre?.conductance).toBe(0);
  });
});
