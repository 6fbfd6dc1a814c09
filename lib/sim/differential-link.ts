import { z } from "zod";
import { combineVerdicts, type CombinedVerdict } from "./combined-verdict";
import { SimInputError } from "./errors";
import type { Judgement } from "./judgement";
import { runSegmentSchema, signalSchema, type ResolvedSimInput, type SimInput } from "./schema";
import { simulateRun, type SimBit, type SimLine, type SimResult, type SimulateOptions } from "./simulate";
import type { Verdict, VerdictReason } from "./verdict";

/**
 * A differential link: a transmitter drives the data onto a twisted pair as a difference between
 * its two wires, a resistor across the far end terminates the pair, and a receiver there turns
 * the difference back into a logic level that drives the pixel over a short local lead.
 *
 * Only the pair's differential mode carries the data, and for it the pair is a line of the
 * pair's own Z0 and delay (the catalogue's twisted pair, or constants as a datasheet gives them:
 * the two conductors' loop). The transmitter is a source swinging between −V and +V behind its
 * differential output resistance. Shifted up by V, that is the circuit every other run solves:
 * a source from 0 to 2V, the line, and at the far end the terminating resistor to the midpoint
 * V, which is a Thevenin termination of 2R to a 2V supply and 2R to ground, and the receiver's
 * input capacitance, without clamps (its input takes several volts either way). The link is
 * solved so, then everything is shifted back.
 *
 * The receiver is judged on its own thresholds, as the pixel is on its own: guaranteed, a
 * switching point anywhere between −threshold and +threshold (±200 mV, the receiver input
 * sensitivity TIA-485-A states; from memory); typical, near 0 V (an assumption, below). Pulse
 * widths are read with the pixel's timing rule, since the receiver passes each width on as it
 * finds it (its own skew left out). The pixel after the receiver sees a clean local drive: the
 * receiver's output stage over the local lead, a run of its own. The link is as good as the worse
 * of the two.
 */

/** Transmitter and receiver defaults, each an assumption or a figure from memory (see each). */
export const DIFFERENTIAL_DEFAULTS = {
  /**
   * Open-circuit differential swing ±3 V behind 27 Ω: about ±2.0 V into RS-485's 54 Ω test load,
   * above its 1.5 V minimum (TIA-485-A, from memory), and ±2.4 V into one 120 Ω termination.
   * An assumption standing for a 5 V transceiver; give a part's own figures where known.
   */
  openCircuitLevel: 3,
  outputResistance: 27,
  /** 10 ns: a transceiver rated for some 10 Mbit/s (an assumption). */
  edgeTime: 10e-9,
  /** Across the far end: 120 Ω, the usual match to the 120 Ω pairs RS-485 is specified for. */
  terminationResistance: 120,
  /** ±200 mV: TIA-485-A's receiver input threshold (from memory). */
  threshold: 0.2,
  /** Typical receivers switch near 0 V: ±50 mV with 30 mV of hysteresis, an assumption (datasheets give typical hysteresis of some tens of mV). */
  typicalSwitchingPoint: 0,
  typicalSpread: 0.05,
  typicalHysteresis: 0.03,
  /** An assumption: a transceiver's receiver input capacitance, some picofarads. */
  inputCapacitance: 10e-12,
} as const;

const volts = (min: number, max: number) => z.number({ error: "must be a number (V)" }).min(min).max(max);

export const differentialLinkSchema = z.strictObject({
  signal: signalSchema,
  transmitter: z
    .strictObject({
      openCircuitLevel: volts(0.5, 12).default(DIFFERENTIAL_DEFAULTS.openCircuitLevel),
      outputResistance: z.number().min(0).max(10_000).default(DIFFERENTIAL_DEFAULTS.outputResistance),
      edgeTime: z.number().min(0.5e-9).max(1e-6).default(DIFFERENTIAL_DEFAULTS.edgeTime),
    })
    .prefault({}),
  /** The pair: a catalogue kind or its loop constants, and its length. */
  cable: runSegmentSchema.shape.cable,
  terminationResistance: z.number().min(1).max(100_000).default(DIFFERENTIAL_DEFAULTS.terminationResistance),
  receiver: z
    .strictObject({
      threshold: volts(0.001, 5).default(DIFFERENTIAL_DEFAULTS.threshold),
      typicalSwitchingPoint: volts(-5, 5).default(DIFFERENTIAL_DEFAULTS.typicalSwitchingPoint),
      typicalSpread: volts(0, 5).default(DIFFERENTIAL_DEFAULTS.typicalSpread),
      typicalHysteresis: volts(0, 5).default(DIFFERENTIAL_DEFAULTS.typicalHysteresis),
      inputCapacitance: z.number().min(0).max(1e-9).default(DIFFERENTIAL_DEFAULTS.inputCapacitance),
    })
    .prefault({}),
  /** The receiver's output stage, the local lead and the pixel. */
  local: runSegmentSchema,
});

export type DifferentialLinkInput = z.input<typeof differentialLinkSchema>;

/** The pair as judged at the receiver, in differential volts (far end: receiver input; near end: transmitter output). */
export type DifferentialStage = {
  time: number[];
  nearEnd: number[];
  farEnd: number[];
  /** With `keepFullResolution`: every solver step, differential volts. */
  full?: { time: Float64Array; nearEnd: Float64Array; farEnd: Float64Array };
  decoded: string;
  bits: SimBit[];
  line: SimLine;
  verdict: Verdict;
};

export type DifferentialLinkResult = { link: DifferentialStage; local: SimResult; verdict: CombinedVerdict };

