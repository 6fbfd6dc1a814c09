import { NO_TERMINATION, RcBranch, withTermination, type PinTermination } from "./termination";

/**
 * The pixel's input pin: input capacitance and two clamp diodes (to 0 V and to VDD), each behind
 * a series resistance, fed by a Thevenin source (the line, or the driver when the cable has no
 * length). The capacitor is integrated with the second-order backward difference formula (BDF2),
 * which is L-stable: the very fast modes of a conducting diode die out instead of ringing
 * numerically as they would with the trapezoidal rule.
 */

/**
 * Clamp diode model, Shockley law at 27 °C behind an ohmic series resistance (the same as a SPICE
 * `D(IS=1e-14 N=1 RS=…)` model). `seriesResistance` is the default of the receiver's
 * `clampSeriesResistance`: an assumption from memory, not a published figure for any pixel input.
 * On-chip ESD clamps have a few ohms to some tens of ohms; 5 Ω sits at the low end, where an input
 * rated for a 2 kV human-body-model discharge (1.33 A peak through the model's 1.5 kΩ, ANSI/ESDA/
 * JEDEC JS-001) must be to keep that pulse within a few volts of its rail (lib/sim/README.md, "Pin").
 */
export const CLAMP_DIODE_MODEL = {
  saturationCurrent: 1e-14,
  emissionCoefficient: 1,
  thermalVoltage: 0.025865,
  seriesResistance: 5,
} as const;

const IS = CLAMP_DIODE_MODEL.saturationCurrent;
const VT = CLAMP_DIODE_MODEL.thermalVoltage * CLAMP_DIODE_MODEL.emissionCoefficient;
/**
 * Within this distance outside the rails a clamp carries under 0.1 µA (tens of µV across the line):
 * treated as open. Its junction sees at most this distance, less its series resistance's drop.
 */
export const NEGLIGIBLE_CONDUCTION = 0.4;

/**
 * Solves G·v − J + I = 0 when J/G lies beyond a rail, with I the current out of the pin through
 * both clamps, each Is·(e^(u/Vt) − 1) for a junction voltage u = (the pin's distance beyond its
 * rail) − I·Rd, Rd being the clamp's series resistance. Only the clamp on the conducting side
 * matters (the other carries at most Is). Seen from the junction, the series resistance only
 * adds to the source's: the junction is fed from the same open-circuit voltage J/G through
 * 1/G + Rd, that is through G' = G/(1 + G·Rd) with D' = D/(1 + G·Rd), D being the current the
 * source would push into the rail. So with x the
 * junction's distance beyond the rail the equation is f(x) = G'·x − D' + Is·(e^(x/Vt) − 1) = 0,
 * x in [0, D'/G'], or in logarithmic form h(x) = x − Vt·ln(1 + (D' − G'·x)/Is) = 0: the equation
 * of a diode without series resistance, monotone as before. Both are increasing and convex, so a
 * Newton step of either, taken from the right of the root, never passes it, and from the left
 * always does. f's step is poor where the exponential dominates (at most Vt), h's where it is
 * negligible (near D'/G'). Each iteration takes h's step, and where the diode carries less than
 * Vt·G' also f's, keeping the one that lands nearer the root: the longer from the right, the
 * shorter from the left. A shrinking bracket with bisection catches anything else. The pin then
 * lies Rd·(D' − G'·x) beyond the junction; as x moves, the pin moves 1/(1 + G·Rd) as far, so the
 * pin is at least as close to its root as the junction is to its own. `guess` is the caller's
 * estimate of the pin voltage (the last two steps extrapolated, usually within a millivolt),
 * mapped to the junction through the same current; the clamp current is then J − G·v.
 */
