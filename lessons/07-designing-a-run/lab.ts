import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { TYPICAL_WHY } from "../judgement-notes";
import { PIN_3V3_WINDOW, zFraction } from "../source-window";
import { controllerPin3v3 } from "../drivers";

export const lab = {
  slug: "beside-ground-termination",
  title: "A long run with ground beside the data",
  brief: `
A controller's 3.3 V output pin (30 Ω) drives a long two-core cable, data beside ground in one jacket, to the first pixel of a 5 V strip. There is no level shifter.

Choose a series resistor from the E96 series (IEC 60063, 1 % parts) so that, on typical pixels, every bit decodes with at least 120 ns of timing margin and 0.3 V of voltage margin at every switching point they may have.

${TYPICAL_WHY}

Before you touch the workbench, work out the window: the first arrival 3.3 V × (1 − Γ_s) must clear ${PIN_3V3_WINDOW.rise.toFixed(2)} V (the highest point where a typical pixel reads a rise) by 0.3 V, and the second arrival 3.3 V × (1 − Γ_s²) must stay 0.3 V above ${PIN_3V3_WINDOW.fall.toFixed(2)} V (where it reads a fall): R_src between about ${zFraction(PIN_3V3_WINDOW.lower)} × Z0 and ${zFraction(PIN_3V3_WINDOW.upper)} × Z0. Then ask what the resistor a lone lead would need does to this cable.
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
  passRule: { judgement: "typical", judgementWhy: TYPICAL_WHY, allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 0.45 }, questionShare: 0 },
  reference: {
    solution: { main: { seriesResistance: 45.3 } },
    mistakes: [
      {
        choices: { main: { seriesResistance: 249 } },
        mechanism: "staircase",
        explanation: "279 Ω of source on a 94 Ω line gives Γ_s ≈ +0.50: the far end climbs a staircase towards 3.3 V, too slowly for the 1 bits to read as 1 where a typical pixel switches high in its range.",
      },
      {
        choices: { main: { seriesResistance: 68.1 } },
        mechanism: "low-level",
        explanation: "98 Ω of source is a near match: the far end steps cleanly to 3.3 V with no overshoot, which is exactly what falls short: 3.3 V clears the highest typical switching point by less than the 0.3 V the lab asks, and never reaches the 3.5 V a guarantee needs.",
      },
    ],
  },
} satisfies LabInput;
