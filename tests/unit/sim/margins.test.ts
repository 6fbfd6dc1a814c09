/**
 * The receiver's two judgements (docs/simulator.md, "The receiver: two judgements"), on drawn
 * waveforms whose answers follow from the definitions by hand, then on simulated runs:
 * - guaranteed: a switching point anywhere between VIL = 1.5 V and VIH = 3.5 V (5 V pixel), no hysteresis;
 * - typical: a switching point from 2.0 V to 3.0 V with 0.25 V of hysteresis (rises read at
 *   s + 0.125 V, falls at s − 0.125 V), the simulator's stated assumptions.
 */
import { describe, expect, it } from "vitest";
import { RECEIVER_DEFAULTS, simulateRun, switchingBands, type SimInput, type SimResult } from "@/lib/sim";
import type { SlotTiming } from "@/lib/sim/decoder";
import { judgeBand, type JudgedBand } from "@/lib/sim/judgement";
import { measureBitLevels } from "@/lib/sim/metrics";
import { parseSimInput } from "@/lib/sim/schema";
import type { Waveform } from "@/lib/sim/waveform";

const SUPPLY = 5;
const us = 1e-6;
const ns = 1e-9;
const bands = switchingBands(parseSimInput({ cable: { kind: "beside-ground", length: 1 }, signal: { bits: "1" } }).receiver);

/** A far-end waveform through the given (µs, volts) corners. */
function wave(points: [number, number][]): Waveform {
  return { time: Float64Array.from(points.map(([t]) => t * us)), value: Float64Array.from(points.map(([, v]) => v)), count: points.length };
}

/** One 1 bit: the driver rises at 1 µs and falls at 1.8 µs; the slot ends at 2.25 µs. */
const oneBit: SlotTiming[] = [{ sent: 1, start: 1 * us, fall: 1.8 * us }];
const rule = { deglitchTime: 0, minPulse: RECEIVER_DEFAULTS.minPulse, minGap: RECEIVER_DEFAULTS.minGap, decisionTime: RECEIVER_DEFAULTS.decisionTime };

function judge(points: [number, number][], deglitchTime = 0): Record<"guaranteed" | "typical", JudgedBand> {
  const far = wave(points);
  const context = { wave: far, slots: oneBit, bitPeriod: 1.25 * us, delay: 0, rule: { ...rule, deglitchTime }, levels: [] as ReturnType<typeof measureBitLevels>[] };
  const centre = judgeBand("typical", bands.typical, context).readings.lowest.decoding.bits[0];
  context.levels = [measureBitLevels(far, centre, oneBit[0].fall, 0, bands, SUPPLY)];
  return { guaranteed: judgeBand("guaranteed", bands.guaranteed, context), typical: judgeBand("typical", bands.typical, context) };
}

/** A 1 bit with 4 ns edges that stays at `level` through its high time, with `extra` corners inserted after the rise. */
const pulse = (level: number, extra: [number, number][] = []): [number, number][] => [
  [0, 0],
  [1, 0],
  [1.004, level],
  ...extra,
  [1.8, level],
  [1.804, 0],
  [2.5, 0],
];

