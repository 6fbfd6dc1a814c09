/**
 * Voltage margins (docs/simulator.md, "The receiver rule"): in each high period the peak above the
 * high threshold, in each low period the low threshold minus the peak of ringing, and the same
 * against a single mid-supply threshold. Periods start once the edge has crossed into the band:
 * the edge itself is not ringing. Expected figures are measured here, straight from the solver's
 * own steps, independently of lib/sim/metrics.ts.
 */
import { describe, expect, it } from "vitest";
import { simulateRun, type SimInput, type SimResult } from "@/lib/sim";
import type { DecodedBit } from "@/lib/sim/decoder";
import { measureBitLevels } from "@/lib/sim/metrics";
import type { Waveform } from "@/lib/sim/waveform";

const BITS = "0100110101100010";
const SUPPLY = 5;
const HIGH = 0.7 * SUPPLY;
const LOW = 0.3 * SUPPLY;
const MID = SUPPLY / 2;
const ZERO_HIGH = 0.4e-6;
const ONE_HIGH = 0.8e-6;
const BIT_PERIOD = 1.25e-6;

type Case = Pick<SimInput, "driver" | "seriesResistance" | "cable">;

function run(input: Case, receiver: SimInput["receiver"] = {}): SimResult {
  return simulateRun({ ...input, receiver, signal: { bits: BITS } }, { keepFullResolution: true });
}

/** Far-end samples of the solver's steps in [from, to). */
function samples(result: SimResult, from: number, to: number): number[] {
  const { time, farEnd } = result.full!;
  const out: number[] = [];
  for (let i = 0; i < time.length; i += 1) if (time[i] >= from && time[i] < to) out.push(farEnd[i]);
  return out;
}

/**
 * Per bit: the lowest voltage once the pulse has risen through `enter` (until the fall arrives),
 * and the highest once it has fallen through `leave` and turned back up by more than `turn`.
 */
function ringingExtremes(result: SimResult, enter: number, leave: number, turn: number) {
  const delay = result.line.delay;
  return result.bits.map((bit) => {
    const fall = bit.start + (bit.sent ? ONE_HIGH : ZERO_HIGH) + delay;
    const high = samples(result, bit.start + delay, fall);
    const low = samples(result, fall, bit.start + BIT_PERIOD + delay);
    const entered = high.findIndex((v) => v >= enter);
    const dip = entered === -1 ? Infinity : Math.min(...high.slice(entered));
    const left = low.findIndex((v) => v <= leave);
    let lowest = Infinity;
    let ringBack = -Infinity;
    for (const v of left === -1 ? [] : low.slice(left)) {
      lowest = Math.min(lowest, v);
      if (v > lowest + turn) ringBack = Math.max(ringBack, v);
    }
    return { peak: Math.max(...high), dip, ringBack, trough: Math.min(...low) };
  });
}

const us = 1e-6;
const ns = 1e-9;

/** A far-end waveform through the given (µs, volts) corners. */
function wave(points: [number, number][]): Waveform {
  return { time: Float64Array.from(points.map(([t]) => t * us)), value: Float64Array.from(points.map(([, v]) => v)), count: points.length };
}

/** A 0 bit read in the slot 1–2.25 µs, its fall arriving at 1.4 µs. */
const zeroBit: DecodedBit = { sent: 0, received: "0", width: 0.4 * us, timingMargin: 0.2 * us, start: 1 * us, slotStart: 1 * us, slotEnd: 2.25 * us, pulses: [], glitch: false };
const thresholds = { high: HIGH, low: LOW, mid: MID, supply: SUPPLY };
const levelsOf = (points: [number, number][]) => measureBitLevels(wave(points), zeroBit, 1.4 * us, 0, thresholds);

describe("bit levels on drawn waveforms", () => {
  it("a falling staircase with bumps of 20 mV before each step has no ring-back: the margins come from the settled levels", () => {
    const steps: [number, number][] = [[0, 0], [1, 0], [1.004, 5], [1.4, 5], [1.404, 2.19]];
    for (const [at, level, next] of [[1.42, 2.19, 0.96], [1.44, 0.96, 0.42], [1.46, 0.42, 0.18], [1.48, 0.18, 0]]) {
      steps.push([at - 0.002, level], [at - 0.001, level + 0.02], [at + 0.004, next]);
    }
    steps.push([2.5, 0]);
    const levels = levelsOf(steps);
    expect(levels.ringBack).toBeNull();
    expect(levels.voltageMargin).toBeCloseTo(1.5, 9);
    expect(levels.midSupplyVoltageMargin).toBeCloseTo(2.5, 9);
  });

  it("ringing of the high period still swinging when the fall arrives is not ring-back; the ring-back after the fall is", () => {
    const levels = levelsOf([[0, 0], [1, 0], [1.004, 5.5], [1.01, 2.8], [1.02, 5.2], [1.03, 3.6], [1.4, 2.8], [1.402, 3.2], [1.406, 0.3], [1.41, -0.3], [1.42, 0.4], [1.43, 0], [2.5, 0]]);
    expect(levels.ringBack?.value).toBeCloseTo(0.4, 9);
    expect(levels.ringBack?.time).toBeCloseTo(1.42 * us, 15);
    expect(levels.highDip?.value).toBeCloseTo(2.8, 9);
    // min(5.5 − 3.5, 2.8 − 1.5, 1.5 − 0.4)
    expect(levels.voltageMargin).toBeCloseTo(1.1, 9);
    // min(5.5 − 2.5, 2.8 − 2.5, 2.5 − 0.4)
    expect(levels.midSupplyVoltageMargin).toBeCloseTo(0.3, 9);
  });

  it("a dip inside the pulse to 2 V is harmless under hysteresis (it stays above the 1.5 V low threshold) but breaks the pulse at mid-supply", () => {
    const levels = levelsOf([[0, 0], [1, 0], [1.004, 5], [1.1, 5], [1.1 + 5 * ns / us, 2], [1.1 + 10 * ns / us, 5], [1.4, 5], [1.404, 0], [2.5, 0]]);
    expect(levels.highDip?.value).toBeCloseTo(2, 9);
    expect(levels.voltageMargin).toBeCloseTo(0.5, 9);
    expect(levels.midSupplyVoltageMargin).toBeCloseTo(-0.5, 9);
  });

  it("a pulse that never reaches the high threshold has a negative margin of the shortfall, and no dip", () => {
    const levels = levelsOf([[0, 0], [1, 0], [1.2, 3.3], [1.4, 3.3], [1.6, 0], [2.5, 0]]);
    expect(levels.highDip).toBeNull();
    expect(levels.voltageMargin).toBeCloseTo(3.3 - 3.5, 9);
    expect(levels.midSupplyVoltageMargin).toBeCloseTo(0.8, 9);
  });
});

