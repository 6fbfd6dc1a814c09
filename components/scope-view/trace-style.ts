// Two traces told apart by line style as well as hue (teal dashed, copper solid), so the chart
// reads the same in grey or to a reader who does not see red and green apart.
export const traceStyle = {
  near: { stroke: "#1d5c63", dash: "6 4", width: 1.6, label: "Near end", detail: "where the cable starts, after the resistor" },
  far: { stroke: "#b05f26", dash: undefined, width: 2.2, label: "Far end", detail: "the first pixel's input pin" },
} as const;

export const bandStyle = {
  high: "#2f6b3a",
  low: "#4a555c",
  fault: "#a3362b",
  marker: "#1c2529",
  slot: "#bfb8a8",
} as const;