describe("the two judgements on drawn waveforms", () => {
  it("a clean 5 V pulse is guaranteed: margins 1.5 V (5 − 3.5 and 1.5 − 0) and 2.0 V against the typical band", () => {
    const { guaranteed, typical } = judge(pulse(5));
    expect(guaranteed.pass).toBe(true);
    expect(guaranteed.voltageMargin).toBeCloseTo(1.5, 9);
    expect(typical.pass).toBe(true);
    // min(5 − 3.125, 1.875 − 0)
    expect(typical.voltageMargin).toBeCloseTo(1.875, 9);
  });

  it("a pulse above the high threshold for only 3 ns, settling at 3.3 V, is typical, not guaranteed", () => {
    const { guaranteed, typical } = judge(pulse(3.3, [[1.0045, 4.2], [1.007, 3.3]]));
    expect(guaranteed.pass).toBe(false);
    // A pixel switching at 3.5 V sees the pulse end as the far end settles at 3.3 V.
    expect(guaranteed.voltageMargin).toBeCloseTo(3.3 - 3.5, 9);
    expect(typical.pass).toBe(true);
    // 3.3 V against the highest typical fall level, 3.0 − 0.125 V; the 4.2 V peak clears the highest rise level by more.
    expect(typical.voltageMargin).toBeCloseTo(3.3 - 2.875, 9);
  });

  it("a dip to mid-supply inside a 5 V pulse fails both: every switching point from 2.5 V up sees the pulse break", () => {
    const { guaranteed, typical } = judge(pulse(5, [[1.2, 5], [1.205, 2.5], [1.21, 5]]));
    expect(guaranteed.pass).toBe(false);
    expect(guaranteed.voltageMargin).toBeCloseTo(2.5 - 3.5, 9);
    expect(typical.pass).toBe(false);
    expect(typical.voltageMargin).toBeCloseTo(2.5 - 2.875, 9);
  });

  it("a dip to 3.6 V inside a 5 V pulse stays clear of the whole band: guaranteed with 0.1 V", () => {
    const { guaranteed } = judge(pulse(5, [[1.2, 5], [1.205, 3.6], [1.21, 5]]));
    expect(guaranteed.pass).toBe(true);
    expect(guaranteed.voltageMargin).toBeCloseTo(0.1, 9);
  });

  it("ringing that swings back into the band after the fall: 2.0 V is above VIL (not guaranteed) and below the lowest typical rise level (typical)", () => {
    const points = pulse(5).slice(0, 5);
    points.push([1.804, 0], [1.82, 2.0], [1.84, 0], [2.5, 0]);
    const { guaranteed, typical } = judge(points);
    expect(guaranteed.pass).toBe(false);
    expect(guaranteed.voltageMargin).toBeCloseTo(1.5 - 2.0, 9);
    expect(typical.pass).toBe(true);
    expect(typical.voltageMargin).toBeCloseTo(2.125 - 2.0, 9);
  });

  it("an edge that turns back inside the band fails at the switching points it re-crosses, though both extremes read one pulse", () => {
    const { guaranteed } = judge(pulse(5, [[1.05, 5], [1.1, 5]]).map(([t, v]) => (t === 1.004 ? [1.004, 3] : t === 1.05 ? [1.02, 2] : [t, v])));
    expect(guaranteed.readings.highest.decoding.bits[0].received).toBe("1");
    expect(guaranteed.readings.lowest.decoding.bits[0].received).toBe("1");
    expect(guaranteed.pass).toBe(false);
    // Risen to 3 V, back to 2 V: points between 2 and 3 V read a rise, a fall and a rise.
    expect(guaranteed.voltageMargin).toBeCloseTo(-1, 9);
  });

  it("a falling staircase with bumps of 20 mV is not ringing: the margins come from the settled levels", () => {
    const points: [number, number][] = [[0, 0], [1, 0], [1.004, 5], [1.8, 5], [1.804, 2.19]];
    for (const [at, level, next] of [[1.82, 2.19, 0.96], [1.84, 0.96, 0.42], [1.86, 0.42, 0.18], [1.88, 0.18, 0]]) {
      points.push([at - 0.002, level], [at - 0.001, level + 0.02], [at + 0.004, next]);
    }
    points.push([2.5, 0]);
    const { guaranteed } = judge(points);
    expect(guaranteed.pass).toBe(true);
    expect(guaranteed.voltageMargin).toBeCloseTo(1.5, 9);
  });

  it("a pulse narrower at the band's top than at its bottom is judged by its narrowest width for a 1 bit", () => {
    // Slow edges: 3.5 V is crossed 100 ns after 1.5 V on the rise, and 100 ns before it on the fall.
    const { guaranteed } = judge([[0, 0], [1, 0], [1.25, 5], [1.8, 5], [2.05, 0], [2.5, 0]]);
    const top = guaranteed.readings.highest.decoding.bits[0].width!;
    const bottom = guaranteed.readings.lowest.decoding.bits[0].width!;
    expect(top).toBeCloseTo(0.8 * us - 0.1 * us, 12);
    expect(bottom).toBeCloseTo(0.8 * us + 0.1 * us, 12);
    expect(guaranteed.timingMargin).toBeCloseTo(top - RECEIVER_DEFAULTS.decisionTime, 12);
  });

  it("an input filter set for the run hides a short dip from the decoded bits but not from the judgement", () => {
    const dip = pulse(5, [[1.2, 5], [1.202, 1.0], [1.204, 5]]);
    const filtered = judge(dip, 10 * ns);
    expect(filtered.guaranteed.readings.highest.decoding.bits[0].received).toBe("1");
    expect(filtered.guaranteed.pass).toBe(false);
    expect(filtered.typical.pass).toBe(false);
  });
});

const BITS = "0100110101100010";
type Case = Pick<SimInput, "driver" | "seriesResistance" | "cable">;
const run = (input: Case, receiver: SimInput["receiver"] = {}): SimResult => simulateRun({ ...input, receiver, signal: { bits: BITS } });
const pin3v3 = { highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9 };

describe("the judgements on simulated runs", () => {
  it("the classic failing case (10 m lone lead, 33 Ω, 3.3 V pin) fails both by default, and an input filter does not rescue it", () => {
    const classic: Case = { driver: pin3v3, seriesResistance: 33, cable: { kind: "lone-lead", length: 10 } };
    for (const receiver of [{}, { deglitchTime: 10 * ns }]) {
      const result = run(classic, receiver);
      expect(result.verdict.outcome).toBe("fails");
      expect(result.verdict.guaranteed.pass).toBe(false);
      expect(result.verdict.typical.pass).toBe(false);
      expect(result.verdict.typical.voltageMargin).toBeLessThan(0);
    }
  });

  it("a 5 V buffer through 220 Ω into 1.5 m beside ground is guaranteed, margins set by the settled levels", () => {
    const result = run({ driver: { highVoltage: 5, outputResistance: 20 }, seriesResistance: 220, cable: { kind: "beside-ground", length: 1.5 } });
    expect(result.verdict.outcome).toBe("guaranteed");
    expect(result.verdict.guaranteed.voltageMargin).toBeGreaterThan(1.4);
    expect(result.verdict.guaranteed.voltageMargin).toBeLessThanOrEqual(1.5 + 1e-3);
    expect(result.verdict.reasons).toEqual([]);
  });

  it("the field value on a lone lead (3.3 V, 10 m, 240 Ω) works on typical pixels and says why it is not guaranteed", () => {
    const result = run({ driver: pin3v3, seriesResistance: 240, cable: { kind: "lone-lead", length: 10 } });
    expect(result.verdict.outcome).toBe("typical");
    expect(result.verdict.summary).toBe("works on typical pixels, not guaranteed");
    expect(result.verdict.reasons[0]).toMatchObject({ code: "high-level-too-low", judgement: "guaranteed", severity: "warning" });
  });
});
