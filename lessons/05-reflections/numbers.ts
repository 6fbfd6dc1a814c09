import { cableCatalogue, RECEIVER_DEFAULTS } from "@/lib/sim";
import { buffer5v, controllerPin3v3 } from "../drivers";
import { COURSE_CLAMP_CURRENT_LIMIT } from "../pass-rule";
import { lab } from "./lab";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { arrivalTime, farEndAfter, launchedStep, reflection, settlingArrival } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";

const { pixel } = sharedNumbers;
const PREMISE = "the lesson's worked example (a premise)";
const lone = cableCatalogue["lone-lead"];
const beside = cableCatalogue["beside-ground"];
const RUN_LENGTH = 10;
const SHORT_LENGTH = 5;

/** A source of `volts` behind `resistance` on `length` of a cable of z0, open at the far end. */
function bounce(volts: number, resistance: number, z0: number, delayPerMetre: number, length = RUN_LENGTH) {
  const gamma = reflection(resistance, z0);
  const delay = length * delayPerMetre;
  return { gamma, delay, far: (n: number) => farEndAfter(volts, gamma, n), at: (n: number) => arrivalTime(n, delay) };
}

const FAR = "V × (1 − Γs^n)";
const AT = "(2n − 1) × T_d";
const GAMMA = "Γs = (R_src − Z0) / (R_src + Z0)";

/** Case 1: the 5 V buffer straight into 10 m of lone lead. */
function caseOne() {
  const line = bounce(buffer5v.highVoltage, buffer5v.outputResistance, lone.z0, lone.delayPerMetre);
  const arrivals = Object.fromEntries([1, 2, 3, 4, 5].map((n) => [`n${n}`, q(line.far(n), "V", 2, FAR)]));
  const powers = Object.fromEntries([1, 2, 3].map((n) => [`p${n}`, q(line.gamma ** n, "", 3, "Γs^n")]));
  const period = 4 * line.delay;
  return {
    delay: q(line.delay, "ns", 1, "length × delay per metre (catalogue)"),
    launched: q(launchedStep(buffer5v.highVoltage, buffer5v.outputResistance, lone.z0), "V", 2, "V × Z0 / (R_src + Z0)"),
    gamma: q(line.gamma, "", 3, GAMMA),
    powers,
    far: arrivals,
    at: { n2: q(line.at(2), "ns", 0, AT), n3: q(line.at(3), "ns", 0, AT) },
    period: q(period, "ns", 0, "four one-way delays"),
    frequency: q(1 / period, "MHz", 1, "1 / period"),
    overshoot: q(line.far(1) - buffer5v.highVoltage, "V", 1, "first arrival − settled level"),
    clampCurrent: q((line.far(1) - pixel.clamp.value) / lone.z0, "mA", 0, "(V_far(1) − clamp level) / Z0"),
  };
}

