import { awgResistancePerMetre, cableCatalogue, eSeriesValues, perMetreFromGeometry, type CableKind } from "@/lib/sim";
import { numbers as seriesTermination } from "../06-series-termination/numbers";
import { buffer5v, controllerPin3v3 } from "../drivers";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { arrivalTime, farEndAfter, reflection } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";

const { pixel, sim, typical } = sharedNumbers;
const lesson6Window = seriesTermination.window;
const PREMISE = "the lesson's worked design (a premise)";
const IEC_60063 = "IEC 60063: the tolerance that goes with the series";
const E24_TOLERANCE = 0.05;

/** The lone lead's Z0 with its return `spacing` away, by the catalogue's formula for unequal wires. */
function loneLeadAt(spacing: number) {
  const geometry = cableCatalogue["lone-lead"].geometry;
  if (geometry.type !== "two-wire") throw new Error("the lone lead is a two-wire line");
  const perMetre = perMetreFromGeometry({ ...geometry, centreSpacing: spacing });
  return {
    spacing: q(spacing, "mm", 0, "a spacing the lead may lie at (a premise)"),
    z0: q(Math.sqrt(perMetre.inductance / perMetre.capacitance), "Ω", 0, "the catalogue's unequal two-wire formula (lib/sim perMetreFromGeometry)"),
  };
}

/** E24 values nearest `ohms`, below and above. */
function e24Around(ohms: number) {
  const values = eSeriesValues("E24", ohms / 2, ohms * 2);
  const source = "nearest IEC 60063 E24 values (lib/sim eSeriesValues)";
  return {
    below: q(Math.max(...values.filter((v) => v <= ohms)), "Ω", 0, source),
    above: q(Math.min(...values.filter((v) => v >= ohms)), "Ω", 0, source),
  };
}

/** A run's line: one-way delay and total capacitance. */
function line(kind: CableKind, length: number) {
  const entry = cableCatalogue[kind];
  return {
    length: q(length, "m", length % 1 === 0 ? 0 : 1, PREMISE),
    delay: q(length * entry.delayPerMetre, "ns", 0, "length × delay per metre (catalogue)"),
    capacitance: q(length * entry.perMetre.capacitance, "pF", 0, "length × C′ (catalogue)"),
  };
}

/** The 3.3 V pin behind `series` on a line of z0: lesson 5's first two arrivals against the typical band. */
function pinRun(series: number, z0: number) {
  const source = controllerPin3v3.outputResistance + series;
  const gamma = reflection(source, z0);
  const first = farEndAfter(controllerPin3v3.highVoltage, gamma, 1);
  const second = farEndAfter(controllerPin3v3.highVoltage, gamma, 2);
  return {
    series: q(series, "Ω", 0, PREMISE),
    source: q(source, "Ω", 0, "driver resistance + series resistor"),
    gamma: q(gamma, "", 3, "Γs = (R_src − Z0) / (R_src + Z0)"),
    first: q(first, "V", 2, "V × (1 − Γs)"),
    riseMargin: q(first - typical.highestRise.value, "V", 2, "first arrival − the highest typical rise level"),
    second: q(second, "V", 2, "V × (1 − Γs²)"),
    fallMargin: q(second - typical.topFall.value, "V", 2, "second arrival − the highest typical fall level"),
  };
}

/** Lesson 6's 3.3 V window on a line of z0, as source resistances and as series resistors. */
function windowOn(z0: number) {
  const low = lesson6Window.lowerFraction.value * z0;
  const high = lesson6Window.upperFraction.value * z0;
  const WINDOW = "lesson 6's window fraction × Z0";
  const pin = controllerPin3v3.outputResistance;
  return {
    sourceLow: q(low, "Ω", 1, WINDOW),
    sourceHigh: q(high, "Ω", 1, WINDOW),
    seriesLow: q(Math.max(0, low - pin), "Ω", 0, "window edge − the pin's resistance"),
    seriesHigh: q(high - pin, "Ω", 0, "window edge − the pin's resistance"),
    sourceMiddle: q((low + high) / 2, "Ω", 0, "middle of the window"),
    seriesMiddle: q((low + high) / 2 - pin, "Ω", 0, "middle of the window − the pin's resistance"),
  };
}

/** Run A: the 3.3 V pin on 12 m of twisted pair, its window and the chosen resistor. */
function runA() {
  const { z0 } = cableCatalogue["twisted-pair"];
  const run = line("twisted-pair", 12);
  return {
    length: run.length,
    capacitance: run.capacitance,
    delay: q(12 * cableCatalogue["twisted-pair"].delayPerMetre, "ns", 1, "length × delay per metre (catalogue)"),
    ...windowOn(z0),
    ...pinRun(47, z0),
  };
}