export function solveClamped(pinConductance: number, injected: number, supply: number, guess: number, seriesResistance: number): number {
  const above = injected > pinConductance * supply;
  const rail = above ? supply : 0;
  const sign = above ? 1 : -1;
  const scale = 1 / (1 + pinConductance * seriesResistance);
  const conductance = pinConductance * scale;
  const available = sign * (injected - pinConductance * rail) * scale;
  let low = 0;
  let high = available / conductance;
  const start = sign * (guess - rail) - seriesResistance * sign * (injected - pinConductance * guess);
  // Without a usable guess: the root if G' were 0, which lies right of the true one.
  let x = start > low && start < high ? start : Math.min(VT * Math.log(1 + available / IS), high * (1 - 1e-12));
  for (let iteration = 0; iteration < 80; iteration += 1) {
    const ratio = 1 + (available - conductance * x) / IS;
    const residual = x - VT * Math.log(ratio);
    const slope = 1 + (VT * conductance) / (IS * ratio);
    let step = residual / slope;
    // Where the diode carries more than Vt·G', h is nearly straight: h''/(2h') = (h' − 1)²/(2·Vt·h'),
    // and a Newton step of δ leaves an error of about that times δ².
    let curvature = ((slope - 1) * (slope - 1)) / (2 * VT * slope);
    if (slope > 2) {
      // The diode carries less than Vt·G': here f's step is the better one.
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
    if (Math.abs(next - x) < 1e-5 || curvature * step * step < 1e-6) return rail + sign * (next + seriesResistance * (available - conductance * next));
    x = next;
  }
  return rail + sign * (x + seriesResistance * (available - conductance * x));
}

/**
 * The clamped pin's next voltage by one Newton step on f (solveClamped's junction equation) from
 * the last step's answer, whose clamp current (`previousCurrent`, positive into VDD) stands in for
 * the exponential there, at the junction that current leaves behind the series resistance; NaN
 * when that step is longer than 1 mV. Over so short a step the exponential changes by under 4 %,
 * and Newton's error after it is at most about (1/(2·Vt))·(1 mV)², some 20 µV at the junction and
 * no more at the pin: a fifth of the trace's own tolerance.
 */
export function clampStepFrom(
  pinConductance: number,
  injected: number,
  supply: number,
  previous: number,
  previousCurrent: number,
  seriesResistance: number,
): number {
  const above = previousCurrent > 0;
  const rail = above ? supply : 0;
  const sign = above ? 1 : -1;
  const scale = 1 / (1 + pinConductance * seriesResistance);
  const conductance = pinConductance * scale;
  const diode = sign * previousCurrent;
  const x = sign * (previous - rail) - seriesResistance * diode;
  const available = sign * (injected - pinConductance * rail) * scale;
  if (!(x > 0 && diode > 0 && available > 0)) return Number.NaN;
  const step = (conductance * x - available + diode) / (conductance + (diode + IS) / VT);
  if (!(Math.abs(step) < 1e-3)) return Number.NaN;
  const junction = x - step;
  return rail + sign * (junction + seriesResistance * (available - conductance * junction));
}

/** DC voltage of the pin fed by `source` through `conductance`, with or without clamps (each behind `seriesResistance`). */
export function pinEquilibrium(source: number, conductance: number, supply: number, clamps: boolean, seriesResistance: number): number {
  if (!clamps || (source <= supply + NEGLIGIBLE_CONDUCTION && source >= -NEGLIGIBLE_CONDUCTION)) return source;
  return solveClamped(conductance, conductance * source, supply, source, seriesResistance);
}

export class FarNode {
  private v1 = 0;
  private v2 = 0;
  private readonly capacitiveConductance: number;
  private readonly historyWeight1: number;
  private readonly historyWeight2: number;
  private readonly safeLow: number;
  private readonly safeHigh: number;
  private readonly branch: RcBranch;
  /** Clamp current of the last step (A). */
  current = 0;

  constructor(
    capacitance: number,
    dt: number,
    private readonly supply: number,
    private readonly clamps: boolean,
    private readonly clampSeriesResistance: number,
    private readonly termination: PinTermination = NO_TERMINATION,
  ) {
    this.branch = new RcBranch(termination, dt);
    this.capacitiveConductance = (3 * capacitance) / (2 * dt);
    this.historyWeight1 = (2 * capacitance) / dt;
    this.historyWeight2 = capacitance / (2 * dt);
    this.safeLow = clamps ? -NEGLIGIBLE_CONDUCTION : -Infinity;
    this.safeHigh = clamps ? supply + NEGLIGIBLE_CONDUCTION : Infinity;
  }

  /** Advances one step with the pin fed by `source` through conductance `conductance`. */
  step(source: number, conductance: number): number {
    const { termination, branch } = this;
    const branchCurrent = branch.current();
    const injected =
      conductance * source + termination.current + branchCurrent + this.historyWeight1 * this.v1 - this.historyWeight2 * this.v2;
    const total = conductance + termination.conductance + branch.conductance + this.capacitiveConductance;
    let v = injected / total;
    if (v > this.safeHigh || v < this.safeLow) {
      v = solveClamped(total, injected, this.supply, 2 * this.v1 - this.v2, this.clampSeriesResistance);
      this.current = injected - total * v;
    } else {
      this.current = 0;
    }
    branch.advance(v, branchCurrent);
    this.v2 = this.v1;
    this.v1 = v;
    return v;
  }

  /** The DC voltage the pin settles to for this source. */
  equilibrium(source: number, conductance: number): number {
    const fed = withTermination(source, conductance, this.termination);
    return pinEquilibrium(fed.source, fed.conductance, this.supply, this.clamps, this.clampSeriesResistance);
  }

  /** True when the last two steps (and an RC termination's capacitor) sit within `tolerance` of `target`. */
  isSettledAt(target: number, tolerance: number): boolean {
    return Math.abs(this.v1 - target) <= tolerance && Math.abs(this.v2 - target) <= tolerance && this.branch.isQuietAt(target, tolerance);
  }

  holdAt(value: number): void {
    this.v1 = value;
    this.v2 = value;
    this.branch.holdAt(value);
  }
}
