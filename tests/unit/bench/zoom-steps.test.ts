import { describe, expect, it } from "vitest";
import { describeZoom, fitZoom, maxZoom, zoomByWheel, zoomIn, zoomOut } from "@/components/bench-photos/zoom-steps";

describe("photo zoom steps", () => {
  it("fits a large photo by its tighter side and never enlarges a small one to fit", () => {
    expect(fitZoom({ width: 1600, height: 1000 }, { width: 1200, height: 500 })).toBe(0.5);
    expect(fitZoom({ width: 1600, height: 1000 }, { width: 400, height: 800 })).toBe(0.25);
    expect(fitZoom({ width: 64, height: 48 }, { width: 1200, height: 800 })).toBe(1);
  });

  it("steps in from fit through whole doublings up to the limit, and back out to fit", () => {
    const fit = 0.69;
    const upward = [zoomIn(fit, fit)];
    while (upward.at(-1) !== maxZoom) upward.push(zoomIn(upward.at(-1) as number, fit));
    expect(upward).toEqual([1, 2, 4]);
    expect(zoomIn(maxZoom, fit)).toBe(maxZoom);
    expect([zoomOut(4, fit), zoomOut(2, fit), zoomOut(1, fit)]).toEqual([2, 1, "fit"]);
    expect(zoomOut(1.5, fit)).toBe(1);
    expect(zoomIn(0.23, 0.23)).toBe(0.5);
    expect(zoomIn(0.9, 0.5)).toBe(2);
  });

  it("zooms by the wheel in proportion to the turn, within fit and the limit", () => {
    const inward = zoomByWheel(1, 0.5, -380) as number;
    expect(inward).toBeCloseTo(2, 6);
    expect(zoomByWheel(inward, 0.5, 380)).toBeCloseTo(1, 6);
    expect(zoomByWheel(1, 0.5, 10_000)).toBe("fit");
    expect(zoomByWheel(1, 0.5, -10_000)).toBe(maxZoom);
  });

  it("says the zoom as a percentage of the photo's own pixels", () => {
    expect(describeZoom("fit", 0.687)).toBe("Fit · 69 %");
    expect(describeZoom(2, 0.687)).toBe("200 %");
  });
});
