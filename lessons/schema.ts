import { z } from "zod";
import { cableKindSchema } from "./cable-kinds";
import { figureBlockSchema } from "./figures";
import { JUDGEMENTS } from "@/lib/sim";
import { lessonNumbersSchema, type LessonNumbers } from "./numbers/lesson-number";
import { resolveText, type TextProblem } from "./numbers/resolve-text";

const slug = z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, "must be a kebab-case slug");
const markdown = z.string().trim().min(1);
const seconds = z.number().positive();
const volts = z.number().positive().max(12);
const ohms = z.number().min(0).max(100_000);
const fraction = z.number().gt(0).lt(1);

type Keyed = { value: string; path: (string | number)[]; where: string };

/** Flags each value met before at its own path, naming where it was first used: ids and slugs key stored work. */
function flagRepeats(ctx: z.RefinementCtx, items: readonly Keyed[]): void {
  const first = new Map<string, string>();
  for (const item of items) {
    const earlier = first.get(item.value);
    if (earlier === undefined) first.set(item.value, item.where);
    else ctx.addIssue({ code: "custom", path: item.path, message: `"${item.value}" is already used by ${earlier}` });
  }
}

/** Items' `id` fields, each at its path in the list at `list`. */
const idsAt = (list: string, items: readonly { id: string }[]): Keyed[] =>
  items.map((item, i) => ({ value: item.id, path: [list, i, "id"], where: `${list}.${i}.id` }));

/**
 * A numeric answer: `value` in SI base units, `unit` the mathjs unit the learner is expected to
 * type in ("ns", "ohm", "pF/m", "V", "Hz", "s"; "" for a plain number). The learner's entry is
 * evaluated with mathjs, converted to SI and accepted when |entry − value| ≤ tolerance·|value|.
 */
export const numericAnswerSchema = z.strictObject({
  value: z.number().finite(),
  unit: z.string(),
  /** 0 asks for the exact value: a count rounded the way the lesson teaches, where the other rounding is wrong. */
  tolerance: z.number().min(0).max(0.2),
});

export const textBlockSchema = z.strictObject({ kind: z.literal("text"), markdown });
export const cautionBlockSchema = z.strictObject({ kind: z.literal("caution"), title: z.string().trim().min(1), markdown });

/**
 * One of a seeded check's givens: numbers its prompt, hint and explanation quote as `{{given.…}}`,
 * and the answer computed from them. A learner's seed picks one (lib/quick-checks), so the value
 * asked for is not the one the lesson worked out above the question.
 */
export const checkGivenSchema = z.strictObject({ numbers: lessonNumbersSchema, answer: numericAnswerSchema });

/** A numeric quick check: one `answer`, or per-learner `givens` (at least three) instead. */
export const checkBlockSchema = z
  .strictObject({
    kind: z.literal("check"),
    id: slug,
    prompt: markdown,
    answer: numericAnswerSchema.optional(),
    givens: z.array(checkGivenSchema).min(3).max(12).optional(),
    hint: markdown,
    explanation: markdown,
  })
  .refine((check) => (check.answer === undefined) !== (check.givens === undefined), {
    message: "a check has either one answer or givens, not both",
    path: ["answer"],
  });

export const driverSchema = z.strictObject({
  id: slug,
  label: z.string().trim().min(1),
  highVoltage: volts,
  outputResistance: ohms,
  /** Output resistance while driving low, when it differs from driving high (push-pull asymmetry). */
  outputResistanceLow: ohms.optional(),
  edgeTime: seconds,
});

/** A run a non-numeric check draws: what it varies; the pixel and the bits sent are the course's (lib/quick-checks). */
export const checkRunSchema = z.strictObject({
  driver: driverSchema,
  cable: cableKindSchema,
  length: z.number().positive().max(100),
  seriesResistance: ohms,
});

/**
 * pick-trace: which of the drawn far-end traces belongs to the described run;
 * predict: the far end's shape, committed to before the run is drawn;
 * diagnose: given a failing run's trace and symptom, which change fixes it.
 */
export const CHOICE_ASKS = ["pick-trace", "predict", "diagnose"] as const;

/**
 * The changes a diagnose check offers, each one thing in the failing run: the series resistance
 * times or divided by `resistanceFactor`, the cable replaced by `cable`, or a level shifter (the
 * course's 5 V buffered output) in place of the driver.
 */
export const checkFixesSchema = z.strictObject({
  resistanceFactor: z.number().gt(1).max(10),
  cable: cableKindSchema,
});

