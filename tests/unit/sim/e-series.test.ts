import { describe, expect, it } from "vitest";
import { eSeries, eSeriesValues } from "@/lib/sim";

describe("E-series (IEC 60063)", () => {
  it("has the standard counts per decade", () => {
    expect(eSeries("E6")).toHaveLength(6);
    expect(eSeries("E12")).toHaveLength(12);
    expect(eSeries("E24")).toHaveLength(24);
    expect(eSeries("E48")).toHaveLength(48);
    expect(eSeries("E96")).toHaveLength(96);
  });

  it("lists E12 as IEC 60063 gives it", () => {
    expect(eSeries("E12")).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
  });

  it("keeps the E24 values that differ from rounding 10^(i/24), as the standard does", () => {
    const rounded = Array.from({ length: 24 }, (_, i) => Math.round(10 * 10 ** (i / 24)) / 10);
    const differing = eSeries("E24").filter((value, i) => value !== rounded[i]);
    expect(differing).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it("matches 10^(i/96) rounded to three figures for E96", () => {
    const rounded = Array.from({ length: 96 }, (_, i) => Math.round(100 * 10 ** (i / 96)) / 100);
    expect(eSeries("E96")).toEqual(rounded);
  });

  it("gives resistor values across decades, inclusive, ascending", () => {
    expect(eSeriesValues("E12", 10, 100)).toEqual([10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82, 100]);
    expect(eSeriesValues("E96", 240, 260)).toEqual([243, 249, 255]);
    expect(eSeriesValues("E6", 0.9, 1.6)).toEqual([1, 1.5]);
    expect(eSeriesValues("E24", 3e5, 3.4e5)).toEqual([3e5, 3.3e5]);
  });
});
