"use client";

import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, XAxis, YAxis } from "recharts";
import type { LiveRun } from "@/components/simulation";
import { chartMargin, xAxisHeight, yAxisWidth } from "./chart-geometry";
import type { ScopePoint } from "./decimate";
import { niceTicks } from "./ticks";
import type { TimeWindow } from "./time-window";
import { bandStyle, traceStyle } from "./trace-style";

export type ScopeMarker = { number: number; time: number };

type Props = {
  run: LiveRun;
  points: ScopePoint[];
  window: TimeWindow;
  yDomain: [number, number];
  markers: ScopeMarker[];
  selectedBit: number | null;
  height: number;
  /** Most bit-slot numbers that fit across the chart; every k-th slot is numbered when there are more. */
  slotLabels: number;
  /** The traces are drawn over the chart by the drag overlay instead. */
  tracesHidden?: boolean;
};

const micro = (seconds: number) => seconds * 1e6;

function tickFormatter(span: number) {
  return span < 2e-6 ? (value: number) => `${Math.round(value * 1e3)}` : (value: number) => `${Number(value.toFixed(3))}`;
}

/** The chart itself: traces, the receiver's bands, bit slots at the far end, faulty bits and verdict markers. */
export function ScopeChart({ run, points, window, yDomain, markers, selectedBit, height, slotLabels, tracesHidden = false }: Props) {
  const vdd = run.receiver.supplyVoltage;
  const high = run.receiver.highThreshold * vdd;
  const low = run.receiver.lowThreshold * vdd;
  const typical = run.verdict.typical.band;
  const span = window.to - window.from;
  const slotWidth = run.timing.bitPeriod;
  const slots = run.bits
    .map((bit, index) => ({ index, bit, from: bit.start + run.line.delay, to: bit.start + run.line.delay + slotWidth }))
    .filter((slot) => slot.to > window.from && slot.from < window.to);
  const labelEvery = Math.max(1, Math.ceil(slots.length / Math.max(1, slotLabels)));
  const timeTicks = niceTicks(micro(window.from), micro(window.to), height < 260 ? 4 : 7);
  const voltTicks = niceTicks(yDomain[0], yDomain[1], 6);

  return (
    // No keyboard layer: the chart is hidden from assistive technology, which reads the summary beside it instead.
    <LineChart data={points} height={height} responsive style={{ width: "100%" }} margin={chartMargin} accessibilityLayer={false}>
      <CartesianGrid stroke="#eeebe2" />
      <XAxis
        dataKey="t"
        type="number"
        domain={[micro(window.from), micro(window.to)]}
        allowDataOverflow
        ticks={timeTicks}
        tickFormatter={tickFormatter(span)}
        tick={{ fontSize: 12, fill: "#4a555c" }}
        label={{ value: span < 2e-6 ? "time (ns)" : "time (µs)", position: "insideBottomRight", offset: -2, fontSize: 12, fill: "#4a555c" }}
        height={xAxisHeight}
      />
      <YAxis
        type="number"
        domain={yDomain}
        allowDataOverflow
        ticks={voltTicks}
        tickFormatter={(value: number) => `${value} V`}
        tick={{ fontSize: 12, fill: "#4a555c" }}
        width={yAxisWidth}
      />
      <ReferenceArea y1={high} y2={yDomain[1]} fill={bandStyle.high} fillOpacity={0.09} ifOverflow="hidden" />
      <ReferenceArea y1={yDomain[0]} y2={low} fill={bandStyle.low} fillOpacity={0.09} ifOverflow="hidden" />
      <ReferenceLine y={high} stroke={bandStyle.high} strokeWidth={1} label={{ value: `high ${high.toFixed(2)}`, position: "right", fontSize: 11, fill: bandStyle.high }} />
      <ReferenceLine y={low} stroke={bandStyle.low} strokeWidth={1} label={{ value: `low ${low.toFixed(2)}`, position: "right", fontSize: 11, fill: bandStyle.low }} />
      <ReferenceArea
        y1={typical.lowest}
        y2={typical.highest}
        fill={bandStyle.slot}
        fillOpacity={0.12}
        stroke={bandStyle.slot}
        strokeDasharray="2 4"
        ifOverflow="hidden"
        label={{ value: `typical ${typical.lowest.toFixed(2)}–${typical.highest.toFixed(2)}`, position: "insideRight", fontSize: 11, fill: "#5f686e" }}
      />
      {slots.map((slot) => {
        const wrong = slot.bit.received !== String(slot.bit.sent);
        const selected = slot.index === selectedBit;
        return wrong || selected ? (
          <ReferenceArea
            key={`area-${slot.index}`}
            x1={micro(slot.from)}
            x2={micro(slot.to)}
            fill={wrong ? bandStyle.fault : bandStyle.slot}
            fillOpacity={wrong ? 0.1 : 0.15}
            ifOverflow="hidden"
            label={wrong ? { value: "✗", position: "insideTop", fontSize: 13, fill: bandStyle.fault } : undefined}
          />
        ) : null;
      })}
      {slots.map((slot) => (
        <ReferenceLine
          key={`slot-${slot.index}`}
          x={micro(slot.from)}
          stroke={bandStyle.slot}
          strokeDasharray="3 3"
          ifOverflow="hidden"
          label={slot.index % labelEvery === 0 ? { value: String(slot.index + 1), position: "top", fontSize: 10, fill: "#5f686e" } : undefined}
        />
      ))}
      {markers.map((marker) => (
        <ReferenceLine
          key={`marker-${marker.number}`}
          x={micro(marker.time)}
          stroke={bandStyle.marker}
          strokeWidth={1.5}
          ifOverflow="hidden"
          label={{ value: `(${marker.number})`, position: "insideTopLeft", fontSize: 12, fontWeight: 600, fill: bandStyle.marker }}
        />
      ))}
      {tracesHidden
        ? null
        : (["near", "far"] as const).map((end) => (
            <Line
              key={end}
              dataKey={end}
              name={traceStyle[end].label}
              stroke={traceStyle[end].stroke}
              strokeDasharray={traceStyle[end].dash}
              strokeWidth={traceStyle[end].width}
              dot={false}
              activeDot={false}
              isAnimationActive={false}
              type="linear"
            />
          ))}
    </LineChart>
  );
}
