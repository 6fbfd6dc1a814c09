import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { gradeNumericAnswer, MAX_ENTRY_LENGTH, parseQuantity } from "@/lib/answers";

function valueOf(entry: string, unit: string): number {
  const parsed = parseQuantity(entry, unit);
  if (!parsed.ok) throw new Error(`expected ${entry} to parse, got: ${parsed.message}`);
  return parsed.value;
}

describe("parseQuantity reads entries with units into SI", () => {
  it.each([
    ["330 ns", "ns", 330e-9],
    ["0.33us", "ns", 330e-9],
    ["0.33 µs", "us", 330e-9],
    ["0.33 μs", "us", 330e-9],
    ["2.2*270*600e-12 s", "ns", 2.2 * 270 * 600e-12],
    ["2.2*270 ohm*600 pF", "ns", 2.2 * 270 * 600e-12],
    ["2.2 × 270 Ω × 600 pF", "ns", 2.2 * 270 * 600e-12],
    ["94 Ω", "ohm", 94],
    ["4.7 kΩ", "ohm", 4700],
    ["60 pF/m", "pF/m", 60e-12],
    ["1.2 kHz", "kHz", 1200],
    ["1.2 KHz", "Hz", 1200],
    ["5.58 ns/m", "ns/m", 5.58e-9],
    ["12 mA", "mA", 0.012],
    ["−0.2 V", "V", -0.2],
    ["ln(9)*350 ohm*124 pF", "ns", Math.log(9) * 350 * 124e-12],
    ["1/(2*pi*sqrt(150e-9 H*10e-12 F))", "MHz", 1 / (2 * Math.PI * Math.sqrt(150e-9 * 10e-12))],
    ["1/(2π sqrt(150 nH * 10 pF))", "MHz", 1 / (2 * Math.PI * Math.sqrt(150e-9 * 10e-12))],
    ["831", "", 831],
    ["-0.278", "", -0.278],
    ["(5.58/3.336)^2", "", (5.58 / 3.336) ** 2],
  ])("%s as %s", (entry, unit, expected) => {
    expect(valueOf(entry, unit) / expected).toBeCloseTo(1, 12);
  });

  // The letter and digit code of IEC 60062, as printed on resistors and schematics, and the unit's
  // name as people type it.
  it.each([
    ["4k7", 4700],
    ["4K7", 4700],
    ["321R", 321],
    ["47r", 47],
    ["R47", 0.47],
    ["1K", 1000],
    ["2M2", 2.2e6],
    ["4.7k", 4700],
    ["45.3R", 45.3],
    ["321 Ohm", 321],
    ["321 ohms", 321],
    ["47 OHM", 47],
    ["4.7 kOhm", 4700],
    ["1 KOhm", 1000],
  ])("the resistance %s", (entry, ohms) => {
    expect(valueOf(entry, "ohm")).toBeCloseTo(ohms, 9);
  });

  it("reads a resistor's code only where a resistance is asked for", () => {
    expect(parseQuantity("4k7", "ns")).toMatchObject({ ok: false, problem: "unparsable" });
    expect(parseQuantity("1K", "ns")).toMatchObject({ ok: false, problem: "wrong-dimension" });
    expect(parseQuantity("4k7k", "ohm")).toMatchObject({ ok: false });
    expect(parseQuantity("4.7k7", "ohm")).toMatchObject({ ok: false });
  });

  it("accepts any unit of the expected kind, not only the one named", () => {
    expect(valueOf("0.000330 ms", "ns") / 330e-9).toBeCloseTo(1, 12);
    expect(valueOf("800000 Hz", "kHz")).toBe(800e3);
  });
});

describe("parseQuantity says clearly what is wrong with an entry", () => {
  it("names the kind of quantity typed and the kind asked for", () => {
    expect(parseQuantity("3 V", "ns")).toEqual({
      ok: false,
      problem: "wrong-dimension",
      message: "'3 V' is a voltage; this asks for a time.",
    });
    expect(parseQuantity("2 m/s", "ns/m")).toMatchObject({ problem: "wrong-dimension", message: "'2 m/s' is a speed; this asks for a delay per metre." });
    expect(parseQuantity("5 V", "")).toMatchObject({ problem: "wrong-dimension", message: "'5 V' is a voltage; this asks for a plain number, without a unit." });
    expect(parseQuantity("3 V*s", "ns").ok).toBe(false);
  });

  it("explains that a unit after a division belongs to the number before it", () => {
    expect(parseQuantity("1/1.25 us", "kHz")).toMatchObject({
      problem: "wrong-dimension",
      message: "'1/1.25 us' is a time; this asks for a frequency. To divide by a quantity, put it in brackets with its unit, e.g. 1/(2 ms).",
    });
    expect(parseQuantity("1/(1.25 us)", "kHz")).toMatchObject({ ok: true, value: expect.closeTo(800e3, 6) });
    expect(parseQuantity("2 ns/m", "ns")).toMatchObject({ message: "'2 ns/m' is a delay per metre; this asks for a time." });
  });

  it("refuses a bare number when a unit is expected, and suggests the entry with its unit", () => {
    expect(parseQuantity("330", "ns")).toEqual({
      ok: false,
      problem: "missing-unit",
      message: "'330' has no unit; this asks for a time. Add the unit, e.g. 330 ns.",
    });
  });

  it("explains unreadable entries with an example in the expected unit", () => {
    expect(parseQuantity("abc", "ns")).toEqual({
      ok: false,
      problem: "unparsable",
      message: "Could not read 'abc' as a number with a unit, e.g. 330 ns.",
    });
    expect(parseQuantity("three", "")).toMatchObject({ message: "Could not read 'three' as a number, e.g. 0.25." });
    expect(parseQuantity("0,33 us", "us")).toMatchObject({ problem: "unparsable", message: expect.stringContaining("with a point") });
    expect(parseQuantity("ns", "ns")).toMatchObject({ problem: "unparsable" });
    expect(parseQuantity("1e400 s", "s")).toMatchObject({ problem: "unparsable" });
  });

  it("refuses empty and over-long entries before parsing", () => {
    expect(parseQuantity("   ", "ns")).toMatchObject({ problem: "empty" });
    expect(parseQuantity(`${"1+".repeat(MAX_ENTRY_LENGTH)}1 ns`, "ns")).toMatchObject({ problem: "too-long" });
  });

  it.each([
    "import({ evaluate: 1 }, { override: true })",
    "evaluate('1 ns')",
    "createUnit('blip', '1 ns')",
    "f(x) = x",
    "a = 330 ns",
    "[330 ns]",
    "{a: 1}",
    "ns.value",
    "1 ? 2 ns : 3 ns",
    "cos(1) ns",
    "\"330 ns\"",
    "330 ns; 2",
    "1:3",
    "3! ns",
  ])("never evaluates anything beyond arithmetic on quantities: %s", (entry) => {
    expect(parseQuantity(entry, "ns")).toMatchObject({ ok: false, problem: "unparsable" });
  });

  it("an attempt to define a unit leaves the unit undefined", () => {
    parseQuantity("createUnit('blip', '1 ns')", "ns");
    expect(parseQuantity("1 blip", "ns")).toMatchObject({ problem: "unparsable" });
  });
});

