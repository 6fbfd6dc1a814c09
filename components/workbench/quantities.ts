/** Component values as they are printed on parts and drawings: 22.1 Ω, 150 Ω, 4.7 kΩ. */
export function formatOhms(ohms: number): string {
  if (ohms >= 1000) return `${Number((ohms / 1000).toPrecision(3))} kΩ`;
  return `${Number(ohms.toPrecision(3))} Ω`;
}

export function formatNanoseconds(seconds: number): string {
  return `${Math.round(seconds * 1e9)} ns`;
}

export function formatMetres(metres: number): string {
  return `${Number(metres.toPrecision(4))} m`;
}

export function formatPicofaradsPerMetre(faradsPerMetre: number): string {
  return `${Number((faradsPerMetre * 1e12).toPrecision(3))} pF/m`;
}

export function formatDelayPerMetre(secondsPerMetre: number): string {
  return `${(secondsPerMetre * 1e9).toFixed(2)} ns/m`;
}
