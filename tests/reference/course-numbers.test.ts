/**
 * Every number the course asks a learner for, recomputed from its own formula, and the tables the
 * lessons print, recomputed from their sources:
 * - protocol timing and receiver thresholds: the simulator's defaults (parseSimInput, docs/simulator.md);
 * - where typical pixels switch (the 3.3 V window): the simulator's typical band, switching point
 *   ± spread with its hysteresis, from the same defaults;
 * - cable constants: the simulator's catalogue, computed from geometry with the two-wire and coax
 *   line formulas of transmission-line textbooks;
 * - wire: ASTM B258 diameters and annealed copper (1.7241e-8 Ω·m, IEC 60028) through lib/sim/awg;
 * - TTL-compatible input levels (2.0 V / 0.8 V): JEDEC JESD8;
 * - resistor tolerance per series: IEC 60063;
 * - rise time = τ·ln 9 for an RC charge, scope rise ≈ 0.35 / bandwidth, root-sum-of-squares of
 *   cascaded rise times, LC resonance 1/(2π√(LC)), reflection coefficients and the open-end
 *   bounce series V·(1 − Γs^n): electronics textbook formulas;
 * - silicon diode forward drop 0.7 V: textbook figure;
 * - driver resistances and edge times: the course's driver list (lessons/drivers.ts).
 * A learner who types the formula's result must be accepted: each answer lies within half its
 * tolerance of the recomputed value.
 */
import { describe, expect, it } from "vitest";
import {
  awgDiameter,
  awgResistancePerMetre,
  cableCatalogue,
  colourBits,
  eSeriesValues,
  parseSimInput,
  perMetreFromGeometry,
  type TwoWireGeometry,
} from "@/lib/sim";
import { getCourse, type Lesson, type NumericAnswer } from "@/lessons";
import { buffer5v, controllerPin3v3 } from "@/lessons/drivers";

const defaults = parseSimInput({ cable: { kind: "beside-ground", length: 1 }, signal: { bits: "0" } });
const T_BIT = defaults.signal.bitPeriod;
const ZERO_HIGH = defaults.signal.zeroHigh;
const ONE_HIGH = defaults.signal.oneHigh;
const DECISION = defaults.receiver.decisionTime;
const HIGH = defaults.receiver.highThreshold;
const INPUT_C = defaults.receiver.inputCapacitance;
/** The highest level at which a typical pixel reads a rise, and where one switching at the top of the band reads a fall (5 V). */
const TYPICAL_TOP = (defaults.receiver.typicalSwitchingPoint + defaults.receiver.typicalSpread) * 5;
const TYPICAL_RISE = TYPICAL_TOP + (defaults.receiver.typicalHysteresis * 5) / 2;
const TYPICAL_FALL = TYPICAL_TOP - (defaults.receiver.typicalHysteresis * 5) / 2;
const TYPICAL_LOWEST_FALL = (defaults.receiver.typicalSwitchingPoint - defaults.receiver.typicalSpread) * 5 - (defaults.receiver.typicalHysteresis * 5) / 2;
const WORD_BITS = 24;
const LN9 = Math.log(9);
const SPEED_OF_LIGHT = 299_792_458;
const TTL_HIGH = 2.0;
const DIODE_DROP = 0.7;
const PROBE_C = 10e-12;

const lone = cableCatalogue["lone-lead"];
const beside = cableCatalogue["beside-ground"];
const twisted = cableCatalogue["twisted-pair"];
const threeCore = cableCatalogue["three-core"];
const gamma = (source: number, z0: number) => (source - z0) / (source + z0);
/** Lesson 5's fourth case: the controller pin with 100 Ω into 10 m of lone lead. */
const CASE4_SOURCE = controllerPin3v3.outputResistance + 100;
const CASE4_DELAY = 10 * lone.delayPerMetre;
/** First arrival n at which the open far end stays within `fraction` of its final level: |Γs|^n < fraction. */
const settlingArrival = (gammaS: number, fraction: number) => Math.ceil(Math.log(fraction) / Math.log(Math.abs(gammaS)));
const frame = (pixels: number, latch: number) => pixels * WORD_BITS * T_BIT + latch;
const ones = (bits: string) => [...bits].filter((b) => b === "1").length;

