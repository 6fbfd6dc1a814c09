/**
 * "Bench" names real hardware and its photos only; the simulation is "the workbench" or "the
 * simulator". Every string a learner can read in the code that shows, grades or explains a
 * simulated run (labels, messages, lab briefs, verdict reasons) is read here, and any that says
 * "bench" fails, with the file and the line.
 */
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

// Where the model speaks: the workbench and its routes, the simulator and its grading, the scope
// and the lessons' simulated figures, the lab briefs, and the simulator's command line.
const modelSources = [
  "components/workbench",
  "components/simulation",
  "components/scope-view",
  "components/figures",
  "app/(learn)/labs",
  "app/api/labs",
  "lib/sim",
  "lib/grading",
  "lib/lab-drafts",
  "lessons/pass-rule.ts",
  "lessons/judgement-notes.ts",
  "scripts/sim.ts",
  ...readdirSync("lessons")
    .filter((entry) => /^\d\d-/.test(entry))
    .map((folder) => `lessons/${folder}/lab.ts`),
];

// The probe-ground figure draws a real scope on a real strip: its "bench" is the hardware.
const hardwareFigures = new Set(["components/figures/probe-ground-figure.tsx"]);

function filesUnder(entry: string): string[] {
  if (statSync(entry).isFile()) return [entry];
  return readdirSync(entry).flatMap((name) => filesUnder(path.join(entry, name)));
}

/**
 * A source file without its comments (which speak to developers, "npm run bench:live" included)
 * and its module names: what is left of it is code and the text a reader may see.
 */
function withoutCommentsAndImports(file: string): string {
  const source = readFileSync(file, "utf8");
  let out = "";
  let quote: string | null = null;
  for (let i = 0; i < source.length; i += 1) {
    const char = source[i];
    if (quote) {
      out += char;
      if (char === "\\") out += source[++i] ?? "";
      else if (char === quote) quote = null;
    } else if (char === "/" && source[i + 1] === "/") {
      while (i < source.length && source[i] !== "\n") i += 1;
      out += "\n";
    } else if (char === "/" && source[i + 1] === "*") {
      i = source.indexOf("*/", i + 2) + 1;
    } else {
      if (char === '"' || char === "'" || char === "`") quote = char;
      out += char;
    }
  }
  return out.replace(/^\s*(import|export)\b[^;]*\bfrom\s*["'][^"']*["'];?/gm, "").replace(/import\(\s*["'][^"']*["']\s*\)/g, "");
}

/** "bench" as a word of its own (a bench, benches), not inside "workbench". */
const benchWord = /(?<![a-z])benche?s?(?![a-z])/i;

describe("words that keep the model and the measurement apart", () => {
  const files = modelSources.flatMap(filesUnder).filter((file) => /\.tsx?$/.test(file) && !hardwareFigures.has(file));

  it("reads the workbench's sources", () => {
    expect(files).toContain("components/workbench/workbench.tsx");
    expect(files).toContain("lib/sim/verdict.ts");
    expect(files.length).toBeGreaterThan(40);
  });

  it("never calls the simulation the bench", () => {
    const found = files.flatMap((file) =>
      withoutCommentsAndImports(file)
        .split("\n")
        .filter((line) => benchWord.test(line))
        .map((line) => `${file}: ${line.trim()}`),
    );
    expect(found).toEqual([]);
  });

  it("would catch the word where it slipped in, and only there", () => {
    const sample = path.join(mkdtempSync(path.join(tmpdir(), "model-words-")), "sample.tsx");
    writeFileSync(sample, ['import { x } from "@/lib/bench/photos";', "// npm run bench:live times it", 'const a = <p>On the bench this run meets the rule.</p>;', 'const b = "https://example.test/workbench";'].join("\n"));
    expect(withoutCommentsAndImports(sample).split("\n").filter((line) => benchWord.test(line))).toEqual(["const a = <p>On the bench this run meets the rule.</p>;"]);
    expect(benchWord.test("On the bench this run meets the lab's rule.")).toBe(true);
    expect(benchWord.test("Back to my bench")).toBe(true);
    expect(benchWord.test("Try it on the workbench")).toBe(false);
  });
});
