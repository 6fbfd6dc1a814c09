import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { TYPICAL_WHY } from "../judgement-notes";
import { controllerPin3v3 } from "../drivers";

export const lab = {
  slug: "cable-spec",
  title: "Pick the cable to the standard",
  brief: `
The company standard for data runs reads:

| property | requirement |
| --- | --- |
| characteristic impedance Z0 | 85 Ω to 110 Ω |
| delay | at most 5.7 ns/m |
| capacitance C′ | at most 65 pF/m |

The controller output is a 3.3 V pin (30 Ω) with a 47 Ω resistor already fitted; the first pixel runs from 5 V. Choose a cable from the catalogue that meets the standard. The grader checks the cable against the standard and runs the simulator: on typical pixels every bit must decode with at least 100 ns of timing margin and 0.3 V of voltage margin.

${TYPICAL_WHY}

Then answer the two questions. Use the catalogue table of the lesson.
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
        cableOptions: ["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"],
        length: 8,
        seriesResistance: 47,
      },
      choices: { cable: true },
      variant: { length: { min: 6, max: 12, step: 0.5 } },
    },
  ],
  questions: [
    {
      id: "capacitance-10m",
      prompt: "What is the total capacitance of 10 m of the data-beside-ground cable (59.5 pF/m)?",
      answer: { value: 10 * 59.5e-12, unit: "pF", tolerance: 0.02 },
      hint: "Capacitance per metre × length.",
    },
    {
      id: "round-trip-twisted",
      prompt: "How long does a reflection take to return to the driver on 10 m of the twisted pair (5.20 ns/m)?",
      answer: { value: 2 * 10 * 5.2e-9, unit: "ns", tolerance: 0.02 },
      hint: "There and back: twice the length times the delay per metre.",
    },
  ],
  passRule: {
    judgement: "typical",
    judgementWhy: TYPICAL_WHY,
    allBitsDecode: true,
    minTimingMargin: 100e-9,
    minVoltageMargin: 0.3,
    cableSpec: { minZ0: 85, maxZ0: 110, maxDelayPerMetre: 5.7e-9, maxCapacitancePerMetre: 65e-12 },
  },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 160e-9, voltage: 0.45 }, questionShare: 0.2 },
  reference: {
    solution: { main: { cable: "beside-ground" } },
    mistakes: [
      {
        choices: { main: { cable: "three-core" } },
        mechanism: "off-spec-cable",
        explanation: "The three-core cable has 79 pF/m and a Z0 of 70 Ω: outside the standard on both counts.",
      },
      {
        choices: { main: { cable: "lone-lead" } },
        mechanism: "off-spec-cable",
        explanation: "A lone lead has a Z0 near 350 Ω, far above the standard's range.",
      },
    ],
  },
} satisfies LabInput;
