import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { GUARANTEED_WHY } from "../judgement-notes";
import { buffer5v } from "../drivers";

export const lab = {
  slug: "overshoot-limit",
  title: "Keep the overshoot down",
  brief: `
A 5 V buffered output (20 Ω) drives a long run of cable to the first pixel, which runs from 5 V. With no resistor, the far end overshoots far above the pixel's supply and rings.

Fit a series resistor from the E24 series (IEC 60063) so that:

- the far end overshoots its settled level by no more than 10 % of the pixel's supply (0.5 V);
- the far end's rise time (10–90 %) is no more than 60 ns;
- on every pixel that meets its datasheet, every bit decodes with at least 120 ns of timing margin and 0.5 V of voltage margin.

${GUARANTEED_WHY}

Predict first: what source resistance makes Γ_s = (R_src − Z0) / (R_src + Z0) small? How far below Z0 may it go before the first arrival, V × (1 − Γ_s), overshoots by more than 0.5 V? How far above before the staircase takes more than one round trip to pass 90 %?
`,
  runs: [
    {
      id: "main",
      label: "Controller to first pixel",
      scenario: {
        driver: buffer5v,
        receiver: { supplyVoltage: 5 },
        signal: { pattern: { bits: "0100110101100010" } },
        cable: "lone-lead",
        length: 6,
        seriesResistance: 0,
      },
      choices: { seriesResistance: { series: "E24", min: 10, max: 1000 } },
      variant: { length: { min: 4, max: 9, step: 0.5 }, cable: ["lone-lead", "beside-ground", "twisted-pair"] },
    },
  ],
  questions: [],
  passRule: { judgement: "guaranteed", judgementWhy: GUARANTEED_WHY, allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.5, maxOvershoot: 0.1, maxRiseTime: 60e-9 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 1.2 }, questionShare: 0 },
  reference: {
    solution: { main: { seriesResistance: 330 } },
    mistakes: [
      {
        choices: { main: { seriesResistance: 47 } },
        mechanism: "overshoot",
        explanation: "67 Ω of source on a 351 Ω line gives Γ_s ≈ −0.68: the first arrival tries to reach 8.4 V and the clamp diodes catch it.",
      },
      {
        choices: { main: { seriesResistance: 1000 } },
        mechanism: "slow-edge",
        explanation: "1020 Ω of source gives Γ_s ≈ +0.49: the far end climbs a staircase of round trips and its rise time runs past the limit.",
      },
    ],
  },
} satisfies LabInput;
