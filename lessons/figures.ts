import { z } from "zod";
import { cableKindSchema } from "./cable-kinds";

/**
 * Interactive figures a lesson can place between its text blocks. Each id has one params schema;
 * the UI draws the figure from these numbers and lets one control ("slider") move one of them.
 * All quantities are SI (V, Ω, F, H, s, m). A slider's `field` names the param it moves, starting
 * from that param's value; the control covers min..max in `step` increments, or, for resistors
 * with an E-series given, the series values (IEC 60063) within min..max.
 *
 * Analytic figures (no simulator): pulse-train, threshold-bands, rc-edge, bounce-diagram, probe-ground.
 * Simulator figures: series-termination, cable-compare, clamp-compare — build their input with `figureSimInputs`.
 */

const seconds = z.number().positive();
const volts = z.number().positive().max(12);
const ohms = z.number().min(0).max(100_000);
const fraction = z.number().gt(0).lt(1);
const bits = z.string().regex(/^[01]{1,48}$/, "bits must be 1 to 48 characters of 0 and 1");

function slider<const F extends readonly [string, ...string[]]>(fields: F) {
  return z
    .object({ field: z.enum(fields), min: z.number(), max: z.number(), step: z.number().positive() })
    .refine((s) => s.max > s.min, { message: "slider max must exceed min", path: ["max"] });
}

const eSeriesName = z.enum(["E12", "E24", "E96"]);

/**
 * The ideal driver output for a bit string: bit slots of `bitPeriod`, each high for `zeroHigh` or
 * `oneHigh`. The UI marks the slots, the pixel's decision instant (`decisionTime` after each rising
 * edge) and, when `editableBits`, lets the learner toggle bits. The slider moves a high time.
 */
export const pulseTrainParamsSchema = z.strictObject({
  bits,
  bitPeriod: seconds,
  zeroHigh: seconds,
  oneHigh: seconds,
  decisionTime: seconds,
  highVoltage: volts,
  editableBits: z.boolean(),
  slider: slider(["zeroHigh", "oneHigh"]).optional(),
});

/**
 * A pixel's input bands for supply VDD: guaranteed low below lowThreshold·VDD, guaranteed high
 * above highThreshold·VDD, undefined between, with the mid-supply line at VDD/2. A bar shows the
 * driver's high level (and 0 V low level); the UI labels the high noise margin
 * driverHighVoltage − highThreshold·VDD (negative when the driver falls short) and the low noise
 * margin lowThreshold·VDD − 0.
 */
export const thresholdBandsParamsSchema = z.strictObject({
  supplyVoltage: volts,
  highThreshold: fraction,
  lowThreshold: fraction,
  driverHighVoltage: volts,
  slider: slider(["driverHighVoltage", "supplyVoltage"]).optional(),
});

/**
 * One pulse of `highTime` from a driver of `highVoltage` through outputResistance + seriesResistance
 * into a lumped capacitance: v(t) = V·(1 − e^(−t/τ)) rising, V·e^(−t/τ) falling, τ = (Rout + Rs)·C.
 * The UI marks the pixel's thresholds (fractions of supplyVoltage), the 10–90 % rise time
 * τ·ln 9 ≈ 2.2·τ, and where the pulse the pixel sees starts and ends.
 */
export const rcEdgeParamsSchema = z.strictObject({
  highVoltage: volts,
  outputResistance: ohms,
  seriesResistance: ohms,
  capacitance: z.number().positive().max(1e-7),
  supplyVoltage: volts,
  highThreshold: fraction,
  lowThreshold: fraction,
  highTime: seconds,
  slider: slider(["seriesResistance", "capacitance"]),
});

/**
 * A lattice (bounce) diagram for a step of `stepVoltage` (open-circuit source) behind
 * `sourceResistance` into a line of `z0` and one-way delay `oneWayDelay`, ending in a load of
 * reflection coefficient `loadReflection` (+1 for an open end such as a pixel input). Launched step
 * V1 = stepVoltage·z0/(sourceResistance + z0); source coefficient Γs = (Rsrc − z0)/(Rsrc + z0).
 * Beside the lattice the UI draws the far-end voltage after each arrival, for `arrivals` arrivals:
 * with an open end, Vfar(n) = stepVoltage·(1 − Γs^n).
 */