/** Source resistance below which the doubled first arrival of `volts` clears `threshold` by `margin`. */
const firstArrivalLimit = (z0: number, volts: number, threshold: number, margin: number) => z0 * ((2 * volts) / (threshold + margin) - 1);
/** Source resistance above which the second arrival V·(1 − Γs²) stays `margin` above `level`. */
function secondArrivalLimit(z0: number, volts: number, level: number, margin: number): number {
  const deepest = Math.sqrt(1 - (level + margin) / volts);
  return z0 * ((1 - deepest) / (1 + deepest));
}

/** A seeded check's premise, by its name in the given's numbers, in SI. */
type Given = (name: string) => number;
type Formula = { source: string; value: (given: Given) => number };

const formulas: Record<string, Formula> = {
  "pixel-data-stream/bit-rate": { source: "f = 1/T", value: (given) => 1 / given("period") },
  "pixel-data-stream/word-high-time": {
    source: "sum of high times of a GRB word (simulator defaults)",
    value: () => {
      const bits = colourBits([[0, 170, 0]], "GRB");
      return ones(bits) * ONE_HIGH + (bits.length - ones(bits)) * ZERO_HIGH;
    },
  },
  "pixel-data-stream/frame-time-200": { source: "T = N·24·T_bit + T_latch", value: (given) => frame(given("pixels"), 280e-6) },
  "pixel-data-stream/refresh-200": { source: "f = 1 / T_frame", value: (given) => 1 / frame(given("pixels"), 280e-6) },
  "pixel-data-stream/max-pixels-40hz": {
    source: "N = floor((1/f − T_latch) / (24·T_bit))",
    value: (given) => Math.floor((1 / given("rate") - 50e-6) / (WORD_BITS * T_BIT)),
  },
  "timing-budget/frame-time": { source: "T = N·24·T_bit + T_latch", value: () => frame(360, 300e-6) },
  "timing-budget/refresh-rate": { source: "f = 1 / T_frame", value: () => 1 / frame(360, 300e-6) },

  "logic-levels/high-threshold-5v": { source: "simulator default high threshold × VDD", value: (given) => HIGH * given("supply") },
  "logic-levels/margin-sagged-supply": { source: "NM_high = V_OH − 0.7·VDD", value: () => 3.3 - HIGH * 4.5 },
  "logic-levels/shifter-input-margin": { source: "JEDEC JESD8 TTL-compatible V_IH = 2.0 V", value: (given) => given("high") - TTL_HIGH },
  "logic-levels/ground-offset": { source: "Ohm's law; 20 AWG from ASTM B258 + IEC 60028", value: () => 4 * 2.5 * awgResistancePerMetre(20) },
  "logic-levels/mid-supply-margin": { source: "V_OH − VDD/2", value: (given) => given("high") - 5 / 2 },
  "thresholds/direct-high-margin": { source: "NM_high = V_OH − 0.7·VDD", value: () => 3.3 - HIGH * 5 },
  "thresholds/shifted-high-margin": { source: "NM_high = V_OH − 0.7·VDD", value: () => 5 - HIGH * 5 },

  "edges/time-constant": {
    source: "τ = R·C; C from the catalogue plus the simulator's default input capacitance",
    value: (given) => (20 + given("series")) * (given("length") * beside.perMetre.capacitance + INPUT_C),
  },
  "edges/rise-time": { source: "RC charge: t(10→90 %) = τ·ln 9", value: (given) => LN9 * given("tau") },
  "edges/cable-capacitance": { source: "C′·length + input capacitance", value: () => 4 * beside.perMetre.capacitance + INPUT_C },
  "edges/largest-resistance": { source: "R = t_rise / (C·ln 9)", value: () => 100e-9 / (LN9 * (4 * beside.perMetre.capacitance + INPUT_C)) },
  "edges/clamp-current": { source: "Ohm's law with a 0.7 V silicon diode drop (textbook)", value: (given) => (5 - DIODE_DROP) / (20 + given("series")) },

  "transmission-line/z0-from-per-metre": { source: "Z0 = √(L′/C′)", value: () => Math.sqrt(520e-9 / 52e-12) },
  "transmission-line/delay-per-metre": { source: "delay = √(L′·C′)", value: () => Math.sqrt(520e-9 * 52e-12) },
  "transmission-line/run-delay": { source: "length × catalogue delay per metre", value: () => 12 * beside.delayPerMetre },
  "transmission-line/launched-step": { source: "voltage divider with Z0 (catalogue)", value: (given) => (5 * beside.z0) / (20 + given("series") + beside.z0) },
  "transmission-line/round-trip-length": {
    source: "2·length·delay = rise time; catalogue delay",
    value: (given) => given("edge") / (2 * twisted.delayPerMetre),
  },
  "transmission-line/effective-permittivity": {
    source: "delay = √ε_eff / c",
    value: (given) => (given("delay") * SPEED_OF_LIGHT) ** 2,
  },
  "cable-spec/capacitance-10m": { source: "C′·length (catalogue)", value: () => 10 * beside.perMetre.capacitance },
  "cable-spec/round-trip-twisted": { source: "2 · length · delay per metre (catalogue)", value: () => 2 * 10 * twisted.delayPerMetre },

  "reflections/source-coefficient": { source: "Γ = (R − Z0)/(R + Z0)", value: (given) => gamma(20 + given("series"), beside.z0) },
  "reflections/first-arrival": { source: "V_far(1) = V·(1 − Γs)", value: (given) => 5 * (1 - gamma(20 + given("series"), beside.z0)) },
  "reflections/ringing-period": { source: "four one-way delays (catalogue)", value: (given) => 4 * given("length") * lone.delayPerMetre },
  "reflections/settling-time": {
    source: "first n with |Γs|^n < 1 %, arriving at (2n − 1)·T_d (catalogue delay, controller pin)",
    value: (given) => (2 * settlingArrival(gamma(controllerPin3v3.outputResistance + given("series"), lone.z0), 0.01) - 1) * CASE4_DELAY,
  },
  "reflections/staircase-second-step": { source: "V_far(n) = V·(1 − Γs^n)", value: (given) => 5 * (1 - gamma(20 + given("series"), beside.z0) ** 2) },

  "series-termination/matching-resistor": { source: "R_s = Z0 − R_out (catalogue Z0)", value: () => lone.z0 - 30 },
  "series-termination/first-arrival-3v3": { source: "V_far(1) = 2·V·Z0/(R_src + Z0)", value: (given) => (2 * 3.3 * lone.z0) / (30 + given("series") + lone.z0) },
  "series-termination/beside-ground-limit": {
    source: "first arrival 0.3 V above the highest typical rise level: R_src = Z0·(2V/(V_rise + m) − 1)",
    value: () => firstArrivalLimit(beside.z0, 3.3, TYPICAL_RISE, 0.3) - 30,
  },
  "series-termination/staircase-arrival": {
    source: "(2n − 1)·T_d, n the first arrival V·(1 − Γs^n) above 0.7·VDD (catalogue delay)",
    value: (given) => {
      const n = Math.ceil(Math.log(1 - HIGH) / Math.log(gamma(20 + given("series"), threeCore.z0)));
      return (2 * n - 1) * 15 * threeCore.delayPerMetre;
    },
  },

  "designing-a-run/twisted-pair-limit": {
    source: "first arrival 0.3 V above the highest typical rise level",
    value: () => firstArrivalLimit(twisted.z0, 3.3, TYPICAL_RISE, 0.3) - 30,
  },
  "designing-a-run/resistor-tolerance": { source: "IEC 60063: E24 with ±5 %", value: () => 68 * 1.05 },
  "designing-a-run/supply-drop": {
    source: "Ohm's law over the loop; 18 AWG from ASTM B258 + IEC 60028",
    value: (given) => given("current") * 2 * given("length") * awgResistancePerMetre(18),
  },
  "designing-a-run/long-run-delay": { source: "length × catalogue delay per metre", value: () => 25 * twisted.delayPerMetre },

  "on-the-bench/scope-rise-time": { source: "t_rise ≈ 0.35 / bandwidth", value: (given) => 0.35 / given("bandwidth") },
  "on-the-bench/measured-rise": { source: "root sum of squares of cascaded rise times", value: (given) => Math.hypot(10e-9, 0.35 / given("bandwidth")) },
  "on-the-bench/ground-lead-ring": { source: "f = 1/(2π√(LC))", value: (given) => 1 / (2 * Math.PI * Math.sqrt(given("inductance") * PROBE_C)) },
  "on-the-bench/probe-loading": { source: "far-end τ = Z0·C, rise = τ·ln 9", value: (given) => LN9 * lone.z0 * (INPUT_C + given("capacitance")) },
};

