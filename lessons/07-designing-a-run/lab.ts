import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { controllerPin3v3 } from "../drivers";

export const lab = {
  slug: "beside-ground-termination",
  title: "A long run with ground beside the data",
  brief: `
A controller's 3.3 V output pin (30 Ω) drives a long two-core cable, data beside ground in one jacket, to the first pixel of a 5 V strip. There is no level shifter.

Choose a series resistor from the E96 series (IEC 60063, 1 % parts) so that every bit decodes with at least 120 ns of timing margin and 0.3 V of voltage margin, with no ringing crossing a threshold.

Before you touch the workbench, work out the window: the first arrival 3.3 V × (1 − Γ_s) must clear 3.5 V by 0.3 V. Then ask what the resistor a lone lead would need does to this cable.
`,
  runs: [
    {
      id: "main",
      label: "Controller to first pixel",
      scenario: {
        driver: controllerPin3v3,
        receiver: { supplyVoltage: 5 },
        signal: { pattern: { bits: "0100110101100010" } },
        cable: "beside-ground",
        length: 12,
        seriesResistance: 249,
      },
      choices: { seriesResistance: { series: "E96", min: 10, max: 1000 } },
      variant: { length: { min: 10, max: 18, step: 0.5 } },
    },
  ],
  questions: [],
  passRule: { allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3, rejectFilteredRinging: true },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 0.7 }, questionShare: 0 },
  reference: {
    solution: { main: { seriesResistance: 22.1 } },
    mistakes: [
      {
        choices: { main: { seriesResistance: 249 } },
        mechanism: "staircase",
        explanation: "279 Ω of source on a 94 Ω line gives Γ_s ≈ +0.50: the far end climbs a staircase towards 3.3 V and never clears the 3.5 V threshold.",
      },
      {
        choices: { main: { seriesResistance: 68.1 } },
        mechanism: "low-level",
        explanation: "98 Ω of source is a near match: the far end steps cleanly to 3.3 V, which is exactly what fails, because 3.3 V is below the 3.5 V threshold.",
      },
    ],
  },
} satisfies LabInput;