const codes = (result: SimResult) => result.verdict.reasons.map((reason) => reason.code);

describe("the voltage margin of a falling staircase (5 V driver of 20 Ω, 220 Ω, 1.5 m beside ground)", () => {
  const input: Case = { driver: { highVoltage: 5, outputResistance: 20 }, seriesResistance: 220, cable: { kind: "beside-ground", length: 1.5 } };

  it("decodes, with no ring-back: each low period only falls, apart from bumps of tens of millivolts", () => {
    const result = run(input);
    expect(result.decoded).toBe(BITS);
    for (const levels of ringingExtremes(result, HIGH, LOW, 0.05)) expect(levels.ringBack).toBe(-Infinity);
  });

  it("is set by the settled levels, 5 V and 0 V against 3.5 V and 1.5 V: about 1.5 V, and no ringing is reported", () => {
    const result = run(input);
    expect(result.metrics.voltageMargin).toBeGreaterThan(1.4);
    expect(result.metrics.voltageMargin).toBeLessThanOrEqual(1.5 + 1e-3);
    expect(result.metrics.midSupplyVoltageMargin).toBeGreaterThan(2.4);
    expect(result.bits.every((bit) => bit.voltageMargin > 1.4)).toBe(true);
    expect(result.verdict).toEqual({ pass: true, reasons: [] });
  });
});

describe("the voltage margin of a ringing run (3.3 V driver of 30 Ω, 33 Ω, 13 m lone lead)", () => {
  const input: Case = { driver: { highVoltage: 3.3, outputResistance: 30 }, seriesResistance: 33, cable: { kind: "lone-lead", length: 13 } };

  it("does not take the high period's ringing, still there when the fall arrives, for ring-back", () => {
    const result = run(input);
    expect(result.decoded).toBe(BITS);
    const extremes = ringingExtremes(result, HIGH, LOW, 0.05);
    // The ring-back after each fall stays well below the low threshold...
    for (const levels of extremes) expect(levels.ringBack).toBeLessThan(LOW - 0.5);
    expect(codes(result)).not.toContain("ringing-undefined-zone");
    // ...so the margin is set by the dips inside the pulses, which graze the low threshold.
    const deepestDip = Math.min(...extremes.map((levels) => levels.dip));
    expect(result.metrics.voltageMargin).toBeCloseTo(deepestDip - LOW, 2);
    expect(result.metrics.voltageMargin).toBeGreaterThan(-0.1);
  });
});

describe("the margin against a single mid-supply threshold counts ringing inside the pulses", () => {
  const ringing: Case = { driver: { highVoltage: 3.3, outputResistance: 30 }, seriesResistance: 33, cable: { kind: "lone-lead", length: 10 } };
  const clean: Case = { driver: { highVoltage: 5, outputResistance: 20 }, seriesResistance: 33, cable: { kind: "beside-ground", length: 10 } };
  const midSupplyReceiver = { highThreshold: 0.52, lowThreshold: 0.48 };

  it("lone lead 10 m, 33 Ω, 3.3 V: ringing dips below VDD/2 in every pulse, the margin is negative and a mid-supply receiver corrupts", () => {
    const result = run(ringing);
    const extremes = ringingExtremes(result, MID, MID, 0.05);
    const deepestDip = Math.min(...extremes.map((levels) => levels.dip));
    expect(deepestDip).toBeLessThan(MID);
    expect(result.metrics.midSupplyVoltageMargin).toBeCloseTo(deepestDip - MID, 2);
    expect(run(ringing, midSupplyReceiver).decoded).not.toBe(BITS);
    expect(codes(result)).toContain("mid-supply-dip");
  });

  it("beside ground 10 m, 33 Ω, 5 V: positive, and a mid-supply receiver decodes", () => {
    const result = run(clean);
    expect(result.metrics.midSupplyVoltageMargin).toBeGreaterThan(0.5);
    expect(run(clean, midSupplyReceiver).decoded).toBe(BITS);
    expect(codes(result)).not.toContain("mid-supply-dip");
  });

});