export const bounceDiagramParamsSchema = z.strictObject({
  stepVoltage: volts,
  sourceResistance: ohms,
  z0: z.number().positive().max(1000),
  oneWayDelay: seconds,
  loadReflection: z.number().min(-1).max(1),
  arrivals: z.number().int().min(1).max(12),
  supplyVoltage: volts,
  highThreshold: fraction,
  slider: slider(["sourceResistance", "z0"]),
});

/**
 * A simulated run: driver → series resistor → catalogue cable → pixel. The UI runs the simulator
 * (input from `figureSimInputs`) and draws near-end and far-end traces with the threshold bands.
 * The slider moves the series resistor (over E-series values when `series` is given) or the length.
 */
export const seriesTerminationParamsSchema = z.strictObject({
  cable: cableKindSchema,
  length: z.number().positive().max(100),
  seriesResistance: ohms,
  highVoltage: volts,
  outputResistance: ohms,
  edgeTime: seconds,
  supplyVoltage: volts,
  bits,
  slider: z.union([
    z.strictObject({ field: z.literal("seriesResistance"), series: eSeriesName, min: ohms, max: ohms }),
    slider(["length"]),
  ]),
});

/**
 * The same driver, resistor and length on several catalogue cables at once: one far-end trace per
 * cable on shared axes, and a table of the catalogue's Z0, C′ and delay per metre for each. The
 * optional slider moves the length or the resistor for all cables together.
 */
export const cableCompareParamsSchema = z.strictObject({
  cables: z.array(cableKindSchema).min(2).max(5),
  length: z.number().positive().max(100),
  seriesResistance: ohms,
  highVoltage: volts,
  outputResistance: ohms,
  edgeTime: seconds,
  supplyVoltage: volts,
  bits,
  slider: slider(["length", "seriesResistance"]).optional(),
});

/**
 * One run drawn twice: with the pixel's clamp diodes (as every pixel input has them) and without
 * (the textbook's bounce arithmetic), far ends on shared axes with the guaranteed thresholds and
 * the typical switching band, and beside them each run's peak, clamp current and verdict.
 */
export const clampCompareParamsSchema = z.strictObject({
  cable: cableKindSchema,
  length: z.number().positive().max(100),
  seriesResistance: ohms,
  highVoltage: volts,
  outputResistance: ohms,
  edgeTime: seconds,
  supplyVoltage: volts,
  bits,
});

/**
 * What a passive probe shows of a clean edge: the probe tip capacitance and the ground lead's
 * inductance form a series RLC with the source resistance. Step response of that circuit (edge of
 * `edgeTime`, height `stepVoltage`) against the true edge; the UI labels the ring frequency
 * f = 1/(2π·√(L·C)) and the damping ζ = (R/2)·√(C/L).
 */
export const probeGroundParamsSchema = z.strictObject({
  stepVoltage: volts,
  sourceResistance: ohms,
  probeCapacitance: z.number().positive().max(1e-9),
  groundLeadInductance: z.number().positive().max(1e-6),
  edgeTime: seconds,
  slider: slider(["groundLeadInductance", "probeCapacitance"]),
});

const figureShape = <const Id extends string, P extends z.ZodType>(figure: Id, params: P) =>
  z.strictObject({ kind: z.literal("figure"), figure: z.literal(figure), caption: z.string().trim().min(1), params });

export const figureBlockSchema = z.discriminatedUnion("figure", [
  figureShape("pulse-train", pulseTrainParamsSchema),
  figureShape("threshold-bands", thresholdBandsParamsSchema),
  figureShape("rc-edge", rcEdgeParamsSchema),
  figureShape("bounce-diagram", bounceDiagramParamsSchema),
  figureShape("series-termination", seriesTerminationParamsSchema),
  figureShape("cable-compare", cableCompareParamsSchema),
  figureShape("clamp-compare", clampCompareParamsSchema),
  figureShape("probe-ground", probeGroundParamsSchema),
]);

export type FigureBlock = z.infer<typeof figureBlockSchema>;
export type FigureId = FigureBlock["figure"];
export const FIGURE_IDS = figureBlockSchema.options.map((o) => o.shape.figure.value) as FigureId[];
export type FigureParams<Id extends FigureId> = Extract<FigureBlock, { figure: Id }>["params"];
