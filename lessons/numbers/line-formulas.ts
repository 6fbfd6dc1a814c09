/**
 * The textbook formulas the lessons work with, for their numbers files: RC charging, reflection
 * coefficients and the bounce series at an open end, and the frame arithmetic of the protocol.
 */

/** 10–90 % rise time of a resistance charging a capacitance: τ·ln 9. */
export const rcRiseTime = (tau: number) => tau * Math.log(9);

/** Time for an RC edge from 0 towards `final` to reach `level`: τ·ln(final / (final − level)). */
export const rcTimeToRise = (tau: number, final: number, level: number) => tau * Math.log(final / (final - level));

/** Time for an RC edge falling from `start` towards 0 to reach `level`: τ·ln(start / level). */
export const rcTimeToFall = (tau: number, start: number, level: number) => tau * Math.log(start / level);

/** Reflection coefficient of a load (or a source resistance) on a line of impedance z0. */
export const reflection = (load: number, z0: number) => (load - z0) / (load + z0);

/** Step a source of open-circuit `volts` behind `source` launches onto a line of z0. */
export const launchedStep = (volts: number, source: number, z0: number) => (volts * z0) / (source + z0);

/** Open far end after n arrivals: V·(1 − Γs^n). */
export const farEndAfter = (volts: number, sourceReflection: number, n: number) => volts * (1 - sourceReflection ** n);

/** Time of the nth arrival at the far end after the driver switches: (2n − 1)·T_d. */
export const arrivalTime = (n: number, oneWayDelay: number) => (2 * n - 1) * oneWayDelay;

/** First arrival n at which the far end stays within `fraction` of its final level: |Γs|^n < fraction. */
export const settlingArrival = (sourceReflection: number, fraction: number) =>
  Math.ceil(Math.log(fraction) / Math.log(Math.abs(sourceReflection)));

/** Source resistance, as a fraction of Z0, at which the doubled first arrival of `volts` reaches `level`. */
export const firstArrivalSourceFraction = (volts: number, level: number) => (2 * volts) / level - 1;

/**
 * Source resistance, as a fraction of Z0, at which the linear ring-back after a falling edge,
 * V·Γs², reaches `level`.
 */
export function ringBackSourceFraction(volts: number, level: number): number {
  const gamma = Math.sqrt(level / volts);
  return (1 - gamma) / (1 + gamma);
}

/** One frame: a colour word per pixel, then the latch gap. */
export const frameTime = (pixels: number, wordBits: number, bitPeriod: number, latchGap: number) =>
  pixels * wordBits * bitPeriod + latchGap;
