/**
 * Checks of the reference machinery itself, independent of lib/sim: the FFT against a direct DFT,
 * the frequency-domain solution and ngspice against the bounce-diagram closed form and against each
 * other, the netlist, the wrdata parser, the windowed comparison and the receiver rule.
 */
import { describe, expect, it } from "vitest";
import { openEndStaircase } from "./support/bounce-diagram";
import { fft } from "./support/fft";
import { solveInFrequencyDomain } from "./support/frequency-domain";
import { buildNgspiceNetlist, temperatureCelsiusFor } from "./support/ngspice-netlist";
import { parseWrdata, runNgspice } from "./support/ngspice-runner";
import { decodeWaveform, type DecodeSettings } from "./support/receiver-decode";
import { lineDelay, type ReferenceCircuit } from "./support/reference-circuit";
import { windowedError } from "./support/waveform-compare";

const silicon = { saturationCurrent: 1e-14, emissionCoefficient: 1, thermalVoltage: 0.025852, seriesResistance: 0 };

function circuit(overrides: Partial<ReferenceCircuit> = {}): ReferenceCircuit {
  return {
    highVoltage: 5,
    sourceResistance: 150,
    edgeTime: 3e-9,
    line: { resistance: 0, inductance: 5.2e-7, capacitance: 5.2e-11, conductance: 0, length: 10 },
    supplyVoltage: 5,
    inputCapacitance: 1e-12,
    clampDiodes: false,
    diode: silicon,
    receiver: { highThreshold: 0.7, lowThreshold: 0.3, deglitchTime: 0, minPulse: 0.15e-6, decisionTime: 0.6e-6 },
    bits: "1",
    bitPeriod: 5e-6,
    zeroHigh: 1e-6,
    oneHigh: 4e-6,
    leadIn: 1e-6,
    quietTail: 1e-6,
    ...overrides,
  };
}

function valueAt(time: ArrayLike<number>, value: ArrayLike<number>, t: number): number {
  let i = 0;
  while (i < time.length - 1 && time[i + 1] <= t) i++;
  return value[i];
}

describe("radix-2 FFT", () => {
  it("matches a direct DFT and inverts", () => {
    const n = 64;
    const re = Float64Array.from({ length: n }, (_, i) => Math.sin(i * 0.7) + (i % 5));
    const im = Float64Array.from({ length: n }, (_, i) => Math.cos(i * 1.3));
    const [origRe, origIm] = [re.slice(), im.slice()];
    fft(re, im);
    for (const k of [0, 1, 7, 31, 32, 63]) {
      let sr = 0;
      let si = 0;
      for (let m = 0; m < n; m++) {
        const a = (-2 * Math.PI * k * m) / n;
        sr += origRe[m] * Math.cos(a) - origIm[m] * Math.sin(a);
        si += origRe[m] * Math.sin(a) + origIm[m] * Math.cos(a);
      }
      expect(re[k]).toBeCloseTo(sr, 9);
      expect(im[k]).toBeCloseTo(si, 9);
    }
    fft(re, im, true);
    re.forEach((v, i) => expect(v).toBeCloseTo(origRe[i], 12));
  });
});

describe("bounce diagram against both references (lossless line, resistive source, near-open end)", () => {
  // Textbook lattice diagram: Z0 = 100 Ω, Rs = 150 Ω → ρS = 0.2, launched 2 V, far end 4, 4.8, 4.96 V …
  const step = circuit();
  const td = lineDelay(step);
  const levels = openEndStaircase(5, 150, 100, 4);
  const plateauMiddles = levels.map((_, k) => step.leadIn + (2 * k + 2) * td);

  it("closed form gives the textbook levels", () => {
    expect(levels[0]).toBeCloseTo(4, 12);
    expect(levels[1]).toBeCloseTo(4.8, 12);
    expect(levels[2]).toBeCloseTo(4.96, 12);
  });

  it("frequency-domain solution lands on each plateau within 5 mV", () => {
    const result = solveInFrequencyDomain(step);
    expect(result.quietBeforeLeadIn).toBeLessThan(1e-3);
    plateauMiddles.forEach((t, k) => expect(Math.abs(valueAt(result.time, result.farEnd, t) - levels[k])).toBeLessThan(5e-3));
  });

  it("ngspice (lossless T) lands on each plateau within 5 mV", async () => {
    const result = await runNgspice(step);
    plateauMiddles.forEach((t, k) => expect(Math.abs(valueAt(result.time, result.vectors["v(far)"], t) - levels[k])).toBeLessThan(5e-3));
  });
});