/**
 * A quick check answered by choosing, graded on the server: which option is right is computed
 * from the simulator for the run the learner's seed picks, never written here.
 * pick-trace: `runs` are the candidate traces (3 or 4), one of them described;
 * predict and diagnose: `runs` are the runs a learner may be given, one per seed.
 */
export const choiceCheckBlockSchema = z
  .strictObject({
    kind: z.literal("choice"),
    id: slug,
    ask: z.enum(CHOICE_ASKS),
    prompt: markdown,
    hint: markdown,
    explanation: markdown,
    runs: z.array(checkRunSchema).min(2).max(8),
    fixes: checkFixesSchema.optional(),
  })
  .superRefine((check, ctx) => {
    if (check.ask === "pick-trace" && check.runs.length > 4) {
      ctx.addIssue({ code: "custom", path: ["runs"], message: "a pick-the-trace check draws 3 or 4 traces" });
    }
    if (check.ask !== "pick-trace" && check.runs.length < 3) {
      ctx.addIssue({ code: "custom", path: ["runs"], message: "a seeded check needs at least 3 runs to pick from" });
    }
    if (check.ask === "pick-trace" && check.runs.length < 3) {
      ctx.addIssue({ code: "custom", path: ["runs"], message: "a pick-the-trace check draws 3 or 4 traces" });
    }
    if ((check.ask === "diagnose") !== (check.fixes !== undefined)) {
      ctx.addIssue({ code: "custom", path: ["fixes"], message: "diagnose checks, and only they, offer fixes" });
    }
    if (check.ask === "diagnose") {
      check.runs.forEach((run, i) => {
        if (run.seriesResistance === 0) ctx.addIssue({ code: "custom", path: ["runs", i, "seriesResistance"], message: "a diagnosed run needs a resistor to scale" });
        if (run.cable === check.fixes?.cable) ctx.addIssue({ code: "custom", path: ["runs", i, "cable"], message: "the run already uses the cable offered as the fix" });
      });
    }
  });

export const blockSchema = z.discriminatedUnion("kind", [textBlockSchema, cautionBlockSchema, figureBlockSchema, checkBlockSchema, choiceCheckBlockSchema]);

/** Quick checks of either kind, in lesson order: what a lesson's completion counts. */
export function quickCheckIds(blocks: readonly { kind: string; id?: string }[]): string[] {
  return blocks.flatMap((block) => (block.kind === "check" || block.kind === "choice" ? [block.id!] : []));
}


export const receiverSchema = z.strictObject({
  supplyVoltage: volts,
  inputCapacitance: z.number().positive().max(1e-9).optional(),
  clampDiodes: z.boolean().optional(),
  highThreshold: fraction.optional(),
  lowThreshold: fraction.optional(),
  minPulse: seconds.optional(),
  decisionTime: seconds.optional(),
});

const byteOrder = z.enum(["RGB", "RBG", "GRB", "GBR", "BRG", "BGR"]);
const channel = z.number().int().min(0).max(255);

export const signalSchema = z.strictObject({
  pattern: z.union([
    z.strictObject({ bits: z.string().regex(/^[01]{1,96}$/, "bits must be 1 to 96 characters of 0 and 1") }),
    z.strictObject({ colours: z.array(z.tuple([channel, channel, channel])).min(1).max(4), byteOrder }),
  ]),
  bitPeriod: seconds.optional(),
  zeroHigh: seconds.optional(),
  oneHigh: seconds.optional(),
  leadIn: seconds.optional(),
  latchGap: seconds.optional(),
});

/**
 * One run as the lab author sets it up: the defaults of every field. A variant (lessons/variant.ts)
 * replaces the fields named in the run's `variant`; the learner's choices replace the fields named
 * in `choices` (lessons/build-run.ts).
 */
