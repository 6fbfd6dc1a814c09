import type { Decoding, DecodedBit } from "./decoder";
import type { BitLevels, RunMetrics } from "./metrics";

/**
 * The verdict: pass when every bit decodes as sent and nothing extra is read. Each reason names
 * the physics behind the waveform feature it points at, using the circuit's own numbers.
 */

export type VerdictReason = {
  code: string;
  severity: "fail" | "warning";
  message: string;
  at?: { time: number; bit?: number };
};

export type Verdict = { pass: boolean; reasons: VerdictReason[] };

export type CircuitFacts = {
  highVoltage: number;
  /** Driver plus series resistor while pulling high / low (Ω). */
  sourceResistanceHigh: number;
  sourceResistanceLow: number;
  z0: number;
  delay: number;
  /** Cable capacitance, whole length (F). */
  cableCapacitance: number;
  inputCapacitance: number;
  supply: number;
  highLevel: number;
  lowLevel: number;
  settledHigh: number;
  deglitchTime: number;
  minPulse: number;
  decisionTime: number;
  latchGap: number | undefined;
  falls: number[];
  clampCurrentPeakTime: number;
};

/** Pixel inputs are commonly rated for about 20 mA of clamp current (common datasheet figure, from memory). */
const CLAMP_CURRENT_WARNING = 10e-3;
/** Shortest low period that latches the colours (docs/simulator.md, "Signal"). */
const MIN_LATCH_GAP = 50e-6;
const THIN_TIMING_MARGIN = 50e-9;
const THIN_VOLTAGE_SHARE = 0.05;

const volts = (v: number) => `${v.toFixed(2)} V`;
const ohms = (r: number) => `${r < 10 ? r.toFixed(1) : Math.round(r)} Ω`;
const duration = (s: number) => (Math.abs(s) < 1e-6 ? `${Math.round(s * 1e9)} ns` : `${(s * 1e6).toFixed(2)} µs`);
const picofarads = (c: number) => `${Math.round(c * 1e12)} pF`;

function reflectionCoefficient(source: number, z0: number) {
  return (source - z0) / (source + z0);
}

function bitKinds(bits: DecodedBit[], indices: number[]): string {
  const zeros = indices.some((i) => bits[i].sent === 0);
  const ones = indices.some((i) => bits[i].sent === 1);
  return zeros && ones ? "0 and 1 bits" : zeros ? "0 bits" : "1 bits";
}

function countNote(indices: number[], total: number): string {
  return indices.length === total ? `every bit` : `${indices.length} of ${total} bits`;
}

function slowEdgeCause(facts: CircuitFacts, resistance: number, edge: "rising" | "falling"): string {
  const capacitance = facts.cableCapacitance + facts.inputCapacitance;
  const tau = resistance * capacitance;
  const verb = edge === "rising" ? "charging" : "discharging";
  let cause = `the resistor and the cable capacitance make the ${edge} edge too slow (${ohms(resistance)} ${verb} ${picofarads(capacitance)}, a time constant of about ${duration(tau)})`;
  if (facts.delay > 0 && resistance > 1.5 * facts.z0) {
    const motion = edge === "rising" ? "climbs" : "falls";
    cause += `; with the source well above the line's ${ohms(facts.z0)} the far end ${motion} in a staircase, one step per ${duration(2 * facts.delay)} round trip`;
  }
  return cause;
}

function ringingCause(facts: CircuitFacts, resistance: number, swing: "down" | "up"): string {
  const gamma = reflectionCoefficient(resistance, facts.z0);
  if (facts.delay > 0 && gamma < -0.2) {
    return `the source (${ohms(resistance)}) is far below the line's impedance (${ohms(facts.z0)}), so the reflection returns with the wrong sign (reflection coefficient ${gamma.toFixed(2)}) and the far end swings back ${swing}`;
  }
  return `the line's inductance and the capacitance at its end ring, and too little resistance damps them`;
}

