import type { BenchExerciseInput } from "../schema";

export const bench = {
  slug: "document-a-run",
  title: "Document a run with a scope photo",
  minutes: 90,
  brief: `
Measure and document one real data run, on the bench or on an installation you are allowed to work on, at its first pixel. Use a 10:1 probe compensated on the scope's calibrator, with its spring ground on the pixel's ground pad.

Submit two photos, the scope screen and the probing setup, and state the values below. In the note, identify the run and say whether the edge you measured is one the pixel reads cleanly, and why. Your instructor checks that the photo supports every number you give.

Keep to the low-voltage side. Clip the scope's ground only to the supply's negative, with the supply's output isolated from earth, and leave anything on the mains side to a licensed electrician.
`,
  asks: [
    { id: "cable", label: "Cable (kind and conductor size)", kind: "cable", unit: "" },
    { id: "length", label: "Cable length", kind: "length", unit: "m" },
    { id: "resistor", label: "Series resistor at the driver", kind: "resistor", unit: "ohm" },
    { id: "rise-time", label: "Rise time (10–90 %) at the first pixel", kind: "riseTime", unit: "ns" },
    { id: "overshoot", label: "Overshoot above the settled high level", kind: "overshoot", unit: "V" },
    { id: "scope", label: "Scope bandwidth and probe used", kind: "text", unit: "" },
  ],
  photo: {
    required: true,
    mustShow: [
      "the rising edge at the first pixel with timebase and volts per division readable",
      "the rise-time and overshoot readouts or cursors on screen",
      "a second photo of the probe tip on the data pad and the spring ground on the ground pad",
    ],
  },
  rubric: [
    { id: "measurement-correct", criterion: "Measurement correct: the stated rise time and overshoot agree with the readouts or cursors on the scope photo", points: 3 },
    { id: "trace-readable", criterion: "Trace readable: the scope photo is square-on and in focus, with the timebase, volts per division and readouts legible", points: 3 },
    {
      id: "conclusion-sound",
      criterion: "Conclusion sound: the note identifies the run (cable, length, resistor, driver, measured pixel supply) and its verdict on the edge follows from the values measured",
      points: 2,
    },
    { id: "probing-shown", criterion: "Probing shown: the probing photo shows the tip on the first pixel's data pad and the spring ground on its ground pad", points: 2 },
  ],
} satisfies BenchExerciseInput;
