/**
 * Preferred numbers of IEC 60063. E6 and E12 are every fourth and every second value of E24;
 * E48 is every second value of E96. The tables are written out because E24 (and E12, E6) differ
 * in places from rounding 10^(i/24), as the standard notes.
 */
export const E_SERIES_NAMES = ["E6", "E12", "E24", "E48", "E96"] as const;
export type ESeriesName = (typeof E_SERIES_NAMES)[number];

const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
];

const E96 = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43, 1.47, 1.5, 1.54, 1.58, 1.62,
  1.65, 1.69, 1.74, 1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21, 2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61,
  2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09, 3.16, 3.24, 3.32, 3.4, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22,
  4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49, 5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81,
  6.98, 7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
];

const everyNth = (values: number[], n: number) => values.filter((_, index) => index % n === 0);

const tables: Record<ESeriesName, readonly number[]> = {
  E6: everyNth(E24, 4),
  E12: everyNth(E24, 2),
  E24,
  E48: everyNth(E96, 2),
  E96,
};

/** The mantissas of one decade, 1 ≤ m < 10, ascending. */
export function eSeries(name: ESeriesName): number[] {
  return [...tables[name]];
}

/** Every value of the series between min and max inclusive (ohms), ascending. */
export function eSeriesValues(name: ESeriesName, min: number, max: number): number[] {
  if (!(min > 0) || !(max >= min)) return [];
  const digits = name === "E48" || name === "E96" ? 100 : 10;
  const values: number[] = [];
  for (let decade = Math.floor(Math.log10(min)) - 1; decade <= Math.ceil(Math.log10(max)); decade += 1) {
    for (const mantissa of tables[name]) {
      const scaled = Math.round(mantissa * digits);
      const exponent = decade - Math.log10(digits);
      const value = exponent >= 0 ? scaled * 10 ** exponent : scaled / 10 ** -exponent;
      if (value >= min * (1 - 1e-12) && value <= max * (1 + 1e-12)) values.push(value);
    }
  }
  return values;
}
