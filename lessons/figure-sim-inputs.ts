import type { SimInput } from "@/lib/sim";
import type { FigureParams } from "./figures";

type SimulatedFigure =
  | { figure: "series-termination"; params: FigureParams<"series-termination"> }
  | { figure: "cable-compare"; params: FigureParams<"cable-compare"> };

/**
 * The simulator inputs a simulated figure draws: one for series-termination, one per cable for
 * cable-compare. `sliderValue` replaces the field the figure's slider moves (its start value when
 * omitted), so the UI re-runs exactly what the control shows.
 */
export function figureSimInputs(block: SimulatedFigure, sliderValue?: number): SimInput[] {
  const { params } = block;
  const moved = params.slider && sliderValue !== undefined ? { [params.slider.field]: sliderValue } : {};
  const values = { length: params.length, seriesResistance: params.seriesResistance, ...moved };
  const cables = block.figure === "series-termination" ? [block.params.cable] : block.params.cables;
  return cables.map((kind) => ({
    driver: { highVoltage: params.highVoltage, outputResistance: params.outputResistance, edgeTime: params.edgeTime },
    seriesResistance: values.seriesResistance,
    cable: { kind, length: values.length },
    receiver: { supplyVoltage: params.supplyVoltage },
    signal: { bits: params.bits },
  }));
}