/** Run B: the 5 V buffer on 18 m of data beside ground, matched from just below. */
function runB() {
  const { z0 } = cableCatalogue["beside-ground"];
  const match = z0 - buffer5v.outputResistance;
  const neighbours = e24Around(match);
  const series = neighbours.below.value;
  const source = buffer5v.outputResistance + series;
  const gamma = reflection(source, z0);
  const first = farEndAfter(buffer5v.highVoltage, gamma, 1);
  return {
    ...line("beside-ground", 18),
    match: q(match, "Ω", 0, "R_s = Z0 − R_out"),
    neighbours,
    source: q(source, "Ω", 0, "driver resistance + series resistor"),
    gamma: q(gamma, "", 3, "Γs = (R_src − Z0) / (R_src + Z0)"),
    oneMinusGamma: q(1 - gamma, "", 3, "1 − Γs"),
    first: q(first, "V", 2, "V × (1 − Γs)"),
    overshoot: q(first - buffer5v.highVoltage, "V", 2, "first arrival − settled level"),
    lowest: q(series * (1 - E24_TOLERANCE), "Ω", 1, "nominal × (1 − tolerance)"),
    highest: q(series * (1 + E24_TOLERANCE), "Ω", 1, "nominal × (1 + tolerance)"),
  };
}

/** Run C: the 3.3 V pin on 2.5 m of data beside ground. */
function runC() {
  const { z0 } = cableCatalogue["beside-ground"];
  const run = line("beside-ground", 2.5);
  const { seriesLow, seriesHigh } = windowOn(z0);
  const { series, first } = pinRun(47, z0);
  return { length: run.length, delay: run.delay, seriesLow, seriesHigh, series, first };
}

function supplyFeed() {
  const current = 10;
  const length = 5;
  const gauge = 18;
  const perMetre = awgResistancePerMetre(gauge);
  const loop = 2 * length * perMetre;
  return {
    current: q(current, "A", 0, PREMISE),
    length: q(length, "m", 0, PREMISE),
    gauge: q(gauge, "", 0, PREMISE),
    perMetre: q(perMetre, "mΩ/m", 1, "ASTM B258 diameter and annealed copper (lib/sim awgResistancePerMetre)"),
    perMetreInOhms: q(perMetre, "Ω/m", 4, "ASTM B258 diameter and annealed copper (lib/sim awgResistancePerMetre)"),
    loop: q(loop, "Ω", 3, "2 × length × resistance per metre"),
    drop: q(current * loop, "V", 2, "I × R"),
    left: q(pixel.vdd.value - current * loop, "V", 2, "supply − drop"),
    heat: q(current ** 2 * loop, "W", 0, "I² × R"),
  };
}

function longTwisted() {
  const length = 25;
  const delay = length * cableCatalogue["twisted-pair"].delayPerMetre;
  const arrivals = 3;
  return {
    length: q(length, "m", 0, "the quick check's run (a premise)"),
    delay: q(delay, "ns", 0, "length × delay per metre (catalogue)"),
    factor: q(2 * arrivals - 1, "", 0, "2n − 1 for the third arrival"),
    crossing: q(arrivalTime(arrivals, delay), "ns", 0, "(2n − 1) × T_d"),
    fall: q(sim.zeroHigh.value + delay, "ns", 0, "0-bit high time + T_d"),
  };
}

export const numbers = {
  loneAt: { near: loneLeadAt(5e-3), far: loneLeadAt(30e-3) },
  window: {
    margin: lesson6Window.margin,
    lower: q(lesson6Window.lowerFraction.value, "", 2, lesson6Window.lowerFraction.source),
    upper: q(lesson6Window.upperFraction.value, "", 2, lesson6Window.upperFraction.source),
  },
  tolerance: {
    e12: q(0.1, "%", 0, IEC_60063),
    e24: q(E24_TOLERANCE, "%", 0, IEC_60063),
    e96: q(0.01, "%", 0, IEC_60063),
  },
  runA: runA(),
  runB: runB(),
  runC: runC(),
  supply: supplyFeed(),
  longTwisted: longTwisted(),
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";

/** Each learner's premises for the quick checks, away from the lesson's worked feed, and the answers computed from them. */
export const checkGivens = {
  supplyDrop: [
    [6, 5],
    [8, 4],
    [12, 3],
    [9, 3],
  ].map(([current, length]) => {
    const perMetre = awgResistancePerMetre(18);
    const loop = 2 * length * perMetre;
    return {
      current: q(current, "A", 0, GIVEN),
      length: q(length, "m", 0, GIVEN),
      loop: q(loop, "Ω", 3, "2 × length × resistance per metre"),
      drop: q(current * loop, "V", 2, "I × R"),
    };
  }),
};

export const plainNumbers: PlainNumber[] = [
  { text: "one controller with 3.3 V outputs", why: "the controller-pin class" },
  { text: "**The 3.3 V window closes.**", why: "the controller-pin class" },
  { text: "at 3.3 V into", why: "the controller-pin class" },
  { text: "out and back, 2 ×", why: "a loop is twice the feed's length" },
  { text: "R = 2 ×", why: "a loop is twice the feed's length" },
  { text: "somewhere around 10 to 20 metres", why: "common practice of the trade, as the text says" },
  { text: "±200 mV", why: "TIA-485-A receiver sensitivity" },
  { text: "−7 V to +12 V", why: "TIA-485-A common-mode range" },
  { text: "about 100 Ω for a data-network cable", why: "the TIA-568 figure for a pair" },
];