describe("gradeNumericAnswer", () => {
  const answer = { value: 2.2 * 270 * 600e-12, unit: "ns", tolerance: 0.02 };

  it("accepts entries within the relative tolerance and refuses those outside it", () => {
    expect(gradeNumericAnswer("356 ns", answer)).toEqual({
      status: "correct",
      correct: true,
      value: expect.closeTo(356e-9, 20),
      message: "Correct: 356 ns.",
    });
    expect(gradeNumericAnswer("2.2*270 ohm*600 pF", answer)).toMatchObject({ status: "correct" });
    expect(gradeNumericAnswer(`${356.4 * 1.019} ns`, answer).correct).toBe(true);
    expect(gradeNumericAnswer(`${356.4 * 1.021} ns`, answer).correct).toBe(false);
    expect(gradeNumericAnswer(`${356.4 * 0.979} ns`, answer).correct).toBe(false);
  });

  it("says a wrong value is wrong and how the entry was read", () => {
    expect(gradeNumericAnswer("400 ns", answer)).toEqual({
      status: "incorrect",
      correct: false,
      value: expect.closeTo(400e-9, 20),
      message: "Not yet: 400 ns is not the answer (answers within 2 % count).",
    });
    expect(gradeNumericAnswer("0.4us", answer).message).toBe(
      "Not yet: '0.4us' works out to 400 ns, which is not the answer (answers within 2 % count).",
    );
  });

  it("reports an unreadable entry as unreadable, not as a wrong answer", () => {
    expect(gradeNumericAnswer("3 V", answer)).toEqual({
      status: "unreadable",
      correct: false,
      value: null,
      problem: "wrong-dimension",
      message: "'3 V' is a voltage; this asks for a time.",
    });
  });

  it("grades a negative answer by its distance, not its sign flipped", () => {
    const gamma = { value: (53 - 93.8) / (53 + 93.8), unit: "", tolerance: 0.02 };
    expect(gradeNumericAnswer("-0.278", gamma).correct).toBe(true);
    expect(gradeNumericAnswer("0.278", gamma).correct).toBe(false);
  });
});

describe("parseQuantity never throws", () => {
  const units = fc.constantFrom("", "ns", "us", "ohm", "pF/m", "kHz", "V", "mA", "ns/m", "MHz");
  const token = fc.constantFrom(
    "330", "0.33", "2.2", "600e-12", "1e400", "-", "+", "*", "/", "^", "(", ")", " ", "ns", "us", "µs", "Ω", "ohm", "pF", "m",
    "kHz", "V", "sqrt(", "ln(", "log(", "pi", "π", ",", ".", "=", "[", "]", "{", "}", ":", "?", "'", "\"", ";", "!", "x", "to", "in",
  );

  it("for any string", () => {
    fc.assert(
      fc.property(fc.string({ unit: "grapheme", maxLength: 200 }), units, (entry, unit) => {
        const parsed = parseQuantity(entry, unit);
        expect(typeof parsed.ok).toBe("boolean");
        if (parsed.ok) expect(Number.isFinite(parsed.value)).toBe(true);
        else expect(parsed.message.length).toBeGreaterThan(0);
      }),
      { numRuns: 2000 },
    );
  });

  it("for strings built from the pieces of real entries", () => {
    fc.assert(
      fc.property(fc.array(token, { maxLength: 40 }).map((parts) => parts.join("")), units, (entry, unit) => {
        const parsed = parseQuantity(entry, unit);
        if (parsed.ok) expect(Number.isFinite(parsed.value)).toBe(true);
        else expect(["empty", "too-long", "unparsable", "missing-unit", "wrong-dimension"]).toContain(parsed.problem);
      }),
      { numRuns: 3000 },
    );
  });
});
