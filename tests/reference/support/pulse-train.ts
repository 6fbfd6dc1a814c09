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