function neverHighMessage(facts: CircuitFacts, kinds: string): string {
  const head = `the far end never rises above the high threshold (${volts(facts.highLevel)}) during ${kinds}`;
  const resistance = facts.sourceResistanceHigh;
  if (facts.settledHigh < facts.highLevel) {
    const firstArrival = facts.delay > 0 ? (2 * facts.highVoltage * facts.z0) / (resistance + facts.z0) : facts.highVoltage;
    const lift =
      facts.delay > 0 && firstArrival > facts.settledHigh * 1.02
        ? `the reflection at the open end lifts the first arrival only to about ${volts(Math.min(firstArrival, facts.supply + 0.7))}, and not for long`
        : `a source of ${ohms(resistance)} against the line's ${ohms(facts.z0)} gives no overshoot to lift it`;
    return `${head}: the driver's ${volts(facts.highVoltage)} high level sits below that threshold, and ${lift}`;
  }
  return `${head}: ${slowEdgeCause(facts, resistance, "rising")}`;
}

type Finding = { code: string; index: number; time: number };

function classifyBit(bit: DecodedBit, index: number, previous: DecodedBit | undefined, facts: CircuitFacts, levels: BitLevels): Finding | null {
  if (bit.received === String(bit.sent)) return null;
  const fallArrives = facts.falls[index] + facts.delay;
  const lastBefore = previous?.pulses.at(-1);
  if (bit.pulses.length === 0) {
    if (lastBefore && (lastBefore.end === null || lastBefore.end > bit.slotStart)) {
      return { code: "slow-fall", index, time: bit.slotStart };
    }
    return { code: "never-high", index, time: levels.highPeakTime };
  }
  if (bit.pulses.length > 1) {
    const first = bit.pulses[0];
    if (first.end !== null && first.end < fallArrives) return { code: "ring-after-rise", index, time: first.end };
    return { code: "ring-after-fall", index, time: bit.pulses[1].start };
  }
  const pulse = bit.pulses[0];
  if (pulse.end === null) return { code: "stuck-high", index, time: pulse.start };
  if (bit.glitch) {
    if (pulse.end < fallArrives) return { code: "ring-after-rise", index, time: pulse.end };
    if (pulse.start >= fallArrives) return { code: "ring-after-fall", index, time: pulse.start };
    return { code: "narrow-pulse", index, time: pulse.start };
  }
  return bit.sent === 0
    ? { code: "stretched-zero", index, time: pulse.end }
    : { code: "shortened-one", index, time: pulse.start };
}

function failMessage(code: string, bits: DecodedBit[], indices: number[], facts: CircuitFacts): string {
  const first = bits[indices[0]];
  const kinds = bitKinds(bits, indices);
  const high = facts.sourceResistanceHigh;
  const low = facts.sourceResistanceLow;
  switch (code) {
    case "never-high":
      return neverHighMessage(facts, kinds);
    case "slow-fall":
      return `the far end does not fall below the low threshold (${volts(facts.lowLevel)}) before the next bit starts, so that bit's pulse is missed: ${slowEdgeCause(facts, low, "falling")}`;
    case "ring-after-rise":
      return `ringing after the rising edge re-crosses the low threshold (${volts(facts.lowLevel)}) and breaks the pulse: ${ringingCause(facts, high, "down")}`;
    case "ring-after-fall":
      return `ringing after the falling edge rises back above the high threshold (${volts(facts.highLevel)}) and the pixel reads an extra pulse: ${ringingCause(facts, low, "up")}`;
    case "stuck-high":
      return `the far end never falls below the low threshold (${volts(facts.lowLevel)}) after the pulse: ${slowEdgeCause(facts, low, "falling")}`;
    case "narrow-pulse":
      return `a pulse only ${duration(first.width ?? 0)} wide at the thresholds counts as a glitch (shorter than ${duration(facts.minPulse)}): the far end crosses the high threshold late and leaves it early, because ${slowEdgeCause(facts, high, "rising")}`;
    case "stretched-zero":
      return `0 bits read as 1: the pulse is ${duration(first.width ?? 0)} wide at the thresholds, longer than the ${duration(facts.decisionTime)} decision time, because the far end falls below the low threshold late: ${slowEdgeCause(facts, low, "falling")}`;
    case "shortened-one":
      return `1 bits read as 0: the pulse is only ${duration(first.width ?? 0)} wide at the thresholds, shorter than the ${duration(facts.decisionTime)} decision time, because the far end reaches the high threshold late: ${slowEdgeCause(facts, high, "rising")}`;
    default:
      return `${kinds} do not decode`;
  }
}

