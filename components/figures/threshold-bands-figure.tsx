"use client";

import { useState } from "react";
import { RECEIVER_DEFAULTS } from "@/lib/sim/receiver";
import type { FigureParams } from "@/lessons";
import { FigureFrame } from "./figure-frame";
import { formatVolts } from "./format-quantity";
import { linearScale, niceTicks } from "./plot-scale";
import { gridValues, RangeControl } from "./range-control";
import { tone } from "./tones";
import { useElementWidth } from "./use-element-width";

type Params = FigureParams<"threshold-bands">;

export function thresholdMargins(p: { supplyVoltage: number; highThreshold: number; lowThreshold: number; driverHighVoltage: number }) {
  const high = p.highThreshold * p.supplyVoltage;
  const low = p.lowThreshold * p.supplyVoltage;
  return { high, low, highMargin: p.driverHighVoltage - high, lowMargin: low - 0 };
}

const height = 320;
const margin = { top: 14, bottom: 26, left: 46, right: 12 };

export function ThresholdBandsFigure({ params, caption }: { params: Params; caption: string }) {
  const [moved, setMoved] = useState(params.slider ? params[params.slider.field] : 0);
  const p = { ...params, ...(params.slider ? { [params.slider.field]: moved } : {}) };
  const { high, low, highMargin, lowMargin } = thresholdMargins(p);
  const typicalTop = (RECEIVER_DEFAULTS.typicalSwitchingPoint + RECEIVER_DEFAULTS.typicalSpread) * p.supplyVoltage;
  const typicalBottom = (RECEIVER_DEFAULTS.typicalSwitchingPoint - RECEIVER_DEFAULTS.typicalSpread) * p.supplyVoltage;
  const { ref, width } = useElementWidth<HTMLDivElement>();

  const top = Math.max(p.supplyVoltage, p.driverHighVoltage, params.slider?.max ?? 0) * 1.08;
  const sy = linearScale([0, top], [height - margin.bottom, margin.top]);
  // On a phone the bands narrow and their labels shorten, so the driver's labels keep room on the right.
  const narrow = width < 480;
  const bandsRight = margin.left + Math.round((width - margin.left) * (narrow ? 0.42 : 0.58));
  const driverX = narrow ? width - 122 : bandsRight + Math.round((width - bandsRight) * 0.45);
  const regions = [
    { from: high, to: p.supplyVoltage, label: narrow ? `reads 1 (≥ ${formatVolts(high)})` : `reads as 1 (above ${formatVolts(high)})`, fill: tone.high },
    { from: low, to: high, label: narrow ? "undefined" : "undefined: could read either way", fill: tone.warn },
    { from: 0, to: low, label: narrow ? `reads 0 (≤ ${formatVolts(low)})` : `reads as 0 (below ${formatVolts(low)})`, fill: tone.low },
  ];
  const labelSize = narrow ? 11 : 12;

  return (
    <FigureFrame
      label="Input thresholds of a pixel"
      caption={caption}
      controls={
        params.slider ? (
          <RangeControl
            label={params.slider.field === "driverHighVoltage" ? "Driver's high level" : "Pixel supply (VDD)"}
            values={gridValues(params.slider.min, params.slider.max, params.slider.step)}
            value={moved}
            format={formatVolts}
            onChange={setMoved}
          />
        ) : null
      }
      readout={
        <div className="space-y-1">
          <p>
            Pixel supply {formatVolts(p.supplyVoltage)}: a 1 needs at least {formatVolts(high)} ({Math.round(p.highThreshold * 100)} % of VDD), a
            0 at most {formatVolts(low)} ({Math.round(p.lowThreshold * 100)} %).
          </p>
          <p className="font-medium">
            High noise margin {formatVolts(highMargin)}
            {highMargin < 0 ? " — the driver's high falls short of the threshold, so the pixel may not see a 1 at all." : "."} Low noise
            margin {formatVolts(lowMargin)}.
          </p>
        </div>
      }
    >
      <div ref={ref} className="w-full">
        <svg width={width} height={height} role="img" aria-label="Input regions of the pixel and the driver's levels" className="block max-w-full">
          {niceTicks([0, top], 6).map((t) => (
            <g key={t}>
              <line x1={margin.left} x2={width - margin.right} y1={sy(t)} y2={sy(t)} stroke={tone.grid} />
              <text x={margin.left - 6} y={sy(t) + 4} textAnchor="end" fontSize={11} fill="var(--color-ink-faint)">
                {t} V
              </text>
            </g>
          ))}
          {regions.map((region) => (
            <g key={region.label}>
              <rect x={margin.left} width={bandsRight - margin.left} y={sy(region.to)} height={sy(region.from) - sy(region.to)} fill={region.fill} opacity={0.14} />
              <text x={margin.left + 6} y={sy(region.to) + 16} fontSize={labelSize} fill="var(--color-ink)">
                {region.label}
              </text>
            </g>
          ))}
          <line x1={margin.left} x2={width - margin.right} y1={sy(p.supplyVoltage)} y2={sy(p.supplyVoltage)} stroke={tone.ink} strokeDasharray="4 3" />
          <text x={width - margin.right} y={sy(p.supplyVoltage) - 5} textAnchor="end" fontSize={11} fill={tone.ink}>
            VDD {formatVolts(p.supplyVoltage)}
          </text>
          <rect
            x={margin.left}
            width={bandsRight - margin.left}
            y={sy(typicalTop)}
            height={sy(typicalBottom) - sy(typicalTop)}
            fill="none"
            stroke={tone.ideal}
            strokeDasharray="2 4"
          />
          <text x={bandsRight - 4} y={sy(typicalTop) - 4} textAnchor="end" fontSize={10} fill="var(--color-ink-faint)">
            typical pixels switch here (assumed)
          </text>
          <line x1={driverX} x2={driverX} y1={sy(0)} y2={sy(p.driverHighVoltage)} stroke={tone.signal} strokeWidth={10} strokeLinecap="butt" opacity={0.9} />
          <text x={driverX + 10} y={sy(p.driverHighVoltage) + 4} fontSize={labelSize} fontWeight={600} fill={tone.signal}>
            driver high {formatVolts(p.driverHighVoltage)}
          </text>
          <line x1={driverX - 16} x2={driverX + 16} y1={sy(high)} y2={sy(high)} stroke={tone.high} strokeWidth={2} />
          <text x={driverX - 22} y={sy(high) + 4} textAnchor="end" fontSize={11} fill={tone.high}>
            {formatVolts(high)}
          </text>
          <text x={driverX + 10} y={Math.max(sy(high), sy(p.driverHighVoltage)) + 18} fontSize={11} fontWeight={600} fill={highMargin < 0 ? tone.warn : tone.high}>
            margin {formatVolts(highMargin)}
          </text>
          <text x={driverX + 10} y={sy(0) - 5} fontSize={11} fill={tone.signal}>
            driver low 0.00 V
          </text>
        </svg>
      </div>
    </FigureFrame>
  );
}
