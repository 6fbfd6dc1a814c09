import { cableCatalogue, eSeriesValues, type CableKind } from "@/lib/sim";
import { buffer5v, controllerPin3v3 } from "../drivers";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { arrivalTime, farEndAfter, reflection } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import { simulatedNumbers } from "../numbers/simulated-numbers";
import { PIN_3V3_WINDOW } from "../source-window";
import { lab } from "./lab";

const { pixel, sim, catalogue, typical } = sharedNumbers;
const PREMISE = "the lesson's worked example (a premise)";
const FIELD_RULE = "the installers' rule of thumb the lesson examines (common practice of the trade)";
const PIN_V = controllerPin3v3.highVoltage;
const PIN_R = controllerPin3v3.outputResistance;
const HIGH = pixel.high.value;
const RISE = typical.highestRise.value;
const FALL = typical.topFall.value;
const lone = cableCatalogue["lone-lead"];
const beside = cableCatalogue["beside-ground"];
const threeCore = cableCatalogue["three-core"];

const RUN_LENGTH = 10;
const FIELD_LONE = 250;
const FIELD_BESIDE = 33;
/** The voltage margin the 3.3 V window asks for on each side (lessons/source-window.ts). */
const MARGIN = 0.3;
const THREE_CORE_LENGTH = 15;
const WINDOW = "the 3.3 V window for typical pixels (lessons/source-window.ts)";

/** The nearest E12 values either side of `ohms`. */
function e12Neighbours(ohms: number) {
  const values = eSeriesValues("E12", ohms / 2, ohms * 2);
  const source = "nearest IEC 60063 E12 values (lib/sim eSeriesValues)";
  return {
    below: q(Math.max(...values.filter((v) => v <= ohms)), "Ω", 0, source),
    above: q(Math.min(...values.filter((v) => v >= ohms)), "Ω", 0, source),
  };
}

function matching(z0: number) {
  const series = z0 - PIN_R;
  return { series: q(series, "Ω", 0, "R_s = Z0 − R_out"), ...e12Neighbours(series) };
}

/** The pin behind `series` on a line of z0: the source resistance and its reflection coefficient. */
function source(series: number, z0: number) {
  const resistance = PIN_R + series;
  return {
    resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"),
    gamma: q(reflection(resistance, z0), "", 2, "Γs = (R_src − Z0) / (R_src + Z0)"),
  };
}

/** The pin's first two arrivals at the open far end (lesson 5's bounce arithmetic, no clamps). */
function arrivals(series: number, z0: number) {
  const gamma = reflection(PIN_R + series, z0);
  const first = farEndAfter(PIN_V, gamma, 1);
  const second = farEndAfter(PIN_V, gamma, 2);
  return {
    first: q(first, "V", 2, "V × (1 − Γs)"),
    second: q(second, "V", 2, "V × (1 − Γs²)"),
    riseMargin: q(first - RISE, "V", 2, "first arrival − the highest typical rise level"),
    fallMargin: q(second - FALL, "V", 2, "second arrival − the highest typical fall level"),
  };
}

/** The far end's first four steps behind a source above the match. */
function staircase(series: number, z0: number) {
  const gamma = reflection(PIN_R + series, z0);
  const step = (n: number) => q(farEndAfter(PIN_V, gamma, n), "V", 2, "V × (1 − Γs^n)");
  return { n1: step(1), n2: step(2), n3: step(3), n4: step(4) };
}

function windowOn(kind: CableKind) {
  const { z0 } = cableCatalogue[kind];
  return {
    low: q(Math.max(0, PIN_3V3_WINDOW.lower * z0 - PIN_R), "Ω", 0, `${WINDOW} × Z0 − the pin's resistance`),
    high: q(PIN_3V3_WINDOW.upper * z0 - PIN_R, "Ω", 0, `${WINDOW} × Z0 − the pin's resistance`),
  };
}

const gammaOf = (fraction: number) => (fraction - 1) / (fraction + 1);

/** Lesson 6's 5 V staircase on 15 m of three-core behind `series`. */
function threeCoreStaircase(series: number) {
  const resistance = buffer5v.outputResistance + series;
  const gamma = reflection(resistance, threeCore.z0);
  const passAt = 1 - HIGH / buffer5v.highVoltage;
  const arrival = Math.ceil(Math.log(passAt) / Math.log(gamma));
  const delay = THREE_CORE_LENGTH * threeCore.delayPerMetre;
  const POWERS = "Γs^n";
  return {
    series: q(series, "Ω", 0, PREMISE),
    resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"),
    gamma: q(gamma, "", 3, "Γs = (R_src − Z0) / (R_src + Z0)"),
    before: q(gamma ** (arrival - 1), "", 2, POWERS),
    at: q(gamma ** arrival, "", 2, POWERS),
    previous: q(arrival - 1, "", 0, "the arrival before the crossing"),
    arrival: q(arrival, "", 0, "first n with Γs^n < 1 − V_th / V"),
    factor: q(2 * arrival - 1, "", 0, "2n − 1"),
    crossing: q(arrivalTime(arrival, delay), "ns", 0, "(2n − 1) × T_d"),
  };
}

const threeCoreDelay = THREE_CORE_LENGTH * threeCore.delayPerMetre;
const fallAtFarEnd = sim.zeroHigh.value + threeCoreDelay;
const fast = threeCoreStaircase(330);