export const scenarioSchema = z
  .strictObject({
    driver: driverSchema,
    /** Drivers on offer when the learner chooses the driver. */
    driverOptions: z.array(driverSchema).min(2).optional(),
    receiver: receiverSchema,
    signal: signalSchema,
    cable: cableKindSchema,
    /** Cables on offer when the learner chooses the cable. */
    cableOptions: z.array(cableKindSchema).min(2).optional(),
    length: z.number().positive().max(100),
    /** Length range on offer when the learner chooses the length, metres. */
    lengthRange: z.tuple([z.number().positive(), z.number().positive()]).optional(),
    /** The resistor fitted when the learner does not choose it; the control's start when they do. */
    seriesResistance: ohms,
  })
  .superRefine((s, ctx) => {
    if (s.cableOptions && !s.cableOptions.includes(s.cable)) {
      ctx.addIssue({ code: "custom", path: ["cable"], message: "default cable must be one of cableOptions" });
    }
    if (s.driverOptions && !s.driverOptions.some((d) => d.id === s.driver.id)) {
      ctx.addIssue({ code: "custom", path: ["driver", "id"], message: "default driver must be one of driverOptions" });
    }
    if (s.lengthRange && !(s.lengthRange[0] <= s.length && s.length <= s.lengthRange[1])) {
      ctx.addIssue({ code: "custom", path: ["length"], message: "default length must lie within lengthRange" });
    }
  });

const range = (min: z.ZodNumber) =>
  z
    .strictObject({ min, max: min, step: z.number().positive() })
    .refine((r) => r.max >= r.min, { message: "max must not be below min", path: ["max"] });

/** What the learner sets for a run. A field absent here is fixed by the scenario or its variant. */
export const choiceSpecSchema = z
  .strictObject({
    cable: z.literal(true).optional(),
    seriesResistance: z
      .strictObject({ series: z.enum(["E12", "E24", "E96"]), min: ohms, max: ohms })
      .refine((r) => r.max > r.min, { message: "max must exceed min", path: ["max"] })
      .optional(),
    driver: z.literal(true).optional(),
    length: z.strictObject({ step: z.number().positive() }).optional(),
    timing: z.strictObject({ zeroHigh: range(seconds), oneHigh: range(seconds) }).optional(),
  })
  .refine((c) => Object.keys(c).length > 0, { message: "a run must leave at least one choice to the learner" });

/** Which fields differ per learner, and over what. Picked by `labVariant` from a seeded PRNG. */
export const variantSpecSchema = z.strictObject({
  length: range(z.number().positive()).optional(),
  cable: z.array(cableKindSchema).min(2).optional(),
  driver: z.array(driverSchema).min(2).optional(),
});

export const runSpecSchema = z
  .strictObject({
    id: slug,
    label: z.string().trim().min(1),
    scenario: scenarioSchema,
    choices: choiceSpecSchema,
    variant: variantSpecSchema,
  })
  .superRefine((run, ctx) => {
    const { scenario, choices, variant } = run;
    if (choices.cable && !scenario.cableOptions) {
      ctx.addIssue({ code: "custom", path: ["scenario", "cableOptions"], message: "required when the learner chooses the cable" });
    }
    if (choices.driver && !scenario.driverOptions) {
      ctx.addIssue({ code: "custom", path: ["scenario", "driverOptions"], message: "required when the learner chooses the driver" });
    }
    if (choices.length && !scenario.lengthRange) {
      ctx.addIssue({ code: "custom", path: ["scenario", "lengthRange"], message: "required when the learner chooses the length" });
    }
    if (choices.timing && (scenario.signal.zeroHigh === undefined || scenario.signal.oneHigh === undefined)) {
      ctx.addIssue({ code: "custom", path: ["scenario", "signal"], message: "zeroHigh and oneHigh are required when the learner sets the timing" });
    }
    if (choices.cable && variant.cable) {
      ctx.addIssue({ code: "custom", path: ["variant", "cable"], message: "the cable cannot be both the learner's choice and varied" });
    }
    if (choices.driver && variant.driver) {
      ctx.addIssue({ code: "custom", path: ["variant", "driver"], message: "the driver cannot be both the learner's choice and varied" });
    }
    if (choices.length && variant.length) {
      ctx.addIssue({ code: "custom", path: ["variant", "length"], message: "the length cannot be both the learner's choice and varied" });
    }
  });

/** A learner's choices for one run; only the fields the run's choice spec names are allowed. */
export const runChoicesSchema = z.strictObject({
  cable: cableKindSchema.optional(),
  seriesResistance: ohms.optional(),
  driver: slug.optional(),
  length: z.number().positive().optional(),
  zeroHigh: seconds.optional(),
  oneHigh: seconds.optional(),
});

export const labQuestionSchema = z.strictObject({ id: slug, prompt: markdown, answer: numericAnswerSchema, hint: markdown });

