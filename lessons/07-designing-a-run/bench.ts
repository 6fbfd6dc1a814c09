import type { BenchExerciseInput } from "../schema";

export const bench = {
  slug: "build-a-run",
  title: "Build and measure a run of your design",
  minutes: 120,
  brief: `
Build one data run of your own design on the bench: a controller output (or a signal source set to the pixel protocol), a series resistor, at least 5 m of cable, and a strip whose first pixel you can probe. Work through the seven steps of the lesson on paper first and keep your working.

Measure at the first pixel's data input, with the probe's ground on the pixel's ground (lesson 8 explains how), and record what the run does. Then state what you built and what you measured, and conclude: does the measurement agree with your prediction, and if not, why?

Power the strip from a supply with a fuse sized for its conductors, and disconnect the supply before changing any wiring. Work only on the low-voltage side; leave any mains wiring to a licensed electrician.
`,
  asks: [
    { id: "cable", label: "Cable used (kind and conductor size)", kind: "cable", unit: "" },
    { id: "length", label: "Cable length", kind: "length", unit: "m" },
    { id: "resistor", label: "Series resistor fitted", kind: "resistor", unit: "ohm" },
    { id: "rise-time", label: "Rise time (10–90 %) measured at the first pixel", kind: "riseTime", unit: "ns" },
    { id: "overshoot", label: "Overshoot above the settled high level at the first pixel", kind: "overshoot", unit: "V" },
    { id: "prediction", label: "Your predicted first arrival and window, with the working", kind: "text", unit: "" },
  ],
  photo: {
    required: true,
    mustShow: [
      "one rising edge at the first pixel, with the timebase and volts per division readable",
      "the scope's rise-time or cursor measurement on screen",
      "a label or note giving the cable, length and resistor",
    ],
  },
  rubric: [
    {
      id: "measurement-correct",
      criterion: "Measurement correct: taken at the first pixel's data input with a short probe ground, and the stated rise time and overshoot are the ones on the photo",
      points: 3,
    },
    { id: "trace-readable", criterion: "Trace readable: the photo shows the rising edge with its timebase, volts per division and rise-time readout legible", points: 2 },
    { id: "conclusion-sound", criterion: "Conclusion sound: it sets the measurement beside the prediction and accounts for any difference between them", points: 2 },
    { id: "design-worked", criterion: "Design worked: the written design goes through the seven steps, and its window of resistor values contains the one fitted", points: 3 },
  ],
} satisfies BenchExerciseInput;