export const numbers = {
  field: { lone: q(FIELD_LONE, "Ω", 0, FIELD_RULE), beside: q(FIELD_BESIDE, "Ω", 0, FIELD_RULE) },
  run: { length: q(RUN_LENGTH, "m", 0, PREMISE) },
  plateau: q(2 * RUN_LENGTH * lone.delayPerMetre, "ns", 0, "round trip on 10 m of lone lead"),
  halfLevel: q(buffer5v.highVoltage / 2, "V", 1, "half the 5 V driver's level"),
  match: { lone: matching(lone.z0), beside: matching(beside.z0) },
  zRatio: q(lone.z0 / beside.z0, "", 1, "ratio of the catalogue's Z0s"),
  onLone: {
    field: {
      ...source(FIELD_LONE, lone.z0),
      ...arrivals(FIELD_LONE, lone.z0),
    },
    small: { ...source(FIELD_BESIDE, lone.z0), first: arrivals(FIELD_BESIDE, lone.z0).first, second: arrivals(FIELD_BESIDE, lone.z0).second },
  },
  onBeside: {
    field: { ...source(FIELD_LONE, beside.z0), staircase: staircase(FIELD_LONE, beside.z0) },
    small: { ...source(FIELD_BESIDE, beside.z0), ...arrivals(FIELD_BESIDE, beside.z0) },
  },
  settledClearance: q(PIN_V - RISE, "V", 3, "the pin's level − the highest typical rise level"),
  window: {
    margin: q(MARGIN, "V", 1, WINDOW),
    needed: q((RISE + MARGIN) / PIN_V, "", 3, "(highest typical rise level + m) / V"),
    upperGamma: q(gammaOf(PIN_3V3_WINDOW.upper), "", 3, WINDOW),
    lowerGamma: q(-gammaOf(PIN_3V3_WINDOW.lower), "", 3, WINDOW),
    upperFraction: q(PIN_3V3_WINDOW.upper, "", 2, WINDOW),
    lowerFraction: q(PIN_3V3_WINDOW.lower, "", 2, WINDOW),
    lone: windowOn("lone-lead"),
    beside: windowOn("beside-ground"),
    twisted: windowOn("twisted-pair"),
    coax: windowOn("coax-75"),
    threeCore: windowOn("three-core"),
    besideSource: q(PIN_3V3_WINDOW.upper * beside.z0, "Ω", 1, `${WINDOW} × Z0`),
  },
  simulator: simulatedNumbers("seriesTermination"),
  fiveVolt: {
    low: q(33, "Ω", 0, "the lesson's claim, checked in tests/unit/lessons/lesson-claims.test.ts"),
    high: q(249, "Ω", 0, "the lesson's claim, checked in tests/unit/lessons/lesson-claims.test.ts"),
    passAt: q(1 - HIGH / buffer5v.highVoltage, "", 1, "1 − V_th / V"),
  },
  threeCoreRun: {
    length: q(THREE_CORE_LENGTH, "m", 0, PREMISE),
    delay: q(threeCoreDelay, "ns", 1, "length × delay per metre (catalogue)"),
    fall: q(fallAtFarEnd, "ns", 0, "0-bit high time + T_d"),
    capacitance: q(THREE_CORE_LENGTH * threeCore.perMetre.capacitance, "pF", 0, "C′ × length (catalogue)"),
    fast: { ...fast, lead: q(fallAtFarEnd - fast.crossing.value, "ns", 0, "fall at the far end − crossing") },
    slow: threeCoreStaircase(390),
  },
  shortRuns: {
    least: q(2 * catalogue.delayLeast.value, "ns", 0, "2 m × the catalogue's smallest delay per metre"),
    most: q(3 * catalogue.delayMost.value, "ns", 0, "3 m × the catalogue's largest delay per metre"),
  },
  lab: {
    voltageMargin: q(lab.passRule.minVoltageMargin, "V", 1, "the lab's pass rule (lab.ts)"),
    timingMargin: q(lab.passRule.minTimingMargin, "ns", 0, "the lab's pass rule (lab.ts)"),
  },
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";

/** Each learner's premises for the quick checks, away from the lesson's worked resistors, and the answers computed from them. */
export const checkGivens = {
  firstArrival: [120, 150, 160, 180].map((series) => ({
    series: q(series, "Ω", 0, GIVEN),
    ...source(series, lone.z0),
    first: arrivals(series, lone.z0).first,
  })),
  staircaseArrival: [150, 180, 560, 680].map((series) => ({ ...threeCoreStaircase(series), series: q(series, "Ω", 0, GIVEN) })),
};

export const plainNumbers: PlainNumber[] = [
  { text: "V / 2", why: "half the driver's level, in the formulas of a matched line" },
  { text: "10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82", why: "the E12 values of IEC 60063; course-numbers.test.ts checks them against lib/sim eSeriesValues" },
  { text: "11, 13, 16, 20, 24, 30, 36, 43, 51, 62, 75, 91", why: "the values E24 adds to E12 (IEC 60063); checked the same way" },
  { text: "up to 2 or 3 m nearly anything works", why: "the installers' rule of thumb, as they pass it on" },
  { text: "Up to **2–3 m**", why: "the installers' rule of thumb, as they pass it on" },
  { text: "2 × V × Z0", why: "the doubled first arrival, in the formula" },
  { text: "2 × {{pin.volts}} ×", why: "the doubled first arrival, in the formula" },
  { text: "## Why 3.3 V makes the rule decisive", why: "the controller-pin class in a heading" },
  { text: "## The 3.3 V design window", why: "the controller-pin class in a heading" },
  { text: "decisive at 3.3 V into a", why: "the controller-pin class" },
  { text: "At 3.3 V the simulator is less kind", why: "the controller-pin class" },
];
