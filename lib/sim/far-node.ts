/**
 * The pixel's input pin: input capacitance and two clamp diodes (to 0 V and to VDD), fed by a
 * Thevenin source (the line, or the driver when the cable has no length). The capacitor is
 * integrated with the second-order backward difference formula (BDF2), which is L-stable: the
 * very fast modes of a conducting diode die out instead of ringing numerically as they would
 * with the trapezoidal rule.
 */

/** Clamp diode model, Shockley law at 27 °C (the same as a SPICE `D(IS=1e-14 N=1)` model). */
export const CLAMP_DIODE_MODEL = {
  saturationCurrent: 1e-14,
  emissionCoefficient: 1,
  thermalVoltage: 0.025865,
} as const;

const IS = CLAMP_DIODE_MODEL.saturationCurrent;
const VT = CLAMP_DIODE_MODEL.thermalVoltage * CLAMP_DIODE_MODEL.emissionCoefficient;
/** Within this distance outside the rails a clamp carries under 0.1 µA (tens of µV across the line): treated as open. */
export const NEGLIGIBLE_CONDUCTION = 0.4;

/**
 * Solves G·v − J + I(v) = 0 when J/G lies beyond a rail, with I(v) the current out of the pin
 * through both clamps, Is·(e^((v−VDD)/Vt) − 1) − Is·(e^(−v/Vt) − 1). Only the clamp on the
 * conducting side matters (the other carries at most Is). With x = the distance beyond that
 * rail and D the current the source would push into it, the equation is
 * f(x) = G·x − D + Is·(e^(x/Vt) − 1) = 0, x in [0, D/G], or in logarithmic form
 * h(x) = x − Vt·ln(1 + (D − G·x)/Is) = 0. Both are increasing and convex, so a Newton step of
 * either, taken from the right of the root, never passes it, and from the left always does.
 * f's step is poor where the exponential dominates (at most Vt), h's where it is negligible
 * (near D/G). Each iteration takes h's step, and where the diode carries less than Vt·G also
 * f's, keeping the one that lands nearer the root: the longer from the right, the shorter from
 * the left. A shrinking bracket with bisection catches anything else. `guess` is the caller's estimate (the last two
 * steps extrapolated, usually within a millivolt); the clamp current is then J − G·v.
 */
export function solveClamped(conductance: number, injected: number, supply: number, guess: number): number {
  const above = injected > conductance * supply;
  const rail = above ? supply : 0;
  const sign = above ? 1 : -1;
  const available = sign * (injected - conductance * rail);
  let low = 0;
  let high = available / conductance;
  const start = sign * (guess - rail);
  // Without a usable guess: the root if G were 0, which lies right of the true one.
  let x = start > low && start < high ? start : Math.min(VT * Math.log(1 + available / IS), high * (1 - 1e-12));
  for (let iteration = 0; iteration < 80; iteration += 1) {
    const ratio = 1 + (available - conductance * x) / IS;
    const residual = x - VT * Math.log(ratio);
    const slope = 1 + (VT * conductance) / (IS * ratio);
    let step = residual / slope;
    // Where the diode carries more than Vt·G, h is nearly straight: h''/(2h') = (h' − 1)²/(2·Vt·h'),
    // and a Newton step of δ leaves an error of about that times δ².
    let curvature = ((slope - 1) * (slope - 1)) / (2 * VT * slope);
    if (slope > 2) {
      // The diode carries less than Vt·G: here f's step is the better one.
      const exponential = Math.exp(x / VT);
      const linearStep = (conductance * x - available + IS * (exponential - 1)) / (conductance + (IS / VT) * exponential);
      // Right of the root both steps fall short: take the longer; left of it both overshoot: take the shorter.
      step = Math.max(step, linearStep);
      curvature = Infinity;
    }
    if (residual > 0) high = x;
    else low = x;
    let next = x - step;
    if (!(next > low && next < high)) {
      next = 0.5 * (low + high);
      curvature = Infinity;
    }
    if (Math.abs(next - x) < 1e-5 || curvature * step * step < 1e-6) return rail + sign * next;
    x = next;
  }
  return rail + sign * x;
}

/**
 * The clamped pin's next voltage by one Newton step on f from the last step's answer, whose
 * clamp current (`previousCurrent`, positive into VDD) stands in for the exponential there; NaN
 * when that step is longer than 1 mV. Over so short a step the exponential changes by under
 * 4 %, and Newton's error after it is at most about (1/(2·Vt))·(1 mV)², some 20 µV: a fifth of
 * the trace's own tolerance.
 */
export function clampStepFrom(conductance: number, injected: number, supply: number, previous: number, previousCurrent: number): number {
  const above = previousCurrent > 0;
  const rail = above ? supply : 0;
  const sign = above ? 1 : -1;
  const x = sign * (previous - rail);
  const diode = sign * previousCurrent;
  const available = sign * (injected - conductance * rail);
  if (!(x > 0 && diode > 0 && available > 0)) return Number.NaN;
  const step = (conductance * x - available + diode) / (conductance + (diode + IS) / VT);
  return Math.abs(step) < 1e-3 ? rail + sign * (x - step) : Number.NaN;
}

/** DC voltage of the pin fed by `source` through `conductance`, with or without clamps. */
export function pinEquilibrium(source: number, conductance: number, supply: number, clamps: boolean): number {
  if (!clamps || (source <= supply + NEGLIGIBLE_CONDUCTION && source >= -NEGLIGIBLE_CONDUCTION)) return source;
  return solveClamped(conductance, conductance * source, supply, source);
}

export class FarNode {
  private v1 = 0;
  private v2 = 0;
  private readonly capacitiveConductance: number;
  private readonly historyWeight1: number;
  private readonly historyWeight2: number;
  private readonly safeLow: number;
  private readonly safeHigh: number;
  /** Clamp current of the last step (A). */
  current = 0;

  constructor(
    capacitance: number,
    dt: number,
    private readonly supply: number,
    private readonly clamps: boolean,
  ) {
    this.capacitiveConductance = (3 * capacitance) / (2 * dt);
    this.historyWeight1 = (2 * capacitance) / dt;
    this.historyWeight2 = capacitance / (2 * dt);
    this.safeLow = clamps ? -NEGLIGIBLE_CONDUCTION : -Infinity;
    this.safeHigh = clamps ? supply + NEGLIGIBLE_CONDUCTION : Infinity;
  }

  /** Advances one step with the pin fed by `source` through conductance `conductance`. */
  step(source: number, conductance: number): number {
    const injected = conductance * source + this.historyWeight1 * this.v1 - this.historyWeight2 * this.v2;
    const total = conductance + this.capacitiveConductance;
    let v = injected / total;
    if (v > this.safeHigh || v < this.safeLow) {
      v = solveClamped(total, injected, this.supply, 2 * this.v1 - this.v2);
      this.current = injected - total * v;
    } else {
      this.current = 0;
    }
    this.v2 = this.v1;
    this.v1 = v;
    return v;
  }

  /** The DC voltage the pin settles to for this source. */
  equilibrium(source: number, conductance: number): number {
    return pinEquilibrium(source, conductance, this.supply, this.clamps);
  }

  /** True when the last two steps sit within `tolerance` of `target`. */
  isSettledAt(target: number, tolerance: number): boolean {
    return Math.abs(this.v1 - target) <= tolerance && Math.abs(this.v2 - target) <= tolerance;
  }

  holdAt(value: number): void {
    this.v1 = value;
    this.v2 = value;
  }
}