function failReasons(decoding: Decoding, levels: BitLevels[], facts: CircuitFacts): VerdictReason[] {
  const { bits } = decoding;
  const groups = new Map<string, Finding[]>();
  bits.forEach((bit, i) => {
    const finding = classifyBit(bit, i, bits[i - 1], facts, levels[i]);
    if (finding) groups.set(finding.code, [...(groups.get(finding.code) ?? []), finding]);
  });
  const reasons: VerdictReason[] = [...groups].map(([code, findings]) => {
    const indices = findings.map((finding) => finding.index);
    return {
      code,
      severity: "fail",
      message: `${failMessage(code, bits, indices, facts)} (${countNote(indices, bits.length)}).`,
      at: { time: findings[0].time, bit: findings[0].index },
    };
  });
  if (decoding.extraPulses.length > 0) {
    reasons.push({
      code: "extra-pulse",
      severity: "fail",
      message: `after the last bit the far end rises above the high threshold (${volts(facts.highLevel)}) again and the pixel reads an extra bit: ${ringingCause(facts, facts.sourceResistanceLow, "up")}.`,
      at: { time: decoding.extraPulses[0].start, bit: bits.length - 1 },
    });
  }
  return reasons;
}

/** Index of the bit where `badness` is largest (the first of equals). */
function worstBit(levels: BitLevels[], badness: (level: BitLevels) => number): number {
  return levels.reduce((worst, level, i) => (badness(level) > badness(levels[worst]) ? i : worst), 0);
}

function bitAt(bits: DecodedBit[], time: number): number {
  const index = bits.findIndex((bit) => time < bit.slotEnd);
  return index === -1 ? bits.length - 1 : index;
}

