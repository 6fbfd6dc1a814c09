/**
 * The solver's building blocks on their own: the pin trace keeps every step within its
 * tolerance, the clamp solve lands on the root of the diode equation (with and without the
 * clamps' series resistance), and recorded stretches are only reused where the edges ahead are
 * the same.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CLAMP_DIODE_MODEL } from "@/lib/sim";
import { clampStepFrom, FarNode, pinEquilibrium, solveClamped } from "@/lib/sim/far-node";
import { SegmentLibrary, type SegmentRecording } from "@/lib/sim/segment-replays";
import { Trace, TRACE_TOLERANCE } from "@/lib/sim/trace";
import { expandTrace } from "@/lib/sim/waveform";

describe("the pin trace", () => {
  /** Steps fed one by one (with gaps, which hold the last value) or in spans, then compared step by step. */
  const feeds = fc.array(
    fc.record({ gap: fc.nat({ max: 40 }), values: fc.array(fc.double({ min: -1, max: 6, noNaN: true }), { minLength: 1, maxLength: 30 }), smooth: fc.boolean(), span: fc.boolean() }),
    { minLength: 1, maxLength: 25 },
  );

  it("passes within TRACE_TOLERANCE of every step fed, and holds the last value over skipped steps", () => {
    fc.assert(
      fc.property(feeds, (pieces) => {
        const trace = new Trace(4);
        const expected: number[] = [];
        let step = 0;
        for (const piece of pieces) {
          const last = expected.length > 0 ? expected[expected.length - 1] : 0;
          for (let g = 0; g < piece.gap && expected.length > 0; g += 1) expected.push(last);
          step = expected.length;
          // Smooth pieces imitate a settling edge, rough ones noise: both must be kept.
          const values = piece.smooth ? piece.values.map((v, i) => last + (v - last) * (1 - Math.exp(-i / 5))) : piece.values;
          if (piece.span) trace.pushSpan(step, Float64Array.from(values), 0, values.length);
          else values.forEach((v, i) => trace.push(step + i, v));
          expected.push(...values);
        }
        trace.finish(expected.length - 1);
        const curve = expandTrace(trace, expected.length);
        for (let n = 0; n < expected.length; n += 1) expect(Math.abs(curve[n] - expected[n])).toBeLessThanOrEqual(TRACE_TOLERANCE * (1 + 1e-9));
      }),
      { numRuns: 200 },
    );
  });

  it("keeps a settling exponential in far fewer breakpoints than steps", () => {
    const trace = new Trace();
    for (let n = 0; n < 2000; n += 1) trace.push(n, 5 * (1 - Math.exp(-n / 17.5)));
    trace.finish(1999);
    expect(trace.count).toBeLessThan(200);
  });

  it("breaks exactly at a rest, so what follows depends on nothing before it", () => {
    const trace = new Trace();
    for (let n = 0; n < 50; n += 1) trace.push(n, Math.sin(n / 3));
    trace.breakAt(60, 2.5);
    trace.finish(80);
    const curve = expandTrace(trace, 81);
    expect(curve[60]).toBe(2.5);
    expect(curve[80]).toBe(2.5);
  });
});

