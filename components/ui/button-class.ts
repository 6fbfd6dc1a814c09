const base =
  "inline-flex items-center justify-center gap-2 rounded-lg px-4 py-2.5 text-sm font-semibold no-underline transition-colors disabled:cursor-not-allowed disabled:opacity-60";

const variants = {
  primary: "bg-accent text-white hover:bg-accent-strong",
  secondary: "border border-line-strong bg-surface text-ink hover:bg-sunken",
  quiet: "text-accent hover:bg-accent-soft",
} as const;

/** Shared look for buttons and button-like links. */
export function buttonClass(variant: keyof typeof variants = "primary", extra = ""): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}
