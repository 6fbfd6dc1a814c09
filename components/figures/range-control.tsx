"use client";

import { useId } from "react";

/**
 * A labelled slider over a list of allowed values (a regular grid or an E-series), moved by index
 * so arrow keys step exactly one value. The current value is spoken as formatted text.
 */
export function RangeControl({
  label,
  values,
  value,
  format,
  onChange,
}: {
  label: string;
  values: readonly number[];
  value: number;
  format: (value: number) => string;
  onChange: (value: number) => void;
}) {
  const id = useId();
  const index = nearestIndex(values, value);
  return (
    <div className="space-y-1.5">
      <div className="flex items-baseline justify-between gap-3">
        <label htmlFor={id} className="text-sm font-medium text-ink">
          {label}
        </label>
        <output htmlFor={id} className="font-mono text-sm font-semibold text-accent-strong tabular-nums">
          {format(values[index] ?? value)}
        </output>
      </div>
      <input
        id={id}
        type="range"
        min={0}
        max={values.length - 1}
        step={1}
        value={index}
        aria-valuetext={format(values[index] ?? value)}
        onChange={(event) => onChange(values[Number(event.target.value)] ?? value)}
        className="block h-6 w-full cursor-pointer accent-accent"
      />
      <div className="flex justify-between text-xs text-ink-faint" aria-hidden="true">
        <span>{format(values[0] ?? value)}</span>
        <span>{format(values.at(-1) ?? value)}</span>
      </div>
    </div>
  );
}

export function nearestIndex(values: readonly number[], value: number): number {
  let best = 0;
  values.forEach((candidate, i) => {
    if (Math.abs(candidate - value) < Math.abs(values[best]! - value)) best = i;
  });
  return best;
}

/** min, min+step, …, max, without floating-point drift. */
export function gridValues(min: number, max: number, step: number): number[] {
  const count = Math.floor((max - min) / step + 1e-9) + 1;
  return Array.from({ length: count }, (_, i) => Number((min + i * step).toPrecision(12)));
}
