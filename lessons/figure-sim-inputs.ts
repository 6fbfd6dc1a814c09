import type { CableKind, SimInput } from "@/lib/sim";
import type { FigureParams } from "./figures";

type SimulatedFigure =
  | { figure: "series-termination"; params: FigureParams<"series-termination"> }
  | { figure: "cable-compare"; params: FigureParams<"cable-compare"> }
  | { figure: "clamp-compare"; params: FigureParams<"clamp-compare"> };

/**
 * The simulator inputs a simulated figure draws: one for series-termination, one per cable for
 * cable-compare, and for clamp-compare the run with its clamp diodes, then without. `sliderValue` replaces the field the figure's slider moves (its start value when
 * omitted), so the UI re-runs exactly what the control shows.
 */
export function figureSimInputs(block: SimulatedFigure, sliderValue?: number): SimInput[] {
  if (block.figure === "clamp-compare") {
    const run = simInputOf(block.params, block.params.cable, block.params);
    return [run, { ...run, receiver: { ...run.receiver, clampDiodes: false } }];
  }
  const { params } = block;
  const moved = params.slider && sliderValue !== undefined ? { [params.slider.field]: sliderValue } : {};
  const values = { length: params.length, seriesResistance: params.seriesResistance, ...moved };
  const cables = block.figure === "series-termination" ? [block.params.cable] : block.params.cables;
  return cables.map((kind) => simInputOf(params, kind, values));
}

type FigureRun = Pick<FigureParams<"clamp-compare">, "highVoltage" | "outputResistance" | "edgeTime" | "supplyVoltage" | "bits">;

function simInputOf(params: FigureRun, kind: CableKind, values: { length: number; seriesResistance: number }): SimInput {
  return {
    driver: { highVoltage: params.highVoltage, outputResistance: params.outputResistance, edgeTime: params.edgeTime },
    seriesResistance: values.seriesResistance,
    cable: { kind, length: values.length },
    receiver: { supplyVoltage: params.supplyVoltage, clampDiodes: true },
    signal: { bits: params.bits },
  };
}
