/**
 * Benchmark of redrawing the workbench while a control is dragged (issue: "the browser
 * re-simulates within one animation frame (16 ms) while a learner drags a control").
 *
 * Per case, the median time of what the browser's worker computes (lib/sim's simulateForDrawing
 * with the worker's sampling): the full run at grading accuracy, drawn once a control is let go,
 * which is the reference the ratio is taken against; the whole pattern at preview quality; and
 * the drag preview the worker actually runs while a control moves (DRAG_SPAN). Cases: the
 * standard ones of docs/simulator.md, the run that rings for its whole length, and the slowest
 * drag previews found by a scan over cables, lengths, resistors and drivers a learner can set.
 * The 16 ms frame budget is printed as met or not met; nothing here fails a build. Time in the
 * browser itself (message passing, React, the chart) is measured by scripts/bench-sim-browser.ts.
 */
import { DRAG_SPAN, DRAWING_SAMPLING, FULL_SPAN } from "@/components/simulation/run-spans";
import type { RunSpan } from "@/components/simulation/live-run";
import { CABLE_KINDS, parseSimInput, simulateForDrawing } from "@/lib/sim";
import { cpuTimeOf, inputOf, loadNote, medianTime, medianTimes, STANDARD_CASES, table, verdict, type StandardCase } from "./bench-sim-support";

const FRAME_MS = 16;

const RINGING: StandardCase = {
  name: "6 lone-lead 10 m 33 Ω 3.3 V (rings throughout)",
  kind: "lone-lead",
  length: 10,
  seriesResistance: 33,
  driverVolts: 3.3,
  driverResistance: 30,
  pixels: 4,
};

/** Settings a learner can reach (labs offer 0.5–20 m; the scan goes further), four pixels each. */
const SCAN = {
  lengths: [1, 3, 6, 10, 15, 20, 30],
  resistors: [0, 10, 33, 68, 150, 330, 1000],
  drivers: [
    { driverVolts: 3.3, driverResistance: 30 },
    { driverVolts: 5, driverResistance: 20 },
  ],
};
const WORST_SHOWN = 3;

function drawOnce(c: StandardCase, span: RunSpan) {
  return simulateForDrawing(parseSimInput(inputOf(c)), { ...DRAWING_SAMPLING, ...span });
}

type Row = { name: string; bits: string; fullMs: number; wholePreviewMs: number; dragMs: number; dragCpuMs: number };

function measure(c: StandardCase): Row {
  const drag = drawOnce(c, DRAG_SPAN);
  const dragTimes = medianTimes(() => drawOnce(c, DRAG_SPAN));
  return {
    name: c.name,
    bits: `${drag.bits.length} of ${drag.patternBits}`,
    fullMs: medianTime(() => drawOnce(c, FULL_SPAN)),
    wholePreviewMs: medianTime(() => drawOnce(c, { quality: "preview" })),
    dragMs: dragTimes.wallMs,
    dragCpuMs: dragTimes.cpuMs,
  };
}

/**
 * The slowest drag previews over the scan grid (after the standard cases warmed the code up).
 * Each is ranked by the smaller CPU time of two runs, so that a run that merely waited for a
 * busy core does not push a cheap case to the top.
 */
function slowestDragCases(): { cases: StandardCase[]; scanned: number } {
  const timed: { c: StandardCase; ms: number }[] = [];
  for (const kind of CABLE_KINDS) {
    for (const length of SCAN.lengths) {
      for (const seriesResistance of SCAN.resistors) {
        for (const driver of SCAN.drivers) {
          const c = { name: `${kind} ${length} m ${seriesResistance} Ω ${driver.driverVolts} V`, kind, length, seriesResistance, ...driver, pixels: 4 };
          timed.push({ c, ms: Math.min(cpuTimeOf(() => drawOnce(c, DRAG_SPAN)), cpuTimeOf(() => drawOnce(c, DRAG_SPAN))) });
        }
      }
    }
  }
  timed.sort((a, b) => b.ms - a.ms);
  return { cases: timed.slice(0, WORST_SHOWN).map(({ c }, i) => ({ ...c, name: `scan #${i + 1}: ${c.name}` })), scanned: timed.length };
}

function main() {
  console.log(`live redraw benchmark: Node ${process.version}, one thread, the worker's own code path and sampling`);
  console.log(`at start: ${loadNote()}`);
  console.log(
    `full run: grading accuracy, every bit (drawn when a control is let go; the reference); whole preview: preview quality, every bit; drag: ${DRAG_SPAN.quality} quality, first ${DRAG_SPAN.firstBits} bits (drawn while a control moves)\n`,
  );
  const rows = [...STANDARD_CASES, RINGING].map(measure);
  const scan = slowestDragCases();
  rows.push(...scan.cases.map(measure));
  console.log(
    table(
      ["case", "bits drawn", "full run ms", "whole preview ms", "drag ms", "drag CPU ms", "drag / full", "drag in a frame"],
      rows.map((r) => [
        r.name,
        r.bits,
        r.fullMs.toFixed(2),
        r.wholePreviewMs.toFixed(2),
        r.dragMs.toFixed(2),
        r.dragCpuMs.toFixed(2),
        `${(r.dragMs / r.fullMs).toFixed(2)}×`,
        r.dragMs < FRAME_MS ? "yes" : "NO",
      ]),
    ),
  );
  console.log(`(the scan timed ${scan.scanned} drag previews of every cable kind at ${SCAN.lengths.join(", ")} m, ${SCAN.resistors.join(", ")} Ω, 3.3 V and 5 V drivers; its slowest are shown)`);
  console.log(`at end: ${loadNote()}`);
  console.log("(medians of wall time; drag CPU ms: this process's CPU time, near an idle machine's wall time when the cores are shared)");

  const worst = rows.reduce((a, b) => (b.dragMs > a.dragMs ? b : a));
  const worstCpu = rows.reduce((a, b) => (b.dragCpuMs > a.dragCpuMs ? b : a));
  const ringing = rows.find((r) => r.name === RINGING.name)!;
  console.log("\ntarget (issue 3, a benchmark figure, not a test):");
  console.log(
    `  drag redraw simulated within one animation frame (${FRAME_MS} ms), wall time: worst ${worst.dragMs.toFixed(2)} ms (${worst.name}) — ${verdict(worst.dragMs < FRAME_MS)}`,
  );
  console.log(`  the same in CPU time (what an unshared core would take): worst ${worstCpu.dragCpuMs.toFixed(2)} ms (${worstCpu.name}) — ${verdict(worstCpu.dragCpuMs < FRAME_MS)}`);
  console.log(`  the run that rings throughout: drag ${(ringing.dragMs / ringing.fullMs).toFixed(2)}× its full run (${ringing.dragMs.toFixed(2)} of ${ringing.fullMs.toFixed(2)} ms)`);
}

main();