/**
 * Applied to every run of an attempt (lessons/pass-rule.ts); a lab passes when every run passes.
 * `judgement` names which of the simulator's two judgements the lab holds runs to (lib/sim/receiver.ts):
 * "guaranteed" (every pixel that meets its datasheet) or "typical" (typical pixels), and
 * `judgementWhy` says why, in the brief's words. The margins are that judgement's. Every lab also
 * holds the clamp current to the course's one limit (lessons/pass-rule.ts). maxOvershoot is the far
 * end's highest excursion above the settled high level, as a fraction of the pixel supply VDD.
 */
export const passRuleSchema = z.strictObject({
  judgement: z.enum(JUDGEMENTS),
  judgementWhy: markdown,
  allBitsDecode: z.literal(true),
  minTimingMargin: z.number().min(0),
  minVoltageMargin: z.number().min(0),
  maxOvershoot: z.number().positive().max(1).optional(),
  maxRiseTime: seconds.optional(),
  cableSpec: z
    .strictObject({
      minZ0: ohms,
      maxZ0: ohms,
      maxDelayPerMetre: seconds,
      maxCapacitancePerMetre: z.number().positive(),
    })
    .optional(),
});

/**
 * Scoring of one graded attempt (lessons/scoring.ts):
 * - a passing run scores passBase + (100 − passBase)·m, where m is the smaller of the timing and
 *   voltage margins' progress from the pass rule's minimum (0) to fullMarksMargin (1), each clipped
 *   to 0..1: the weaker margin counts, so a run never outscores one with more of both;
 * - a failing run scores failCreditMax · (bits decoded correctly ÷ bits sent);
 * - the runs' score is their minimum (every run counts); lab questions, when present, weigh
 *   questionShare of the total (100 · correct ÷ asked);
 * - attempts beyond the first `penaltyPerAttemptBeyond` lose `penalty` points each; never below 0.
 */
export const scoringSchema = z
  .strictObject({
    fullMarksMargin: z.strictObject({ timing: seconds, voltage: volts }),
    passBase: z.number().min(0).max(100),
    failCreditMax: z.number().min(0).max(100),
    questionShare: z.number().min(0).max(0.5),
    penaltyPerAttemptBeyond: z.number().int().min(0),
    penalty: z.number().min(0).max(20),
  })
  .refine((s) => s.failCreditMax < s.passBase, { message: "a failing run must score below a passing one", path: ["failCreditMax"] });

/**
 * Why a mistake fails, in the lesson's terms: ringing through a threshold; an edge too slow for the
 * pulse (RC); a far end that climbs a staircase and never clears the threshold; a driver level below
 * the threshold; a pulse timing the decoder misreads; a cable outside the specification; overshoot
 * beyond the limit or into the clamp diodes.
 */
export const mechanismSchema = z.enum(["ringing", "slow-edge", "staircase", "low-level", "timing", "off-spec-cable", "overshoot"]);

/**
 * The author's worked answer for the default variant (no seed): a solution that passes, and
 * mistakes that fail for the reason the lesson teaches. Tests run them through the simulator.
 */
export const referenceSchema = z.strictObject({
  solution: z.record(z.string(), runChoicesSchema),
  mistakes: z
    .array(z.strictObject({ choices: z.record(z.string(), runChoicesSchema), mechanism: mechanismSchema, explanation: markdown }))
    .min(1),
});

export const labSchema = z
  .strictObject({
    slug,
    title: z.string().trim().min(1),
    brief: markdown,
    runs: z.array(runSpecSchema).min(1).max(4),
    questions: z.array(labQuestionSchema).max(4),
    passRule: passRuleSchema,
    scoring: scoringSchema,
    reference: referenceSchema,
  })
  .superRefine((lab, ctx) => {
    const ids = lab.runs.map((r) => r.id);
    flagRepeats(ctx, idsAt("runs", lab.runs));
    flagRepeats(ctx, idsAt("questions", lab.questions));
    if (lab.questions.length === 0 && lab.scoring.questionShare > 0) {
      ctx.addIssue({ code: "custom", path: ["scoring", "questionShare"], message: "must be 0 when the lab asks no questions" });
    }
    const examples = [
      { path: ["reference", "solution"], choices: lab.reference.solution },
      ...lab.reference.mistakes.map((m, i) => ({ path: ["reference", "mistakes", i, "choices"], choices: m.choices })),
    ];
    for (const { path, choices } of examples) {
      const keys = Object.keys(choices).sort();
      if (keys.join() !== [...ids].sort().join()) ctx.addIssue({ code: "custom", path, message: `must give choices for runs ${ids.join(", ")}` });
    }
  });

