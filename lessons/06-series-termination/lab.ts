import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { controllerPin3v3 } from "../drivers";

export const lab = {
  slug: "lone-lead-termination",
  title: "A long run on a lone lead",
  brief: `
A controller's 3.3 V output pin (30 Ω) drives a long data lead run on its own, its return a ground wire about 10 mm away, to the first pixel of a 5 V strip. There is no level shifter.

Choose a series resistor from the E24 series (IEC 60063) so that:

- every bit decodes with at least 120 ns of timing margin and 0.3 V of voltage margin;
- no ringing crosses a threshold, even briefly enough for the pixel's deglitch filter to hide it;
- the current the overshoot drives into the pixel's clamp diodes stays under 5 mA.

Use the 3.3 V window of the lesson: R_src between about 0.25 × Z0 and 0.74 × Z0, with R_src the pin's 30 Ω plus your resistor.
`,
  runs: [
    {
      id: "main",
      label: "Controller to first pixel",
      scenario: {
        driver: controllerPin3v3,
        receiver: { supplyVoltage: 5 },
        signal: { pattern: { bits: "0100110101100010" } },
        cable: "lone-lead",
        length: 10,
        seriesResistance: 33,
      },
      choices: { seriesResistance: { series: "E24", min: 10, max: 1000 } },
      variant: { length: { min: 8, max: 14, step: 0.5 } },
    },
  ],
  questions: [],
  passRule: { allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3, maxClampCurrent: 5e-3, rejectFilteredRinging: true },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 0.9 }, questionShare: 0 },
  reference: {
    solution: { main: { seriesResistance: 150 } },
    mistakes: [
      {
        choices: { main: { seriesResistance: 33 } },
        mechanism: "ringing",
        explanation: "63 Ω of source on a 351 Ω line gives Γ_s ≈ −0.70: the far end overshoots into the clamp diodes and rings back through the pixel's thresholds after every edge.",
      },
      {
        choices: { main: { seriesResistance: 470 } },
        mechanism: "staircase",
        explanation: "500 Ω of source is above the line's 351 Ω: Γ_s is positive, the far end climbs towards 3.3 V from below and never clears the 3.5 V threshold.",
      },
    ],
  },
} satisfies LabInput;