describe("ngspice and the frequency-domain solution agree on a lossless linear pulse train", () => {
  it("ringing case, lone-lead-like line with a low source resistance, within 30 mV", async () => {
    const ringing = circuit({
      sourceResistance: 50,
      line: { resistance: 0, inductance: 1.28e-6, capacitance: 1.05e-11, conductance: 0, length: 10 },
      inputCapacitance: 5e-12,
      bits: "0110",
      bitPeriod: 1.25e-6,
      zeroHigh: 0.4e-6,
      oneHigh: 0.8e-6,
    });
    const [spice, exact] = [await runNgspice(ringing), solveInFrequencyDomain(ringing)];
    expect(exact.quietBeforeLeadIn).toBeLessThan(1e-3);
    const error = windowedError({ time: spice.time, value: spice.vectors["v(far)"] }, { time: exact.time, value: exact.farEnd });
    expect(error.maxError).toBeLessThan(0.03);
    const nearError = windowedError({ time: spice.time, value: spice.vectors["v(near)"] }, { time: exact.time, value: exact.nearEnd });
    expect(nearError.maxError).toBeLessThan(0.03);
  });
});

describe("ngspice netlist", () => {
  it("uses the lossless T element, a 0.1 ns step and maximum step, and the pulse train's breakpoints", () => {
    const text = buildNgspiceNetlist(circuit({ bits: "10", bitPeriod: 1.25e-6, oneHigh: 0.8e-6, zeroHigh: 0.4e-6 }), { outputFile: "/tmp/x.txt" });
    expect(text).toMatch(/^tline near 0 far 0 Z0=1\.00000000000e\+2 TD=5\.20000000000e-8 /m);
    expect(text).toMatch(/^\.tran 1\.00000000000e-10 \S+ 0 1\.00000000000e-10$/m);
    expect(text).toContain("1.00000000000e-6 0 1.00300000000e-6 5.00000000000e+0 1.80000000000e-6 5.00000000000e+0 1.80300000000e-6 0");
    expect(text).toContain("wrdata /tmp/x.txt v(near) v(far)");
  });

  it("refuses a lossy line: the T element cannot represent it", () => {
    expect(() => buildNgspiceNetlist(circuit({ line: { resistance: 0.1, inductance: 5e-7, capacitance: 5e-11, conductance: 0, length: 1 } }))).toThrow(/lossless/);
  });

  it("sets the temperature so that kT/q equals the diode law's thermal voltage, and gives the diode its series resistance", () => {
    expect(temperatureCelsiusFor(0.025852)).toBeCloseTo(26.85, 1);
    expect(buildNgspiceNetlist(circuit({ clampDiodes: true }))).toMatch(/^\.model clamp D\(IS=1\.00000000000e-14 N=1\.00000000000e\+0 RS=0\)$/m);
    const resisted = circuit({ clampDiodes: true, diode: { ...silicon, seriesResistance: 4.7 } });
    expect(buildNgspiceNetlist(resisted)).toMatch(/^\.model clamp D\(IS=1\.00000000000e-14 N=1\.00000000000e\+0 RS=4\.70000000000e\+0\)$/m);
  });

  it("settles a clamped pin where the diode-and-resistor law puts it (RS = 0 and 20 Ω)", async () => {
    // 8 V behind 150 Ω into a 5 V pin: the upper clamp carries about 15 mA once the line is quiet.
    const settled = async (seriesResistance: number) => {
      const held = circuit({ highVoltage: 8, clampDiodes: true, diode: { ...silicon, seriesResistance } });
      const result = await runNgspice(held);
      return valueAt(result.time, result.vectors["v(far)"], held.leadIn + held.oneHigh - 0.1e-6);
    };
    /** The pin x volts above 5 V passes (8 − 5 − x)/150 A, which the law needs at junction x − I·Rs: bisection on x. */
    const law = (rs: number) => {
      let [low, high] = [0, 3];
      for (let k = 0; k < 100; k++) {
        const x = 0.5 * (low + high);
        const current = (3 - x) / 150;
        if (current > silicon.saturationCurrent * Math.expm1((x - current * rs) / silicon.thermalVoltage)) low = x;
        else high = x;
      }
      return 5 + 0.5 * (low + high);
    };
    const [bare, resisted] = [await settled(0), await settled(20)];
    expect(Math.abs(bare - law(0))).toBeLessThan(2e-3);
    expect(Math.abs(resisted - law(20))).toBeLessThan(2e-3);
    expect(resisted - bare).toBeGreaterThan(0.2);
  });

  it("clamped far end stays within the rails plus a diode drop while the open line would reach 2·V", async () => {
    const hard = circuit({ sourceResistance: 20, clampDiodes: true, bits: "1", line: { resistance: 0, inductance: 1.28e-6, capacitance: 1.05e-11, conductance: 0, length: 10 } });
    const result = await runNgspice(hard);
    const far = Array.from(result.vectors["v(far)"]);
    const highest = far.reduce((a, b) => Math.max(a, b));
    expect(highest).toBeLessThan(5 + 0.9);
    expect(highest).toBeGreaterThan(5 + 0.4);
    expect(far.reduce((a, b) => Math.min(a, b))).toBeGreaterThan(-0.9);
    expect(Array.from(result.vectors["i(vclamphigh)"]).reduce((a, b) => Math.max(a, b))).toBeGreaterThan(1e-3);
  });
});

