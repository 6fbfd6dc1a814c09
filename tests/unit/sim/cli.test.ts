import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

/** The command line (scripts/sim.ts) as a lab author runs it. */
function sim(input: string) {
  return spawnSync("npx", ["tsx", "scripts/sim.ts", "-"], { input, encoding: "utf8", cwd: process.cwd() });
}

describe("npm run sim", { timeout: 30_000 }, () => {
  it("prints one JSON result in the documented shape, without the full-resolution arrays", () => {
    const out = sim(JSON.stringify({ cable: { kind: "beside-ground", length: 3 }, signal: { bits: "0110" } }));
    expect(out.status).toBe(0);
    const result = JSON.parse(out.stdout);
    expect(Object.keys(result).sort()).toEqual(["bits", "decoded", "farEnd", "line", "metrics", "nearEnd", "time", "verdict"]);
    expect(result.decoded).toBe("0110");
    expect(result.verdict.pass).toBe(true);
  });

  it("names the bad fields on stderr and exits 1 without a stack trace", () => {
    const out = sim(JSON.stringify({ cable: { kind: "lone-lead", length: -2 }, signal: { bits: "" } }));
    expect(out.status).toBe(1);
    expect(out.stdout).toBe("");
    expect(out.stderr).toContain("cable.length: must be at least 0 m");
    expect(out.stderr).toContain("signal.bits: the bit pattern is empty");
    expect(out.stderr).not.toMatch(/\n\s+at /);
  });

  it("refuses text that is not JSON", () => {
    const out = sim("{ not json");
    expect(out.status).toBe(1);
    expect(out.stderr).toContain("not valid JSON");
  });
});