function parseLink(input: DifferentialLinkInput) {
  const parsed = differentialLinkSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new SimInputError(parsed.error.issues.map((issue) => ({ path: issue.path.map(String).join("."), message: issue.message })));
}

type ParsedLink = ReturnType<typeof parseLink>;

/** The link as the single-ended circuit it equals, shifted up by the transmitter's open-circuit level. */
function shiftedLinkInput(link: ParsedLink, localReceiver: ResolvedSimInput["receiver"]): SimInput {
  const level = link.transmitter.openCircuitLevel;
  const span = 2 * level;
  const { threshold, typicalSwitchingPoint, typicalSpread, typicalHysteresis, inputCapacitance } = link.receiver;
  if (threshold >= level || typicalSwitchingPoint + typicalSpread + typicalHysteresis / 2 >= level || typicalSwitchingPoint - typicalSpread - typicalHysteresis / 2 <= -level) {
    throw new SimInputError([{ path: "receiver", message: "the receiver's thresholds must lie inside the transmitter's swing" }]);
  }
  return {
    driver: { highVoltage: span, outputResistance: link.transmitter.outputResistance, edgeTime: link.transmitter.edgeTime },
    seriesResistance: 0,
    cable: link.cable,
    receiver: {
      supplyVoltage: span,
      inputCapacitance,
      clampDiodes: false,
      highThreshold: (level + threshold) / span,
      lowThreshold: (level - threshold) / span,
      typicalSwitchingPoint: (level + typicalSwitchingPoint) / span,
      typicalSpread: typicalSpread / span,
      typicalHysteresis: typicalHysteresis / span,
      deglitchTime: localReceiver.deglitchTime,
      minPulse: localReceiver.minPulse,
      minGap: localReceiver.minGap,
      decisionTime: localReceiver.decisionTime,
    },
    termination: { kind: "thevenin", toSupply: 2 * link.terminationResistance, toGround: 2 * link.terminationResistance },
    signal: link.signal,
  };
}

const millivolts = (v: number) => `${Math.round(v * 1000)} mV`;
const nanoseconds = (s: number) => `${Math.round(s * 1e9)} ns`;

function shiftJudgement(judgement: Judgement, offset: number): Judgement {
  const { band } = judgement;
  return { ...judgement, band: { ...band, lowest: band.lowest - offset, highest: band.highest - offset } };
}

/** Why the receiver misreads the pair, in the receiver's own terms (the pixel's reasons speak of clamps and supply rails it does not have). */
function receiverReasons(result: SimResult, link: ParsedLink): VerdictReason[] {
  const { verdict, line } = result;
  const reasons: VerdictReason[] = [];
  const gamma = (link.terminationResistance - line.z0) / (link.terminationResistance + line.z0);
  for (const judgement of [verdict.typical, verdict.guaranteed]) {
    if (judgement.pass) continue;
    const where =
      judgement.name === "guaranteed"
        ? `a receiver switching anywhere within its guaranteed ±${millivolts(link.receiver.threshold)}`
        : `a typical receiver (switching within ${millivolts(link.receiver.typicalSwitchingPoint)} ± ${millivolts(link.receiver.typicalSpread)})`;
    const timing = judgement.timingMargin === null ? "no complete pulse" : `timing margin ${nanoseconds(judgement.timingMargin)}`;
    let message = `${where} misreads ${judgement.bitErrors} bit${judgement.bitErrors === 1 ? "" : "s"} (voltage margin ${millivolts(judgement.voltageMargin)}, ${timing})`;
    if (Math.abs(gamma) > 0.2) {
      message += `; the ${Math.round(link.terminationResistance)} Ω termination against the pair's ${Math.round(line.z0)} Ω reflects ${Math.round(Math.abs(gamma) * 100)} % of each edge`;
    }
    reasons.push({ code: "receiver-threshold", severity: judgement.name === "typical" ? "fail" : "warning", judgement: judgement.name, message });
  }
  return reasons;
}

export function simulateDifferentialLink(input: DifferentialLinkInput, options: SimulateOptions = {}): DifferentialLinkResult {
  const link = parseLink(input);
  const localInput = { ...link.local, signal: link.signal } as SimInput;
  const local = simulateRun(localInput, options);
  const localReceiver = runSegmentSchema.parse(link.local).receiver;
  const shifted = simulateRun(shiftedLinkInput(link, localReceiver), options);
  const offset = link.transmitter.openCircuitLevel;
  const shift = (values: number[]) => values.map((v) => Math.round((v - offset) * 1e6) / 1e6);
  const linkVerdict: Verdict = {
    outcome: shifted.verdict.outcome,
    summary: shifted.verdict.summary,
    guaranteed: shiftJudgement(shifted.verdict.guaranteed, offset),
    typical: shiftJudgement(shifted.verdict.typical, offset),
    reasons: receiverReasons(shifted, link),
  };
  const stage: DifferentialStage = {
    time: shifted.time,
    nearEnd: shift(shifted.nearEnd),
    farEnd: shift(shifted.farEnd),
    decoded: shifted.decoded,
    bits: shifted.bits,
    line: shifted.line,
    verdict: linkVerdict,
  };
  if (shifted.full) {
    const { time, nearEnd, farEnd } = shifted.full;
    stage.full = { time, nearEnd: nearEnd.map((v) => v - offset), farEnd: farEnd.map((v) => v - offset) };
  }
  const verdict = combineVerdicts([
    { stage: `the pair (${Number(shifted.line.length.toPrecision(3))} m, at the receiver)`, verdict: linkVerdict },
    { stage: "the local lead (receiver to pixel)", verdict: local.verdict },
  ]);
  return { link: stage, local, verdict };
}