const course = getCourse();
const givenOf =
  (numbers: Record<string, { value: number }>): Given =>
  (name) => {
    if (!numbers[name]) throw new Error(`the given has no number ${name}`);
    return numbers[name].value;
  };
const asked: { key: string; answer: NumericAnswer; given: Given }[] = course.lessons.flatMap((lesson: Lesson) => [
  ...lesson.blocks.flatMap((b) => (b.kind === "check" ? b.variants.map((v) => ({ key: `${lesson.slug}/${b.id}`, answer: v.answer, given: givenOf(v.given) })) : [])),
  ...(lesson.lab?.questions ?? []).map((q) => ({ key: `${lesson.lab!.slug}/${q.id}`, answer: q.answer, given: givenOf({}) })),
]);

describe("every quick check and lab question against its formula", () => {
  it("has a formula for each numeric question, and no formula without a question", () => {
    expect([...new Set(asked.map((a) => a.key))].sort()).toEqual(Object.keys(formulas).sort());
  });

  it.each(asked)("$key", ({ key, answer, given }) => {
    const expected = formulas[key].value(given);
    expect(Math.abs(answer.value - expected)).toBeLessThanOrEqual(0.5 * answer.tolerance * Math.abs(expected));
  });

  it("sanity of the decision time the lessons teach (0.6 µs between the two high times)", () => {
    expect(ZERO_HIGH).toBeLessThan(DECISION);
    expect(ONE_HIGH).toBeGreaterThan(DECISION);
    expect(DECISION - ZERO_HIGH).toBeCloseTo(200e-9, 12);
  });
});

