// The scope chart's frame, shared by the chart and the drag overlay drawn over it, so the overlay's
// traces land on the chart's own axes. Kept apart from the chart module, which loads the charting
// library lazily.

export const chartMargin = { top: 18, right: 58, bottom: 6, left: 0 } as const;
export const yAxisWidth = 48;
export const xAxisHeight = 36;

export type PlotArea = { left: number; top: number; width: number; height: number };

/** Where the chart draws its traces inside a chart of `width` × `height` pixels. */
export function plotArea(width: number, height: number): PlotArea {
  const left = chartMargin.left + yAxisWidth;
  const top = chartMargin.top;
  return { left, top, width: Math.max(0, width - left - chartMargin.right), height: Math.max(0, height - top - chartMargin.bottom - xAxisHeight) };
}