describe("wrdata parser", () => {
  it("reads the shared time column and named vectors", () => {
    const parsed = parseWrdata(" time v(near) v(far)\n 0.0 1.5 2.5\n 1e-9 1.6 -2.5e-1\n");
    expect(Array.from(parsed.time)).toEqual([0, 1e-9]);
    expect(Array.from(parsed.vectors["v(far)"])).toEqual([2.5, -0.25]);
  });
});

describe("windowed waveform error (docs/simulator.md: smallest difference within ±0.5 ns)", () => {
  const ramp = (shift: number, offset: number) => {
    const time = Array.from({ length: 200 }, (_, i) => i * 0.1e-9);
    return { time, value: time.map((t) => Math.min(5, Math.max(0, ((t - 5e-9 - shift) / 3e-9) * 5)) + offset) };
  };

  it("ignores a 0.3 ns shift of a 3 ns edge", () => {
    expect(windowedError(ramp(0, 0), ramp(0.3e-9, 0)).maxError).toBeLessThan(1e-9);
  });

  it("sees the shift beyond the window: 0.8 ns on a 3 ns 5 V edge leaves 0.5 V", () => {
    expect(windowedError(ramp(0, 0), ramp(0.8e-9, 0)).maxError).toBeCloseTo(0.5, 6);
  });

  it("sees a voltage offset in full", () => {
    expect(windowedError(ramp(0, 0), ramp(0, 0.1)).maxError).toBeCloseTo(0.1, 9);
  });
});

describe("receiver rule (docs/simulator.md)", () => {
  const settings: DecodeSettings = {
    supplyVoltage: 5,
    highThreshold: 0.7,
    lowThreshold: 0.3,
    deglitchTime: 20e-9,
    minPulse: 0.15e-6,
    decisionTime: 0.6e-6,
    leadIn: 1e-6,
    bitPeriod: 1.25e-6,
    bitCount: 3,
    slotOffset: 0,
  };
  /** Piecewise-linear wave from [time, value] corners. */
  const wave = (corners: [number, number][]) => ({ time: corners.map((c) => c[0]), value: corners.map((c) => c[1]) });
  const pulse = (start: number, width: number, top = 5): [number, number][] => [
    [start, 0],
    [start + 5e-9, top],
    [start + width, top],
    [start + width + 5e-9, 0],
  ];

  it("decodes clean pulses by width", () => {
    const w = wave([[0, 0], ...pulse(1e-6, 0.4e-6), ...pulse(2.25e-6, 0.8e-6), ...pulse(3.5e-6, 0.4e-6), [6e-6, 0]]);
    expect(decodeWaveform(w, settings).decoded).toBe("010");
  });

  it("a dip below the low threshold ends the pulse: two pulses make x", () => {
    const w = wave([[0, 0], ...pulse(1e-6, 0.2e-6), ...pulse(1.25e-6, 0.2e-6), ...pulse(2.25e-6, 0.8e-6), ...pulse(3.5e-6, 0.4e-6), [6e-6, 0]]);
    expect(decodeWaveform(w, settings).decoded).toBe("x10");
  });

  it("a dip shorter than the deglitch time is ignored; one between the thresholds is no dip at all", () => {
    const short: [number, number][] = [[2.5e-6, 5], [2.505e-6, 0.5], [2.51e-6, 5]];
    const shallow: [number, number][] = [[3.6e-6, 5], [3.65e-6, 2], [3.7e-6, 5]];
    const w = wave([[0, 0], ...pulse(1e-6, 0.4e-6), [2.25e-6, 0], [2.255e-6, 5], ...short, [3.05e-6, 5], [3.055e-6, 0], [3.5e-6, 0], [3.505e-6, 5], ...shallow, [4.3e-6, 5], [4.305e-6, 0], [6e-6, 0]]);
    expect(decodeWaveform(w, settings).decoded).toBe("011");
  });

  it("a pulse narrower than minPulse is a glitch; a pulse that never reaches the high threshold is missing", () => {
    const w = wave([[0, 0], ...pulse(1e-6, 0.1e-6), ...pulse(2.25e-6, 0.8e-6, 3.3), ...pulse(3.5e-6, 0.4e-6), [6e-6, 0]]);
    expect(decodeWaveform(w, settings).decoded).toBe("xx0");
  });
});