export const benchAskSchema = z.strictObject({
  id: slug,
  label: z.string().trim().min(1),
  kind: z.enum(["cable", "length", "resistor", "riseTime", "overshoot", "text"]),
  /** mathjs unit the learner types the measured value in; "" for cable and free text. */
  unit: z.string(),
});

export const benchExerciseSchema = z
  .strictObject({
    slug,
    title: z.string().trim().min(1),
    /** Study time the exercise asks for at the bench, counted in the certificate's hours of study. */
    minutes: z.number().int().positive().max(480),
    brief: markdown,
    asks: z.array(benchAskSchema).min(1),
    photo: z.strictObject({ required: z.boolean(), mustShow: z.array(z.string().trim().min(1)).min(1) }),
    rubric: z.array(z.strictObject({ id: slug, criterion: z.string().trim().min(1), points: z.number().int().positive() })).min(1),
  })
  .superRefine((bench, ctx) => {
    flagRepeats(ctx, idsAt("asks", bench.asks));
    flagRepeats(ctx, idsAt("rubric", bench.rubric));
  });

/**
 * A lesson as written: its text quotes computed numbers as `{{name}}` placeholders
 * (lessons/numbers/placeholders.ts), printed from `numbers` when the lesson is loaded; a
 * placeholder naming no number, or with an option it cannot take, fails validation at its field.
 */
export const lessonSchema = z
  .strictObject({
    slug,
    number: z.number().int().min(1),
    title: z.string().trim().min(1),
    summary: z.string().trim().min(1),
    minutes: z.number().int().positive().max(240),
    numbers: lessonNumbersSchema.default({}),
    blocks: z.array(blockSchema).min(1),
    lab: labSchema.nullable(),
    bench: benchExerciseSchema.optional(),
  })
  .superRefine((lesson, ctx) => {
    const checks = lesson.blocks.flatMap((b, i) =>
      b.kind === "check" || b.kind === "choice" ? [{ value: b.id, path: ["blocks", i, "id"], where: `blocks.${i}.id` }] : [],
    );
    if (checks.length < 3 || checks.length > 8) {
      ctx.addIssue({ code: "custom", path: ["blocks"], message: `a lesson needs 3 to 8 quick checks, found ${checks.length}` });
    }
    const choices = lesson.blocks.filter((b) => b.kind === "choice").length;
    if (choices < 2) ctx.addIssue({ code: "custom", path: ["blocks"], message: `a lesson needs at least 2 checks that are not numeric, found ${choices}` });
    flagRepeats(ctx, checks);
  })
  .transform(({ numbers, blocks, ...content }, ctx) => {
    const report = ({ path, message }: TextProblem) => ctx.addIssue({ code: "custom", path, message });
    return {
      numbers,
      ...resolveText(content, numbers, report),
      blocks: blocks.map((block, i) => (block.kind === "check" ? resolveCheck(block, numbers, report, ["blocks", i]) : resolveText(block, numbers, report, ["blocks", i]))),
    };
  });

/** A numeric check as served: the text and answer of each given, printed with the given's numbers as `given.…`. */
export type CheckVariant = { prompt: string; hint: string; explanation: string; answer: NumericAnswer; given: LessonNumbers };

function resolveCheck(block: z.infer<typeof checkBlockSchema>, numbers: LessonNumbers, report: (problem: TextProblem) => void, path: (string | number)[]) {
  const { givens, answer, ...rest } = block;
  const texts = { prompt: rest.prompt, hint: rest.hint, explanation: rest.explanation };
  const variants: CheckVariant[] = givens
    ? givens.map((given, g) => {
        const scoped = { ...numbers, ...Object.fromEntries(Object.entries(given.numbers).map(([name, value]) => [`given.${name}`, value])) };
        const resolved = resolveText(texts, scoped, ({ path: at, message }) => report({ path: [...path, ...at], message: `given ${g}: ${message}` }));
        return { ...resolved, answer: given.answer, given: given.numbers };
      })
    : [{ ...resolveText(texts, numbers, ({ path: at, message }) => report({ path: [...path, ...at], message })), answer: answer!, given: {} }];
  return { kind: block.kind, id: block.id, ...variants[0], variants };
}

