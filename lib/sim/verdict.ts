import type { Decoding, DecodedBit } from "./decoder";
import type { Corner, JudgedBand, Judgement } from "./judgement";
import type { BitLevels, RunMetrics } from "./metrics";
import type { Comparator, JudgementName } from "./receiver";

/**
 * The verdict: the run judged two ways (receiver.ts), an outcome in plain words, and reasons that
 * name the physics behind each waveform feature they point at, using the circuit's own numbers.
 */

export type VerdictReason = {
  code: string;
  /** "fail": why typical pixels misread the run; "warning": anything less, why it is not guaranteed among them. */
  severity: "fail" | "warning";
  /** The judgement the reason explains: why the run fails on typical pixels, or why it is not guaranteed. */
  judgement?: JudgementName;
  message: string;
  at?: { time: number; bit?: number };
};

/** guaranteed: works on every pixel that meets its datasheet; typical: works on typical pixels only; fails: typical pixels misread it. */
export const OUTCOMES = ["guaranteed", "typical", "fails"] as const;
export type Outcome = (typeof OUTCOMES)[number];

export type Verdict = {
  outcome: Outcome;
  /** The outcome in the words every lesson, lab and message uses. */
  summary: string;
  guaranteed: Judgement;
  typical: Judgement;
  reasons: VerdictReason[];
};

/** The outcome's words, the same everywhere a run is judged. */
export const OUTCOME_WORDS: Record<Outcome, string> = {
  guaranteed: "works on every pixel that meets its datasheet",
  typical: "works on typical pixels, not guaranteed",
  fails: "fails: typical pixels misread it",
};

/** A reason's heading, the same on the workbench, in attempt results and in the lessons. */
export function reasonHeading(reason: Pick<VerdictReason, "severity" | "judgement">): string {
  if (reason.judgement === "guaranteed") return "Not guaranteed";
  return reason.severity === "fail" ? "Fails" : "Warning";
}

/** Only typical pixels misreading a run makes it fail; a run short of the guarantee still works on them. */
const severityOf = (judgement: JudgementName): VerdictReason["severity"] => (judgement === "typical" ? "fail" : "warning");

export function outcomeOf(guaranteed: Pick<Judgement, "pass">, typical: Pick<Judgement, "pass">): Outcome {
  if (guaranteed.pass && typical.pass) return "guaranteed";
  return typical.pass ? "typical" : "fails";
}

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
  settledHigh: number;
  deglitchTime: number;
  minPulse: number;
  minGap: number;
  decisionTime: number;
  latchGap: number | undefined;
  falls: number[];
  clampCurrentPeakTime: number;
  /** The clamp current a design keeps under (A): half the input's rated injection current. */
  clampCurrentLimit: number;
  clampCurrentRating: number;
};

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
    return `the source (${ohms(resistance)}) is far below the line's impedance (${ohms(facts.z0)}), so the reflection returns with the wrong sign (reflection coefficient ${gamma.toFixed(2).replace("-", "−")}) and the far end swings back ${swing}`;
  }
  return `the line's inductance and the capacitance at its end ring, and too little resistance damps them`;
}

/** How a reason names the levels of the switching point it was read at. */
type Levels = { rise: string; fall: string; riseVolts: number; fallVolts: number };

function levelWords(name: JudgementName, corner: Corner, comparator: Comparator): Levels {
  if (name === "guaranteed") {
    const which = corner === "highest" ? "high" : "low";
    return {
      rise: `the datasheet's ${which} threshold (${volts(comparator.rise)})`,
      fall: `the datasheet's ${which} threshold (${volts(comparator.fall)})`,
      riseVolts: comparator.rise,
      fallVolts: comparator.fall,
    };
  }
  const end = corner === "highest" ? "top" : "bottom";
  return {
    rise: `${volts(comparator.rise)} (where a typical pixel switching at the ${end} of its range reads a rise)`,
    fall: `${volts(comparator.fall)} (where a typical pixel switching at the ${end} of its range reads a fall)`,
    riseVolts: comparator.rise,
    fallVolts: comparator.fall,
  };
}

