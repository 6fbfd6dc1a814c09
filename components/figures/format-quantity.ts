const prefixes = [
  { exponent: -12, symbol: "p" },
  { exponent: -9, symbol: "n" },
  { exponent: -6, symbol: "µ" },
  { exponent: -3, symbol: "m" },
  { exponent: 0, symbol: "" },
  { exponent: 3, symbol: "k" },
  { exponent: 6, symbol: "M" },
  { exponent: 9, symbol: "G" },
] as const;

/** Engineering notation with an SI prefix: 3.3e-7 s → "330 ns", 94 Ω → "94 Ω", 1.3e8 Hz → "130 MHz". */
export function formatQuantity(value: number, unit: string, significant = 3): string {
  if (!Number.isFinite(value)) return "—";
  if (value === 0) return `0 ${unit}`;
  const exponent = Math.floor(Math.log10(Math.abs(value)) / 3) * 3;
  const prefix = prefixes.findLast((p) => p.exponent <= exponent) ?? prefixes[0];
  const mantissa = Number((value / 10 ** prefix.exponent).toPrecision(significant));
  // Rounding can carry 999.7 up to 1000: step to the next prefix rather than print "1000 ns".
  if (Math.abs(mantissa) >= 1000 && prefix.exponent < 9) return formatQuantity(Math.sign(value) * 10 ** (prefix.exponent + 3), unit, significant);
  return `${mantissa.toLocaleString("en-GB", { maximumFractionDigits: 6 })} ${prefix.symbol}${unit}`;
}

/** Volts to two decimals, with a true minus sign for negative margins. */
export function formatVolts(value: number): string {
  return `${value < 0 ? "−" : ""}${Math.abs(value).toFixed(2)} V`;
}

/** A signed time for margins: "+200 ns", "−35 ns". */
export function formatSignedTime(value: number): string {
  return `${value < 0 ? "−" : "+"}${formatQuantity(Math.abs(value), "s")}`;
}
