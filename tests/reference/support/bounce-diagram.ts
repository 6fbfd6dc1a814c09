/**
 * Closed forms of a lossless line (standard transmission-line textbook results, bounce or lattice
 * diagram): a step V behind source resistance Rs launches V·Z0/(Rs + Z0); each end reflects with
 * ρ = (Z − Z0)/(Z + Z0). At an open far end (ρL = 1) the voltage after the k-th arrival, at
 * t = (2k + 1)·TD, is V·Z0/(Rs + Z0)·(1 + ρL)·Σ_{j=0..k} (ρS·ρL)^j; the near end starts at the launched
 * step and after the j-th return, at t = 2j·TD, has added V·Z0/(Rs + Z0)·ρL·(1 + ρS)·Σ_{i<j} (ρS·ρL)^i.
 */
export function reflectionCoefficient(termination: number, z0: number): number {
  if (termination === Infinity) return 1;
  return (termination - z0) / (termination + z0);
}

export function launchedStep(step: number, sourceResistance: number, z0: number): number {
  return (step * z0) / (sourceResistance + z0);
}

/** Far-end levels after arrivals 0..count−1 for an open far end. */
export function openEndStaircase(step: number, sourceResistance: number, z0: number, count: number): number[] {
  const rhoSource = reflectionCoefficient(sourceResistance, z0);
  const rhoLoad = reflectionCoefficient(Infinity, z0);
  const launched = launchedStep(step, sourceResistance, z0);
  const levels: number[] = [];
  let sum = 0;
  for (let k = 0; k < count; k++) {
    sum += (rhoSource * rhoLoad) ** k;
    levels.push(launched * (1 + rhoLoad) * sum);
  }
  return levels;
}

/** Near-end levels before the first return and after returns 1..count−1, for an open far end. */
export function openEndNearLevels(step: number, sourceResistance: number, z0: number, count: number): number[] {
  const rhoSource = reflectionCoefficient(sourceResistance, z0);
  const rhoLoad = reflectionCoefficient(Infinity, z0);
  const launched = launchedStep(step, sourceResistance, z0);
  const levels = [launched];
  let sum = 0;
  for (let j = 1; j < count; j++) {
    sum += (rhoSource * rhoLoad) ** (j - 1);
    levels.push(launched + launched * rhoLoad * (1 + rhoSource) * sum);
  }
  return levels;
}

/** 10–90 % rise time of a first-order RC charge: ln(9)·R·C ≈ 2.2·R·C. */
export function rcRiseTime(resistance: number, capacitance: number): number {
  return Math.log(9) * resistance * capacitance;
}
