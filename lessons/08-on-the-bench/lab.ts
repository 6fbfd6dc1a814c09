import type { LabInput } from "../schema";
import { scoringPolicy } from "../scoring-policy";
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

Choose an E24 resistor (IEC 60063) for each run. Every run is graded: all three must decode every bit with at least 120 ns of timing margin and 0.3 V of voltage margin, with no ringing crossing a threshold. Your score is that of your weakest run.

Work through lesson 7's steps for each run first: Z0 from the catalogue, the 3.3 V window (R_src between about 0.25 × Z0 and 0.74 × Z0), then the E24 value nearest the middle.
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
  passRule: { allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3, rejectFilteredRinging: true },
  scoring: { ...scoringPolicy, fullMarksMargin: { timing: 180e-9, voltage: 0.7 }, questionShare: 0 },
  reference: {
    solution: { arch: { seriesResistance: 150 }, facade: { seriesResistance: 22 }, canopy: { seriesResistance: 20 } },
    mistakes: [
      {
        choices: { arch: { seriesResistance: 33 }, facade: { seriesResistance: 22 }, canopy: { seriesResistance: 20 } },
        mechanism: "ringing",
        explanation: "33 Ω on the lone lead leaves Γ_s ≈ −0.70: the arch rings through the thresholds although the other two runs are fine.",
      },
      {
        choices: { arch: { seriesResistance: 150 }, facade: { seriesResistance: 150 }, canopy: { seriesResistance: 20 } },
        mechanism: "staircase",
        explanation: "The lone lead's resistor on the facade's 94 Ω cable gives Γ_s ≈ +0.3: the far end never clears 3.5 V.",
      },
    ],
  },
} satisfies LabInput;