/** Rows of the first markdown table after `heading` in the lesson's text blocks, as cells. */
function tableAfter(lesson: Lesson, heading: string): string[][] {
  const text = lesson.blocks.flatMap((b) => (b.kind === "text" ? [b.markdown] : [])).join("\n");
  const from = text.indexOf(heading);
  if (from < 0) throw new Error(`no "${heading}" in ${lesson.slug}`);
  const lines = text.slice(from).split("\n");
  const start = lines.findIndex((l) => l.trim().startsWith("|"));
  const rows: string[][] = [];
  for (let i = start + 2; i < lines.length && lines[i].trim().startsWith("|"); i += 1) {
    rows.push(lines[i].split("|").slice(1, -1).map((c) => c.trim()));
  }
  return rows;
}

const lessonBySlug = (slug: string) => course.lessons.find((l) => l.slug === slug)!;
const number = (cell: string) => Number(cell.replace(/[^\d.]/g, ""));
const closeTo = (stated: number, exact: number, relative: number) => Math.abs(stated - exact) <= relative * Math.abs(exact);

describe("tables printed in the lessons", () => {
  it("lesson 4's cable table matches the simulator's catalogue (to its printed rounding)", () => {
    const rows = tableAfter(lessonBySlug("transmission-line"), "## The course's cables");
    expect(rows).toHaveLength(5);
    for (const [name, z0, c, l, delay, r] of rows) {
      const kind = name.match(/\(([a-z0-9-]+)\)/)![1] as keyof typeof cableCatalogue;
      const entry = cableCatalogue[kind];
      expect(closeTo(number(z0), entry.z0, 0.005), `${kind} Z0`).toBe(true);
      expect(closeTo(number(c) * 1e-12, entry.perMetre.capacitance, 0.005), `${kind} C′`).toBe(true);
      expect(closeTo(number(l) * 1e-9, entry.perMetre.inductance, 0.005), `${kind} L′`).toBe(true);
      expect(closeTo(number(delay) * 1e-9, entry.delayPerMetre, 0.005), `${kind} delay`).toBe(true);
      expect(closeTo(number(r) * 1e-3, entry.perMetre.resistance, 0.01), `${kind} R′`).toBe(true);
    }
  });

  it("lesson 2's wire table matches ASTM B258 diameters and annealed-copper resistance", () => {
    const rows = tableAfter(lessonBySlug("logic-levels"), "## Whose 0 V?");
    expect(rows.length).toBeGreaterThanOrEqual(4);
    for (const [size, diameter, resistance] of rows) {
      const gauge = number(size);
      expect(closeTo(number(diameter) * 1e-3, awgDiameter(gauge), 0.002), `${gauge} AWG diameter`).toBe(true);
      expect(closeTo(number(resistance) * 1e-3, awgResistancePerMetre(gauge), 0.02), `${gauge} AWG resistance`).toBe(true);
    }
  });

  it("lesson 1's frame table follows T = N·24·T_bit + 280 µs", () => {
    const rows = tableAfter(lessonBySlug("pixel-data-stream"), "The same arithmetic for other chain lengths");
    expect(rows).toHaveLength(4);
    for (const [pixels, data, frameTime, refresh] of rows) {
      const n = number(pixels);
      expect(closeTo(number(data) * 1e-3, n * WORD_BITS * T_BIT, 0.002)).toBe(true);
      expect(closeTo(number(frameTime) * 1e-3, frame(n, 280e-6), 0.002)).toBe(true);
      expect(closeTo(number(refresh), 1 / frame(n, 280e-6), 0.005)).toBe(true);
    }
  });

  it("lesson 6's 3.3 V window table follows the first and second arrivals against the typical band (0.3 V margin each side)", () => {
    const rows = tableAfter(lessonBySlug("series-termination"), "## The 3.3 V design window");
    expect(rows).toHaveLength(5);
    const kinds = ["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"] as const;
    rows.forEach(([, z0, window], i) => {
      const entry = cableCatalogue[kinds[i]];
      expect(closeTo(number(z0), entry.z0, 0.005)).toBe(true);
      const upper = firstArrivalLimit(entry.z0, 3.3, TYPICAL_RISE, 0.3) - 30;
      const stated = [...window.matchAll(/(\d+(?:\.\d+)?) Ω/g)].map((m) => Number(m[1]));
      expect(Math.abs(stated[stated.length - 1] - upper), `${kinds[i]} upper edge`).toBeLessThanOrEqual(1);
      const lower = Math.max(0, secondArrivalLimit(entry.z0, 3.3, TYPICAL_FALL, 0.3) - 30);
      expect(Math.abs(stated[0] - lower), `${kinds[i]} lower edge`).toBeLessThanOrEqual(1);
    });
  });

  it("lesson 7's lone-lead impedances at 5 mm and 30 mm follow the unequal two-wire formula", () => {
    const geometry = lone.geometry as TwoWireGeometry;
    const z0At = (spacing: number) => {
      const perMetre = perMetreFromGeometry({ ...geometry, centreSpacing: spacing });
      return Math.sqrt(perMetre.inductance / perMetre.capacitance);
    };
    const text = lessonBySlug("designing-a-run").blocks.flatMap((b) => (b.kind === "text" ? [b.markdown] : [])).join("\n");
    expect(text).toContain(`at 5 mm the figure is about ${Math.round(z0At(5e-3))} Ω`);
    expect(text).toContain(`at 30 mm about ${Math.round(z0At(30e-3))} Ω`);
  });
});

