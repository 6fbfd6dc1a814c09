/** Readable figures for the scope view: times in ns or µs, voltages in V, currents in mA. */
export function formatTime(seconds: number): string {
  const abs = Math.abs(seconds);
  if (abs < 1e-6) return `${Number((seconds * 1e9).toPrecision(3))} ns`;
  if (abs < 1e-3) return `${Number((seconds * 1e6).toPrecision(3))} µs`;
  return `${Number((seconds * 1e3).toPrecision(3))} ms`;
}

export function formatVolts(volts: number): string {
  return `${volts.toFixed(2)} V`;
}

export function formatMilliamps(amps: number): string {
  return `${(amps * 1e3).toFixed(1)} mA`;
}

export function formatOptionalTime(seconds: number | null): string {
  return seconds === null ? "not measurable" : formatTime(seconds);
}
