import { cableCatalogue, CABLE_KINDS, type CableEntry } from "@/lib/sim";
import { numbers as edges } from "../03-edges/numbers";
import { buffer5v, controllerPin3v3 } from "../drivers";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { arrivalTime, farEndAfter, launchedStep, reflection, settlingArrival } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import { lab } from "./lab";

const { textbook, catalogue } = sharedNumbers;
const PREMISE = "the lesson's worked example (a premise)";
const beside = cableCatalogue["beside-ground"];
const lone = cableCatalogue["lone-lead"];
const threeCore = cableCatalogue["three-core"];
const twisted = cableCatalogue["twisted-pair"];
const coax = cableCatalogue["coax-75"];
const V = buffer5v.highVoltage;
const C_LIGHT = textbook.speedOfLight.value;
const MU0_OVER_PI = 4e-7;

/** The lesson's standard run: 10 m, a 33 Ω resistor behind the 5 V buffer. */
const RUN_LENGTH = 10;
const RUN_SERIES = 33;

function launch() {
  const source = buffer5v.outputResistance + RUN_SERIES;
  const DIVIDER = "voltage divider of the source resistance and Z0 (catalogue)";
  return {
    series: q(RUN_SERIES, "Ω", 0, PREMISE),
    source: q(source, "Ω", 0, "driver resistance + series resistor"),
    fraction: q(beside.z0 / (source + beside.z0), "", 3, DIVIDER),
    step: q(launchedStep(V, source, beside.z0), "V", 2, DIVIDER),
  };
}

/** The two-wire formulas of the lesson worked through for data beside ground, from its geometry. */
function besideFromGeometry() {
  const geometry = beside.geometry;
  if (geometry.type !== "two-wire") throw new Error("data beside ground is a two-wire line");
  const d = sharedNumbers.beside.diameter.value;
  const spacing = geometry.centreSpacing;
  const logTerm = Math.acosh(spacing / d);
  const eps = geometry.effectivePermittivity;
  const GEOMETRY = "the catalogue's geometry for data beside ground";
  return {
    wall: q((spacing - d) / 2, "mm", 1, `${GEOMETRY}: PVC wall`),
    ratio: q(spacing / d, "", 3, "D / d"),
    acosh: q(logTerm, "", 3, "acosh(D / d)"),
    impedanceFactor: q(120 / Math.sqrt(eps), "", 1, "120 / √ε_eff"),
    z0: q((120 / Math.sqrt(eps)) * logTerm, "Ω", 1, "Z0 = (120 / √ε_eff) × acosh(D / d)"),
    capacitance: q((Math.PI * textbook.epsilon0.value * eps) / logTerm, "pF/m", 1, "C′ = π × ε0 × ε_eff / acosh(D / d)"),
    inductance: q(MU0_OVER_PI * logTerm, "nH/m", 0, "L′ = (μ0 / π) × acosh(D / d)"),
  };
}

function coaxFromGeometry() {
  const geometry = coax.geometry;
  if (geometry.type !== "coax") throw new Error("75 Ω coax is a coaxial line");
  const logTerm = Math.log(geometry.dielectricDiameter / sharedNumbers.coax.diameter.value);
  const root = Math.sqrt(geometry.relativePermittivity);
  return {
    log: q(logTerm, "", 3, "ln(D / d) with the catalogue's coax geometry"),
    root: q(root, "", 1, "√ε_r"),
    z0: q((60 / root) * logTerm, "Ω", 0, "Z0 = (60 / √ε_r) × ln(D / d)"),
    delay: q(root / C_LIGHT, "ns/m", 1, "√ε_r / c"),
  };
}

/** Lesson 4's three-core example works from the table's rounded L′ and C′. */
function threeCoreFromTable() {
  const inductance = Number((threeCore.perMetre.inductance * 1e9).toFixed(0)) * 1e-9;
  const capacitance = Number((threeCore.perMetre.capacitance * 1e12).toFixed(1)) * 1e-12;
  const FROM_TABLE = "from the table's rounded L′ and C′";
  return {
    ratio: q(Math.round(inductance / capacitance / 10) * 10, "Ω²", 0, `L′ / C′ ${FROM_TABLE}, to three figures`),
    z0: q(Math.sqrt(inductance / capacitance), "Ω", 0, `√(L′ / C′) ${FROM_TABLE}`),
    delay: q(Math.sqrt(inductance * capacitance), "ns/m", 2, `√(L′ × C′) ${FROM_TABLE}`),
  };
}

