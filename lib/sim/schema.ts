import { z } from "zod";
import { CABLE_KINDS } from "./cables";
import { SimInputError } from "./errors";
import { RECEIVER_DEFAULTS } from "./receiver";
import { BYTE_ORDERS } from "./signal";

function quantity(unit: string, min: number, max: number, options: { exclusiveMin?: boolean } = {}) {
  const lower = options.exclusiveMin ? `more than ${min} ${unit}` : `at least ${min} ${unit}`;
  return z
    .number({ error: (issue) => (issue.input === undefined ? "is required" : `must be a number (${unit})`) })
    .refine(Number.isFinite, { error: "must be a finite number" })
    .refine((value) => (options.exclusiveMin ? value > min : value >= min), { error: `must be ${lower}` })
    .refine((value) => value <= max, { error: `must be at most ${max} ${unit}` });
}

const fraction = () =>
  quantity("of the supply", 0, 1, { exclusiveMin: true }).refine((value) => value < 1, {
    error: "must be less than 1 (a fraction of the supply)",
  });


const driverSchema = z.strictObject({
  highVoltage: quantity("V", 0.5, 24).default(5),
  outputResistance: quantity("Ω", 0, 10_000).default(20),
  outputResistanceLow: quantity("Ω", 0, 10_000).optional(),
  edgeTime: quantity("s", 0.5e-9, 1e-6).default(3e-9),
});

const perMetreSchema = z.strictObject({
  resistance: quantity("Ω/m", 0, 10),
  inductance: quantity("H/m", 1e-8, 1e-4),
  capacitance: quantity("F/m", 1e-12, 1e-8),
  conductance: quantity("S/m", 0, 1).default(0),
});

const cableSchema = z
  .strictObject({
    kind: z
      .enum(CABLE_KINDS, { error: `unknown cable kind; use one of ${CABLE_KINDS.join(", ")}` })
      .optional(),
    perMetre: perMetreSchema.optional(),
    length: quantity("m", 0, 300),
  })
  .check((ctx) => {
    const { kind, perMetre } = ctx.value;
    if ((kind === undefined) === (perMetre === undefined)) {
      ctx.issues.push({
        code: "custom",
        input: ctx.value,
        path: ["kind"],
        message: "give either a catalogue kind or perMetre constants, not both or neither",
      });
    }
  });

const receiverSchema = z
  .strictObject({
    supplyVoltage: quantity("V", 1, 24).default(5),
    inputCapacitance: quantity("F", 0, 1e-9).default(5e-12),
    clampDiodes: z.boolean({ error: "must be true or false" }).default(true),
    highThreshold: fraction().default(RECEIVER_DEFAULTS.highThreshold),
    lowThreshold: fraction().default(RECEIVER_DEFAULTS.lowThreshold),
    typicalSwitchingPoint: fraction().default(RECEIVER_DEFAULTS.typicalSwitchingPoint),
    typicalSpread: quantity("of the supply", 0, 0.5).default(RECEIVER_DEFAULTS.typicalSpread),
    typicalHysteresis: quantity("of the supply", 0, 0.5).default(RECEIVER_DEFAULTS.typicalHysteresis),
    deglitchTime: quantity("s", 0, 1e-6).default(RECEIVER_DEFAULTS.deglitchTime),
    minPulse: quantity("s", 0, 10e-6).default(RECEIVER_DEFAULTS.minPulse),
    minGap: quantity("s", 0, 10e-6).default(RECEIVER_DEFAULTS.minGap),
    decisionTime: quantity("s", 0, 10e-6, { exclusiveMin: true }).default(RECEIVER_DEFAULTS.decisionTime),
    clampCurrentRating: quantity("A", 0, 1, { exclusiveMin: true }).default(RECEIVER_DEFAULTS.clampCurrentRating),
    clampSeriesResistance: quantity("Ω", 0, 10_000).default(RECEIVER_DEFAULTS.clampSeriesResistance),
  })
  .check((ctx) => {
    const receiver = ctx.value;
    if (receiver.lowThreshold >= receiver.highThreshold) {
      ctx.issues.push({
        code: "custom",
        input: receiver.lowThreshold,
        path: ["lowThreshold"],
        message: "must be below highThreshold",
      });
    }
    const { typicalSwitchingPoint: centre, typicalSpread: spread, typicalHysteresis: hysteresis } = receiver;
    if (centre - spread - hysteresis / 2 <= 0 || centre + spread + hysteresis / 2 >= 1) {
      ctx.issues.push({
        code: "custom",
        input: receiver.typicalSpread,
        path: ["typicalSpread"],
        message: "the typical switching band with its hysteresis must lie inside the supply",
      });
    }
    if (receiver.minPulse >= receiver.decisionTime) {
      ctx.issues.push({
        code: "custom",
        input: receiver.minPulse,
        path: ["minPulse"],
        message: "must be shorter than decisionTime",
      });
    }
  });

