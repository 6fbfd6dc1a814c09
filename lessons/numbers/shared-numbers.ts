import { awgDiameter, CABLE_KINDS, cableCatalogue, colourBits, parseSimInput, type CableKind } from "@/lib/sim";
import { buffer5v, controllerPin3v3 } from "../drivers";
import { receiverLevels } from "../receiver-model";
import { quantity as q, type NumberTree } from "./lesson-number";

/**
 * The numbers every lesson may quote: the simulator's defaults and catalogue, the course's
 * drivers, and the few physical and textbook constants the formulas use. Each lesson's numbers
 * (lessons/NN-…/numbers.ts) add their own to these.
 */

const SIM_DEFAULT = "the simulator's default (parseSimInput, docs/simulator.md)";
const CATALOGUE = "the simulator's cable catalogue (lib/sim/cables.ts, from geometry)";
const GEOMETRY = "the simulator's catalogue geometry (lib/sim/cables.ts)";

const defaults = parseSimInput({ cable: { kind: "beside-ground", length: 1 }, signal: { bits: "0" } });
const { bitPeriod, zeroHigh, oneHigh } = defaults.signal;
const receiver = defaults.receiver;

/** Protocol timing and the pixel's receiver as the simulator models them by default. */
const sim = {
  bitPeriod: q(bitPeriod, "µs", 2, SIM_DEFAULT),
  bitRate: q(1 / bitPeriod, "kHz", 0, "f = 1 / bit period"),
  zeroHigh: q(zeroHigh, "µs", 1, SIM_DEFAULT),
  oneHigh: q(oneHigh, "µs", 1, SIM_DEFAULT),
  zeroLow: q(bitPeriod - zeroHigh, "µs", 2, "bit period − 0-bit high time"),
  oneLow: q(bitPeriod - oneHigh, "µs", 2, "bit period − 1-bit high time"),
  decisionTime: q(receiver.decisionTime, "µs", 1, SIM_DEFAULT),
  timingMargin: q(Math.min(receiver.decisionTime - zeroHigh, oneHigh - receiver.decisionTime), "ns", 0, "distance of each default high time from the decision time"),
  minPulse: q(receiver.minPulse, "µs", 2, SIM_DEFAULT),
  deglitchTime: q(receiver.deglitchTime, "ns", 0, SIM_DEFAULT),
  inputCapacitance: q(receiver.inputCapacitance, "pF", 0, SIM_DEFAULT),
  highThreshold: q(receiver.highThreshold, "", 1, SIM_DEFAULT),
  lowThreshold: q(receiver.lowThreshold, "", 1, SIM_DEFAULT),
  wordBits: q(colourBits([[0, 0, 0]], "GRB").length, "", 0, "bits of one colour word (lib/sim colourBits)"),
  /** Checked against the simulator's verdict in tests/unit/lessons/lesson-claims.test.ts. */
  latchGap: q(50e-6, "µs", 0, "the shortest low the simulator's verdict accepts as a latch (lib/sim/verdict.ts)"),
};

/** The pixel every lesson's examples drive: the simulator's default supply and thresholds. */
const vdd = receiver.supplyVoltage;
const DIODE_DROP = 0.7;
const pixel = {
  vdd: q(vdd, "V", 0, SIM_DEFAULT),
  high: q(receiver.highThreshold * vdd, "V", 1, "high threshold × VDD"),
  low: q(receiver.lowThreshold * vdd, "V", 1, "low threshold × VDD"),
  mid: q(vdd / 2, "V", 1, "VDD / 2"),
  clamp: q(vdd + DIODE_DROP, "V", 1, "VDD plus a silicon diode's forward drop"),
};

/** Where typical pixels switch at the default supply: the receiver model's assumption (lib/sim/receiver.ts). */
const levels = receiverLevels(vdd);
const TYPICAL = "the receiver model's typical band at the default supply (lessons/receiver-model.ts, lib/sim/receiver.ts)";
const typical = {
  bottomFraction: q(receiver.typicalSwitchingPoint - receiver.typicalSpread, "", 1, SIM_DEFAULT),
  topFraction: q(receiver.typicalSwitchingPoint + receiver.typicalSpread, "", 1, SIM_DEFAULT),
  hysteresisFraction: q(receiver.typicalHysteresis, "", 2, SIM_DEFAULT),
  bottom: q(levels.typicalBottom, "V", 2, TYPICAL),
  top: q(levels.typicalTop, "V", 2, TYPICAL),
  hysteresis: q(levels.hysteresis, "V", 2, TYPICAL),
  highestRise: q(levels.highestRise, "V", 3, `${TYPICAL}: the highest level at which a typical pixel reads a rise`),
  topFall: q(levels.topFall, "V", 3, `${TYPICAL}: where a pixel switching at the top of the band reads a fall`),
  lowestFall: q(levels.lowestFall, "V", 3, `${TYPICAL}: the lowest level at which a typical pixel reads a fall`),
};