/** Lesson 3's short lead (5 V buffer, 330 Ω, 2 m of data beside ground) seen as a line. */
function staircase() {
  const source = buffer5v.outputResistance + edges.shortLead.series.value;
  const delay = edges.shortLead.length.value * beside.delayPerMetre;
  const gammaS = reflection(source, beside.z0);
  const steps = Object.fromEntries(
    [1, 2, 3, 4, 5].map((n) => [
      `n${n}`,
      {
        far: q(farEndAfter(V, gammaS, n), "V", 2, "V × (1 − Γs^n)"),
        at: q(arrivalTime(n, delay), "ns", 1, "(2n − 1) × T_d"),
      },
    ]),
  );
  const ninety = settlingArrival(gammaS, 0.1);
  return {
    source: q(source, "Ω", 0, "driver resistance + series resistor"),
    delay: q(delay, "ns", 1, "length × delay per metre (catalogue)"),
    gamma: q(gammaS, "", 3, "Γs = (R_src − Z0) / (R_src + Z0)"),
    steps,
    ninetyArrival: q(ninety, "", 0, "first arrival n with Γs^n < 0.1"),
    riseDelays: q(2 * (ninety - 1), "", 0, "from the first arrival to arrival n: 2(n − 1) one-way delays"),
    riseRoundTrips: q(ninety - 1, "", 0, "2(n − 1) one-way delays are n − 1 round trips"),
    rise: q(2 * (ninety - 1) * delay, "ns", 0, "2(n − 1) × T_d"),
    bareFirstStep: q(farEndAfter(V, reflection(buffer5v.outputResistance, beside.z0), 1), "V", 1, "V × (1 − Γs) without the series resistor"),
  };
}

function centreSpacing(entry: CableEntry): number {
  if (entry.geometry.type !== "two-wire") throw new Error("only a two-wire line has a centre spacing");
  return entry.geometry.centreSpacing;
}

const jacketed = CABLE_KINDS.filter((kind) => kind !== "lone-lead").map((kind) => cableCatalogue[kind].delayPerMetre);
const edgeSixth = buffer5v.edgeTime / 6;
const pinSixth = controllerPin3v3.edgeTime / 6;
const runDelay = RUN_LENGTH * beside.delayPerMetre;
const spec = lab.passRule.cableSpec;
const TWELVE = 12;

