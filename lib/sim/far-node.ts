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
const EXP_LIMIT = 40;
const EXP_AT_LIMIT = Math.exp(EXP_LIMIT);

/** Clamp current (A, positive into VDD) at the answer of the last solveClamped call. */
export let lastClampCurrent = 0;

/**
 * Solves G·v − J + I(v) = 0 when J/G lies beyond a rail, with I(v) the current out of the pin
 * through both clamps, Is·(e^((v−VDD)/Vt) − 1) − Is·(e^(−v/Vt) − 1); the exponential is continued
 * as a straight line beyond 40·Vt so that no step overflows. The left side is monotonic,
 * so the root lies between the rail and J/G; Newton's method starts from the previous step's
 * answer (usually a few millivolts away) and a shrinking bracket with bisection catches any
 * step that leaves it.
 */
export function solveClamped(conductance: number, injected: number, supply: number, guess: number): number {
  const open = injected / conductance;
  const above = open > supply;
  let low = above ? supply : open;
  let high = above ? open : 0;
  let v = guess > low && guess < high ? guess : open;
  // Only the clamp on the conducting side matters: the other carries at most Is.
  const rail = above ? supply : 0;
  const sign = above ? 1 : -1;
  for (let iteration = 0; iteration < 60; iteration += 1) {
    const x = (sign * (v - rail)) / VT;
    const exponential = x < EXP_LIMIT ? Math.exp(x) : EXP_AT_LIMIT * (1 + x - EXP_LIMIT);
    const residual = conductance * v - injected + sign * IS * (exponential - 1);
    if (residual > 0) high = v;
    else low = v;
    const slope = conductance + (IS / VT) * (x < EXP_LIMIT ? exponential : EXP_AT_LIMIT);
    let next = v - residual / slope;
    if (!(next >= low && next <= high)) next = 0.5 * (low + high);
    lastClampCurrent = sign * IS * (exponential - 1);
    // Newton converges quadratically: after a 10 µV correction the remaining error is far below 1 µV.
    if (Math.abs(next - v) < 1e-5) return next;
    v = next;
  }
  return v;
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
      v = solveClamped(total, injected, this.supply, this.v1);
      this.current = lastClampCurrent;
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