const byte = z
  .number({ error: "must be a number from 0 to 255" })
  .int({ error: "must be a whole number from 0 to 255" })
  .min(0, { error: "must be a number from 0 to 255" })
  .max(255, { error: "must be a number from 0 to 255" });

const signalSchema = z
  .strictObject({
    bits: z
      .string({ error: "must be a string of 0s and 1s" })
      .min(1, { error: "the bit pattern is empty" })
      .max(100_000, { error: "the bit pattern is longer than 100000 bits" })
      .regex(/^[01]*$/, { error: "must contain only 0 and 1" })
      .optional(),
    colours: z
      .array(z.tuple([byte, byte, byte], { error: "each colour is [red, green, blue]" }), {
        error: "must be a list of [red, green, blue] colours",
      })
      .min(1, { error: "the colour list is empty" })
      .max(4_000, { error: "at most 4000 colours" })
      .optional(),
    byteOrder: z.enum(BYTE_ORDERS, { error: `must be one of ${BYTE_ORDERS.join(", ")}` }).default("GRB"),
    bitPeriod: quantity("s", 0.1e-6, 100e-6).default(1.25e-6),
    zeroHigh: quantity("s", 0, 100e-6, { exclusiveMin: true }).default(0.4e-6),
    oneHigh: quantity("s", 0, 100e-6, { exclusiveMin: true }).default(0.8e-6),
    leadIn: quantity("s", 0, 100e-6).default(1e-6),
    latchGap: quantity("s", 0, 1e-3).optional(),
  })
  .check((ctx) => {
    const signal = ctx.value;
    if ((signal.bits === undefined) === (signal.colours === undefined)) {
      ctx.issues.push({
        code: "custom",
        input: signal,
        path: ["bits"],
        message: "give either bits or colours, not both or neither",
      });
    }
    if (signal.zeroHigh >= signal.oneHigh) {
      ctx.issues.push({ code: "custom", input: signal.zeroHigh, path: ["zeroHigh"], message: "must be shorter than oneHigh" });
    }
    if (signal.oneHigh >= signal.bitPeriod) {
      ctx.issues.push({ code: "custom", input: signal.oneHigh, path: ["oneHigh"], message: "must be shorter than bitPeriod" });
    }
  });

/** Far-end termination at the pixel input (lib/sim/termination.ts); none when absent. */
export const terminationSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("parallel"), resistance: quantity("Ω", 1, 1e6) }),
    z.strictObject({ kind: z.literal("thevenin"), toSupply: quantity("Ω", 1, 1e6), toGround: quantity("Ω", 1, 1e6) }),
    z.strictObject({ kind: z.literal("rc"), resistance: quantity("Ω", 1, 1e6), capacitance: quantity("F", 1e-12, 1e-6) }),
  ],
  { error: "unknown termination kind; use one of parallel, thevenin, rc" },
);

const outputSchema = z.strictObject({
  sampleInterval: quantity("s", 1e-12, 1e-3).optional(),
});

/** Driver to pixel without the signal: one segment of a run that regenerating pixels split (split-run.ts). */
const segmentShape = {
  driver: driverSchema.prefault({}),
  seriesResistance: quantity("Ω", 0, 10_000).default(0),
  cable: cableSchema,
  receiver: receiverSchema.prefault({}),
  termination: terminationSchema.optional(),
};

export const runSegmentSchema = z.strictObject(segmentShape);

export { signalSchema };

export const simInputSchema = z
  .strictObject({
    ...segmentShape,
    signal: signalSchema,
    output: outputSchema.prefault({}),
  })
  .check((ctx) => {
    const { driver, signal } = ctx.value;
    const shortestGap = Math.min(signal.zeroHigh, signal.bitPeriod - signal.oneHigh);
    if (driver.edgeTime >= shortestGap) {
      ctx.issues.push({
        code: "custom",
        input: driver.edgeTime,
        path: ["driver", "edgeTime"],
        message: "must be shorter than the shortest high or low time of the signal",
      });
    }
  });

export type SimInput = z.input<typeof simInputSchema>;
export type ResolvedSimInput = z.output<typeof simInputSchema>;

export function parseSimInput(value: unknown): ResolvedSimInput {
  const parsed = simInputSchema.safeParse(value);
  if (parsed.success) return parsed.data;
  throw new SimInputError(
    parsed.error.issues.map((issue) => ({
      path: issue.path.map(String).join("."),
      message: issue.message,
    })),
  );
}