export const numbers = {
  edgeFront: q(buffer5v.edgeTime / catalogue.delayLeast.value, "m", 2, "edge time × the catalogue's fastest speed"),
  besideProduct: q(beside.perMetre.inductance * beside.perMetre.capacitance, "s²/m²", 2, "L′ × C′ (catalogue)"),
  besideRatio: q(beside.perMetre.inductance / beside.perMetre.capacitance, "Ω²", 0, "L′ / C′ (catalogue)"),
  launch: launch(),
  exercise: {
    inductance: q(520e-9, "nH/m", 0, "the quick check's cable (a premise)"),
    capacitance: q(52e-12, "pF/m", 0, "the quick check's cable (a premise)"),
    ratio: q(520e-9 / 52e-12, "Ω²", 0, "L′ / C′"),
    z0: q(Math.sqrt(520e-9 / 52e-12), "Ω", 0, "Z0 = √(L′ / C′)"),
    product: q(520e-9 * 52e-12, "s²/m²", 3, "L′ × C′"),
    delay: q(Math.sqrt(520e-9 * 52e-12), "ns/m", 1, "√(L′ × C′)"),
  },
  besideGeometry: besideFromGeometry(),
  loneSpacingRatio: q(centreSpacing(lone) / centreSpacing(beside), "", 0, "centre spacings of the catalogue's lone lead and data beside ground"),
  loneToBeside: q(lone.z0 / beside.z0, "", 1, "ratio of the catalogue's Z0s"),
  coaxGeometry: coaxFromGeometry(),
  run: {
    length: q(RUN_LENGTH, "m", 0, PREMISE),
    besideResistance: q(RUN_LENGTH * beside.perMetre.resistance, "Ω", 2, "R′ × length (catalogue)"),
    besideCapacitance: q(RUN_LENGTH * beside.perMetre.capacitance, "pF", 0, "C′ × length (catalogue)"),
    delay: q(runDelay, "ns", 1, "length × delay per metre (catalogue)"),
    roundTrip: q(2 * runDelay, "ns", 0, "2 × one-way delay"),
    roundTripEdges: q((2 * runDelay) / buffer5v.edgeTime, "", 0, "round trip ÷ edge time"),
  },
  threeCoreFromTable: threeCoreFromTable(),
  twelve: { length: q(TWELVE, "m", 0, PREMISE), delay: q(TWELVE * beside.delayPerMetre, "ns", 0, "length × delay per metre (catalogue)") },
  lumped: {
    sixth: q(edgeSixth, "ns", 1, "a sixth of the buffer's edge time"),
    limit: q(edgeSixth / beside.delayPerMetre, "m", 2, "a sixth of the edge ÷ delay per metre"),
  },
  pinOnTwisted: {
    roundTripLength: q(controllerPin3v3.edgeTime / (2 * twisted.delayPerMetre), "m", 2, "edge time ÷ (2 × delay per metre)"),
    sixth: q(pinSixth, "ns", 2, "a sixth of the pin's edge time"),
    lumpedLimit: q(pinSixth / twisted.delayPerMetre, "m", 2, "a sixth of the edge ÷ delay per metre"),
  },
  shortLead: { series: edges.shortLead.series, length: edges.shortLead.length, rise: edges.shortLead.rise },
  bare: { rise: edges.bare.rise },
  staircase: staircase(),
  jacketed: {
    least: q(Math.min(...jacketed), "ns/m", 1, "smallest delay per metre of the catalogue's jacketed cables"),
    most: q(Math.max(...jacketed), "ns/m", 1, "largest delay per metre of the catalogue's jacketed cables"),
  },
  standard: {
    minZ0: q(spec!.minZ0, "Ω", 0, "the lab's cable standard (lessons/04-transmission-line/lab.ts)"),
    maxZ0: q(spec!.maxZ0, "Ω", 0, "the lab's cable standard"),
    maxDelay: q(spec!.maxDelayPerMetre, "ns/m", 1, "the lab's cable standard"),
    maxCapacitance: q(spec!.maxCapacitancePerMetre, "pF/m", 0, "the lab's cable standard"),
    series: q(lab.runs[0].scenario.seriesResistance, "Ω", 0, "the lab's fitted resistor"),
  },
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";

/** Each learner's premises for the quick checks, away from the lesson's worked examples, and the answers computed from them. */
export const checkGivens = {
  launchedStep: [47, 68, 82, 100, 150].map((series) => {
    const source = buffer5v.outputResistance + series;
    const DIVIDER = "voltage divider of the source resistance and Z0 (catalogue)";
    return {
      series: q(series, "Ω", 0, GIVEN),
      total: q(source + beside.z0, "Ω", 1, "source resistance + Z0"),
      step: q(launchedStep(V, source, beside.z0), "V", 2, DIVIDER),
    };
  }),
  roundTripLength: [3e-9, 5e-9, 6e-9, 8e-9].map((edge) => ({
    edge: q(edge, "ns", 0, GIVEN),
    length: q(edge / (2 * twisted.delayPerMetre), "m", 2, "edge time ÷ (2 × delay per metre)"),
  })),
  permittivity: [4.2e-9, 4.4e-9, 4.8e-9, 6.2e-9].map((delay) => ({
    delay: q(delay, "ns/m", 1, GIVEN),
    ratio: q(delay * C_LIGHT, "", 3, "delay per metre × c"),
    squared: q((delay * C_LIGHT) ** 2, "", 2, "(delay × c)²"),
  })),
};

export const plainNumbers: PlainNumber[] = [
  { text: "(120 / √", why: "the two-wire formula's constant, η0 / π ≈ 120 Ω (textbook form)" },
  { text: "(60 / √", why: "the coax formula's constant, η0 / 2π ≈ 60 Ω (textbook form)" },
  { text: "(60 / {{coaxGeometry.root}})", why: "the coax formula's constant, η0 / 2π ≈ 60 Ω" },
  { text: "μ0 = 4π × 10⁻⁷ H/m", why: "the vacuum permeability (SI, to the precision the lesson needs)" },
  { text: "L′ = 4 × 10⁻⁷ H/m ×", why: "μ0 / π" },
  { text: "{{beside.diameter}} + 2 × {{besideGeometry.wall}}", why: "one diameter plus two walls" },
  { text: "made for 100 Ω between the two conductors", why: "the TIA-568 cabling standards' figure for a pair" },
  { text: "4/3 of the two-core value", why: "the thin-wire image method's ratio for two returns (lib/sim/cables.ts)" },
  { text: "one round trip, 2 T_d", why: "the definition of a round trip" },
  { text: "÷ (2 × {{twisted.delay}})", why: "round trip = 2 × length × delay per metre" },
  { text: "Round trip = 2 × length", why: "the definition of a round trip" },
  { text: "passes 10 % at the first step and 90 % at step", why: "the rise-time convention" },
];