const textbook = {
  diodeDrop: q(DIODE_DROP, "V", 1, "forward drop of a silicon diode at moderate current (textbook figure)"),
  ln9: q(Math.log(9), "", 1, "RC charge from 10 % to 90 %: ln(0.9/0.1)"),
  speedOfLight: q(299_792_458, "m/s", 0, "speed of light in vacuum (SI definition)"),
  vacuumDelay: q(1 / 299_792_458, "ns/m", 3, "1 / c"),
  epsilon0: q(8.8541878128e-12, "pF/m", 3, "vacuum permittivity (CODATA 2018)"),
};

function geometryNumbers(kind: CableKind): NumberTree {
  const { geometry } = cableCatalogue[kind];
  if (geometry.type === "coax") return { dielectric: q(geometry.dielectricDiameter, "mm", 1, GEOMETRY) };
  return {
    returnGauge: q(geometry.returnGauge, "", 0, GEOMETRY),
    spacing: q(geometry.centreSpacing, "mm", geometry.centreSpacing < 5e-3 ? 3 : 0, `${GEOMETRY}: centre-to-centre spacing of data and return`),
  };
}

function cableNumbers(kind: CableKind) {
  const entry = cableCatalogue[kind];
  const { geometry, perMetre } = entry;
  const permittivity = geometry.type === "coax" ? geometry.relativePermittivity : geometry.effectivePermittivity;
  return {
    ...geometryNumbers(kind),
    z0: q(entry.z0, "Ω", entry.z0 >= 100 ? 0 : 1, CATALOGUE),
    capacitance: q(perMetre.capacitance, "pF/m", 1, CATALOGUE),
    inductance: q(perMetre.inductance, "nH/m", 0, CATALOGUE),
    delay: q(entry.delayPerMetre, "ns/m", 2, CATALOGUE),
    speed: q(1 / entry.delayPerMetre, "m/ns", 2, "1 / delay per metre (catalogue)"),
    resistance: q(perMetre.resistance, "mΩ/m", 0, CATALOGUE),
    permittivity: q(permittivity, "", permittivity === Math.round(permittivity * 10) / 10 ? 1 : 2, GEOMETRY),
    gauge: q(geometry.type === "coax" ? geometry.centreGauge : geometry.signalGauge, "", 0, GEOMETRY),
    diameter: q(awgDiameter(geometry.type === "coax" ? geometry.centreGauge : geometry.signalGauge), "mm", 3, "ASTM B258 diameter of the data conductor's gauge"),
  };
}

const entries = CABLE_KINDS.map((kind) => cableCatalogue[kind]);
const z0s = entries.map((entry) => entry.z0);
const delays = entries.map((entry) => entry.delayPerMetre);

/** The catalogue's extremes. */
const catalogue = {
  z0Least: q(Math.min(...z0s), "Ω", 0, "the catalogue's lowest Z0"),
  z0Most: q(Math.max(...z0s), "Ω", 0, "the catalogue's highest Z0"),
  delayLeast: q(Math.min(...delays), "ns/m", 2, "the catalogue's smallest delay per metre"),
  delayMost: q(Math.max(...delays), "ns/m", 2, "the catalogue's largest delay per metre"),
  speedLeast: q(1 / Math.max(...delays), "m/ns", 2, "1 / the catalogue's largest delay per metre"),
  speedMost: q(1 / Math.min(...delays), "m/ns", 2, "1 / the catalogue's smallest delay per metre"),
};

const driverNumbers = (driver: typeof controllerPin3v3 | typeof buffer5v) => ({
  volts: q(driver.highVoltage, "V", driver.highVoltage % 1 === 0 ? 0 : 1, "the course's driver list (lessons/drivers.ts)"),
  resistance: q(driver.outputResistance, "Ω", 0, "the course's driver list (lessons/drivers.ts)"),
  edge: q(driver.edgeTime, "ns", 0, "the course's driver list (lessons/drivers.ts)"),
});

export const sharedNumbers = {
  sim,
  pixel,
  typical,
  textbook,
  catalogue,
  pin: driverNumbers(controllerPin3v3),
  buffer: driverNumbers(buffer5v),
  lone: cableNumbers("lone-lead"),
  beside: cableNumbers("beside-ground"),
  twisted: cableNumbers("twisted-pair"),
  coax: cableNumbers("coax-75"),
  threeCore: cableNumbers("three-core"),
} satisfies NumberTree;