function neverHighMessage(facts: CircuitFacts, kinds: string, levels: Levels): string {
  const head = `the far end never rises above ${levels.rise} during ${kinds}`;
  const resistance = facts.sourceResistanceHigh;
  if (facts.settledHigh < levels.riseVolts) {
    const firstArrival = facts.delay > 0 ? (2 * facts.highVoltage * facts.z0) / (resistance + facts.z0) : facts.highVoltage;
    const lift =
      facts.delay > 0 && firstArrival > facts.settledHigh * 1.02
        ? `the reflection at the open end lifts the first arrival only to about ${volts(Math.min(firstArrival, facts.supply + 0.7))}, and not for long`
        : `a source of ${ohms(resistance)} against the line's ${ohms(facts.z0)} gives no overshoot to lift it`;
    return `${head}: the driver's ${volts(facts.highVoltage)} high level sits below that level, and ${lift}`;
  }
  return `${head}: ${slowEdgeCause(facts, resistance, "rising")}`;
}

/** A pulse that clears the rise level only on the doubled wave's overshoot and then settles below the fall level: the driver's high level itself is too low. */
function lowLevelMessage(facts: CircuitFacts, levels: Levels): string {
  return `the far end rises through ${levels.rise} only on the overshoot of the doubled wave, then settles at ${volts(facts.settledHigh)}, below ${levels.fall}, and the pulse breaks: the driver's ${volts(facts.highVoltage)} high level is too low for a ${volts(facts.supply)} pixel; a level shifter to the pixel's supply fixes the cause`;
}

type Finding = { code: string; index: number; time: number };

