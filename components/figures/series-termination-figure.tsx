"use client";

import { useState } from "react";
import { ScopeView } from "@/components/scope-view";
import { useLiveSimulation } from "@/components/simulation";
import type { FigureParams } from "@/lessons";
import { figureSimInputs } from "@/lessons/figure-sim-inputs";
import { FigureFrame } from "./figure-frame";
import { formatQuantity } from "./format-quantity";
import { gridValues, RangeControl } from "./range-control";

type Params = FigureParams<"series-termination">;

/**
 * The simulated run of lessons 6 and 7 on the workbench's scope view, re-simulated in the
 * browser's simulator worker as the control moves.
 */
export function SeriesTerminationFigure({ params, caption, resistorValues }: { params: Params; caption: string; resistorValues: number[] }) {
  const slider = params.slider;
  const isResistor = slider.field === "seriesResistance";
  const values = "series" in slider ? resistorValues : gridValues(slider.min, slider.max, slider.step);
  const [moved, setMoved] = useState(params[slider.field]);
  const [input] = figureSimInputs({ figure: "series-termination", params }, moved);
  const { result, pending, error } = useLiveSimulation(input ?? null, { quality: "preview" });
  const shown = isResistor ? formatQuantity(moved, "Ω") : `${moved} m`;

  return (
    <FigureFrame label="Simulated run with a series resistor" caption={caption}>
      <div className="space-y-4 pb-4">
        <RangeControl
          label={isResistor ? `Series resistor${"series" in slider ? ` (${slider.series} values)` : ""}` : "Cable length"}
          values={values}
          value={moved}
          format={(value) => (isResistor ? formatQuantity(value, "Ω") : `${value} m`)}
          onChange={setMoved}
        />
        {error ? (
          <p role="alert" className="rounded-lg border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
            The simulator could not run this: {error}
          </p>
        ) : null}
        {result ? (
          <ScopeView run={result} stale={pending} caption={`Near and far end of the run with ${shown}`} height={260} />
        ) : (
          <div className="h-[260px] animate-pulse rounded-lg bg-sunken" aria-hidden="true" />
        )}
      </div>
    </FigureFrame>
  );
}
