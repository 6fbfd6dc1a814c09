import { cableCatalogue } from "@/lib/sim";
import { buffer5v } from "../drivers";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { rcRiseTime, rcTimeToFall, rcTimeToRise } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";

const { sim, pixel, textbook, catalogue } = sharedNumbers;
const PREMISE = "the lesson's worked example (a premise)";
const C_PER_METRE = cableCatalogue["beside-ground"].perMetre.capacitance;
const INPUT_C = sim.inputCapacitance.value;
const DRIVER_R = buffer5v.outputResistance;
const V = buffer5v.highVoltage;
const DIODE = textbook.diodeDrop.value;

/** A driver of `DRIVER_R` through `series` into `length` of data beside ground and a pixel, as one RC. */
function lumped(length: number, series: number) {
  const resistance = DRIVER_R + series;
  const capacitance = length * C_PER_METRE + INPUT_C;
  const tau = resistance * capacitance;
  return {
    length: q(length, "m", length % 1 === 0 ? 0 : 1, PREMISE),
    series: q(series, "Ω", 0, PREMISE),
    resistance: q(resistance, "Ω", 0, "driver resistance + series resistor"),
    cableCapacitance: q(length * C_PER_METRE, "pF", 0, "C′ (catalogue, data beside ground) × length"),
    capacitance: q(capacitance, "pF", 0, "C′ × length + the pixel's input capacitance"),
    tau: q(tau, "ns", 1, "τ = R × C"),
    rise: q(rcRiseTime(tau), "ns", 0, "t_rise = τ × ln 9"),
  };
}

const shortLead = lumped(2, 330);
const bare = lumped(2, 0);
const longRun = lumped(10, 270);
const fourMetres = lumped(4, 0);
const RISE_LIMIT = 100e-9;
/** ln 9 as the rule of thumb rounds it. */
const RULE_FACTOR = Math.round(Math.log(9) * 10) / 10;
const WEAK_VOLTS = 4.5;
const WEAK_TAU = 170e-9;
const weakShrink = rcTimeToRise(1, WEAK_VOLTS, pixel.high.value) - rcTimeToFall(1, WEAK_VOLTS, pixel.low.value);
const symmetricCrossing = rcTimeToRise(1, V, pixel.high.value);
const shortLeadDelay = shortLead.length.value * cableCatalogue["beside-ground"].delayPerMetre;

export const numbers = {
  pixelsInTwoMetres: q((shortLead.length.value * C_PER_METRE) / INPUT_C, "", 0, "C′ × 2 m ÷ the pixel's input capacitance"),
  charged: {
    one: q(1 - Math.exp(-1), "%", 0, "1 − e^(−1)"),
    two: q(1 - Math.exp(-2), "%", 0, "1 − e^(−2)"),
    three: q(1 - Math.exp(-3), "%", 0, "1 − e^(−3)"),
  },
  tenPercentAt: q(Math.log(1 / 0.9), "", 3, "ln(1/0.9)"),
  ninetyPercentAt: q(Math.log(10), "", 3, "ln 10"),
  shortLead: { ...shortLead, delay: q(shortLeadDelay, "ns", 0, "length × delay per metre (catalogue)"), sixth: q(shortLead.rise.value / 6, "ns", 0, "a sixth of the rise time") },
  bare: { tau: q(bare.tau.value, "ns", 1, "τ = R × C without the series resistor"), rise: q(bare.rise.value, "ns", 1, "τ × ln 9") },
  symmetric: {
    gap: q(V - pixel.high.value, "V", 1, "driver level − high threshold"),
    crossing: q(symmetricCrossing, "", 3, "ln(V / (V − v_th)), in time constants"),
    tauLimit: q(sim.zeroHigh.value / symmetricCrossing, "ns", 0, "0-bit high time ÷ the crossing in time constants"),
  },
  weak: {
    volts: q(WEAK_VOLTS, "V", 1, PREMISE),
    riseGap: q(WEAK_VOLTS - pixel.high.value, "V", 1, "driver level − high threshold"),
    rise: q(rcTimeToRise(1, WEAK_VOLTS, pixel.high.value), "", 3, "ln(V / (V − v_th)), in time constants"),
    fall: q(rcTimeToFall(1, WEAK_VOLTS, pixel.low.value), "", 3, "ln(V / v_th), in time constants"),
    shrink: q(weakShrink, "", 1, "rising crossing − falling crossing, in time constants"),
    tau: q(WEAK_TAU, "ns", 0, PREMISE),
    lost: q(weakShrink * WEAK_TAU, "ns", 0, "shrink × τ"),
    left: q(sim.timingMargin.value - weakShrink * WEAK_TAU, "ns", 0, "timing margin − what the shrink takes"),
  },
  fourMetres: {
    length: fourMetres.length,
    cableCapacitance: fourMetres.cableCapacitance,
    capacitance: fourMetres.capacitance,
    riseLimit: q(RISE_LIMIT, "ns", 0, PREMISE),
    largestR: q(RISE_LIMIT / (Math.log(9) * fourMetres.capacitance.value), "Ω", 0, "R = t_rise / (C × ln 9)"),
    largestRByRule: q(RISE_LIMIT / (RULE_FACTOR * fourMetres.capacitance.value), "Ω", 0, "R = t_rise / (2.2 × C)"),
  },
  clamp: {
    drive: q(V - DIODE, "V", 1, "driver level − diode drop"),
    bare: q((V - DIODE) / DRIVER_R, "mA", 0, "(V − 0.7 V) / R_out"),
    fitted: q((V - DIODE) / shortLead.resistance.value, "mA", 0, "(V − 0.7 V) / (R_out + R_s)"),
  },
  shortRoundTrip: {
    least: q(2 * shortLead.length.value * catalogue.delayLeast.value, "ns", 0, "2 × length × the catalogue's smallest delay per metre"),
    most: q(2 * shortLead.length.value * catalogue.delayMost.value, "ns", 0, "2 × length × the catalogue's largest delay per metre"),
  },
  longRun: {
    length: longRun.length,
    series: longRun.series,
    resistance: longRun.resistance,
    capacitance: longRun.capacitance,
    tau: longRun.tau,
    rise: longRun.rise,
    crossing: q(symmetricCrossing * longRun.tau.value, "ns", 0, "ln(V / (V − v_th)) × τ"),
    reached: q(1 - Math.exp(-sim.zeroHigh.value / longRun.tau.value), "%", 0, "1 − e^(−t/τ) at the end of a 0 bit"),
  },
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";
const givenSeries = (series: number) => ({ ...lumped(shortLead.length.value, series), series: q(series, "Ω", 0, GIVEN) });

/** Each learner's premises for the quick checks, away from the lesson's worked resistors, and the answers computed from them. */
export const checkGivens = {
  timeConstant: [150, 220, 270, 390, 470].map(givenSeries),
  riseTime: [100, 180, 300, 560].map(givenSeries),
  clampCurrent: [150, 220, 270, 390, 470].map((series) => {
    const lead = givenSeries(series);
    return { ...lead, current: q((V - DIODE) / lead.resistance.value, "mA", 1, "(V − 0.7 V) / (R_out + R_s)") };
  }),
};

export const plainNumbers: PlainNumber[] = [
  { text: "rather than 0 % and 100 %", why: "the definition of rise time" },
  { text: "v = 0.1 V", why: "10 % of the swing V, in the derivation" },
  { text: "v = 0.9 V", why: "90 % of the swing V, in the derivation" },
  { text: "ln(1/0.9)", why: "the derivation's formula" },
  { text: "ln(10)", why: "the derivation's formula" },
  { text: "ln 9", why: "the derivation's formula" },
];
