"use client";

import { useId } from "react";
import type { RunChoices } from "@/lessons/schema";
import type { WorkbenchRun, CableOption, DriverOption } from "./workbench-types";
import { ResistorEntryField } from "./resistor-entry-field";
import { formatDelayPerMetre, formatMetres, formatNanoseconds, formatOhms, formatPicofaradsPerMetre } from "./quantities";

type StepperProps = {
  label: string;
  values: number[];
  value: number;
  format: (value: number) => string;
  onChange: (value: number) => void;
  /** The pointer went down on the slider: a drag may follow. */
  onDragStart?: () => void;
  note?: string;
  disabled?: boolean;
};

/**
 * A slider over a fixed list of values (an E-series, a length grid, timing steps) with step
 * buttons beside it. From the keyboard the slider steps along the list as a native range does:
 * arrows one value, Page Up/Down a tenth of the list, Home and End to its ends.
 */
function ValueStepper({ label, values, value, format, onChange, onDragStart, note, disabled }: StepperProps) {
  const id = useId();
  const index = Math.max(0, values.findIndex((v) => Math.abs(v - value) <= 1e-9 * Math.max(1, Math.abs(v))));
  const move = (to: number) => onChange(values[Math.min(values.length - 1, Math.max(0, to))]);
  return (
    <div className="space-y-1.5">
      <div className="flex items-baseline justify-between gap-3">
        <label htmlFor={id} className="text-sm font-medium text-ink">
          {label}
        </label>
        <output htmlFor={id} className="text-lg font-semibold tabular-nums text-ink" aria-live="off">
          {format(value)}
        </output>
      </div>
      <div className="flex items-center gap-2">
        <button
          type="button"
          onClick={() => move(index - 1)}
          disabled={disabled || index === 0}
          className="h-9 w-9 shrink-0 rounded-lg border border-line-strong bg-surface text-lg font-semibold hover:bg-sunken disabled:opacity-40"
          aria-label={`${label}: one step down`}
        >
          −
        </button>
        <input
          id={id}
          type="range"
          min={0}
          max={values.length - 1}
          step={1}
          value={index}
          disabled={disabled}
          onChange={(event) => move(Number(event.target.value))}
          onPointerDown={onDragStart}
          aria-valuetext={format(value)}
          aria-describedby={`${id}-range`}
          className="h-2 w-full cursor-pointer accent-accent"
        />
        <button
          type="button"
          onClick={() => move(index + 1)}
          disabled={disabled || index === values.length - 1}
          className="h-9 w-9 shrink-0 rounded-lg border border-line-strong bg-surface text-lg font-semibold hover:bg-sunken disabled:opacity-40"
          aria-label={`${label}: one step up`}
        >
          +
        </button>
      </div>
      <p id={`${id}-range`} className="flex justify-between text-xs text-ink-faint">
        <span>{format(values[0])}</span>
        {note ? <span>{note}</span> : null}
        <span>{format(values[values.length - 1])}</span>
      </p>
    </div>
  );
}

function OptionCards<T>({
  legend,
  name,
  options,
  selected,
  keyOf,
  render,
  onChange,
  disabled,
}: {
  legend: string;
  name: string;
  options: T[];
  selected: string;
  keyOf: (option: T) => string;
  render: (option: T) => React.ReactNode;
  onChange: (key: string) => void;
  disabled?: boolean;
}) {
  return (
    <fieldset className="space-y-2" disabled={disabled}>
      <legend className="mb-1.5 text-sm font-medium text-ink">{legend}</legend>
      {options.map((option) => {
        const key = keyOf(option);
        return (
          <label
            key={key}
            className={`flex cursor-pointer gap-3 rounded-lg border p-3 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent ${
              key === selected ? "border-accent bg-accent-soft" : "border-line bg-surface hover:bg-sunken"
            }`}
          >
            <input type="radio" name={name} value={key} checked={key === selected} onChange={() => onChange(key)} className="mt-1 accent-accent" />
            <span>{render(option)}</span>
          </label>
        );
      })}
    </fieldset>
  );
}