function classifyBit(bit: DecodedBit, index: number, previous: DecodedBit | undefined, facts: CircuitFacts, level: BitLevels): Finding | null {
  if (bit.received === String(bit.sent)) return null;
  const fallArrives = facts.falls[index] + facts.delay;
  const lastBefore = previous?.pulses.at(-1);
  if (bit.pulses.length === 0) {
    if (lastBefore && (lastBefore.end === null || lastBefore.end > bit.slotStart)) {
      return { code: "slow-fall", index, time: bit.slotStart };
    }
    return { code: "never-high", index, time: level.highPeakTime };
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
  if (bit.shortGap) return { code: "short-low", index, time: pulse.end };
  return bit.sent === 0
    ? { code: "stretched-zero", index, time: pulse.end }
    : { code: "shortened-one", index, time: pulse.start };
}

/** The high time the sender chose for a bit, and the low it leaves before the next bit (Infinity after the last): the driver's own pulse, before the line shapes it. */
function drivenTiming(facts: CircuitFacts, bits: DecodedBit[], index: number): { high: number; low: number } {
  const high = facts.falls[index] - bits[index].start;
  const next = bits[index + 1];
  return { high, low: next ? next.start - facts.falls[index] : Infinity };
}

/** A bit whose high time the sender chose so long (or short) that the driver's own pulse decides it, whatever the line does. */
function timingCause(facts: CircuitFacts, bits: DecodedBit[], index: number): string | null {
  const bit = bits[index];
  const { high } = drivenTiming(facts, bits, index);
  if (bit.sent === 1 && high <= facts.decisionTime) return `the high time chosen for a 1 (${duration(high)}) is itself no longer than the ${duration(facts.decisionTime)} decision time`;
  if (bit.sent === 0 && high >= facts.decisionTime) return `the high time chosen for a 0 (${duration(high)}) is itself no shorter than the ${duration(facts.decisionTime)} decision time`;
  return null;
}

/** A low after a pulse that the sender's own timing already makes too short, whatever the line does. */
function chosenLowCause(facts: CircuitFacts, bits: DecodedBit[], index: number): string | null {
  const { high, low } = drivenTiming(facts, bits, index);
  if (low >= facts.minGap) return null;
  return `the high time chosen for a ${bits[index].sent} (${duration(high)}) itself leaves only ${duration(low)} of low before the next bit, less than the ${duration(facts.minGap)} a pixel needs`;
}

type TimingLimit = "decision" | "pulse" | "gap";

/**
 * Why a judgement's timing margin is what it is: on the bit and reading that set it, the limit it
 * comes nearest (the decision time, the shortest pulse, the shortest low) with the sender's own
 * timing, and what the line takes of it. When the chosen high times alone leave nearly as thin a
 * margin, they are the cause, however fast the edges; otherwise the far end's edges are.
 */
function timingMarginReason(judged: JudgedBand, facts: CircuitFacts): VerdictReason | null {
  const margins = judged.bitTimingMargins;
  const index = margins.reduce<number>((worst, margin, i) => (margin !== null && (worst === -1 || margin < margins[worst]!) ? i : worst), -1);
  if (index === -1) return null;
  const corner = (["highest", "lowest"] as const).reduce((a, b) =>
    (judged.readings[b].decoding.bits[index].timingMargin ?? Infinity) < (judged.readings[a].decoding.bits[index].timingMargin ?? Infinity) ? b : a,
  );
  const bits = judged.readings[corner].decoding.bits;
  const bit = bits[index];
  const width = bit.width!;
  const margin = margins[index]!;
  const driven = drivenTiming(facts, bits, index);
  const limits: Record<TimingLimit, { read: number; sent: number }> = {
    decision: bit.sent === 1 ? { read: width - facts.decisionTime, sent: driven.high - facts.decisionTime } : { read: facts.decisionTime - width, sent: facts.decisionTime - driven.high },
    pulse: { read: width - facts.minPulse, sent: driven.high - facts.minPulse },
    gap: { read: (bit.gap ?? Infinity) - facts.minGap, sent: driven.low - facts.minGap },
  };
  const limit = (Object.keys(limits) as TimingLimit[]).reduce((a, b) => (limits[b].read < limits[a].read ? b : a));
  const { sent } = limits[limit];
  const other = bit.sent === 1 ? 0 : 1;
  const head = {
    decision: `bit ${index + 1}, a ${bit.sent}, comes within ${duration(margin)} of being read as a ${other} by a pixel switching somewhere its datasheet allows`,
    pulse: `the pulse of bit ${index + 1} comes within ${duration(margin)} of being too short to count, for a pixel switching somewhere its datasheet allows`,
    gap: `the low after bit ${index + 1} comes within ${duration(margin)} of being too short to end it, for a pixel switching somewhere its datasheet allows`,
  }[limit];
  const room = (only: string) =>
    ({
      decision: `is ${only}${duration(sent)} ${bit.sent === 1 ? "longer" : "shorter"} than the ${duration(facts.decisionTime)} decision time`,
      pulse: `is ${only}${duration(sent)} longer than the shortest pulse a pixel counts (${duration(facts.minPulse)})`,
      gap: `leaves ${duration(driven.low)} of low, ${only}${duration(sent)} more than the ${duration(facts.minGap)} a pixel needs`,
    })[limit];
  const chosen = `the high time chosen for a ${bit.sent} (${duration(driven.high)})`;
  let cause: string;
  // The chosen timing is the cause when it already leaves a margin this thin, the line taking less than half of it.
  if (sent - margin < sent / 2) {
    cause = `${chosen} ${room("itself only ")}; the line takes ${duration(Math.max(0, sent - margin))} more. The pulse widths chosen set this margin, not the edges`;
  } else {
    // A pulse comes out short when its rise arrives late, long (or its low short) when its fall does.
    const edge = limit === "pulse" || (limit === "decision" && bit.sent === 1) ? "rising" : "falling";
    const resistance = edge === "rising" ? facts.sourceResistanceHigh : facts.sourceResistanceLow;
    cause = `${chosen} ${room("")}, and the far end takes ${duration(sent - margin)} of that: ${slowEdgeCause(facts, resistance, edge)}`;
  }
  return {
    code: "thin-timing-margin",
    severity: "warning",
    message: `${head}: ${cause}.`,
    at: { time: bit.slotStart, bit: index },
  };
}

function failMessage(code: string, bits: DecodedBit[], indices: number[], facts: CircuitFacts, levels: Levels): string {
  const first = bits[indices[0]];
  const kinds = bitKinds(bits, indices);
  const high = facts.sourceResistanceHigh;
  const low = facts.sourceResistanceLow;
  const sent = timingCause(facts, bits, indices[0]);
  switch (code) {
    case "never-high":
      return neverHighMessage(facts, kinds, levels);
    case "high-level-too-low":
      return lowLevelMessage(facts, levels);
    case "slow-fall":
      return `the far end does not fall below ${levels.fall} before the next bit starts, so that bit's pulse is missed: ${slowEdgeCause(facts, low, "falling")}`;
    case "ring-after-rise":
      return `ringing after the rising edge falls back through ${levels.fall} and breaks the pulse: ${ringingCause(facts, high, "down")}`;
    case "ring-after-fall":
      return `ringing after the falling edge rises back through ${levels.rise} and the pixel reads an extra pulse: ${ringingCause(facts, low, "up")}`;
    case "stuck-high":
      return `the far end never falls below ${levels.fall} after the pulse: ${slowEdgeCause(facts, low, "falling")}`;
    case "narrow-pulse":
      return `a pulse only ${duration(first.width ?? 0)} wide counts as a glitch (shorter than ${duration(facts.minPulse)}): the far end crosses ${levels.rise} late and leaves it early, because ${slowEdgeCause(facts, high, "rising")}`;
    case "short-low":
      return `the low after the pulse lasts only ${duration(first.gap ?? 0)}, shorter than the ${duration(facts.minGap)} the protocol leaves between pulses, so the pixel cannot tell where the bit ends: ${chosenLowCause(facts, bits, indices[0]) ?? `the high time chosen for a ${first.sent} leaves ${duration(drivenTiming(facts, bits, indices[0]).low)} of low, and the far end's falling edge takes the rest: ${slowEdgeCause(facts, low, "falling")}`}`;
    case "stretched-zero":
      return `0 bits read as 1: the pulse is ${duration(first.width ?? 0)} wide, longer than the ${duration(facts.decisionTime)} decision time, because ${sent ?? `the far end falls below ${levels.fall} late: ${slowEdgeCause(facts, low, "falling")}`}`;
    case "shortened-one":
      return `1 bits read as 0: the pulse is only ${duration(first.width ?? 0)} wide, shorter than the ${duration(facts.decisionTime)} decision time, because ${sent ?? `the far end reaches ${levels.rise} late: ${slowEdgeCause(facts, high, "rising")}`}`;
    default:
      return `${kinds} do not decode`;
  }
}


function decodingReasons(judged: JudgedBand, corner: Corner, levels: BitLevels[], facts: CircuitFacts): VerdictReason[] {
  const { comparator, decoding } = judged.readings[corner];
  const words = levelWords(judged.name, corner, comparator);
  const { bits } = decoding;
  const groups = new Map<string, Finding[]>();
  const settlesBelow = facts.settledHigh < comparator.fall;
  bits.forEach((bit, i) => {
    const finding = classifyBit(bit, i, bits[i - 1], facts, levels[i]);
    if (finding?.code === "ring-after-rise" && settlesBelow) finding.code = "high-level-too-low";
    if (finding) groups.set(finding.code, [...(groups.get(finding.code) ?? []), finding]);
  });
  const reasons: VerdictReason[] = [...groups].map(([code, findings]) => {
    const indices = findings.map((finding) => finding.index);
    return {
      code,
      severity: severityOf(judged.name),
      judgement: judged.name,
      message: `${failMessage(code, bits, indices, facts, words)} (${countNote(indices, bits.length)}).`,
      at: { time: findings[0].time, bit: findings[0].index },
    };
  });
  if (decoding.extraPulses.length > 0) {
    reasons.push({
      code: "extra-pulse",
      severity: severityOf(judged.name),
      judgement: judged.name,
      message: `after the last bit the far end rises back through ${words.rise} and the pixel reads an extra bit: ${ringingCause(facts, facts.sourceResistanceLow, "up")}.`,
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

/**
 * Ringing that turns back through a switching point between the band's extremes: both extremes
 * read every bit, yet a part switching in between would see a pulse break or an extra one.
 */
function recrossingReason(judged: JudgedBand, levels: BitLevels[], facts: CircuitFacts): VerdictReason | null {
  const name = judged.name;
  const holdBit = worstBit(levels, (level) => -(level.margins[name].hold?.value ?? Infinity));
  const ringBit = worstBit(levels, (level) => -(level.margins[name].ringBack?.value ?? Infinity));
  const hold = levels[holdBit].margins[name].hold;
  const ringBack = levels[ringBit].margins[name].ringBack;
  const band = `${volts(judged.band.lowest)}–${volts(judged.band.highest)}`;
  if (hold !== null && hold.value < 0 && (ringBack === null || hold.value <= ringBack.value)) {
    const top = judged.band.highest - judged.band.hysteresis / 2;
    if (facts.settledHigh < top) {
      const levels = levelWords(name, "highest", judged.readings.highest.comparator);
      return { code: "high-level-too-low", severity: severityOf(name), judgement: name, message: `${lowLevelMessage(facts, levels)}.`, at: { time: hold.time, bit: holdBit } };
    }
    return {
      code: "ring-after-rise",
      severity: severityOf(name),
      judgement: name,
      message: `ringing after the rising edge turns back down through switching points in the ${band} band and breaks the pulse there (by ${volts(-hold.value)}): ${ringingCause(facts, facts.sourceResistanceHigh, "down")}.`,
      at: { time: hold.time, bit: holdBit },
    };
  }
  if (ringBack !== null && ringBack.value < 0) {
    return {
      code: "ring-after-fall",
      severity: severityOf(name),
      judgement: name,
      message: `ringing after the falling edge swings back up through switching points in the ${band} band and starts an extra pulse there (by ${volts(-ringBack.value)}): ${ringingCause(facts, facts.sourceResistanceLow, "up")}.`,
      at: { time: ringBack.time, bit: ringBit },
    };
  }
  return null;
}

/** Why a judgement fails: the bits misread at the band's extremes, or else ringing through a switching point in between. */
function judgementReasons(judged: JudgedBand, levels: BitLevels[], facts: CircuitFacts): VerdictReason[] {
  if (judged.pass) return [];
  for (const corner of ["lowest", "highest"] as const) {
    const reasons = decodingReasons(judged, corner, levels, facts);
    if (reasons.length > 0) return reasons;
  }
  const recrossing = recrossingReason(judged, levels, facts);
  if (recrossing) return [recrossing];
  return [
    {
      code: "thin-margin",
      severity: severityOf(judged.name),
      judgement: judged.name,
      message: `the far end comes within reach of the switching band (voltage margin ${volts(judged.voltageMargin)}, timing margin ${judged.timingMargin === null ? "none" : duration(judged.timingMargin)}).`,
    },
  ];
}

function warningReasons(decoding: Decoding, metrics: RunMetrics, judgements: Record<JudgementName, JudgedBand>, facts: CircuitFacts): VerdictReason[] {
  const reasons: VerdictReason[] = [];
  const { bits, filtered } = decoding;
  for (const kind of ["dip", "spike"] as const) {
    const events = filtered.filter((event) => event.kind === kind);
    if (events.length === 0) continue;
    const longest = events.reduce((a, b) => (b.duration > a.duration ? b : a));
    const what = kind === "dip" ? "ringing after the rising edge dips back through the switching point" : "ringing after the falling edge rises back through the switching point";
    reasons.push({
      code: kind === "dip" ? "ringing-filtered-low" : "ringing-filtered-high",
      severity: "warning",
      message: `${what} for up to ${duration(longest.duration)}; the ${duration(facts.deglitchTime)} input filter set for this run hides it from the decoded bits, but no datasheet promises such a filter, so the judgements count it.`,
      at: { time: events[0].start, bit: bitAt(bits, events[0].start) },
    });
  }
  if (metrics.clampCurrentPeak > facts.clampCurrentLimit) {
    reasons.push({
      code: "clamp-current",
      severity: "warning",
      message: `the clamp diodes at the pixel input carry up to ${(metrics.clampCurrentPeak * 1e3).toFixed(1)} mA, above the ${(facts.clampCurrentLimit * 1e3).toFixed(0)} mA a design keeps under (half the ${(facts.clampCurrentRating * 1e3).toFixed(0)} mA injection rating assumed for the input): the overshoot beyond the supply rails is pushed into the pixel's input.`,
      at: { time: facts.clampCurrentPeakTime, bit: bitAt(bits, facts.clampCurrentPeakTime) },
    });
  }
  const guaranteed = judgements.guaranteed;
  if (guaranteed.pass) {
    if (guaranteed.voltageMargin < THIN_VOLTAGE_SHARE * facts.supply) {
      reasons.push({
        code: "thin-voltage-margin",
        severity: "warning",
        message: `the far end clears the datasheet's thresholds by only ${volts(guaranteed.voltageMargin)}: a little more cable or a weaker driver and it is no longer guaranteed.`,
      });
    }
    if (guaranteed.timingMargin !== null && guaranteed.timingMargin < THIN_TIMING_MARGIN) {
      const reason = timingMarginReason(guaranteed, facts);
      if (reason) reasons.push(reason);
    }
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

/**
 * The verdict on a run judged both ways. The reasons explain the judgement that decides the
 * outcome: why typical pixels fail it, or else why it is not guaranteed; then the warnings.
 */
export function judgeVerdict(
  judgements: Record<JudgementName, JudgedBand>,
  centre: Decoding,
  levels: BitLevels[],
  metrics: RunMetrics,
  facts: CircuitFacts,
): Omit<Verdict, "guaranteed" | "typical"> {
  const outcome = outcomeOf(judgements.guaranteed, judgements.typical);
  const deciding = outcome === "fails" ? judgements.typical : judgements.guaranteed;
  return {
    outcome,
    summary: OUTCOME_WORDS[outcome],
    reasons: [...judgementReasons(deciding, levels, facts), ...warningReasons(centre, metrics, judgements, facts)],
  };
}
