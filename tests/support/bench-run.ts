/** A bench run on "build-a-run" as a learner states it in the hand-in form: every field valid. */
export const statedRun = {
  cable: "beside-ground",
  "driver-voltage": "3.3 V",
  length: "12 m",
  resistor: "22 ohm",
  "rise-time": "14 ns",
  overshoot: "0.35 V",
  prediction: "Z0 about 94 ohm; first arrival 3.3 V x (1 - gamma) clears 3.5 V for R below about 40 ohm; chose 22 ohm.",
  note: "Probe at the first pixel with the spring ground. Edge clean, one small overshoot, no re-crossing.",
};
