import type { SimResult } from "@/lib/sim";
import type { PassRule } from "./schema";

export type RuleFailureCode =
  | "bits-not-decoded"
  | "timing-margin"
  | "voltage-margin"
  | "overshoot"
  | "rise-time"
  | "clamp-current"
  | "filtered-ringing"
  | "cable-spec";

export interface RuleFailure {
  code: RuleFailureCode;
  message: string;
}

export interface RunJudgement {
  pass: boolean;
  failures: RuleFailure[];
  bitsCorrect: number;
  bitsSent: number;
}

/** The simulator's warnings for threshold re-crossings its deglitch filter removed. */
const FILTERED_RINGING_CODES = ["ringing-filtered-low", "ringing-filtered-high"];

const ns = (s: number) => `${(s * 1e9).toFixed(0)} ns`;
const volts = (v: number) => `${v.toFixed(2)} V`;

/**
 * A run against its lab's pass rule. The simulator's own verdict judges against its defaults;
 * the lab's rule is stricter or adds limits the lesson is about, so both are not mixed here.
 */
export function judgeRun(rule: PassRule, supplyVoltage: number, result: SimResult): RunJudgement {
  const failures: RuleFailure[] = [];
  const bitsSent = result.bits.length;
  const bitsCorrect = result.bits.filter((b) => b.received === String(b.sent)).length;
  const { metrics } = result;

  if (bitsCorrect < bitsSent) {
    failures.push({ code: "bits-not-decoded", message: `${bitsSent - bitsCorrect} of ${bitsSent} bits did not decode as sent` });
  }
  if (metrics.timingMargin === null) {
    failures.push({ code: "timing-margin", message: "no bit slot holds a single complete pulse to measure" });
  } else if (metrics.timingMargin < rule.minTimingMargin) {
    failures.push({ code: "timing-margin", message: `timing margin ${ns(metrics.timingMargin)} is below ${ns(rule.minTimingMargin)}` });
  }
  if (metrics.voltageMargin < rule.minVoltageMargin) {
    failures.push({ code: "voltage-margin", message: `voltage margin ${volts(metrics.voltageMargin)} is below ${volts(rule.minVoltageMargin)}` });
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
  if (rule.maxClampCurrent !== undefined && metrics.clampCurrentPeak > rule.maxClampCurrent) {
    failures.push({
      code: "clamp-current",
      message: `clamp current peaks at ${(metrics.clampCurrentPeak * 1e3).toFixed(1)} mA, above ${(rule.maxClampCurrent * 1e3).toFixed(1)} mA`,
    });
  }
  if (rule.rejectFilteredRinging) {
    const ringing = result.verdict.reasons.filter((r) => FILTERED_RINGING_CODES.includes(r.code));
    if (ringing.length > 0) {
      failures.push({
        code: "filtered-ringing",
        message: `ringing re-crosses a threshold (${ringing.map((r) => r.message).join(" ")})`,
      });
    }
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
