"use client";

import { useState } from "react";
import type { FigureParams } from "@/lessons";
import { FigureFrame } from "./figure-frame";
import { formatQuantity, formatVolts } from "./format-quantity";
import { linearScale } from "./plot-scale";
import { gridValues, RangeControl } from "./range-control";
import { tone } from "./tones";
import { useElementWidth } from "./use-element-width";
import { WaveChart } from "./wave-chart";

type Params = FigureParams<"bounce-diagram">;

/**
 * The lattice of a step launched into a line: V1 = Vs·Z0/(Rsrc + Z0) travels out, each end
 * reflects it by its coefficient (Γs at the driver, Γl at the pixel). The far end after arrival n
 * is the sum of every wave that has reached it: V1·(1 + Γl)·Σ (Γl·Γs)^k, k < n.
 */
export function bounceWaves(p: Omit<Params, "slider">) {
  const launched = (p.stepVoltage * p.z0) / (p.sourceResistance + p.z0);
  const sourceReflection = (p.sourceResistance - p.z0) / (p.sourceResistance + p.z0);
  const waves: { forward: number; backward: number }[] = [];
  const farEnd: number[] = [];
  let forward = launched;
  let far = 0;
  for (let n = 0; n < p.arrivals; n += 1) {
    const backward = forward * p.loadReflection;
    far += forward + backward;
    waves.push({ forward, backward });
    farEnd.push(far);
    forward = backward * sourceReflection;
  }
  return { launched, sourceReflection, waves, farEnd };
}

const latticeHeight = 300;

export function BounceDiagramFigure({ params, caption }: { params: Params; caption: string }) {
  const [moved, setMoved] = useState(params[params.slider.field]);
  const p = { ...params, [params.slider.field]: moved };
  const { launched, sourceReflection, waves, farEnd } = bounceWaves(p);
  const { ref, width } = useElementWidth<HTMLDivElement>(320);
  const td = p.oneWayDelay;
  const horizon = 2 * p.arrivals * td;
  const vHigh = p.highThreshold * p.supplyVoltage;
  const isSource = params.slider.field === "sourceResistance";

  const left = 70;
  const right = Math.max(left + 120, width - 70);
  const sy = linearScale([0, horizon], [28, latticeHeight - 10]);
  const labelled = Math.min(waves.length, 4);

  const staircase: [number, number][] = [[0, 0]];
  farEnd.forEach((v, n) => {
    const t = (2 * n + 1) * td;
    staircase.push([t, staircase.at(-1)![1]], [t, v]);
  });
  staircase.push([horizon, farEnd.at(-1) ?? 0]);
  const firstCrossing = farEnd.findIndex((v) => v >= vHigh);
  const dips = farEnd.findIndex((v, n) => n > firstCrossing && firstCrossing >= 0 && v < vHigh);
  const extremes = [0, ...farEnd, p.stepVoltage];

  return (
    <FigureFrame
      label="Bounce diagram"
      caption={caption}
      controls={
        <RangeControl
          label={isSource ? "Source resistance (driver + series resistor)" : "Line impedance Z0"}
          values={gridValues(params.slider.min, params.slider.max, params.slider.step)}
          value={moved}
          format={(value) => formatQuantity(value, "Ω")}
          onChange={setMoved}
        />
      }
      readout={
        <div className="space-y-1">
          <p>
            Launched step V1 = {formatVolts(p.stepVoltage)} × {formatQuantity(p.z0, "Ω")} / ({formatQuantity(p.sourceResistance, "Ω")} +{" "}
            {formatQuantity(p.z0, "Ω")}) = {formatVolts(launched)}. Reflection at the driver Γs = {sourceReflection.toFixed(3)}; at the pixel Γ ={" "}
            {p.loadReflection.toFixed(2)}.
          </p>
          <p className="font-medium">
            Far end after each arrival: {farEnd.map((v) => formatVolts(v)).join(", ")}.{" "}
            {firstCrossing < 0
              ? `It never reaches the ${formatVolts(vHigh)} threshold within ${p.arrivals} arrivals.`
              : `It first clears ${formatVolts(vHigh)} at arrival ${firstCrossing + 1}${dips > 0 ? `, then falls back below it at arrival ${dips + 1} (ringing through the threshold)` : ""}.`}
          </p>
        </div>
      }
    >
      <div className="grid gap-4 lg:grid-cols-2">
        <div ref={ref} className="w-full">
          <svg width={width} height={latticeHeight} role="img" aria-label="Waves travelling between driver and pixel" className="block max-w-full">
            <text x={left} y={14} textAnchor="middle" fontSize={11} fontWeight={600} fill={tone.ink}>
              driver
            </text>
            <text x={right} y={14} textAnchor="middle" fontSize={11} fontWeight={600} fill={tone.ink}>
              pixel
            </text>
            <line x1={left} x2={left} y1={22} y2={latticeHeight - 4} stroke={tone.ink} strokeWidth={2} />
            <line x1={right} x2={right} y1={22} y2={latticeHeight - 4} stroke={tone.ink} strokeWidth={2} />
            {waves.map((wave, n) => {
              const t0 = 2 * n * td;
              return (
                <g key={n}>
                  <line x1={left} y1={sy(t0)} x2={right} y2={sy(t0 + td)} stroke={tone.signal} strokeWidth={1.6} />
                  <line x1={right} y1={sy(t0 + td)} x2={left} y2={sy(t0 + 2 * td)} stroke={tone.far} strokeWidth={1.6} strokeDasharray="6 4" />
                  {n < labelled ? (
                    <>
                      <text x={(left + right) / 2} y={sy(t0 + td / 2) - 5} textAnchor="middle" fontSize={11} fill={tone.signal}>
                        {formatVolts(wave.forward)}
                      </text>
                      <text x={(left + right) / 2} y={sy(t0 + 1.5 * td) - 5} textAnchor="middle" fontSize={11} fill={tone.far}>
                        {formatVolts(wave.backward)}
                      </text>
                    </>
                  ) : null}
                  <text x={right + 6} y={sy(t0 + td) + 4} fontSize={10} fill="var(--color-ink-faint)">
                    {formatQuantity(t0 + td, "s", 3)}
                  </text>
                </g>
              );
            })}
          </svg>
          <p className="mt-1 text-xs text-ink-soft">Time runs downwards. Solid: waves towards the pixel; dashed: reflections back to the driver.</p>
        </div>
        <WaveChart
          title="Far-end voltage after each arrival"
          xDomain={[0, horizon]}
          yDomain={[Math.min(...extremes, 0) - 0.3, Math.max(...extremes) * 1.1 + 0.2]}
          traces={[{ id: "far", label: "Pixel input (far end)", points: staircase, tone: "far", width: 2.4 }]}
          levels={[
            { y: vHigh, label: `high threshold ${formatVolts(vHigh)}`, tone: "high" },
            { y: p.stepVoltage, label: `step ${formatVolts(p.stepVoltage)}`, tone: "ideal", dash: "dotted" },
          ]}
          height={latticeHeight}
        />
      </div>
    </FigureFrame>
  );
}
