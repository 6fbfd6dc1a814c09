import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

/** The command line (scripts/sim.ts) as a lab author runs it. */
function sim(input: string) {
  return spawnSync("npx", ["tsx", "scripts/sim.ts", "-"], { input, encoding: "utf8", cwd: process.cwd(), maxBuffer: 64 * 1024 * 1024 });
}

describe("npm run sim", { timeout: 30_000 }, () => {
  it("prints one JSON result in the documented shape, without the full-resolution arrays", () => {
    const out = sim(JSON.stringify({ cable: { kind: "beside-ground", length: 3 }, signal: { bits: "0110" } }));
    expect(out.status).toBe(0);
    const result = JSON.parse(out.stdout);
    expect(Object.keys(result).sort()).toEqual(["bits", "decoded", "farEnd", "line", "metrics", "nearEnd", "time", "verdict"]);
    expect(result.decoded).toBe("0110");
    expect(result.verdict.outcome).toBe("guaranteed");
    expect(result.verdict.summary).toBe("works on every pixel that meets its datasheet");
  });

  it("fails the classic case by default, and its default trace is fine enough to show the ringing re-cross the typical band", () => {
    const classic = {
      driver: { highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9 },
      seriesResistance: 33,
      cable: { kind: "lone-lead", length: 10 },
      receiver: { supplyVoltage: 5, clampDiodes: true },
      signal: { bits: "0100110101100010" },
    };
    const out = sim(JSON.stringify(classic));
    expect(out.status).toBe(0);
    const result = JSON.parse(out.stdout);
    expect(result.verdict.outcome).toBe("fails");
    expect(result.verdict.guaranteed.pass).toBe(false);
    expect(result.verdict.typical.pass).toBe(false);
    expect(result.time[1] - result.time[0]).toBeLessThanOrEqual(1e-9);
    // In the first 1 bit's high time the printed far end rises through 3.125 V (where a typical
    // pixel switching at the top of its range reads a rise) and falls back below 2.875 V.
    const start = 2.25e-6 + result.line.delay;
    const high = result.farEnd.filter((_: number, i: number) => result.time[i] >= start && result.time[i] < start + 0.8e-6);
    const risen = high.findIndex((v: number) => v > 3.125);
    expect(risen).toBeGreaterThanOrEqual(0);
    expect(Math.min(...high.slice(risen))).toBeLessThan(2.875);
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
