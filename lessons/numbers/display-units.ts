/**
 * The units a lesson prints its numbers in. A number is stored in SI (`value`); its display unit
 * says how to show it (`scale` SI units per displayed unit) and which other units it may be shown
 * in (`dimension`): a placeholder may switch `ns` to `µs`, never to `V`.
 */
export const DISPLAY_UNITS = {
  "": { dimension: "1", scale: 1 },
  "%": { dimension: "1", scale: 0.01 },
  V: { dimension: "V", scale: 1 },
  mV: { dimension: "V", scale: 1e-3 },
  A: { dimension: "A", scale: 1 },
  mA: { dimension: "A", scale: 1e-3 },
  W: { dimension: "W", scale: 1 },
  "Ω": { dimension: "Ω", scale: 1 },
  "mΩ": { dimension: "Ω", scale: 1e-3 },
  "MΩ": { dimension: "Ω", scale: 1e6 },
  "Ω²": { dimension: "Ω²", scale: 1 },
  s: { dimension: "s", scale: 1 },
  ms: { dimension: "s", scale: 1e-3 },
  "µs": { dimension: "s", scale: 1e-6 },
  ns: { dimension: "s", scale: 1e-9 },
  "s²/m²": { dimension: "s²/m²", scale: 1 },
  Hz: { dimension: "Hz", scale: 1 },
  kHz: { dimension: "Hz", scale: 1e3 },
  MHz: { dimension: "Hz", scale: 1e6 },
  "GS/s": { dimension: "Hz", scale: 1e9 },
  m: { dimension: "m", scale: 1 },
  cm: { dimension: "m", scale: 1e-2 },
  mm: { dimension: "m", scale: 1e-3 },
  F: { dimension: "F", scale: 1 },
  pF: { dimension: "F", scale: 1e-12 },
  H: { dimension: "H", scale: 1 },
  nH: { dimension: "H", scale: 1e-9 },
  "F/m": { dimension: "F/m", scale: 1 },
  "pF/m": { dimension: "F/m", scale: 1e-12 },
  "H/m": { dimension: "H/m", scale: 1 },
  "nH/m": { dimension: "H/m", scale: 1e-9 },
  "µH/m": { dimension: "H/m", scale: 1e-6 },
  "s/m": { dimension: "s/m", scale: 1 },
  "ns/m": { dimension: "s/m", scale: 1e-9 },
  "Ω/m": { dimension: "Ω/m", scale: 1 },
  "mΩ/m": { dimension: "Ω/m", scale: 1e-3 },
  "m/s": { dimension: "m/s", scale: 1 },
  "m/ns": { dimension: "m/s", scale: 1e9 },
  "s/div": { dimension: "s/div", scale: 1 },
  "ns/div": { dimension: "s/div", scale: 1e-9 },
  "µs/div": { dimension: "s/div", scale: 1e-6 },
} as const satisfies Record<string, { dimension: string; scale: number }>;

export type DisplayUnit = keyof typeof DISPLAY_UNITS;

export const DISPLAY_UNIT_NAMES = Object.keys(DISPLAY_UNITS) as DisplayUnit[];

export function isDisplayUnit(unit: string): unit is DisplayUnit {
  return Object.hasOwn(DISPLAY_UNITS, unit);
}
