"use client";

import { useId, useState } from "react";

type Note = { kind: "set" | "error"; text: string };

/**
 * A resistor's value typed as the trade writes it (47R, 4k7, 1K, 47 Ω, 47 ohm), set on the control
 * as the nearest value it offers, with a note saying what was set.
 */
export function ResistorEntryField({
  label,
  values,
  series,
  onSet,
  disabled,
}: {
  label: string;
  values: number[];
  series: string;
  onSet: (ohms: number) => void;
  disabled?: boolean;
}) {
  const id = useId();
  const [entry, setEntry] = useState("");
  const [note, setNote] = useState<Note | null>(null);

  const apply = async () => {
    // The entry parser loads on first use, not with the page.
    const { readResistorEntry } = await import("./resistor-entry");
    const read = readResistorEntry(entry, values, series);
    if (!read.ok) {
      setNote({ kind: "error", text: read.message });
      return;
    }
    setNote({ kind: "set", text: read.note });
    onSet(read.value);
  };

  return (
    <div className="space-y-1">
      <form
        className="flex items-end gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          void apply();
        }}
      >
        <div className="min-w-0 flex-1">
          <label htmlFor={id} className="block text-xs font-medium text-ink-soft">
            {label}
          </label>
          <input
            id={id}
            type="text"
            inputMode="text"
            autoComplete="off"
            spellCheck={false}
            value={entry}
            onChange={(event) => setEntry(event.target.value)}
            placeholder="e.g. 4k7, 47R, 150 Ω"
            disabled={disabled}
            aria-describedby={note ? `${id}-note` : undefined}
            aria-invalid={note?.kind === "error" || undefined}
            className="mt-1 h-9 w-full rounded-lg border border-line-strong bg-surface px-3 text-sm tabular-nums text-ink"
          />
        </div>
        <button type="submit" disabled={disabled || entry.trim() === ""} className="h-9 shrink-0 rounded-lg border border-line-strong bg-surface px-3 text-sm font-semibold hover:bg-sunken disabled:opacity-40">
          Set
        </button>
      </form>
      <p id={`${id}-note`} role="status" className={`min-h-4 text-xs ${note?.kind === "error" ? "text-danger" : "text-ink-soft"}`}>
        {note?.text}
      </p>
    </div>
  );
}
