/**
 * The circuit of docs/simulator.md ("What is modelled"), fully resolved, as the reference tools see it:
 * ideal ramped source → driver resistance + series resistor → line → receiver pin with Cin and clamps.
 * Built here from the doc's JSON interface without using lib/sim, so the references stay independent.
 */
import { catalogueFromGeometry, type CableKind } from "./cable-geometry";

export interface DiodeLaw {
  /** Saturation current Is (A) of the exponential law I = Is·(exp((V − I·Rs)/(n·Vt)) − 1). */
  saturationCurrent: number;
  emissionCoefficient: number;
  thermalVoltage: number;
  /** Ohmic series resistance Rs (Ω), a SPICE diode's RS. */
  seriesResistance: number;
}

export interface ReferenceCircuit {
  highVoltage: number;
  /** Driver output resistance plus series resistor (Ω). */
  sourceResistance: number;
  edgeTime: number;
  line: { resistance: number; inductance: number; capacitance: number; conductance: number; length: number };
  supplyVoltage: number;
  inputCapacitance: number;
  clampDiodes: boolean;
  diode: DiodeLaw;
  receiver: { highThreshold: number; lowThreshold: number; deglitchTime: number; minPulse: number; decisionTime: number };
  /** Far-end termination beside the pin (docs: parallel R to ground, Thevenin divider to the pixel's supply, R in series with C). */
  termination?: ReferenceTermination;
  bits: string;
  bitPeriod: number;
  zeroHigh: number;
  oneHigh: number;
  leadIn: number;
  /** Time simulated after the last bit slot ends. */
  quietTail: number;
}

export type ReferenceTermination =
  | { kind: "parallel"; resistance: number }
  | { kind: "thevenin"; toSupply: number; toGround: number }
  | { kind: "rc"; resistance: number; capacitance: number };

type PerMetre = { resistance: number; inductance: number; capacitance: number; conductance: number };

/** The doc's JSON input, as far as the reference side needs it (structurally what lib/sim accepts). */
export interface DocSimInput {
  driver: { highVoltage: number; outputResistance: number; outputResistanceLow?: number; edgeTime: number };
  seriesResistance: number;
  cable: { kind: CableKind; length: number } | { perMetre: PerMetre; length: number };
  receiver: {
    supplyVoltage: number;
    inputCapacitance: number;
    clampDiodes: boolean;
    clampSeriesResistance?: number;
    highThreshold?: number;
    lowThreshold?: number;
    deglitchTime: number;
    minPulse?: number;
    decisionTime?: number;
  };
  termination?: ReferenceTermination;
  signal: {
    bits?: string;
    colours?: [number, number, number][];
    byteOrder?: "RGB" | "RBG" | "GRB" | "GBR" | "BRG" | "BGR";
    bitPeriod?: number;
    zeroHigh?: number;
    oneHigh?: number;
    leadIn?: number;
  };
  output?: { sampleInterval?: number };
}

/** Defaults as docs/simulator.md states them ("What is modelled", "The receiver rule"). */
const DOC_DEFAULTS = {
  highThreshold: 0.7,
  lowThreshold: 0.3,
  minPulse: 0.15e-6,
  decisionTime: 0.6e-6,
  bitPeriod: 1.25e-6,
  zeroHigh: 0.4e-6,
  oneHigh: 0.8e-6,
  leadIn: 1e-6,
};

/** 24 bits per pixel, most significant bit first, bytes in the given order (docs/simulator.md, "Signal"). */
export function referenceColourBits(colours: [number, number, number][], byteOrder: string): string {
  return colours
    .map(([red, green, blue]) => {
      const byChannel: Record<string, number> = { R: red, G: green, B: blue };
      return [...byteOrder].map((channel) => byChannel[channel].toString(2).padStart(8, "0")).join("");
    })
    .join("");
}

export function perMetreOf(cable: DocSimInput["cable"]): PerMetre {
  return "kind" in cable ? catalogueFromGeometry[cable.kind].perMetre : cable.perMetre;
}

/** `diode` gives the law; the input's own `clampSeriesResistance`, when set, replaces its series resistance. */
export function resolveReferenceCircuit(
  input: DocSimInput,
  diode: DiodeLaw,
  quietTail = 1e-6,
): ReferenceCircuit {
  if (input.driver.outputResistanceLow !== undefined && input.driver.outputResistanceLow !== input.driver.outputResistance) {
    throw new Error("the reference circuits model a symmetric driver only");
  }
  const signal = { ...DOC_DEFAULTS, ...input.signal };
  const bits = signal.bits ?? referenceColourBits(signal.colours ?? [], signal.byteOrder ?? "GRB");
  if (bits.length === 0) throw new Error("empty bit pattern");
  return {
    highVoltage: input.driver.highVoltage,
    sourceResistance: input.driver.outputResistance + input.seriesResistance,
    edgeTime: input.driver.edgeTime,
    line: { ...perMetreOf(input.cable), length: input.cable.length },
    supplyVoltage: input.receiver.supplyVoltage,
    inputCapacitance: input.receiver.inputCapacitance,
    clampDiodes: input.receiver.clampDiodes,
    diode: { ...diode, seriesResistance: input.receiver.clampSeriesResistance ?? diode.seriesResistance },
    receiver: {
      highThreshold: input.receiver.highThreshold ?? DOC_DEFAULTS.highThreshold,
      lowThreshold: input.receiver.lowThreshold ?? DOC_DEFAULTS.lowThreshold,
      deglitchTime: input.receiver.deglitchTime,
      minPulse: input.receiver.minPulse ?? DOC_DEFAULTS.minPulse,
      decisionTime: input.receiver.decisionTime ?? DOC_DEFAULTS.decisionTime,
    },
    ...(input.termination ? { termination: input.termination } : {}),
    bits,
    bitPeriod: signal.bitPeriod,
    zeroHigh: signal.zeroHigh,
    oneHigh: signal.oneHigh,
    leadIn: signal.leadIn,
    quietTail,
  };
}

export function lineDelay(circuit: ReferenceCircuit): number {
  return circuit.line.length * Math.sqrt(circuit.line.inductance * circuit.line.capacitance);
}

export function losslessImpedance(circuit: ReferenceCircuit): number {
  return Math.sqrt(circuit.line.inductance / circuit.line.capacitance);
}

export function stopTime(circuit: ReferenceCircuit): number {
  return circuit.leadIn + circuit.bits.length * circuit.bitPeriod + circuit.quietTail;
}
