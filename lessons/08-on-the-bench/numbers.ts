import { cableCatalogue } from "@/lib/sim";
import { numbers as pixelDataStream } from "../01-pixel-data-stream/numbers";
import { buffer5v } from "../drivers";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { rcRiseTime } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";

const { sim } = sharedNumbers;
const PRACTICE = "common practice (read the probe's own markings)";
const PREMISE = "the lesson's worked example (a premise)";
/** Scope rise time ≈ 0.35 / bandwidth: the textbook approximation for a first-order response, ln 9 / 2π. */
const SCOPE_FACTOR = 0.35;
const TRUE_EDGE = 10e-9;
const PROBE_C = 10e-12;
const INPUT_C = sim.inputCapacitance.value;
const GROUND_LEAD_LENGTH = 0.15;
const INDUCTANCE_PER_METRE = 1e-6;
const SPRING_INDUCTANCE = 10e-9;
const SCREEN_DIVISIONS = 10;
const BIT_TIMEBASE = 1e-6;

const scopeRise = (bandwidth: number) => SCOPE_FACTOR / bandwidth;
const resonance = (inductance: number, capacitance: number) => 1 / (2 * Math.PI * Math.sqrt(inductance * capacitance));
const damping = (resistance: number, inductance: number, capacitance: number) => (resistance / 2) * Math.sqrt(capacitance / inductance);

function scope(bandwidth: number) {
  const rise = scopeRise(bandwidth);
  return {
    bandwidth: q(bandwidth, "MHz", 0, PREMISE),
    rise: q(rise, "ns", 1, "0.35 / bandwidth"),
    sumOfSquares: q((TRUE_EDGE * 1e9) ** 2 + (rise * 1e9) ** 2, "", 2, "t_signal² + t_scope², in ns²"),
    seen: q(Math.hypot(TRUE_EDGE, rise), "ns", 1, "√(t_signal² + t_scope²)"),
  };
}

/** The rise the far-end capacitance adds behind Z0: τ = Z0 × C, rise = τ × ln 9. */
function farEndRise(z0: number, capacitance: number) {
  return q(rcRiseTime(z0 * capacitance), "ns", 1, "ln 9 × Z0 × C");
}

const lead = GROUND_LEAD_LENGTH * INDUCTANCE_PER_METRE;
const wanted = buffer5v.edgeTime / 3;
const lone = cableCatalogue["lone-lead"];
const beside = cableCatalogue["beside-ground"];
const scope100 = scope(100e6);
const scope20 = scope(20e6);