describe("the clamp solve", () => {
  const { saturationCurrent: is, thermalVoltage: vt } = CLAMP_DIODE_MODEL;
  /** G·v − J + Is·(e^((v−VDD)/Vt) − 1) − Is·(e^(−v/Vt) − 1), the pin's equation (lib/sim/README.md). */
  const residual = (g: number, j: number, supply: number, v: number) => g * v - j + is * Math.expm1((v - supply) / vt) - is * Math.expm1(-v / vt);
  /** Bisection to 1e-12 V, as an independent reference. */
  function bisect(g: number, j: number, supply: number): number {
    let low = -5;
    let high = supply + 5;
    for (let k = 0; k < 80; k += 1) {
      const middle = 0.5 * (low + high);
      if (residual(g, j, supply, middle) > 0) high = middle;
      else low = middle;
    }
    return 0.5 * (low + high);
  }

  it("without series resistance, lands within 10 µV of the root from any guess, above the supply and below ground", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 0.5, noNaN: true }),
        fc.double({ min: 0.45, max: 8, noNaN: true }),
        fc.boolean(),
        fc.constantFrom(3.3, 5),
        fc.double({ min: -3, max: 3, noNaN: true }),
        (g, overdrive, above, supply, guessOffset) => {
          const open = above ? supply + overdrive : -overdrive;
          const root = bisect(g, g * open, supply);
          expect(Math.abs(solveClamped(g, g * open, supply, root + guessOffset, 0) - root)).toBeLessThan(1e-5);
          expect(Math.abs(solveClamped(g, g * open, supply, root + guessOffset * 1e-3, 0) - root)).toBeLessThan(1e-5);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("the clamp solve with series resistance", () => {
  const { saturationCurrent: is, thermalVoltage: vt } = CLAMP_DIODE_MODEL;
  /**
   * The current into the conducting rail from a source `open` volts (through conductance g) with
   * the pin left free, solved on its own law, I = Is·(e^((x − I/g − I·Rs)/Vt) − 1) with x the open
   * voltage's distance beyond the rail: I − Is·(e^(…) − 1) rises with I from −∞·… to I = g·x, so
   * bisection on [0, g·x] to 1e-15 A finds it.
   */
  function bisectCurrent(g: number, open: number, supply: number, rs: number): number {
    const beyond = open > supply ? open - supply : -open;
    let low = 0;
    let high = g * beyond;
    for (let k = 0; k < 200 && high - low > 1e-15; k += 1) {
      const current = 0.5 * (low + high);
      if (current - is * Math.expm1((beyond - current / g - current * rs) / vt) > 0) high = current;
      else low = current;
    }
    return 0.5 * (low + high);
  }
  const pinOf = (g: number, open: number, supply: number, current: number) => (open > supply ? open - current / g : open + current / g);
  const circuits = fc.record({
    g: fc.double({ min: 1e-3, max: 0.5, noNaN: true }),
    overdrive: fc.double({ min: 0.45, max: 8, noNaN: true }),
    above: fc.boolean(),
    supply: fc.constantFrom(3.3, 5),
    rs: fc.oneof(fc.double({ min: 0, max: 100, noNaN: true }), fc.constantFrom(0, 5, 1000)),
    guessOffset: fc.double({ min: -3, max: 3, noNaN: true }),
  });

  it("gives the clamp current of the diode-and-resistor law through a known source, from any guess", () => {
    fc.assert(
      fc.property(circuits, ({ g, overdrive, above, supply, rs, guessOffset }) => {
        const open = above ? supply + overdrive : -overdrive;
        const current = bisectCurrent(g, open, supply, rs);
        const pin = pinOf(g, open, supply, current);
        for (const guess of [pin + guessOffset, pin + guessOffset * 1e-3]) {
          const v = solveClamped(g, g * open, supply, guess, rs);
          expect(Math.abs(v - pin)).toBeLessThan(1e-5);
          // The current follows from the pin through the source: within g·10 µV of the law's.
          expect(Math.abs(Math.abs(g * open - g * v) - current)).toBeLessThan(g * 1e-5 + 1e-12);
        }
      }),
      { numRuns: 300 },
    );
  });

  it("is what the pin node steps to with no capacitance, and what it settles to", () => {
    fc.assert(
      fc.property(circuits, ({ g, overdrive, above, supply, rs }) => {
        const open = above ? supply + overdrive : -overdrive;
        const current = bisectCurrent(g, open, supply, rs);
        const node = new FarNode(0, 1e-10, supply, true, rs);
        const v = node.step(open, g);
        expect(Math.abs(v - pinOf(g, open, supply, current))).toBeLessThan(1e-5);
        expect(Math.abs(Math.abs(node.current) - current)).toBeLessThan(g * 1e-5 + 1e-12);
        expect(Math.sign(node.current)).toBe(above ? 1 : -1);
        expect(Math.abs(node.equilibrium(open, g) - v)).toBeLessThan(1e-5);
      }),
      { numRuns: 200 },
    );
  });

  it("with no series resistance is the law without it, and more resistance lets the pin further past its rail", () => {
    const g = 1 / 53;
    const open = 5;
    const supply = 3.3;
    const bare = pinEquilibrium(open, g, supply, true, 0);
    expect(bare).toBe(solveClamped(g, g * open, supply, open, 0));
    const current = bisectCurrent(g, open, supply, 0);
    expect(Math.abs(bare - pinOf(g, open, supply, current))).toBeLessThan(1e-5);
    const withFive = pinEquilibrium(open, g, supply, true, 5);
    const withFifty = pinEquilibrium(open, g, supply, true, 50);
    expect(withFive).toBeGreaterThan(bare);
    expect(withFifty).toBeGreaterThan(withFive);
    // Between the two the junction's drop changes by Vt·ln of the currents' ratio: the rest is the resistance.
    const [i5, i50] = [g * (open - withFive), g * (open - withFifty)];
    expect(withFifty - withFive).toBeCloseTo(50 * i50 - 5 * i5 + vt * Math.log(i50 / i5), 5);
  });
});

describe("the quick clamp step from the last step's answer", () => {
  const { saturationCurrent: is, thermalVoltage: vt } = CLAMP_DIODE_MODEL;

  it("lands within 25 µV of the new root when it answers, with and without series resistance, and declines a long step", () => {
    let answered = 0;
    let answeredWithResistance = 0;
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 0.5, noNaN: true }),
        fc.double({ min: 0.45, max: 6, noNaN: true }),
        fc.boolean(),
        fc.double({ min: -0.05, max: 0.05, noNaN: true }),
        fc.oneof(fc.constant(0), fc.double({ min: 0, max: 100, noNaN: true })),
        (g, overdrive, above, change, rs) => {
          const supply = 5;
          const open = above ? supply + overdrive : -overdrive;
          const previous = solveClamped(g, g * open, supply, open, rs);
          const previousCurrent = g * open - g * previous;
          const next = g * (open + change);
          const root = solveClamped(g, next, supply, previous, rs);
          const quick = clampStepFrom(g, next, supply, previous, previousCurrent, rs);
          if (Number.isNaN(quick)) return;
          answered += 1;
          if (rs > 0) answeredWithResistance += 1;
          expect(Math.abs(quick - root)).toBeLessThan(2.5e-5);
          // The junction behind the resistance sits on its own law: G'·u − D' + Is·(e^(u/Vt) − 1) = 0.
          const sign = above ? 1 : -1;
          const rail = above ? supply : 0;
          const current = sign * (next - g * quick);
          const junction = sign * (quick - rail) - rs * current;
          const scale = 1 / (1 + g * rs);
          const residual = g * scale * junction - sign * (next - g * rail) * scale + is * Math.expm1(junction / vt);
          expect(Math.abs(residual)).toBeLessThan(2.5e-5 * (g * scale + (current + is) / vt));
        },
      ),
      { numRuns: 300 },
    );
    expect(answered).toBeGreaterThan(20);
    expect(answeredWithResistance).toBeGreaterThan(10);
    expect(clampStepFrom(0.1, 0.1 * 6.5, 5, 5.6, 0.05, 0)).toBeNaN();
    expect(clampStepFrom(0.1, 0.1 * 6.5, 5, 5.9, 0.05, 5)).toBeNaN();
  });
});

