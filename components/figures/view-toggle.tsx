"use client";

export type ViewWindow = "edge" | "all";

/** Two time windows for a simulated trace: the first rising edge up close, or every bit. */
export function ViewToggle({ value, onChange }: { value: ViewWindow; onChange: (value: ViewWindow) => void }) {
  const options: { value: ViewWindow; label: string }[] = [
    { value: "edge", label: "First rising edge (500 ns)" },
    { value: "all", label: "Every bit" },
  ];
  return (
    <fieldset>
      <legend className="text-sm font-medium text-ink">Time window</legend>
      <div className="mt-1.5 inline-flex rounded-lg border border-line-strong p-0.5">
        {options.map((option) => (
          <button
            key={option.value}
            type="button"
            aria-pressed={value === option.value}
            onClick={() => onChange(option.value)}
            className={`rounded-md px-3 py-1.5 text-sm font-medium ${value === option.value ? "bg-accent text-white" : "text-ink-soft hover:bg-sunken"}`}
          >
            {option.label}
          </button>
        ))}
      </div>
    </fieldset>
  );
}
