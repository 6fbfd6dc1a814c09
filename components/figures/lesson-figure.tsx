import { cableCatalogue, eSeriesValues } from "@/lib/sim";
import type { FigureBlock } from "@/lessons";
import { BounceDiagramFigure } from "./bounce-diagram-figure";
import { CableCompareFigure } from "./cable-compare-figure";
import { ClampCompareFigure } from "./clamp-compare-figure";
import { ProbeGroundFigure } from "./probe-ground-figure";
import { PulseTrainFigure } from "./pulse-train-figure";
import { RcEdgeFigure } from "./rc-edge-figure";
import { SeriesTerminationFigure } from "./series-termination-figure";
import { ThresholdBandsFigure } from "./threshold-bands-figure";

/**
 * One lesson figure by its id. Runs on the server: catalogue numbers and E-series values are
 * looked up here and handed down, so the browser does not load the tables to draw them.
 */
export function LessonFigure({ block }: { block: FigureBlock }) {
  switch (block.figure) {
    case "pulse-train":
      return <PulseTrainFigure params={block.params} caption={block.caption} />;
    case "threshold-bands":
      return <ThresholdBandsFigure params={block.params} caption={block.caption} />;
    case "rc-edge":
      return <RcEdgeFigure params={block.params} caption={block.caption} />;
    case "bounce-diagram":
      return <BounceDiagramFigure params={block.params} caption={block.caption} />;
    case "probe-ground":
      return <ProbeGroundFigure params={block.params} caption={block.caption} />;
    case "clamp-compare":
      return <ClampCompareFigure params={block.params} caption={block.caption} />;
    case "series-termination": {
      const slider = block.params.slider;
      const resistorValues = "series" in slider ? eSeriesValues(slider.series, slider.min, slider.max) : [];
      return <SeriesTerminationFigure params={block.params} caption={block.caption} resistorValues={resistorValues} />;
    }
    case "cable-compare": {
      const cables = block.params.cables.map((kind) => {
        const entry = cableCatalogue[kind];
        return { kind, label: entry.label, z0: entry.z0, capacitancePerMetre: entry.perMetre.capacitance, delayPerMetre: entry.delayPerMetre };
      });
      return <CableCompareFigure params={block.params} caption={block.caption} cables={cables} />;
    }
  }
}
