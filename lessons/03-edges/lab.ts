import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { GUARANTEED_WHY } from "../judgement-notes";
import { COURSE_CLAMP_CURRENT_LIMIT } from "../pass-rule";
import { buffer5v } from "../drivers";

export const lab = {
  slug: "rc-window",
  title: "The resistor window on a short lead",
  brief: `
A 5 V buffered output (20 Ω) feeds the first pixel over a short lead with ground beside the data conductor. Fit a series resistor from the E12 series (IEC 60063) so that:

- on every pixel that meets its datasheet, every bit decodes with at least 120 ns of timing margin and 0.5 V of voltage margin;
- the far-end rise time (10–90 %) is no more than 120 ns;
- the current through the pixel's clamp diodes never exceeds the course's limit, ${(COURSE_CLAMP_CURRENT_LIMIT * 1e3).toFixed(0)} mA (half the input's rated injection current; lesson 5 says why).

${GUARANTEED_WHY}

Too little resistance and the edge overshoots the pixel's supply, driving current into its clamp diodes; too much and the edge crawls. Use the RC rule of this lesson (rise ≈ 2.2 × R × C, with C the cable's capacitance plus the pixel's 5 pF) to find the top of the window before you try it.
`,
  runs: [
    {
      id: "main",
      label: "Controller to first pixel",
      scenario: {
        driver: buffer5v,
        receiver: { supplyVoltage: 5 },
        signal: { pattern: { bits: "0100110101100010" } },
        cable: "beside-ground",
        length: 1.5,
        seriesResistance: 10,
      },
      choices: { seriesResistance: { series: "E12", min: 10, max: 4700 } },
      variant: { length: { min: 1, max: 2, step: 0.25 } },
    },
  ],
  questions: [],
  passRule: { judgement: "guaranteed", judgementWhy: GUARANTEED_WHY, allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.5, maxRiseTime: 120e-9 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 1.2 }, questionShare: 0 },
  reference: {
    solution: { main: { seriesResistance: 220 } },
    mistakes: [
      {
        choices: { main: { seriesResistance: 10 } },
        mechanism: "overshoot",
        explanation: "With 30 Ω of source resistance the far end overshoots the pixel's supply and the clamp diode carries tens of milliamperes.",
      },
      {
        choices: { main: { seriesResistance: 2200 } },
        mechanism: "slow-edge",
        explanation: "2.2 kΩ with about 94 pF gives a rise time near 2.2 × 2220 Ω × 94 pF ≈ 460 ns, far over the limit, and the short 0 pulses barely reach the threshold.",
      },
    ],
  },
} satisfies LabInput;
