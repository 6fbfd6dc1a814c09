// The palette of app/globals.css, as literal values: chart libraries paint SVG attributes, which
// do not read CSS custom properties in every browser.
export const chartColours = {
  accent: "#1d5c63",
  copper: "#b05f26",
  ok: "#2f6b3a",
  grid: "#eeebe2",
  axis: "#4a555c",
} as const;
