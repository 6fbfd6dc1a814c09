import type { SimResult } from "@/lib/sim";
// The workbench runs this rule in the browser: the receiver and verdict modules bring no zod with them.
import { RECEIVER_DEFAULTS, clampCurrentLimit, type JudgementName } from "@/lib/sim/receiver";
import { OUTCOME_WORDS } from "@/lib/sim/verdict";
import type { PassRule } from "./schema";

export type RuleFailureCode =
  | "bits-not-decoded"
  | "timing-margin"
  | "voltage-margin"
  | "overshoot"
  | "rise-time"
  | "clamp-current"
  | "cable-spec";

export interface RuleFailure {
  code: RuleFailureCode;
  message: string;
}

export interface RunJudgement {
  pass: boolean;
  failures: RuleFailure[];
  /** Bits read correctly at every switching point of the lab's judgement. */
  bitsCorrect: number;
  bitsSent: number;
}

/**
 * The course's one clamp-current policy: every lab holds a run under half the pixel input's rated
 * injection current (the simulator's receiver defaults say where the rating comes from).
 */
export const COURSE_CLAMP_CURRENT_LIMIT = clampCurrentLimit(RECEIVER_DEFAULTS.clampCurrentRating);

/** What each judgement promises, in the words of the simulator's verdict. */
export const JUDGEMENT_PROMISE: Record<JudgementName, string> = {
  guaranteed: OUTCOME_WORDS.guaranteed,
  typical: "works on typical pixels",
};

const ns = (s: number) => `${(s * 1e9).toFixed(0)} ns`;
const volts = (v: number) => `${v.toFixed(2)} V`;
const milliamps = (a: number) => `${(a * 1e3).toFixed(1)} mA`;

/** The lab's judgement's margins for a run: what its pass rule and its score read. */
export function ruleMargins(rule: PassRule, result: SimResult) {
  const { timingMargin, voltageMargin } = result.verdict[rule.judgement];
  return { timingMargin, voltageMargin };
}

/**
 * A run against its lab's pass rule: the simulator's judgement the lab names, held to the lab's
 * margins, plus the limits the lesson is about.
 */
export function judgeRun(rule: PassRule, supplyVoltage: number, result: SimResult): RunJudgement {
  const failures: RuleFailure[] = [];
  const judgement = result.verdict[rule.judgement];
  const bitsSent = result.bits.length;
  const bitsCorrect = bitsSent - judgement.bitErrors;
  const { metrics } = result;
  const promise = JUDGEMENT_PROMISE[rule.judgement];

  if (!judgement.pass) {
    failures.push({
      code: "bits-not-decoded",
      message:
        judgement.bitErrors > 0
          ? `${judgement.bitErrors} of ${bitsSent} bits are misread at some switching point: the run does not meet "${promise}"`
          : `ringing re-crosses a switching point: the run does not meet "${promise}"`,
    });
  }
  if (judgement.timingMargin === null) {
    failures.push({ code: "timing-margin", message: "no bit slot holds a single complete pulse to measure" });
  } else if (judgement.timingMargin < rule.minTimingMargin) {
    failures.push({ code: "timing-margin", message: `timing margin ${ns(judgement.timingMargin)} is below ${ns(rule.minTimingMargin)}` });
  }
  if (judgement.voltageMargin < rule.minVoltageMargin) {
    failures.push({ code: "voltage-margin", message: `voltage margin ${volts(judgement.voltageMargin)} is below ${volts(rule.minVoltageMargin)}` });
  }
  if (rule.maxOvershoot !== undefined && metrics.overshoot > rule.maxOvershoot * supplyVoltage) {
    failures.push({
      code: "overshoot",
      message: `overshoot ${volts(metrics.overshoot)} exceeds ${volts(rule.maxOvershoot * supplyVoltage)} (${Math.round(rule.maxOvershoot * 100)} % of the pixel supply)`,
    });
  }
  if (rule.maxRiseTime !== undefined) {
    if (metrics.riseTime === null) {
      failures.push({ code: "rise-time", message: "the far end never completes a rise from 10 % to 90 % within a high time" });
    } else if (metrics.riseTime > rule.maxRiseTime) {
      failures.push({ code: "rise-time", message: `rise time ${ns(metrics.riseTime)} exceeds ${ns(rule.maxRiseTime)}` });
    }
  }
  if (metrics.clampCurrentPeak > COURSE_CLAMP_CURRENT_LIMIT) {
    failures.push({
      code: "clamp-current",
      message: `clamp current peaks at ${milliamps(metrics.clampCurrentPeak)}, above the course's ${milliamps(COURSE_CLAMP_CURRENT_LIMIT)} limit`,
    });
  }
  if (rule.cableSpec) {
    const { z0, perMetre, delay, length } = result.line;
    const delayPerMetre = delay / length;
    const spec = rule.cableSpec;
    if (z0 < spec.minZ0 || z0 > spec.maxZ0 || delayPerMetre > spec.maxDelayPerMetre || perMetre.capacitance > spec.maxCapacitancePerMetre) {
      failures.push({
        code: "cable-spec",
        message: `the cable (Z0 ${z0.toFixed(0)} ohm, ${(delayPerMetre * 1e9).toFixed(1)} ns/m, ${(perMetre.capacitance * 1e12).toFixed(0)} pF/m) is outside the specification`,
      });
    }
  }
  return { pass: failures.length === 0, failures, bitsCorrect, bitsSent };
}
