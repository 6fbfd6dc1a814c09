/**
 * Netlist for ngspice (Debian package) of a reference circuit, using the lossless `T` element, which
 * docs/simulator.md ("Reference tools: what to trust") names as the trustworthy line model.
 * Clamp diodes use ngspice's junction diode with IS, N and RS set (no junction capacitance), i.e. the
 * exponential law behind a series resistance that the solver uses; the simulation temperature is
 * chosen so that ngspice's thermal voltage kT/q equals the solver's.
 */
import { lineDelay, losslessImpedance, stopTime, type ReferenceCircuit } from "./reference-circuit";
import { pulseTrainBreakpoints } from "./pulse-train";

/** SI exact values (2019 redefinition); ngspice's own constants differ from them by under 1e-6. */
const BOLTZMANN = 1.380649e-23;
const ELEMENTARY_CHARGE = 1.602176634e-19;

export const NGSPICE_TIMESTEP = 0.1e-9;

/** Vectors written by the netlist, in this column order; the clamp currents only when clamps are fitted. */
export function ngspiceProbes(circuit: ReferenceCircuit): string[] {
  return circuit.clampDiodes ? ["v(near)", "v(far)", "i(vclamphigh)", "i(vclamplow)"] : ["v(near)", "v(far)"];
}

/**
 * The T element schedules a breakpoint one delay after each slope change larger than
 * REL·max|slope| + ABS (ngspice, devices/tra/traacct.c). With the defaults (1, 1 V/s) rounding noise on
 * a flat plateau counts as a slope change, the breakpoints multiply each round trip and a 7 µs run
 * takes minutes; ABS = 1e6 V/s keeps every real edge (3 ns edges slope at ~1e9 V/s) and drops the noise.
 */
const LINE_BREAKPOINT_SLOPE = 1e6;

function spiceNumber(x: number): string {
  return x === 0 ? "0" : x.toExponential(11);
}

export function temperatureCelsiusFor(thermalVoltage: number): number {
  return (thermalVoltage * ELEMENTARY_CHARGE) / BOLTZMANN - 273.15;
}

/** The far-end termination as plain elements: R to ground, R to a supply source and R to ground, or R then C to ground. */
function terminationLines(circuit: ReferenceCircuit): string[] {
  const termination = circuit.termination;
  if (!termination) return [];
  switch (termination.kind) {
    case "parallel":
      return [`rterm far 0 ${spiceNumber(termination.resistance)}`];
    case "thevenin":
      return [
        `vtermsupply termsupply 0 DC ${spiceNumber(circuit.supplyVoltage)}`,
        `rtermup far termsupply ${spiceNumber(termination.toSupply)}`,
        `rtermdown far 0 ${spiceNumber(termination.toGround)}`,
      ];
    case "rc":
      return [`rterm far termcap ${spiceNumber(termination.resistance)}`, `cterm termcap 0 ${spiceNumber(termination.capacitance)}`];
  }
}

export interface NetlistOptions {
  /** File that wrdata writes; omit to run without writing results (for timing). */
  outputFile?: string;
  timestep?: number;
}

export function buildNgspiceNetlist(circuit: ReferenceCircuit, options: NetlistOptions = {}): string {
  const { line } = circuit;
  if (line.resistance !== 0 || line.conductance !== 0) {
    throw new Error("the ngspice reference uses the lossless T element: give R' = 0 and G' = 0");
  }
  const step = options.timestep ?? NGSPICE_TIMESTEP;
  const pwl = pulseTrainBreakpoints(circuit);
  const pwlPairs = pwl.time.map((t, i) => `${spiceNumber(t)} ${spiceNumber(pwl.value[i])}`);
  const lines = [
    "* data run: driver, series resistance, lossless line, receiver pin",
    `vdrive drv 0 PWL(${pwlPairs.join(" ")})`,
    `rsource drv near ${spiceNumber(circuit.sourceResistance)}`,
  ];
  if (line.length > 0) {
    lines.push(`tline near 0 far 0 Z0=${spiceNumber(losslessImpedance(circuit))} TD=${spiceNumber(lineDelay(circuit))} REL=1 ABS=${spiceNumber(LINE_BREAKPOINT_SLOPE)}`);
  } else {
    lines.push("vshort near far DC 0");
  }
  lines.push(`cin far 0 ${spiceNumber(circuit.inputCapacitance)}`);
  lines.push(...terminationLines(circuit));
  if (circuit.clampDiodes) {
    const { saturationCurrent, emissionCoefficient, thermalVoltage, seriesResistance } = circuit.diode;
    const celsius = spiceNumber(temperatureCelsiusFor(thermalVoltage));
    // The 0 V source in the lower clamp's path only serves to read its current.
    lines.push(
      `vclamphigh vdd 0 DC ${spiceNumber(circuit.supplyVoltage)}`,
      "vclamplow gndclamp 0 DC 0",
      "dclamplow gndclamp far clamp",
      "dclamphigh far vdd clamp",
      `.model clamp D(IS=${spiceNumber(saturationCurrent)} N=${spiceNumber(emissionCoefficient)} RS=${spiceNumber(seriesResistance)})`,
      `.options temp=${celsius} tnom=${celsius}`,
    );
  }
  lines.push(`.tran ${spiceNumber(step)} ${spiceNumber(stopTime(circuit))} 0 ${spiceNumber(step)}`, ".control", "set wr_singlescale", "set wr_vecnames", "option numdgt=9", "run", "rusage trantime");
  if (options.outputFile) lines.push(`wrdata ${options.outputFile} ${ngspiceProbes(circuit).join(" ")}`);
  // Batch mode exits with status 1 after a control block unless told to quit.
  lines.push("quit 0", ".endc", ".end", "");
  return lines.join("\n");
}
