import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { TYPICAL_WHY } from "../judgement-notes";
import { PIN_3V3_WINDOW, zFraction } from "../source-window";
import { controllerPin3v3 } from "../drivers";

export const lab = {
  slug: "lone-lead-termination",
  title: "A long run on a lone lead",
  brief: `
A controller's 3.3 V output pin (30 Ω) drives a long data lead run on its own, its return a ground wire about 10 mm away, to the first pixel of a 5 V strip. There is no level shifter.

Choose a series resistor from the E24 series (IEC 60063) so that:

- on typical pixels, every bit decodes with at least 120 ns of timing margin and 0.3 V of voltage margin, at every switching point they may have: no ringing may cross one, however briefly;
- the current the overshoot drives into the pixel's clamp diodes stays under the course's limit (half the input's rated injection current).

${TYPICAL_WHY}

Use the 3.3 V window of the lesson: R_src between about ${zFraction(PIN_3V3_WINDOW.lower)} × Z0 and ${zFraction(PIN_3V3_WINDOW.upper)} × Z0, with R_src the pin's 30 Ω plus your resistor.
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
  passRule: { judgement: "typical", judgementWhy: TYPICAL_WHY, allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 0.45 }, questionShare: 0 },
  reference: {
    solution: { main: { seriesResistance: 240 } },
    mistakes: [
      {
        choices: { main: { seriesResistance: 33 } },
        mechanism: "ringing",
        explanation: "63 Ω of source on a 351 Ω line gives Γ_s ≈ −0.70: the far end overshoots into the clamp diodes and rings back down through where a typical pixel switches, breaking every pulse.",
      },
      {
        choices: { main: { seriesResistance: 470 } },
        mechanism: "staircase",
        explanation: "500 Ω of source is above the line's 351 Ω: Γ_s is positive, so there is no overshoot; the far end climbs towards 3.3 V from below and clears the highest typical switching point by less than the 0.3 V the lab asks (and never reaches the 3.5 V a guarantee needs).",
      },
    ],
  },
} satisfies LabInput;
