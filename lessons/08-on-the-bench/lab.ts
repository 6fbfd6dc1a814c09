import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
import { TYPICAL_WHY } from "../judgement-notes";
import { PIN_3V3_WINDOW, zFraction } from "../source-window";
import { controllerPin3v3 } from "../drivers";

const pin = controllerPin3v3;
const receiver = { supplyVoltage: 5 };

export const lab = {
  slug: "capstone-installation",
  title: "Capstone: a small installation",
  brief: `
A shop front has three pixel strips, all 5 V, fed from one controller whose outputs are 3.3 V pins (30 Ω) with no level shifter. The cables were pulled before you arrived:

- **Arch**: a data lead run on its own over the doorway, its ground wire well away from it;
- **Facade**: two-core cable, data beside ground, along the front;
- **Canopy**: either one pair of a twisted-pair cable or 75 Ω coax (your variant says which).

Choose an E24 resistor (IEC 60063) for each run. Every run is graded: on typical pixels, all three must decode every bit with at least 120 ns of timing margin and 0.3 V of voltage margin at every switching point they may have. Your score is that of your weakest run.

Work through lesson 7's steps for each run first: Z0 from the catalogue, the 3.3 V window (R_src between about ${zFraction(PIN_3V3_WINDOW.lower)} × Z0 and ${zFraction(PIN_3V3_WINDOW.upper)} × Z0), then the E24 value nearest the middle.

${TYPICAL_WHY} Say so in your report to the shop: the installation works on typical pixels, and a level shifter would make it guaranteed.
`,
  runs: [
    {
      id: "arch",
      label: "Arch: lone data lead",
      scenario: {
        driver: pin,
        receiver,
        signal: { pattern: { colours: [[255, 140, 0]], byteOrder: "GRB" } },
        cable: "lone-lead",
        length: 8,
        seriesResistance: 33,
      },
      choices: { seriesResistance: { series: "E24", min: 10, max: 1000 } },
      variant: { length: { min: 6, max: 10, step: 0.5 } },
    },
    {
      id: "facade",
      label: "Facade: data beside ground",
      scenario: {
        driver: pin,
        receiver,
        signal: { pattern: { colours: [[20, 90, 255]], byteOrder: "GRB" } },
        cable: "beside-ground",
        length: 15,
        seriesResistance: 33,
      },
      choices: { seriesResistance: { series: "E24", min: 10, max: 1000 } },
      variant: { length: { min: 12, max: 20, step: 0.5 } },
    },
    {
      id: "canopy",
      label: "Canopy: twisted pair or coax",
      scenario: {
        driver: pin,
        receiver,
        signal: { pattern: { colours: [[200, 255, 60]], byteOrder: "GRB" } },
        cable: "twisted-pair",
        length: 10,
        seriesResistance: 33,
      },
      choices: { seriesResistance: { series: "E24", min: 10, max: 1000 } },
      variant: { length: { min: 8, max: 14, step: 0.5 }, cable: ["twisted-pair", "coax-75"] },
    },
  ],
  questions: [],
  passRule: { judgement: "typical", judgementWhy: TYPICAL_WHY, allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3 },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 0.45 }, questionShare: 0 },
  reference: {
    solution: { arch: { seriesResistance: 240 }, facade: { seriesResistance: 43 }, canopy: { seriesResistance: 47 } },
    mistakes: [
      {
        choices: { arch: { seriesResistance: 33 }, facade: { seriesResistance: 43 }, canopy: { seriesResistance: 47 } },
        mechanism: "ringing",
        explanation: "33 Ω on the lone lead leaves Γ_s ≈ −0.70: the arch rings back down through where a typical pixel switches, although the other two runs are fine.",
      },
      {
        choices: { arch: { seriesResistance: 240 }, facade: { seriesResistance: 240 }, canopy: { seriesResistance: 47 } },
        mechanism: "staircase",
        explanation: "The lone lead's resistor on the facade's 94 Ω cable gives Γ_s ≈ +0.5: the far end climbs a staircase, too slowly for the 1 bits to read as 1.",
      },
    ],
  },
} satisfies LabInput;
