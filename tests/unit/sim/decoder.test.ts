import { describe, expect, it } from "vitest";
import { decodeWaveform, type ReceiverRule, type SlotTiming } from "@/lib/sim/decoder";
import type { Waveform } from "@/lib/sim/waveform";

/** Synthetic far-end waveforms: straight lines between the given (time, volts) corners. */
function wave(points: [number, number][]): Waveform {
  return {
    time: Float64Array.from(points.map(([t]) => t)),
    value: Float64Array.from(points.map(([, v]) => v)),
    count: points.length,
  };
}

const ns = 1e-9;
const us = 1e-6;
const rule: ReceiverRule = { rise: 3.5, fall: 1.5, deglitchTime: 10 * ns, minPulse: 0.15 * us, minGap: 0.15 * us, decisionTime: 0.6 * us };
const slots = (bits: string): SlotTiming[] =>
  Array.from(bits, (bit, i) => {
    const start = 1 * us + i * 1.25 * us;
    return { sent: bit === "1" ? 1 : 0, start, fall: start + (bit === "1" ? 0.8 : 0.4) * us };
  });

/** An ideal 5 V pulse train with 4 ns edges, delayed by `delay`. */
function cleanTrain(bits: string, delay = 0): [number, number][] {
  const points: [number, number][] = [[0, 0]];
  for (const slot of slots(bits)) {
    points.push([slot.start + delay, 0], [slot.start + delay + 4 * ns, 5], [slot.fall + delay, 5], [slot.fall + delay + 4 * ns, 0]);
  }
  points.push([20 * us, 0]);
  return points;
}

describe("the receiver rule", () => {
  it("decodes clean pulses by their width against the decision time", () => {
    const decoding = decodeWaveform(wave(cleanTrain("0110")), slots("0110"), 1.25 * us, 0, rule);
    expect(decoding.bits.map((bit) => bit.received).join("")).toBe("0110");
    // 3.5 V is 2.8 ns into the rising edge and 1.5 V is 2.8 ns into the falling one: width = high time.
    expect(decoding.bits[0].width).toBeCloseTo(0.4 * us, 15);
    expect(decoding.bits[0].timingMargin).toBeCloseTo(0.2 * us, 15);
    expect(decoding.bits[1].width).toBeCloseTo(0.8 * us, 15);
    expect(decoding.bits[1].timingMargin).toBeCloseTo(0.2 * us, 15);
    expect(decoding.extraPulses).toHaveLength(0);
  });

  it("reads slots after the line delay", () => {
    const delay = 300 * ns;
    const decoding = decodeWaveform(wave(cleanTrain("10", delay)), slots("10"), 1.25 * us, delay, rule);
    expect(decoding.bits.map((bit) => bit.received).join("")).toBe("10");
  });

  it("keeps a pulse through a dip that stays above the low threshold (hysteresis)", () => {
    const s = slots("1")[0];
    const points: [number, number][] = [[0, 0], [s.start, 0], [s.start + 4 * ns, 5], [s.start + 200 * ns, 5], [s.start + 250 * ns, 2], [s.start + 300 * ns, 5], [s.fall, 5], [s.fall + 4 * ns, 0], [5 * us, 0]];
    const decoding = decodeWaveform(wave(points), slots("1"), 1.25 * us, 0, rule);
    expect(decoding.bits[0].received).toBe("1");
    expect(decoding.filtered).toHaveLength(0);
  });

  it("removes a re-crossing shorter than the deglitch time and reports it", () => {
    const s = slots("1")[0];
    const dip = s.start + 100 * ns;
    const points: [number, number][] = [[0, 0], [s.start, 0], [s.start + 4 * ns, 5], [dip, 5], [dip + 2 * ns, 1], [dip + 6 * ns, 1], [dip + 8 * ns, 5], [s.fall, 5], [s.fall + 4 * ns, 0], [5 * us, 0]];
    const decoding = decodeWaveform(wave(points), slots("1"), 1.25 * us, 0, rule);
    expect(decoding.bits[0].received).toBe("1");
    expect(decoding.filtered).toHaveLength(1);
    expect(decoding.filtered[0].kind).toBe("dip");
    expect(decoding.filtered[0].duration).toBeLessThan(10 * ns);
  });

  it("splits a pulse at a re-crossing longer than the deglitch time, which makes the slot x", () => {
    const s = slots("1")[0];
    const dip = s.start + 300 * ns;
    const points: [number, number][] = [[0, 0], [s.start, 0], [s.start + 4 * ns, 5], [dip, 5], [dip + 2 * ns, 1], [dip + 40 * ns, 1], [dip + 42 * ns, 5], [s.fall, 5], [s.fall + 4 * ns, 0], [5 * us, 0]];
    const decoding = decodeWaveform(wave(points), slots("1"), 1.25 * us, 0, rule);
    expect(decoding.bits[0].received).toBe("x");
    expect(decoding.bits[0].pulses).toHaveLength(2);
    expect(decoding.bits[0].timingMargin).toBeNull();
  });

  it("calls a slot with no pulse x", () => {
    const decoding = decodeWaveform(wave([[0, 0], [5 * us, 3]]), slots("01"), 1.25 * us, 0, rule);
    expect(decoding.bits.map((bit) => bit.received).join("")).toBe("xx");
  });

  it("calls a pulse narrower than minPulse a glitch (x) with a negative margin", () => {
    const s = slots("0")[0];
    const points: [number, number][] = [[0, 0], [s.start, 0], [s.start + 4 * ns, 5], [s.start + 100 * ns, 5], [s.start + 104 * ns, 0], [5 * us, 0]];
    const decoding = decodeWaveform(wave(points), slots("0"), 1.25 * us, 0, rule);
    expect(decoding.bits[0].received).toBe("x");
    expect(decoding.bits[0].glitch).toBe(true);
    expect(decoding.bits[0].timingMargin).toBeLessThan(0);
  });

  it("reads a stretched 0 as 1 and reports the negative margin", () => {
    const s = slots("0")[0];
    const points: [number, number][] = [[0, 0], [s.start, 0], [s.start + 4 * ns, 5], [s.start + 0.7 * us, 5], [s.start + 0.7 * us + 4 * ns, 0], [5 * us, 0]];
    const decoding = decodeWaveform(wave(points), slots("0"), 1.25 * us, 0, rule);
    expect(decoding.bits[0].received).toBe("1");
    expect(decoding.bits[0].timingMargin).toBeLessThan(0);
  });

  it("reports a pulse after the last slot as an extra pulse", () => {
    const points = cleanTrain("0");
    const late = 3 * us;
    points.splice(points.length - 1, 0, [late, 0], [late + 4 * ns, 5], [late + 0.3 * us, 5], [late + 0.3 * us + 4 * ns, 0]);
    const decoding = decodeWaveform(wave(points), slots("0"), 1.25 * us, 0, rule);
    expect(decoding.bits[0].received).toBe("0");
    expect(decoding.extraPulses).toHaveLength(1);
  });
});
