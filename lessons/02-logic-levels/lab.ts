import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { GUARANTEED_WHY } from "../judgement-notes";

const direct = { id: "direct-3v3", label: "3.3 V controller pin, wired direct", highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9 };
const shifted = { id: "shifter-5v", label: "Through a 5 V level shifter", highVoltage: 5, outputResistance: 20, edgeTime: 3e-9 };

export const lab = {
  slug: "thresholds",
  title: "Levels for a 5 V pixel",
  brief: `
A controller whose logic runs at 3.3 V feeds a 5 V pixel over a short lead with a ground conductor beside the data. A 68 Ω resistor is already fitted at the controller, which suits this cable well (lesson 6 explains why): what reaches the pixel is a clean copy of the driver's own level, with no overshoot to help.

Choose the driver: the controller's 3.3 V pin wired direct, or the same signal through a 5 V level shifter. The pixel must decode every bit with at least 0.5 V of voltage margin against its guaranteed thresholds (0.7 × VDD high, 0.3 × VDD low).

${GUARANTEED_WHY}

Then answer the two questions about the margins.
`,
  runs: [
    {
      id: "main",
      label: "Controller to first pixel",
      scenario: {
        driver: direct,
        driverOptions: [direct, shifted],
        receiver: { supplyVoltage: 5 },
        signal: { pattern: { bits: "010011010110" } },
        cable: "beside-ground",
        length: 1.5,
        seriesResistance: 68,
      },
      choices: { driver: true },
      variant: { length: { min: 0.5, max: 3, step: 0.5 }, cable: ["beside-ground", "twisted-pair"] },
    },
  ],
  questions: [
    {
      id: "direct-high-margin",
      prompt: "What is the guaranteed high noise margin of the 3.3 V pin wired direct into this 5 V pixel? (It may be negative.)",
      answer: { value: 3.3 - 0.7 * 5, unit: "V", tolerance: 0.05 },
      hint: "NM_high = driver high − 0.7 × VDD.",
    },
    {
      id: "shifted-high-margin",
      prompt: "What is the guaranteed high noise margin of the 5 V level shifter's output into the same pixel?",
      answer: { value: 5 - 0.7 * 5, unit: "V", tolerance: 0.02 },
      hint: "The shifter's output swings to its own 5 V supply.",
    },
  ],
  passRule: { judgement: "guaranteed", judgementWhy: GUARANTEED_WHY, allBitsDecode: true, minTimingMargin: 100e-9, minVoltageMargin: 0.5 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 150e-9, voltage: 1.2 }, questionShare: 0.3 },
  reference: {
    solution: { main: { driver: "shifter-5v" } },
    mistakes: [
      {
        choices: { main: { driver: "direct-3v3" } },
        mechanism: "low-level",
        explanation: "On a clean run the far end settles at the driver's 3.3 V, below the 3.5 V high threshold: the pixel is never guaranteed a high.",
      },
    ],
  },
} satisfies LabInput;