export const numbers = {
  threeDb: q(10 ** (-3 / 20), "%", 0, "−3 dB as a fraction of the amplitude: 10^(−3/20)"),
  scopeFactor: q(SCOPE_FACTOR, "", 2, "textbook approximation: scope rise ≈ ln 9 / (2π × bandwidth)"),
  scope100: { ...scope100, added: q(Math.hypot(TRUE_EDGE, scope100.rise.value) / TRUE_EDGE - 1, "%", 0, "seen rise ÷ true rise − 1") },
  scope50: { bandwidth: scope(50e6).bandwidth, rise: q(scopeRise(50e6), "ns", 0, "0.35 / bandwidth") },
  scope20: { bandwidth: scope20.bandwidth, rise: scope20.rise, seen: scope20.seen },
  trueEdge: q(TRUE_EDGE, "ns", 0, PREMISE),
  fastScope: {
    rise: q(wanted, "ns", 0, "a third of the 5 V buffer's edge (common practice)"),
    bandwidth: q(SCOPE_FACTOR / wanted, "MHz", 0, "0.35 / rise time"),
  },
  probe: {
    resistance: q(10e6, "MΩ", 0, PRACTICE),
    capacitance: q(PROBE_C, "pF", 0, PRACTICE),
    withPixel: q(PROBE_C + INPUT_C, "pF", 0, "probe + the pixel's input capacitance"),
  },
  loading: {
    lonePixel: farEndRise(lone.z0, INPUT_C),
    loneProbe: farEndRise(lone.z0, INPUT_C + PROBE_C),
    besideProbe: farEndRise(beside.z0, INPUT_C + PROBE_C),
  },
  ground: {
    length: q(GROUND_LEAD_LENGTH, "cm", 0, PRACTICE),
    inductance: q(lead, "nH", 0, "length × about 1 nH per millimetre (rule of thumb)"),
    frequency: q(resonance(lead, PROBE_C), "MHz", 0, "f = 1 / (2π × √(L × C))"),
    besideHalfR: q(Math.round(beside.z0) / 2, "Ω", 0, "R / 2 with R ≈ Z0 of data beside ground"),
    besideDamping: q(damping(beside.z0, lead, PROBE_C), "", 2, "ζ = (R / 2) × √(C / L)"),
    loneDamping: q(damping(lone.z0, lead, PROBE_C), "", 1, "ζ = (R / 2) × √(C / L)"),
    spring: q(SPRING_INDUCTANCE, "nH", 0, PRACTICE),
    springFrequency: q(resonance(SPRING_INDUCTANCE, PROBE_C), "MHz", 0, "f = 1 / (2π × √(L × C))"),
  },
  bits: {
    timebase: q(BIT_TIMEBASE, "µs/div", 0, "the setting the lesson recommends"),
    divisions: q(SCREEN_DIVISIONS, "", 0, "horizontal divisions of a usual scope screen"),
    slots: q((SCREEN_DIVISIONS * BIT_TIMEBASE) / sim.bitPeriod.value, "", 0, "divisions × timebase ÷ bit period"),
  },
  longLatch: pixelDataStream.longLatch,
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";

/** Each learner's premises for the quick checks, away from the lesson's worked scopes and probe, and the answers computed from them. */
export const checkGivens = {
  scopeRise: [60e6, 70e6, 150e6, 200e6].map((bandwidth) => ({ ...scope(bandwidth), bandwidth: q(bandwidth, "MHz", 0, GIVEN) })),
  measuredRise: [40e6, 60e6, 70e6, 80e6].map((bandwidth) => ({ ...scope(bandwidth), bandwidth: q(bandwidth, "MHz", 0, GIVEN) })),
  groundRing: [0.05, 0.1, 0.2, 0.3].map((length) => {
    const inductance = length * INDUCTANCE_PER_METRE;
    const rootLC = Math.sqrt(inductance * PROBE_C);
    return {
      inductance: q(inductance, "nH", 0, GIVEN),
      rootLC: q(rootLC, "ns", 3, "√(L × C)"),
      period: q(2 * Math.PI * rootLC, "ns", 2, "2π × √(L × C)"),
      frequency: q(resonance(inductance, PROBE_C), "MHz", 0, "f = 1 / (2π × √(L × C))"),
    };
  }),
  probeLoading: [7e-12, 12e-12, 14e-12, 20e-12].map((capacitance) => ({
    capacitance: q(capacitance, "pF", 0, GIVEN),
    withPixel: q(capacitance + INPUT_C, "pF", 0, "probe + the pixel's input capacitance"),
    tau: q(lone.z0 * (INPUT_C + capacitance), "ns", 1, "τ = Z0 × C"),
    rise: farEndRise(lone.z0, INPUT_C + capacitance),
  })),
};

export const plainNumbers: PlainNumber[] = [
  { text: "(−3 dB)", why: "the definition of bandwidth" },
  { text: "10:1", why: "the division ratio that names the probe type" },
  { text: "ζ = (R / 2)", why: "the damping formula" },
  { text: "5 to 10 ns/div", why: "the timebase the lesson recommends for edges (common practice)" },
  { text: "at 20 to 50 µs/div", why: "the timebase the lesson recommends for the latch gap (common practice)" },
];
