import { CLAMP_DIODE_MODEL } from "./far-node";
import type { ResolvedSimInput } from "./schema";

/**
 * The receiver model of docs/simulator.md ("The receiver: two judgements"): a pixel input switches
 * at some point s with some hysteresis h, reading a rise through s + h/2 and a fall through s − h/2.
 * Nobody knows s for a given part, so a run is judged over a band of switching points, twice:
 *
 * - guaranteed: s anywhere between the datasheet's thresholds (VIL = lowThreshold·VDD,
 *   VIH = highThreshold·VDD), with no hysteresis. Nothing between VIL and VIH is promised, so
 *   this is what a design can promise on every part that meets its datasheet.
 * - typical: s within ±typicalSpread·VDD of typicalSwitchingPoint·VDD, with typicalHysteresis·VDD.
 *   No published figure fixes these for this class of part: they are stated assumptions
 *   (schema.ts), shown with every result.
 */

/**
 * The receiver's defaults (lib/sim/receiver.ts, docs/simulator.md "The receiver"), each with its basis:
 * - thresholds: VIH = 0.7·VDD, VIL = 0.3·VDD, the guaranteed input levels of CMOS-input pixel
 *   datasheets (common datasheet figures, from memory);
 * - typical switching point 0.5·VDD ± 0.1·VDD with 0.05·VDD of hysteresis: an assumption (a CMOS
 *   input switches near mid-supply; spread over parts and temperature and hysteresis are not
 *   published for this class of part);
 * - deglitch time 0: no datasheet promises an input filter, so none is assumed;
 * - shortest high and low: the protocol's shortest nominal high (0.40 µs) and low (0.45 µs) less
 *   their ±0.15 µs tolerance (the 800 kHz protocol's timing table, from memory), less a further
 *   0.10 µs and 0.15 µs that a receiver is assumed to accept: 0.15 µs each; a shorter pulse or low is
 *   not a bit the protocol defines;
 * - clamp injection rating 20 mA: the absolute maximum input clamp current of standard CMOS logic
 *   inputs (±20 mA, JEDEC JESD7A for the high-speed CMOS family, from memory), assumed for pixel
 *   inputs whose datasheets do not state one; a design keeps under half of it (common derating);
 * - clamp series resistance 5 Ω: an assumption from memory, kept with the diode law in
 *   CLAMP_DIODE_MODEL (far-node.ts, where its basis is given).
 */
export const RECEIVER_DEFAULTS = {
  highThreshold: 0.7,
  lowThreshold: 0.3,
  typicalSwitchingPoint: 0.5,
  typicalSpread: 0.1,
  typicalHysteresis: 0.05,
  deglitchTime: 0,
  minPulse: 0.15e-6,
  minGap: 0.15e-6,
  decisionTime: 0.6e-6,
  clampCurrentRating: 20e-3,
  clampSeriesResistance: CLAMP_DIODE_MODEL.seriesResistance,
} as const;

/** The clamp current a design keeps under: half the input's rated injection current (common derating practice). */
export const clampCurrentLimit = (rating: number) => rating / 2;

export const JUDGEMENTS = ["guaranteed", "typical"] as const;
export type JudgementName = (typeof JUDGEMENTS)[number];

/** Switching points from `lowest` to `highest` (V), each with `hysteresis` (V). */
export type SwitchingBand = { lowest: number; highest: number; hysteresis: number };

/** A comparator: a pulse starts when the input rises through `rise` and ends when it falls through `fall` (V). */
export type Comparator = { rise: number; fall: number };

/**
 * Turns back from a peak or a trough by less than this share of VDD are part of the edge, not
 * ringing: the bumps a capacitive pin puts on each step of a staircase (tens of millivolts).
 * Ringing that matters is far larger. Not counting such a turn overstates a margin by less than it.
 */
export const EDGE_BUMP_SHARE = 0.02;

export function switchingBands(receiver: ResolvedSimInput["receiver"]): Record<JudgementName, SwitchingBand> {
  const vdd = receiver.supplyVoltage;
  return {
    guaranteed: { lowest: receiver.lowThreshold * vdd, highest: receiver.highThreshold * vdd, hysteresis: 0 },
    typical: {
      lowest: (receiver.typicalSwitchingPoint - receiver.typicalSpread) * vdd,
      highest: (receiver.typicalSwitchingPoint + receiver.typicalSpread) * vdd,
      hysteresis: receiver.typicalHysteresis * vdd,
    },
  };
}

/**
 * The band's two extreme comparators. With edges that cross the band once, a pulse is narrowest
 * for the highest switching point (it starts latest and ends earliest) and widest for the lowest:
 * a 1 bit is judged at the first, a 0 bit at the second.
 */
export function bandCorners(band: SwitchingBand): { highest: Comparator; lowest: Comparator } {
  const half = band.hysteresis / 2;
  return {
    highest: { rise: band.highest + half, fall: band.highest - half },
    lowest: { rise: band.lowest + half, fall: band.lowest - half },
  };
}

/** The band's middle switching point: what the run's `decoded` bits are read with. */
export function bandCentre(band: SwitchingBand): Comparator {
  const centre = (band.lowest + band.highest) / 2;
  return { rise: centre + band.hysteresis / 2, fall: centre - band.hysteresis / 2 };
}
