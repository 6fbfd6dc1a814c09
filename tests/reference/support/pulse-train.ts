/**
 * The driver's open-circuit waveform as breakpoints of a piecewise-linear function, following
 * docs/simulator.md ("Signal"): bit i starts at leadIn + i·bitPeriod, the ramp up starts at the slot
 * start, the ramp down starts zeroHigh or oneHigh later, each ramp lasting edgeTime (0–100 %).
 */
import type { ReferenceCircuit } from "./reference-circuit";

export interface Breakpoints {
  time: number[];
  value: number[];
}

export function pulseTrainBreakpoints(circuit: ReferenceCircuit): Breakpoints {
  const { bits, leadIn, bitPeriod, zeroHigh, oneHigh, edgeTime, highVoltage } = circuit;
  const time = [0];
  const value = [0];
  for (let i = 0; i < bits.length; i++) {
    const start = leadIn + i * bitPeriod;
    const high = bits[i] === "1" ? oneHigh : zeroHigh;
    time.push(start, start + edgeTime, start + high, start + high + edgeTime);
    value.push(0, highVoltage, highVoltage, 0);
  }
  for (let i = 1; i < time.length; i++) {
    if (!(time[i] > time[i - 1])) throw new Error(`pulse train breakpoints not increasing at ${time[i]}`);
  }
  return { time, value };
}

export function evaluatePiecewiseLinear(points: Breakpoints, t: number): number {
  const { time, value } = points;
  if (t <= time[0]) return value[0];
  if (t >= time[time.length - 1]) return value[value.length - 1];
  let lo = 0;
  let hi = time.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (time[mid] <= t) lo = mid;
    else hi = mid;
  }
  const f = (t - time[lo]) / (time[hi] - time[lo]);
  return value[lo] + f * (value[hi] - value[lo]);
}
