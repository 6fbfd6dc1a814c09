/**
 * A differential link as ngspice sees it, written without lib/sim: two complementary PWL sources
 * about a common-mode level, each behind half the transmitter's differential output resistance,
 * a lossless `T` element whose two ports are the pair's two wires (ngspice's T element carries
 * the mode between a port's two nodes: the pair's differential mode), the terminating resistor
 * across the far end and the receiver's capacitance across its inputs, its common mode held by
 * 1 MΩ per wire. The probes are each wire's
 * voltage to ground, so the differential voltage is computed by the test, not by ngspice.
 */
import { NGSPICE_TIMESTEP } from "./ngspice-netlist";

export interface DifferentialCircuit {
  /** Open-circuit differential level: the transmitter swings between −level and +level (V). */
  level: number;
  /** Differential output resistance (Ω), split between the two wires. */
  outputResistance: number;
  edgeTime: number;
  commonMode: number;
  z0: number;
  delay: number;
  terminationResistance: number;
  inputCapacitance: number;
  bits: string;
  leadIn: number;
  bitPeriod: number;
  zeroHigh: number;
  oneHigh: number;
  stopTime: number;
}

export const DIFFERENTIAL_PROBES = ["v(nearp)", "v(nearn)", "v(farp)", "v(farn)"];

const number = (x: number) => (x === 0 ? "0" : x.toExponential(11));

/** The differential drive e(t): −level between bits, +level while a bit is high, linear ramps of edgeTime. */
function driveBreakpoints(c: DifferentialCircuit): [number, number][] {
  const points: [number, number][] = [[0, -c.level]];
  for (let i = 0; i < c.bits.length; i += 1) {
    const start = c.leadIn + i * c.bitPeriod;
    const high = c.bits[i] === "1" ? c.oneHigh : c.zeroHigh;
    points.push([start, -c.level], [start + c.edgeTime, c.level], [start + high, c.level], [start + high + c.edgeTime, -c.level]);
  }
  return points;
}

export function buildDifferentialNetlist(c: DifferentialCircuit, outputFile: string): string {
  const drive = driveBreakpoints(c);
  const wire = (sign: 1 | -1) => drive.map(([t, e]) => `${number(t)} ${number(c.commonMode + (sign * e) / 2)}`).join(" ");
  return [
    "* differential link: complementary drivers, twisted pair, termination, receiver input",
    `vdrivep drvp 0 PWL(${wire(1)})`,
    `vdriven drvn 0 PWL(${wire(-1)})`,
    `rsourcep drvp nearp ${number(c.outputResistance / 2)}`,
    `rsourcen drvn nearn ${number(c.outputResistance / 2)}`,
    `tpair nearp nearn farp farn Z0=${number(c.z0)} TD=${number(c.delay)} REL=1 ABS=1e6`,
    `rterm farp farn ${number(c.terminationResistance)}`,
    `cin farp farn ${number(c.inputCapacitance)}`,
    // The far end's common mode needs a DC path or its two wires float (ngspice then starts them
    // at 0 V): 1 MΩ from each wire to the common-mode level, 2 MΩ across the pair, under 0.01 %
    // of the termination's current.
    `vcommon common 0 DC ${number(c.commonMode)}`,
    `rcommonp farp common 1e6`,
    `rcommonn farn common 1e6`,
    `.tran ${number(NGSPICE_TIMESTEP)} ${number(c.stopTime)} 0 ${number(NGSPICE_TIMESTEP)}`,
    ".control",
    "set wr_singlescale",
    "set wr_vecnames",
    "option numdgt=9",
    "run",
    "rusage trantime",
    `wrdata ${outputFile} ${DIFFERENTIAL_PROBES.join(" ")}`,
    "quit 0",
    ".endc",
    ".end",
    "",
  ].join("\n");
}
