/**
 * The differential link (lib/sim/differential-link.ts) against ngspice (Debian package). ngspice
 * gets the balanced circuit itself (support/differential-netlist.ts): two complementary drivers
 * about a 2.5 V common mode, each behind half the differential output resistance, the pair as a
 * lossless `T` element between the two wires, the termination and the receiver's capacitance
 * across the far end; the solver gets the single-ended circuit it reduces the link to. The
 * differential voltage (far: receiver input, near: transmitter output) agrees within 2 % of the
 * transmitter's full swing (2 × its open-circuit level, the "VDD" of the shifted circuit), each
 * instant's error the smallest difference within ±0.5 ns as in ngspice-comparison.test.ts, and the
 * independent receiver rule (support/receiver-decode.ts) reads the same bits from both at the
 * receiver's guaranteed thresholds, ±200 mV (TIA-485-A, from memory), and at 0 V.
 */
import { describe, expect, it } from "vitest";
import { cableCatalogue, characteristicImpedance, delayPerMetre } from "@/lib/sim";
import { DIFFERENTIAL_DEFAULTS, simulateDifferentialLink, type DifferentialLinkInput } from "@/lib/sim/differential-link";
import { buildDifferentialNetlist, DIFFERENTIAL_PROBES, type DifferentialCircuit } from "./support/differential-netlist";
import { runNgspiceNetlist } from "./support/ngspice-runner";
import { decodeWaveform, type DecodeSettings } from "./support/receiver-decode";
import { windowedError } from "./support/waveform-compare";

interface LinkCase {
  name: string;
  length: number;
  /** The pair's constants: the catalogue's twisted pair without resistance, or Z0 and delay as a datasheet gives them. */
  pair: { z0: number; delayPerMetre: number };
  terminationResistance: number;
  bits: string;
}

const catalogue = cableCatalogue["twisted-pair"].perMetre;
const twisted = { z0: characteristicImpedance(catalogue), delayPerMetre: delayPerMetre(catalogue) };

const CASES: LinkCase[] = [
  { name: "50 m of the catalogue's twisted pair, 120 Ω across the far end", length: 50, pair: twisted, terminationResistance: 120, bits: "0100110101" },
  { name: "100 m of it, matched (100 Ω)", length: 100, pair: twisted, terminationResistance: 100, bits: "01101001" },
  { name: "30 m of it, mismatched (1 kΩ)", length: 30, pair: twisted, terminationResistance: 1000, bits: "10010110" },
  { name: "80 m of a 120 Ω, 5 ns/m pair, 120 Ω", length: 80, pair: { z0: 120, delayPerMetre: 5e-9 }, terminationResistance: 120, bits: "01011100" },
];

const TIMING = { bitPeriod: 1.25e-6, zeroHigh: 0.4e-6, oneHigh: 0.8e-6, leadIn: 1e-6 };

function inputOf(c: LinkCase): DifferentialLinkInput {
  const { z0, delayPerMetre: tpd } = c.pair;
  return {
    signal: { bits: c.bits, ...TIMING },
    cable: { perMetre: { resistance: 0, inductance: z0 * tpd, capacitance: tpd / z0, conductance: 0 }, length: c.length },
    terminationResistance: c.terminationResistance,
    local: { driver: { highVoltage: 5, outputResistance: 20 }, seriesResistance: 33, cable: { kind: "beside-ground", length: 0.3 } },
  };
}

function circuitOf(c: LinkCase): DifferentialCircuit {
  return {
    level: DIFFERENTIAL_DEFAULTS.openCircuitLevel,
    outputResistance: DIFFERENTIAL_DEFAULTS.outputResistance,
    edgeTime: DIFFERENTIAL_DEFAULTS.edgeTime,
    commonMode: 2.5,
    z0: c.pair.z0,
    delay: c.length * c.pair.delayPerMetre,
    terminationResistance: c.terminationResistance,
    inputCapacitance: DIFFERENTIAL_DEFAULTS.inputCapacitance,
    bits: c.bits,
    ...TIMING,
    stopTime: TIMING.leadIn + c.bits.length * TIMING.bitPeriod + 1e-6,
  };
}

/** The receiver rule at a pair of differential levels (V): supplyVoltage 1 makes the thresholds volts. */
function settingsAt(c: LinkCase, circuit: DifferentialCircuit, rise: number, fall: number): DecodeSettings {
  return {
    supplyVoltage: 1,
    highThreshold: rise,
    lowThreshold: fall,
    deglitchTime: 0,
    minPulse: 0.15e-6,
    decisionTime: 0.6e-6,
    leadIn: TIMING.leadIn,
    bitPeriod: TIMING.bitPeriod,
    bitCount: c.bits.length,
    slotOffset: circuit.delay,
  };
}

describe("differential link against ngspice's balanced circuit (within 2 % of the full swing, ±0.5 ns)", () => {
  it.each(CASES.map((c) => [c.name, c] as const))("%s", async (_, c) => {
    const circuit = circuitOf(c);
    const spice = await runNgspiceNetlist((file) => buildDifferentialNetlist(circuit, file), DIFFERENTIAL_PROBES);
    const difference = (p: string, n: string) => spice.vectors[p].map((v, i) => v - spice.vectors[n][i]);
    const spiceFar = { time: spice.time, value: difference("v(farp)", "v(farn)") };
    const spiceNear = { time: spice.time, value: difference("v(nearp)", "v(nearn)") };
    const solved = simulateDifferentialLink(inputOf(c), { keepFullResolution: true });
    const full = solved.link.full!;
    const swing = 2 * circuit.level;

    const far = windowedError(spiceFar, { time: full.time, value: full.farEnd });
    expect(far.maxError / swing, `receiver input error ${far.maxError.toFixed(4)} V at ${far.at} s`).toBeLessThan(0.02);
    const near = windowedError(spiceNear, { time: full.time, value: full.nearEnd });
    expect(near.maxError / swing, `transmitter output error ${near.maxError.toFixed(4)} V at ${near.at} s`).toBeLessThan(0.02);

    const threshold = DIFFERENTIAL_DEFAULTS.threshold;
    for (const [rise, fall] of [[threshold, -threshold], [0.015, -0.015]]) {
      const settings = settingsAt(c, circuit, rise, fall);
      const fromSpice = decodeWaveform(spiceFar, settings).decoded;
      expect(decodeWaveform({ time: full.time, value: full.farEnd }, settings).decoded).toBe(fromSpice);
    }
    expect(solved.link.decoded).toBe(decodeWaveform(spiceFar, settingsAt(c, circuit, 0.015, -0.015)).decoded);
  });
});