const textOf = (slug: string) => lessonBySlug(slug).blocks.flatMap((b) => (b.kind === "text" ? [b.markdown] : [])).join("\n");
/** A signed number as printed in the lessons, with the typographic minus. */
const signed = (cell: string) => Number(cell.replace("−", "-").replace("+", ""));

describe("worked examples printed in the lessons", () => {
  it("lesson 1's colour word for red 200 in GRB order is the simulator's", () => {
    const bits = colourBits([[200, 0, 0]], "GRB");
    const grouped = (byte: string) => `${byte.slice(0, 4)} ${byte.slice(4)}`;
    expect(textOf("pixel-data-stream")).toContain([bits.slice(0, 8), bits.slice(8, 16), bits.slice(16)].map(grouped).join(" · "));
    expect(textOf("pixel-data-stream")).toContain(`So 200 = ${grouped(bits.slice(8, 16))}`);
  });

  it("lesson 6's four 3.3 V cases fall where the text puts them", () => {
    const arrival = (series: number, z0: number, n: number) => 3.3 * (1 - gamma(30 + series, z0) ** n);
    expect(gamma(30 + 250, beside.z0), "beside ground, 250 Ω: a staircase").toBeGreaterThan(0);
    for (const [series, z0] of [[33, beside.z0], [250, lone.z0]]) {
      expect(arrival(series, z0, 1), `${series} Ω: first arrival above the typical rise level`).toBeGreaterThan(TYPICAL_RISE);
      expect(arrival(series, z0, 2), `${series} Ω: second arrival above the top fall level`).toBeGreaterThan(TYPICAL_FALL);
    }
    expect(arrival(33, lone.z0, 2), "lone lead, 33 Ω: the second arrival below every typical fall level").toBeLessThan(TYPICAL_LOWEST_FALL);
  });

  it("lesson 6's E12 and E24 lists are IEC 60063's", () => {
    const e12 = eSeriesValues("E12", 10, 82);
    const e24Only = eSeriesValues("E24", 10, 91).filter((r) => !e12.includes(r));
    const text = textOf("series-termination");
    expect(text).toContain(`twelve values per decade, ${e12.join(", ")};`);
    expect(text).toContain(`E24 adds ${e24Only.join(", ")};`);
  });

  it("lesson 5's step-by-step bounce table follows (2n − 1)·T_d, 2·V_launch·Γs^(n−1) and V·(1 − Γs^n)", () => {
    const rows = tableAfter(lessonBySlug("reflections"), "## A bounce diagram, step by step");
    expect(rows).toHaveLength(6);
    const volts = controllerPin3v3.highVoltage;
    const gammaS = gamma(CASE4_SOURCE, lone.z0);
    const launched = (volts * lone.z0) / (CASE4_SOURCE + lone.z0);
    rows.forEach(([arrival, time, step, far], i) => {
      const n = i + 1;
      expect(number(arrival)).toBe(n);
      expect(Math.abs(number(time) * 1e-9 - (2 * n - 1) * CASE4_DELAY), `arrival ${n} time`).toBeLessThanOrEqual(0.6e-9);
      expect(Math.abs(signed(step) - 2 * launched * gammaS ** (n - 1)), `arrival ${n} step`).toBeLessThanOrEqual(0.006);
      expect(Math.abs(signed(far) - volts * (1 - gammaS ** n)), `arrival ${n} far end`).toBeLessThanOrEqual(0.006);
    });
  });

  it("lesson 5's fourth case: coefficient, launched step, settling and the shorter cable", () => {
    const text = textOf("reflections");
    const gammaS = gamma(CASE4_SOURCE, lone.z0);
    const z0 = Math.round(lone.z0);
    expect(text).toContain(`Γ_s = (${CASE4_SOURCE} − ${z0}) / (${CASE4_SOURCE} + ${z0}) = −${Math.abs(gammaS).toFixed(3)}`);
    expect(text).toContain(`T_d = ${(CASE4_DELAY * 1e9).toFixed(1)} ns`);
    expect(text).toContain(`the launched step is 3.3 V × ${z0} / ${CASE4_SOURCE + z0} = ${((3.3 * lone.z0) / (CASE4_SOURCE + lone.z0)).toFixed(2)} V`);
    const n = settlingArrival(gammaS, 0.01);
    expect(n).toBe(6);
    expect(text).toContain(`ln 0.01 / ln ${Math.abs(gammaS).toFixed(3)} = ${(Math.log(0.01) / Math.log(Math.abs(gammaS))).toFixed(1)}: arrival ${n}, at ${2 * n - 1} × T_d = ${Math.round((2 * n - 1) * CASE4_DELAY * 1e9)} ns`);
    expect(text).toContain(`A 0 bit is high for only ${Math.round(ZERO_HIGH * 1e9)} ns`);
    const at = (n: number) => (2 * n - 1) * CASE4_DELAY * 1e9;
    expect(text).toContain(`The ${(3.3 * (1 - gammaS ** 2)).toFixed(2)} V plateau lies inside the band where pixels switch`);
    expect(text).toContain(`sees the pulse start at ${at(1).toFixed(1)} ns, end at ${Math.round(at(2))} ns and start again at ${Math.round(at(3))} ns`);
    expect(text).toContain(`(T_d = ${(5 * lone.delayPerMetre * 1e9).toFixed(1)} ns)`);
    expect(text).toContain(`10 m of lone lead has ${(10 * lone.perMetre.resistance).toFixed(2)} Ω against ${z0} Ω`);
    expect(text).toContain(`each one round trip long (${Math.round(2 * CASE4_DELAY * 1e9)} ns on 10 m of lone lead)`);
    expect((buffer5v.outputResistance + 680) / (buffer5v.outputResistance + 330)).toBe(2);
  });

  it("lesson 4's three-core example: Z0 and delay from the printed L′ and C′, and the 4/3 and 3/4 against beside ground", () => {
    const text = textOf("transmission-line");
    const l = Math.round(threeCore.perMetre.inductance * 1e9);
    const c = Number((threeCore.perMetre.capacitance * 1e12).toFixed(1));
    expect(text).toContain(`L′ = ${l} nH/m and C′ = ${c} pF/m`);
    const ratio = (l * 1e-9) / (c * 1e-12);
    expect(text).toContain(`√${(Math.round(ratio / 10) * 10).toLocaleString("en-US")} Ω² ≈ ${Math.round(Math.sqrt(ratio))} Ω`);
    expect(text).toContain(`≈ ${(Math.sqrt(l * 1e-9 * c * 1e-12) * 1e9).toFixed(2)} ns/m (the catalogue's ${threeCore.z0.toFixed(1)} Ω and ${(threeCore.delayPerMetre * 1e9).toFixed(2)} ns/m`);
    expect(threeCore.perMetre.capacitance / beside.perMetre.capacitance).toBeCloseTo(4 / 3, 9);
    expect(threeCore.perMetre.inductance / beside.perMetre.inductance).toBeCloseTo(3 / 4, 9);
    expect(threeCore.delayPerMetre).toBeCloseTo(beside.delayPerMetre, 15);
    expect(text).toContain(`fell from ${beside.z0.toFixed(1)} Ω to ${threeCore.z0.toFixed(1)} Ω`);
    const entries = Object.values(cableCatalogue);
    const z0s = entries.map((e) => e.z0);
    const delays = entries.map((e) => e.delayPerMetre * 1e9);
    expect(text).toContain(`impedances span ${Math.round(Math.min(...z0s))} to ${Math.round(Math.max(...z0s))} Ω`);
    expect(text).toContain(`delays stay between ${Math.min(...delays).toFixed(2)} and ${Math.max(...delays).toFixed(2)} ns/m`);
  });

  it("lesson 4's round-trip rule for the controller pin on twisted pair", () => {
    const text = textOf("transmission-line");
    const rise = controllerPin3v3.edgeTime;
    const delay = twisted.delayPerMetre;
    expect(text).toContain(`(a ${rise * 1e9} ns edge`);
    expect(text).toContain(`${rise * 1e9} ns ÷ (2 × ${(delay * 1e9).toFixed(2)} ns/m) = ${(rise / (2 * delay)).toFixed(2)} m`);
    expect(text).toContain(`${((rise / 6) * 1e9).toFixed(2)} ns ÷ ${(delay * 1e9).toFixed(2)} ns/m = ${(rise / 6 / delay).toFixed(2)} m`);
  });

  it("lesson 4's staircase for lesson 3's short lead follows 5 V·(1 − Γs^n) at (2n − 1)·T_d", () => {
    const text = textOf("transmission-line");
    const source = buffer5v.outputResistance + 330;
    const delay = 2 * beside.delayPerMetre;
    const gammaS = gamma(source, beside.z0);
    expect(text).toContain(`T_d = ${(delay * 1e9).toFixed(1)} ns`);
    expect(text).toContain(`Γ_s = (${source} − ${beside.z0.toFixed(1)}) / (${source} + ${beside.z0.toFixed(1)}) = +${gammaS.toFixed(3)}`);
    const steps = [1, 2, 3, 4, 5].map((n) => `${(buffer5v.highVoltage * (1 - gammaS ** n)).toFixed(2)} V at ${((2 * n - 1) * delay * 1e9).toFixed(1)} ns`);
    expect(text).toContain(steps.join(", "));
    const ninety = settlingArrival(gammaS, 0.1);
    expect(ninety).toBe(5);
    expect(buffer5v.highVoltage * (1 - gammaS)).toBeGreaterThan(0.1 * buffer5v.highVoltage);
    expect(text).toContain(`a rise of ${2 * (ninety - 1)} × T_d ≈ ${Math.round(2 * (ninety - 1) * delay * 1e9)} ns against RC's ${Math.round(LN9 * source * (2 * beside.perMetre.capacitance + INPUT_C) * 1e9)} ns`);
    expect(text).toContain(`first step of ${(buffer5v.highVoltage * (1 - gamma(buffer5v.outputResistance, beside.z0))).toFixed(1)} V`);
  });
});
