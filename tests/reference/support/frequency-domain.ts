/**
 * Exact steady-state solution of the linear circuit (no clamps) for a periodic drive, after
 * docs/simulator.md ("Reference tools"): the line as a two-port with ABCD matrix
 *   [cosh γl, Z0·sinh γl; sinh γl / Z0, cosh γl],  γ = sqrt((R' + jωL')(G' + jωC')),  Z0 = (R' + jωL')/γ,
 * fed by the source through its resistance Rs and loaded by Cin (YL = jωCin):
 *   Vfar = Vs / (A + B·YL + Rs·(C + D·YL)),  Vnear = Vfar·(A + B·YL).
 * The drive is the pulse train followed by a long quiet tail, taken as one period. Its Fourier
 * coefficients are exact for the piecewise-linear waveform: v'' is a train of slope steps Δs_i at the
 * breakpoints t_i, so c_k = −(1/(P·ω_k²))·Σ Δs_i·e^(−jω_k t_i), one FFT when the breakpoints sit on the
 * sample grid. The tail must be long enough for the circuit to come to rest, else the next period's
 * start is disturbed: `quietBeforeLeadIn` reports the largest far-end voltage before the first edge.
 */
import { fft } from "./fft";
import { pulseTrainBreakpoints } from "./pulse-train";
import { stopTime, type ReferenceCircuit } from "./reference-circuit";

type Complex = [number, number];

const mul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const add = (a: Complex, b: Complex): Complex => [a[0] + b[0], a[1] + b[1]];
const div = (a: Complex, b: Complex): Complex => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const sqrt = ([re, im]: Complex): Complex => {
  const r = Math.hypot(re, im);
  const sr = Math.sqrt((r + re) / 2);
  const si = Math.sqrt(Math.max(0, (r - re) / 2));
  return [sr, im < 0 ? -si : si];
};
const cosh = ([x, y]: Complex): Complex => [Math.cosh(x) * Math.cos(y), Math.sinh(x) * Math.sin(y)];
const sinh = ([x, y]: Complex): Complex => [Math.sinh(x) * Math.cos(y), Math.cosh(x) * Math.sin(y)];

/** Far-end and near-end transfer from the ideal source voltage at angular frequency ω > 0. */
export function transferAt(circuit: ReferenceCircuit, omega: number): { far: Complex; near: Complex } {
  const { resistance, inductance, conductance, capacitance, length } = circuit.line;
  const series: Complex = [resistance, omega * inductance];
  const shunt: Complex = [conductance, omega * capacitance];
  const gamma = sqrt(mul(series, shunt));
  const gammaLength: Complex = [gamma[0] * length, gamma[1] * length];
  const a = cosh(gammaLength);
  const s = sinh(gammaLength);
  const b = mul(div(series, gamma), s);
  const c = mul(div(gamma, series), s);
  const load: Complex = [0, omega * circuit.inputCapacitance];
  const atLoad = add(a, mul(b, load));
  const rs = circuit.sourceResistance;
  const denominator = add(atLoad, mul([rs, 0], add(c, mul(a, load))));
  const far = div([1, 0], denominator);
  return { far, near: mul(far, atLoad) };
}

/** The same transfer at ω = 0, where γ = sqrt(R'G') and the load draws no current. */
export function transferAtDc(circuit: ReferenceCircuit): { far: number; near: number } {
  const { resistance, conductance, length } = circuit.line;
  const x = Math.sqrt(resistance * conductance) * length;
  const sinhOverX = x === 0 ? 1 : Math.sinh(x) / x;
  const a = Math.cosh(x);
  const c = conductance * length * sinhOverX;
  const far = 1 / (a + circuit.sourceResistance * c);
  return { far, near: far * a };
}

export interface FrequencyDomainResult {
  time: Float64Array;
  nearEnd: Float64Array;
  farEnd: Float64Array;
  quietBeforeLeadIn: number;
}

export function solveInFrequencyDomain(circuit: ReferenceCircuit, options: { timestep?: number; settleTime?: number } = {}): FrequencyDomainResult {
  const dt = options.timestep ?? 0.1e-9;
  const settle = options.settleTime ?? 30e-6;
  const end = stopTime(circuit);
  const n = 2 ** Math.ceil(Math.log2((end + settle) / dt));
  const period = n * dt;
  const { time: bt, value: bv } = pulseTrainBreakpoints(circuit);

  const slopeSteps = new Float64Array(n);
  const zeros = new Float64Array(n);
  let mean = 0;
  for (let i = 0; i < bt.length; i++) {
    const slopeBefore = i === 0 ? 0 : (bv[i] - bv[i - 1]) / (bt[i] - bt[i - 1]);
    const slopeAfter = i === bt.length - 1 ? 0 : (bv[i + 1] - bv[i]) / (bt[i + 1] - bt[i]);
    const index = bt[i] / dt;
    if (Math.abs(index - Math.round(index)) > 1e-6) throw new Error(`breakpoint ${bt[i]} is off the ${dt} s grid`);
    slopeSteps[Math.round(index)] += slopeAfter - slopeBefore;
    if (i > 0) mean += ((bv[i] + bv[i - 1]) / 2) * (bt[i] - bt[i - 1]);
  }
  mean /= period;
  fft(slopeSteps, zeros);

  const farRe = new Float64Array(n);
  const farIm = new Float64Array(n);
  const nearRe = new Float64Array(n);
  const nearIm = new Float64Array(n);
  const dc = transferAtDc(circuit);
  farRe[0] = mean * dc.far;
  nearRe[0] = mean * dc.near;
  for (let k = 1; k < n / 2; k++) {
    const omega = (2 * Math.PI * k) / period;
    const scale = -1 / (period * omega * omega);
    const coefficient: Complex = [slopeSteps[k] * scale, zeros[k] * scale];
    const { far, near } = transferAt(circuit, omega);
    const farK = mul(coefficient, far);
    const nearK = mul(coefficient, near);
    farRe[k] = farK[0];
    farIm[k] = farK[1];
    farRe[n - k] = farK[0];
    farIm[n - k] = -farK[1];
    nearRe[k] = nearK[0];
    nearIm[k] = nearK[1];
    nearRe[n - k] = nearK[0];
    nearIm[n - k] = -nearK[1];
  }
  fft(farRe, farIm, true);
  fft(nearRe, nearIm, true);

  const samples = Math.floor(end / dt) + 1;
  const time = new Float64Array(samples);
  const farEnd = new Float64Array(samples);
  const nearEnd = new Float64Array(samples);
  let quietBeforeLeadIn = 0;
  for (let m = 0; m < samples; m++) {
    time[m] = m * dt;
    farEnd[m] = farRe[m] * n;
    nearEnd[m] = nearRe[m] * n;
    if (time[m] < circuit.leadIn) quietBeforeLeadIn = Math.max(quietBeforeLeadIn, Math.abs(farEnd[m]));
  }
  return { time, nearEnd, farEnd, quietBeforeLeadIn };
}