export const courseSchema = z
  .strictObject({
    slug,
    title: z.string().trim().min(1),
    summary: z.string().trim().min(1),
    unlockInOrder: z.boolean(),
    lessons: z.array(lessonSchema).min(1),
    completion: z.strictObject({
      labs: z.array(z.strictObject({ lab: slug, minScore: z.number().min(0).max(100) })),
      benchExercises: z.array(slug),
    }),
    /**
     * What a certificate of the course says its holder can do, each shown by labs and bench
     * exercises the completion rule requires; every requirement backs at least one competence.
     */
    competences: z
      .array(z.strictObject({ statement: z.string().trim().min(1).max(200), shownBy: z.array(slug).min(1) }))
      .min(1)
      .max(6),
  })
  .superRefine((course, ctx) => {
    course.lessons.forEach((lesson, i) => {
      if (lesson.number !== i + 1) ctx.addIssue({ code: "custom", path: ["lessons", i, "number"], message: `expected lesson number ${i + 1}` });
    });
    const labs = new Set(course.lessons.flatMap((l) => (l.lab ? [l.lab.slug] : [])));
    const benches = new Set(course.lessons.flatMap((l) => (l.bench ? [l.bench.slug] : [])));
    course.completion.labs.forEach((entry, i) => {
      if (!labs.has(entry.lab)) ctx.addIssue({ code: "custom", path: ["completion", "labs", i, "lab"], message: `no lab "${entry.lab}" in the course` });
    });
    course.completion.benchExercises.forEach((slugValue, i) => {
      if (!benches.has(slugValue)) ctx.addIssue({ code: "custom", path: ["completion", "benchExercises", i], message: `no bench exercise "${slugValue}"` });
    });
    const required = new Set([...course.completion.labs.map((entry) => entry.lab), ...course.completion.benchExercises]);
    const shown = new Set<string>();
    course.competences.forEach((competence, i) =>
      competence.shownBy.forEach((slugValue, j) => {
        shown.add(slugValue);
        if (!required.has(slugValue)) {
          ctx.addIssue({ code: "custom", path: ["competences", i, "shownBy", j], message: `"${slugValue}" is not a lab or bench exercise the certificate requires` });
        }
      }),
    );
    for (const slugValue of required) {
      if (!shown.has(slugValue)) ctx.addIssue({ code: "custom", path: ["competences"], message: `no competence is shown by "${slugValue}"` });
    }
    // Lessons, labs and bench exercises are stored and linked by slug, each kind in its own table.
    const slugsOf = (part: "lab" | "bench" | null) =>
      course.lessons.flatMap((lesson, i) => {
        const owner = part ? lesson[part] : lesson;
        const where = `lesson ${lesson.number}${part ? `'s ${part}` : ""}`;
        return owner ? [{ value: owner.slug, path: part ? ["lessons", i, part, "slug"] : ["lessons", i, "slug"], where }] : [];
      });
    flagRepeats(ctx, slugsOf(null));
    flagRepeats(ctx, slugsOf("lab"));
    flagRepeats(ctx, slugsOf("bench"));
  });

export type NumericAnswer = z.infer<typeof numericAnswerSchema>;
export type Block = Lesson["blocks"][number];
export type CheckBlock = Extract<Block, { kind: "check" }>;
export type ChoiceCheckBlock = z.infer<typeof choiceCheckBlockSchema>;
export type CheckRun = z.infer<typeof checkRunSchema>;
export type CheckFixes = z.infer<typeof checkFixesSchema>;
export type ChoiceAsk = (typeof CHOICE_ASKS)[number];
export type Driver = z.infer<typeof driverSchema>;
export type Receiver = z.infer<typeof receiverSchema>;
export type Signal = z.infer<typeof signalSchema>;
export type Scenario = z.infer<typeof scenarioSchema>;
export type ChoiceSpec = z.infer<typeof choiceSpecSchema>;
export type VariantSpec = z.infer<typeof variantSpecSchema>;
export type RunSpec = z.infer<typeof runSpecSchema>;
export type RunChoices = z.infer<typeof runChoicesSchema>;
export type LabQuestion = z.infer<typeof labQuestionSchema>;
export type PassRule = z.infer<typeof passRuleSchema>;
export type Scoring = z.infer<typeof scoringSchema>;
export type Mechanism = z.infer<typeof mechanismSchema>;
export type Lab = z.infer<typeof labSchema>;
export type BenchExercise = z.infer<typeof benchExerciseSchema>;
export type Lesson = z.infer<typeof lessonSchema>;
export type Course = z.infer<typeof courseSchema>;
export type LessonInput = z.input<typeof lessonSchema>;
export type LabInput = z.input<typeof labSchema>;
export type CourseInput = z.input<typeof courseSchema>;
export type BenchExerciseInput = z.input<typeof benchExerciseSchema>;