describe("recorded stretches", () => {
  const recording = (offsets: number[], rising: number[], restAt: number): SegmentRecording => ({
    startsHigh: rising[0] === 0,
    offsets: Int32Array.from(offsets),
    rising: Uint8Array.from(rising),
    restAt,
    farSteps: new Int32Array(1),
    farValues: new Float64Array(1),
    arrivalSteps: new Int32Array(0),
    arrivalValues: new Float64Array(0),
    clampCurrentPeak: 0,
    clampPeakAt: -1,
  });
  // A 0 bit: rise at 0, fall 4000 steps later, rest 9000 steps after the rise.
  const zeroBit = recording([0, 4000], [1, 0], 9000);
  const library = new SegmentLibrary();
  library.add(zeroBit);
  const ramps = Int32Array.from([1000, 5000, 13500, 17500, 26000, 34000]);
  const rising = Uint8Array.from([1, 0, 1, 0, 1, 0]);

  it("are reused where the same edges follow from the same rest, with the next edge after the rest", () => {
    expect(library.find(false, ramps, rising, 0, 100_000)).toBe(zeroBit);
    expect(library.find(false, ramps, rising, 2, 100_000)).toBe(zeroBit);
  });

  it("are not reused for other edge timings, another starting state, an edge before the rest, or past the end of the run", () => {
    expect(library.find(false, ramps, rising, 4, 100_000)).toBeNull();
    expect(library.find(true, ramps, rising, 0, 100_000)).toBeNull();
    expect(library.find(false, Int32Array.from([1000, 5000, 9500]), Uint8Array.from([1, 0, 1]), 0, 100_000)).toBeNull();
    expect(library.find(false, ramps, rising, 0, 9_500)).toBeNull();
  });
});
