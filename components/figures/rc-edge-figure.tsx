"use client";

import { useState } from "react";
import type { FigureParams } from "@/lessons";
import { FigureFrame } from "./figure-frame";
import { formatQuantity, formatVolts } from "./format-quantity";
import { gridValues, RangeControl } from "./range-control";
import { WaveChart, type Mark, type Span } from "./wave-chart";

type Params = FigureParams<"rc-edge">;

/**
 * One pulse through a lumped RC: v = V(1 − e^(−t/τ)) while the driver is high, then
 * v(T)·e^(−(t−T)/τ). The pixel's pulse starts when the rise crosses the high threshold and ends
 * when the fall crosses the low one (lesson 3, "Time to cross a threshold").
 */
export function rcPulse(p: Omit<Params, "slider">) {
  const tau = (p.outputResistance + p.seriesResistance) * p.capacitance;
  const vHigh = p.highThreshold * p.supplyVoltage;
  const vLow = p.lowThreshold * p.supplyVoltage;
  const peak = p.highVoltage * (1 - Math.exp(-p.highTime / tau));
  const rises = peak >= vHigh && p.highVoltage > vHigh;
  const start = rises ? tau * Math.log(p.highVoltage / (p.highVoltage - vHigh)) : null;
  const end = peak > vLow ? p.highTime + tau * Math.log(peak / vLow) : null;
  const voltageAt = (t: number) => (t <= p.highTime ? p.highVoltage * (1 - Math.exp(-t / tau)) : peak * Math.exp(-(t - p.highTime) / tau));
  return { tau, riseTime: tau * Math.log(9), vHigh, vLow, peak, seen: start !== null && end !== null ? { start, end, width: end - start } : null, voltageAt };
}

export function RcEdgeFigure({ params, caption }: { params: Params; caption: string }) {
  const [moved, setMoved] = useState(params[params.slider.field]);
  const p = { ...params, [params.slider.field]: moved };
  const pulse = rcPulse(p);
  const horizon = p.highTime * 2.5;
  const samples = 400;
  const curve = Array.from({ length: samples + 1 }, (_, i) => {
    const t = (i / samples) * horizon;
    return [t, pulse.voltageAt(t)] as const;
  });
  const ideal = [[0, 0], [0, p.highVoltage], [p.highTime, p.highVoltage], [p.highTime, 0], [horizon, 0]] as const;
  const marks: Mark[] = pulse.seen
    ? [
        { x: pulse.seen.start, tone: "high", dash: "dashed" },
        { x: pulse.seen.end, tone: "low", dash: "dashed" },
      ]
    : [];
  const spans: Span[] = pulse.seen
    ? [{ from: pulse.seen.start, to: pulse.seen.end, y: p.highVoltage * 1.15, label: `pixel sees ${formatQuantity(pulse.seen.width, "s")}`, tone: "ink" }]
    : [];
  const isResistor = params.slider.field === "seriesResistance";

  return (
    <FigureFrame
      label="An edge through resistance and capacitance"
      caption={caption}
      controls={
        <RangeControl
          label={isResistor ? "Series resistor" : "Load capacitance"}
          values={gridValues(params.slider.min, params.slider.max, params.slider.step)}
          value={moved}
          format={(value) => formatQuantity(value, isResistor ? "Ω" : "F")}
          onChange={setMoved}
        />
      }
      readout={
        <div className="space-y-1">
          <p>
            τ = ({formatQuantity(p.outputResistance, "Ω")} + {formatQuantity(p.seriesResistance, "Ω")}) × {formatQuantity(p.capacitance, "F")} ={" "}
            {formatQuantity(pulse.tau, "s")}; 10–90 % rise time ≈ 2.2 τ = {formatQuantity(pulse.riseTime, "s")}.
          </p>
          <p className="font-medium">
            {pulse.seen
              ? `Sent ${formatQuantity(p.highTime, "s")} high; the pixel sees a pulse of ${formatQuantity(pulse.seen.width, "s")} (${formatVolts(pulse.vHigh)} up, ${formatVolts(pulse.vLow)} down).`
              : `The pulse peaks at ${formatVolts(pulse.peak)} and never reaches the ${formatVolts(pulse.vHigh)} threshold: the pixel sees no pulse at all.`}
          </p>
        </div>
      }
    >
      <WaveChart
        title="Pulse at the pixel through the RC"
        xDomain={[0, horizon]}
        yDomain={[-0.3, p.highVoltage * 1.3]}
        traces={[
          { id: "ideal", label: "Driver without RC", points: ideal, tone: "ideal", dash: "dashed", width: 1.5 },
          { id: "rc", label: "At the pixel input", points: curve, tone: "signal", width: 2.4 },
        ]}
        levels={[
          { y: pulse.vHigh, label: `high threshold ${formatVolts(pulse.vHigh)}`, tone: "high" },
          { y: pulse.vLow, label: `low threshold ${formatVolts(pulse.vLow)}`, tone: "low" },
        ]}
        marks={marks}
        spans={spans}
      />
    </FigureFrame>
  );
}
