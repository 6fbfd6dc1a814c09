import { RECEIVER_DEFAULTS } from "@/lib/sim";

/**
 * The source-resistance window of lessons 6 to 8 for a driver whose high level is below the
 * pixel's guaranteed threshold (a 3.3 V pin into a 5 V pixel), judged for typical pixels: the
 * bounce arithmetic of lesson 5 at an open far end, V_far(n) = V·(1 − Γs^n), ignoring the pin's
 * capacitance, the clamps and the cable's loss (the workbench has them all).
 *
 * - The first arrival V·(1 − Γs) must rise `margin` above the highest level at which a typical
 *   pixel reads a rise (top of the typical band plus half its hysteresis): Γs ≤ 1 − (rise + margin)/V.
 * - The second arrival V·(1 − Γs²) must stay `margin` above the level where that pixel reads a
 *   fall again (top of the band less half the hysteresis): |Γs| ≤ √(1 − (fall + margin)/V).
 *
 * Returned as fractions of Z0, since R_src/Z0 = (1 + Γs)/(1 − Γs).
 */
export function typicalSourceWindow(options: { driverVolts: number; supply: number; margin: number }) {
  const { driverVolts, supply, margin } = options;
  const top = (RECEIVER_DEFAULTS.typicalSwitchingPoint + RECEIVER_DEFAULTS.typicalSpread) * supply;
  const halfHysteresis = (RECEIVER_DEFAULTS.typicalHysteresis * supply) / 2;
  const rise = top + halfHysteresis;
  const fall = top - halfHysteresis;
  const highestGamma = 1 - (rise + margin) / driverVolts;
  const deepestGamma = -Math.sqrt(Math.max(0, 1 - (fall + margin) / driverVolts));
  const ratio = (gamma: number) => (1 + gamma) / (1 - gamma);
  return { lower: ratio(deepestGamma), upper: ratio(highestGamma), rise, fall };
}

/** The window the 3.3 V labs use: a 3.3 V pin into a 5 V pixel with 0.3 V of margin. */
export const PIN_3V3_WINDOW = typicalSourceWindow({ driverVolts: 3.3, supply: 5, margin: 0.3 });

/** A fraction of Z0 as the briefs print it. */
export const zFraction = (fraction: number) => fraction.toFixed(2);
