/**
 * Far-end terminations at the pixel input, beside its capacitance and clamps: a resistor to
 * ground (parallel), a divider between the pixel's supply and ground (Thevenin), or a resistor in
 * series with a capacitor to ground (RC). Each is a linear load on the pin; the solver folds it
 * into the pin's equation as a conductance and a current (lib/sim/README.md, "Terminations").
 */

export type TerminationInput =
  | { kind: "parallel"; resistance: number }
  | { kind: "thevenin"; toSupply: number; toGround: number }
  | { kind: "rc"; resistance: number; capacitance: number };

/**
 * A termination as the pin sees it: at DC a Norton source (`current` into the pin alongside
 * `conductance` to ground); the RC branch carries no DC current and adds its own state.
 */
export type PinTermination = {
  conductance: number;
  current: number;
  /** The RC branch: 1/R and C, or 0 and 0 without one. */
  branchConductance: number;
  branchCapacitance: number;
};

export const NO_TERMINATION: PinTermination = { conductance: 0, current: 0, branchConductance: 0, branchCapacitance: 0 };

export function pinTermination(termination: TerminationInput | undefined, supply: number): PinTermination {
  if (termination === undefined) return NO_TERMINATION;
  switch (termination.kind) {
    case "parallel":
      return { ...NO_TERMINATION, conductance: 1 / termination.resistance };
    case "thevenin":
      return {
        ...NO_TERMINATION,
        conductance: 1 / termination.toSupply + 1 / termination.toGround,
        current: supply / termination.toSupply,
      };
    case "rc":
      return { ...NO_TERMINATION, branchConductance: 1 / termination.resistance, branchCapacitance: termination.capacitance };
  }
}

/** The DC source that feeds the pin: `source` behind `conductance`, with the termination's conductance and current beside it. */
export function withTermination(source: number, conductance: number, termination: PinTermination): { source: number; conductance: number } {
  const total = conductance + termination.conductance;
  return { source: (conductance * source + termination.current) / total, conductance: total };
}

/**
 * The RC branch integrated by BDF2 like the pin's own capacitance. With g = 1/R, Cc = 3C/(2·dt)
 * and the history H = (2C/dt)·c1 − (C/(2dt))·c2 of the capacitor's last two voltages, the
 * capacitor's next voltage is c = (g·v + H)/(g + Cc), so the branch draws g·(v − c) = Geq·v − s·H
 * from the pin, with s = g/(g + Cc) and Geq = s·Cc: a companion conductance and a source that the
 * pin's equation takes in like the line's.
 */
export class RcBranch {
  readonly active: boolean;
  /** Geq (S), 0 without a branch. */
  readonly conductance: number;
  private readonly resistorConductance: number;
  private readonly share: number;
  private readonly weight1: number;
  private readonly weight2: number;
  c1 = 0;
  c2 = 0;

  constructor(termination: PinTermination, dt: number) {
    const g = termination.branchConductance;
    const capacitance = termination.branchCapacitance;
    this.active = g > 0 && capacitance > 0;
    const capacitiveConductance = (3 * capacitance) / (2 * dt);
    this.resistorConductance = g;
    this.share = this.active ? g / (g + capacitiveConductance) : 0;
    this.conductance = this.share * capacitiveConductance;
    this.weight1 = (2 * capacitance) / dt;
    this.weight2 = capacitance / (2 * dt);
  }

  /** s·H: the companion source for the next step (A, into the pin). */
  current(): number {
    return this.share * (this.weight1 * this.c1 - this.weight2 * this.c2);
  }

  /** Moves the capacitor on once the pin's voltage `v` for this step is known; `current` is what current() gave for it. */
  advance(v: number, current: number): void {
    if (!this.active) return;
    this.c2 = this.c1;
    this.c1 = this.share * v + current / this.resistorConductance;
  }

  /** Sets the capacitor to `v`, the pin's DC value: no current flows in the branch. */
  holdAt(v: number): void {
    this.c1 = this.active ? v : 0;
    this.c2 = this.c1;
  }

  /** True when the branch carries no more than the pin's own settled tolerance would leave. */
  isQuietAt(v: number, tolerance: number): boolean {
    return !this.active || (Math.abs(this.c1 - v) <= tolerance && Math.abs(this.c2 - v) <= tolerance);
  }
}
