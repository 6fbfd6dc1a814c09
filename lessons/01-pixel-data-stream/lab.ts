import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { GUARANTEED_WHY } from "../judgement-notes";
import { RECEIVER_DEFAULTS } from "@/lib/sim";
import { buffer5v } from "../drivers";

export const lab = {
  slug: "timing-budget",
  title: "Frame budget and pulse timing",
  brief: `
A controller output feeds a chain of pixels over a short lead with ground beside the data conductor. Someone has changed its pulse timing: as delivered, the high time of a 0 is 0.55 µs and of a 1 is 0.65 µs, both within 50 ns of the pixel's 0.6 µs decision time.

1. Answer the two questions about the frame budget.
2. Set the high time of a 0 and of a 1 so that the first pixel decodes every bit of the colour word, with at least 120 ns of timing margin on every bit, on every pixel that meets its datasheet. Every pulse also needs a low after it: a pixel cannot tell one bit from the next across a low shorter than ${RECEIVER_DEFAULTS.minGap * 1e9} ns.

${GUARANTEED_WHY}

The bit period stays at 1.25 µs. A high time too close to the whole period leaves almost no low time before the next bit starts; watch the scope view for what that does.
`,
  runs: [
    {
      id: "main",
      label: "Controller to first pixel",
      scenario: {
        driver: buffer5v,
        receiver: { supplyVoltage: 5 },
        signal: { pattern: { colours: [[40, 200, 90]], byteOrder: "GRB" }, bitPeriod: 1.25e-6, zeroHigh: 0.55e-6, oneHigh: 0.65e-6 },
        cable: "beside-ground",
        length: 1,
        seriesResistance: 33,
      },
      choices: {
        timing: {
          zeroHigh: { min: 0.1e-6, max: 1.2e-6, step: 0.05e-6 },
          oneHigh: { min: 0.1e-6, max: 1.2e-6, step: 0.05e-6 },
        },
      },
      variant: { length: { min: 0.5, max: 3, step: 0.5 } },
    },
  ],
  questions: [
    {
      id: "frame-time",
      prompt: "The same output will later drive 360 pixels with a 300 µs latch gap. What is the frame time?",
      answer: { value: 360 * 24 * 1.25e-6 + 300e-6, unit: "ms", tolerance: 0.01 },
      hint: "T_frame = N × 24 × 1.25 µs + T_latch.",
    },
    {
      id: "refresh-rate",
      prompt: "What refresh rate does that frame time allow?",
      answer: { value: 1 / (360 * 24 * 1.25e-6 + 300e-6), unit: "Hz", tolerance: 0.01 },
      hint: "Frames per second: 1 / T_frame.",
    },
  ],
  passRule: { judgement: "guaranteed", judgementWhy: GUARANTEED_WHY, allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.5 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 190e-9, voltage: 1.2 }, questionShare: 0.3 },
  reference: {
    solution: { main: { zeroHigh: 0.4e-6, oneHigh: 0.8e-6 } },
    mistakes: [
      {
        choices: { main: { zeroHigh: 0.55e-6, oneHigh: 0.8e-6 } },
        mechanism: "timing",
        explanation: "A 0.55 µs high for a 0 still decodes as 0, but only 50 ns from the decision time: any slow edge in a longer run would flip it.",
      },
      {
        choices: { main: { zeroHigh: 0.4e-6, oneHigh: 0.5e-6 } },
        mechanism: "timing",
        explanation: "A 1 high for 0.5 µs falls before the 0.6 µs decision time, so every 1 is read as a 0.",
      },
      {
        choices: { main: { zeroHigh: 0.4e-6, oneHigh: 1.2e-6 } },
        mechanism: "timing",
        explanation: "A 1 high for 1.2 µs leaves only 50 ns of low before the next bit starts, less than the shortest low a pixel is held to tell one bit from the next.",
      },
    ],
  },
} satisfies LabInput;