const cableLine = (cable: CableOption) => (
  <>
    <span className="block font-semibold text-ink">{cable.label}</span>
    <span className="block tabular-nums text-ink-soft">
      Z0 {Math.round(cable.z0)} Ω · C′ {formatPicofaradsPerMetre(cable.capacitancePerMetre)} · delay {formatDelayPerMetre(cable.delayPerMetre)}
    </span>
  </>
);

const driverLine = (driver: DriverOption) => (
  <>
    <span className="block font-semibold text-ink">{driver.label}</span>
    <span className="block tabular-nums text-ink-soft">
      high level {driver.highVoltage} V · output {formatOhms(driver.outputResistance)} · edge {formatNanoseconds(driver.edgeTime)}
    </span>
  </>
);

function timingValues(range: { min: number; max: number; step: number }): number[] {
  const count = Math.floor((range.max - range.min) / range.step + 1e-9) + 1;
  return Array.from({ length: count }, (_, i) => Number((range.min + i * range.step).toPrecision(12)));
}

/** The controls of one run: exactly the choices its lab leaves to the learner. */
export function ChoiceControls({
  run,
  choices,
  onChange,
  onDragStart,
  disabled,
}: {
  run: WorkbenchRun;
  choices: RunChoices;
  onChange: (choices: RunChoices) => void;
  onDragStart?: () => void;
  disabled?: boolean;
}) {
  const { controls } = run;
  const set = (patch: Partial<RunChoices>) => onChange({ ...choices, ...patch });
  const name = `${run.id}-${useId()}`;
  return (
    <div className="space-y-6">
      {controls.driver ? (
        <OptionCards
          legend="Driver"
          name={`${name}-driver`}
          options={controls.driver}
          selected={choices.driver ?? ""}
          keyOf={(d) => d.id}
          render={driverLine}
          onChange={(driver) => set({ driver })}
          disabled={disabled}
        />
      ) : null}
      {controls.cable ? (
        <OptionCards
          legend="Cable"
          name={`${name}-cable`}
          options={controls.cable}
          selected={choices.cable ?? ""}
          keyOf={(c) => c.kind}
          render={cableLine}
          onChange={(cable) => set({ cable: cable as RunChoices["cable"] })}
          disabled={disabled}
        />
      ) : null}
      {controls.length ? (
        <ValueStepper
          label="Cable length"
          values={controls.length}
          value={choices.length ?? controls.length[0]} format={formatMetres}
          onChange={(length) => set({ length })}
          onDragStart={onDragStart}
          disabled={disabled}
        />
      ) : null}
      {controls.seriesResistance ? (
        <div className="space-y-3">
          <ValueStepper
            label={`Series resistor (${controls.seriesResistance.series})`}
            values={controls.seriesResistance.values}
            value={choices.seriesResistance ?? controls.seriesResistance.values[0]}
            format={formatOhms}
            note={`${controls.seriesResistance.values.length} standard values`}
            onChange={(seriesResistance) => set({ seriesResistance })}
            onDragStart={onDragStart}
            disabled={disabled}
          />
          <ResistorEntryField
            key={run.id}
            label="Or type a value"
            values={controls.seriesResistance.values}
            series={controls.seriesResistance.series}
            onSet={(seriesResistance) => set({ seriesResistance })}
            disabled={disabled}
          />
        </div>
      ) : null}
      {controls.timing ? (
        <>
          <ValueStepper
            label="High time of a 0 bit"
            values={timingValues(controls.timing.zeroHigh)}
            value={choices.zeroHigh ?? controls.timing.zeroHigh.min}
            format={formatNanoseconds}
            onChange={(zeroHigh) => set({ zeroHigh })}
            onDragStart={onDragStart}
            disabled={disabled}
          />
          <ValueStepper
            label="High time of a 1 bit"
            values={timingValues(controls.timing.oneHigh)}
            value={choices.oneHigh ?? controls.timing.oneHigh.min}
            format={formatNanoseconds}
            onChange={(oneHigh) => set({ oneHigh })}
            onDragStart={onDragStart}
            disabled={disabled}
          />
        </>
      ) : null}
    </div>
  );
}
