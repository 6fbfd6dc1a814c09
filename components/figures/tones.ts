/** Drawing colours from the app's palette (app/globals.css), by role rather than by hue. */
export const tone = {
  signal: "var(--color-accent)",
  far: "var(--color-copper)",
  ideal: "var(--color-ink-faint)",
  ink: "var(--color-ink)",
  grid: "var(--color-line)",
  high: "var(--color-ok)",
  low: "var(--color-accent)",
  warn: "var(--color-danger)",
} as const;

export type Tone = keyof typeof tone;

/** Dash patterns, so traces differ by more than colour. */
export const dash = { solid: undefined, dashed: "7 5", dotted: "2 4" } as const;
export type Dash = keyof typeof dash;