/** Cases 2 and 3: the 5 V buffer through `series` into 10 m of data beside ground. */
function besideCase(series: number, arrivalsShown: number) {
  const resistance = buffer5v.outputResistance + series;
  const line = bounce(buffer5v.highVoltage, resistance, beside.z0, beside.delayPerMetre);
  const far = Object.fromEntries(Array.from({ length: arrivalsShown }, (_, i) => [`n${i + 1}`, q(line.far(i + 1), "V", 2, FAR)]));
  return { line, series: q(series, "Ω", 0, PREMISE), resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"), gamma: q(line.gamma, "", 3, GAMMA), far };
}

function caseTwo() {
  const { line, series, resistance, gamma, far } = besideCase(33, 3);
  return {
    series,
    resistance,
    gamma,
    far,
    overshoot: q(line.far(1) - buffer5v.highVoltage, "V", 1, "first arrival − settled level"),
    clampCurrent: q((line.far(1) - pixel.clamp.value) / beside.z0, "mA", 0, "(V_far(1) − clamp level) / Z0"),
  };
}

function caseThree() {
  const { line, series, resistance, gamma, far } = besideCase(270, 5);
  const crossing = settlingArrival(line.gamma, 1 - pixel.high.value / buffer5v.highVoltage);
  return {
    series,
    resistance,
    gamma,
    far,
    roundTrip: q(2 * line.delay, "ns", 0, "2 × T_d"),
    delay: q(line.delay, "ns", 1, "length × delay per metre (catalogue)"),
    crossArrival: q(crossing, "", 0, "first n with V × (1 − Γs^n) above the high threshold"),
    crossFactor: q(2 * crossing - 1, "", 0, "2n − 1"),
    crossAt: q(line.at(crossing), "ns", 0, AT),
  };
}

/** The fourth case: the controller pin behind 100 Ω into 10 m of lone lead, step by step. */
function caseFour() {
  const series = 100;
  const resistance = controllerPin3v3.outputResistance + series;
  const volts = controllerPin3v3.highVoltage;
  const line = bounce(volts, resistance, lone.z0, lone.delayPerMetre);
  const launched = launchedStep(volts, resistance, lone.z0);
  const rows = Object.fromEntries(
    [1, 2, 3, 4, 5, 6].map((n) => [
      `n${n}`,
      {
        at: q(line.at(n), "ns", n === 1 ? 1 : 0, AT),
        step: q(2 * launched * line.gamma ** (n - 1), "V", 2, "2 × V_launch × Γs^(n − 1)"),
        far: q(line.far(n), "V", 2, FAR),
      },
    ]),
  );
  const settled = settlingArrival(line.gamma, 0.01);
  const short = bounce(volts, resistance, lone.z0, lone.delayPerMetre, SHORT_LENGTH);
  return {
    series: q(series, "Ω", 0, PREMISE),
    resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"),
    total: q(resistance + lone.z0, "", 0, "R_src + Z0"),
    gamma: q(line.gamma, "", 3, GAMMA),
    launched: q(launched, "V", 2, "V × Z0 / (R_src + Z0)"),
    delay: q(line.delay, "ns", 1, "length × delay per metre (catalogue)"),
    roundTrip: q(2 * line.delay, "ns", 0, "2 × T_d"),
    returned: q(line.gamma * launched, "V", 2, "Γs × V_launch"),
    rows,
    settlingRatio: q(Math.log(0.01) / Math.log(Math.abs(line.gamma)), "", 1, "ln 0.01 / ln |Γs|"),
    settledArrival: q(settled, "", 0, "first n with |Γs|^n < 0.01"),
    settledFactor: q(2 * settled - 1, "", 0, "2n − 1"),
    settledAt: q(line.at(settled), "ns", 0, AT),
    shortLength: q(SHORT_LENGTH, "m", 0, PREMISE),
    shortDelay: q(short.delay, "ns", 1, "length × delay per metre (catalogue)"),
  };
}

/** Lesson 6's classic failing run: the controller pin behind 33 Ω into 10 m of lone lead, no clamps. */
function classicRun() {
  const series = 33;
  const resistance = controllerPin3v3.outputResistance + series;
  const line = bounce(controllerPin3v3.highVoltage, resistance, lone.z0, lone.delayPerMetre);
  const far = Object.fromEntries([1, 2, 3, 4].map((n) => [`n${n}`, q(line.far(n), "V", 2, FAR)]));
  return {
    series: q(series, "Ω", 0, "the trade's best-known failing run (common practice of the trade)"),
    resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"),
    gamma: q(line.gamma, "", 3, GAMMA),
    far,
  };
}

const CLAMP_RATING = "the receiver model's clamp injection rating (lib/sim/receiver.ts: JEDEC JESD7A, from memory)";

const SCOPE_SMALL = 330;
const SCOPE_LARGE = 680;

export const numbers = {
  run: {
    length: q(RUN_LENGTH, "m", 0, PREMISE),
    loneResistance: q(RUN_LENGTH * lone.perMetre.resistance, "Ω", 2, "R′ × length (catalogue)"),
  },
  case1: caseOne(),
  case2: caseTwo(),
  case3: caseThree(),
  case4: caseFour(),
  classic: classicRun(),
  lab: { maxOvershoot: q(lab.passRule.maxOvershoot ?? NaN, "%", 0, "the lab's pass rule (lab.ts)") },
  clamp: {
    rating: q(RECEIVER_DEFAULTS.clampCurrentRating, "mA", 0, CLAMP_RATING),
    limit: q(COURSE_CLAMP_CURRENT_LIMIT, "mA", 0, "half the rating, the course's limit (lessons/pass-rule.ts)"),
  },
  scope: {
    small: q(SCOPE_SMALL, "Ω", 0, "lesson 3's series resistor"),
    large: q(SCOPE_LARGE, "Ω", 0, PREMISE),
    smallSource: q(buffer5v.outputResistance + SCOPE_SMALL, "Ω", 0, "driver resistance + series resistor"),
    largeSource: q(buffer5v.outputResistance + SCOPE_LARGE, "Ω", 0, "driver resistance + series resistor"),
  },
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";

/** The buffer through `series` into data beside ground, as a learner's given. */
function besideGiven(series: number) {
  const resistance = buffer5v.outputResistance + series;
  const line = bounce(buffer5v.highVoltage, resistance, beside.z0, beside.delayPerMetre);
  return {
    series: q(series, "Ω", 0, GIVEN),
    resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"),
    numerator: q(resistance - beside.z0, "", 1, "R_src − Z0"),
    denominator: q(resistance + beside.z0, "", 1, "R_src + Z0"),
    gamma: q(line.gamma, "", 3, GAMMA),
    squared: q(line.gamma ** 2, "", 3, "Γs²"),
    launched: q(launchedStep(buffer5v.highVoltage, resistance, beside.z0), "V", 2, "V × Z0 / (R_src + Z0)"),
    n1: q(line.far(1), "V", 2, FAR),
    n2: q(line.far(2), "V", 2, FAR),
  };
}

/** The controller pin through `series` into 10 m of lone lead, settling as a learner's given. */
function settlingGiven(series: number) {
  const line = bounce(controllerPin3v3.highVoltage, controllerPin3v3.outputResistance + series, lone.z0, lone.delayPerMetre);
  const settled = settlingArrival(line.gamma, 0.01);
  return {
    series: q(series, "Ω", 0, GIVEN),
    gamma: q(line.gamma, "", 3, GAMMA),
    delay: q(line.delay, "ns", 1, "length × delay per metre (catalogue)"),
    settlingRatio: q(Math.log(0.01) / Math.log(Math.abs(line.gamma)), "", 1, "ln 0.01 / ln |Γs|"),
    settledArrival: q(settled, "", 0, "first n with |Γs|^n < 0.01"),
    settledFactor: q(2 * settled - 1, "", 0, "2n − 1"),
    settledAt: q(line.at(settled), "ns", 0, AT),
  };
}

/** Each learner's premises for the quick checks, away from the lesson's worked cases, and the answers computed from them. */
export const checkGivens = {
  sourceCoefficient: [10, 47, 56, 68].map(besideGiven),
  firstArrival: [0, 22, 39, 62].map(besideGiven),
  ringingPeriod: [6, 8, 12, 15].map((length) => {
    const delay = length * lone.delayPerMetre;
    return {
      length: q(length, "m", 0, GIVEN),
      delay: q(delay, "ns", 1, "length × delay per metre (catalogue)"),
      period: q(4 * delay, "ns", 0, "four one-way delays"),
      frequency: q(1 / (4 * delay), "MHz", 1, "1 / period"),
    };
  }),
  settlingTime: [47, 68, 150, 180].map(settlingGiven),
  secondStep: [200, 220, 240, 440].map(besideGiven),
};

export const plainNumbers: PlainNumber[] = [
  { text: "2 × V_incident", why: "the doubling at an open end, in the formula" },
  { text: "2 × V_launched", why: "the doubling at an open end, in the formula" },
  { text: "T_d, 3 T_d, 5 T_d", why: "arrival times (2n − 1) × T_d, in the formula" },
  { text: "ringing every 4 T_d", why: "the ringing period, four one-way delays" },
  { text: "faster than 4 T_d", why: "the ringing period, four one-way delays" },
  { text: "4 × {{case1.delay}}", why: "the ringing period, four one-way delays" },
  { text: "4 × {{given.delay}}", why: "the ringing period, four one-way delays" },
  { text: "ln 0.01", why: "the lesson's 1 % settling criterion (its own choice, as the text says)" },
  { text: "|Γ_s|^n < 0.01", why: "the lesson's 1 % settling criterion" },
];