function warningReasons(decoding: Decoding, levels: BitLevels[], metrics: RunMetrics, facts: CircuitFacts, failing: boolean): VerdictReason[] {
  const reasons: VerdictReason[] = [];
  const { bits, filtered } = decoding;
  for (const kind of ["dip", "spike"] as const) {
    const events = filtered.filter((event) => event.kind === kind);
    if (events.length === 0) continue;
    const longest = events.reduce((a, b) => (b.duration > a.duration ? b : a));
    const what =
      kind === "dip"
        ? `ringing after the rising edge dips below the low threshold (${volts(facts.lowLevel)})`
        : `ringing after the falling edge rises above the high threshold (${volts(facts.highLevel)})`;
    reasons.push({
      code: kind === "dip" ? "ringing-filtered-low" : "ringing-filtered-high",
      severity: "warning",
      message: `${what} for up to ${duration(longest.duration)}; the pixel's ${duration(facts.deglitchTime)} deglitch filter (an assumed figure) removes it, but an input with a shorter filter would read a broken pulse.`,
      at: { time: events[0].start, bit: bitAt(bits, events[0].start) },
    });
  }
  if (metrics.clampCurrentPeak > CLAMP_CURRENT_WARNING) {
    reasons.push({
      code: "clamp-current",
      severity: "warning",
      message: `the clamp diodes at the pixel input carry up to ${(metrics.clampCurrentPeak * 1e3).toFixed(0)} mA: the overshoot beyond the supply rails is pushed into the pixel; inputs are commonly rated for about 20 mA (check the part's datasheet).`,
      at: { time: facts.clampCurrentPeakTime, bit: bitAt(bits, facts.clampCurrentPeakTime) },
    });
  }
  const ringBack = worstBit(levels, (level) => level.ringBack?.value ?? -Infinity);
  const ringBackPeak = levels[ringBack].ringBack;
  if (!failing && ringBackPeak !== null && ringBackPeak.value > facts.lowLevel) {
    const mid = facts.supply / 2;
    const peak = ringBackPeak.value;
    const consequence =
      peak >= facts.highLevel
        ? `above the high threshold (${volts(facts.highLevel)}); only the deglitch filter keeps it from starting an extra pulse`
        : `above the guaranteed low level (${volts(facts.lowLevel)}); it stays below the high threshold so the pulse count is right, but ${peak > mid ? `a pixel switching near mid-supply (${volts(mid)}) would read it as a high` : "the noise margin is gone"}`;
    reasons.push({
      code: "ringing-undefined-zone",
      severity: "warning",
      message: `ringing after the falling edge swings back up to ${volts(peak)}, ${consequence}: ${ringingCause(facts, facts.sourceResistanceLow, "up")}.`,
      at: { time: ringBackPeak.time, bit: ringBack },
    });
  } else if (!failing && metrics.voltageMargin >= 0 && metrics.voltageMargin < THIN_VOLTAGE_SHARE * facts.supply) {
    reasons.push({
      code: "thin-voltage-margin",
      severity: "warning",
      message: `the far end clears the pixel's thresholds by only ${volts(metrics.voltageMargin)}: a little more cable or a weaker driver and bits will be lost.`,
    });
  }
  const midDip = worstBit(levels, (level) => -(level.midHighDip?.value ?? Infinity));
  const midDipLevel = levels[midDip].midHighDip;
  if (!failing && midDipLevel !== null && midDipLevel.value < facts.supply / 2) {
    reasons.push({
      code: "mid-supply-dip",
      severity: "warning",
      message: `ringing after the rising edge dips to ${volts(midDipLevel.value)} inside the pulse, below mid-supply (${volts(facts.supply / 2)}): a pixel whose input switches near mid-supply, as real inputs usually do, would see the pulse break and misread the bit: ${ringingCause(facts, facts.sourceResistanceHigh, "down")}.`,
      at: { time: midDipLevel.time, bit: midDip },
    });
  }
  if (!failing && metrics.timingMargin !== null && metrics.timingMargin < THIN_TIMING_MARGIN) {
    reasons.push({
      code: "thin-timing-margin",
      severity: "warning",
      message: `a pulse comes within ${duration(metrics.timingMargin)} of being read as the other bit: the edges at the far end are slow compared with the protocol's timing.`,
    });
  }
  if (failing && metrics.midSupplyVoltageMargin > 0) {
    reasons.push({
      code: "passes-at-mid-supply",
      severity: "warning",
      message: `a pixel whose input actually switches near mid-supply (${volts(facts.supply / 2)}) would likely decode this run: it may work on one bench and fail on another, because only the ${volts(facts.highLevel)} / ${volts(facts.lowLevel)} thresholds are guaranteed.`,
    });
  }
  if (facts.latchGap !== undefined && facts.latchGap < MIN_LATCH_GAP) {
    reasons.push({
      code: "latch-gap-short",
      severity: "warning",
      message: `the low gap after the data (${duration(facts.latchGap)}) is shorter than the 50 µs most pixels need to latch the colours (some need 280 µs).`,
    });
  }
  return reasons;
}

export function judgeVerdict(decoding: Decoding, levels: BitLevels[], metrics: RunMetrics, facts: CircuitFacts): Verdict {
  const fails = failReasons(decoding, levels, facts);
  const warnings = warningReasons(decoding, levels, metrics, facts, fails.length > 0);
  return { pass: fails.length === 0, reasons: [...fails, ...warnings] };
}
