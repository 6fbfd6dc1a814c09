"use client";

import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, XAxis, YAxis } from "recharts";
import type { PredictedPoint } from "@/lib/bench/prediction";

// The same look as the workbench's scope view: near end teal and dashed, far end copper and solid.
const nearStroke = "#1d5c63";
const farStroke = "#b05f26";

/** The predicted rising edge at the first pixel, on a scale a scope photo of it would use. */
export function PredictionChart({ trace, highLevel, lowLevel }: { trace: PredictedPoint[]; highLevel: number; lowLevel: number }) {
  const top = Math.max(highLevel, ...trace.map((p) => Math.max(p.near, p.far)));
  const bottom = Math.min(0, ...trace.map((p) => Math.min(p.near, p.far)));
  return (
    <figure>
      <LineChart data={trace} height={260} responsive style={{ width: "100%" }} margin={{ top: 8, right: 12, bottom: 4, left: 0 }}>
        <CartesianGrid stroke="#eeebe2" />
        <XAxis
          dataKey="t"
          type="number"
          domain={["dataMin", "dataMax"]}
          tickFormatter={(value: number) => `${Math.round(value)}`}
          tick={{ fontSize: 12, fill: "#4a555c" }}
          label={{ value: "time (ns)", position: "insideBottomRight", offset: -2, fontSize: 12, fill: "#4a555c" }}
          height={34}
        />
        <YAxis
          type="number"
          domain={[Math.floor(bottom * 2) / 2, Math.ceil(top * 2) / 2]}
          tick={{ fontSize: 12, fill: "#4a555c" }}
          width={40}
          label={{ value: "V", position: "insideTopLeft", offset: 6, fontSize: 12, fill: "#4a555c" }}
        />
        <ReferenceLine y={highLevel} stroke="#2f6b3a" strokeDasharray="3 3" label={{ value: `high ${highLevel.toFixed(2)} V`, position: "insideTopRight", fontSize: 11, fill: "#2f6b3a" }} />
        <ReferenceLine y={lowLevel} stroke="#4a555c" strokeDasharray="3 3" label={{ value: `low ${lowLevel.toFixed(2)} V`, position: "insideBottomRight", fontSize: 11, fill: "#4a555c" }} />
        <Line type="linear" dataKey="near" name="Near end (after the resistor)" stroke={nearStroke} strokeDasharray="6 4" strokeWidth={1.6} dot={false} isAnimationActive={false} />
        <Line type="linear" dataKey="far" name="Far end (first pixel)" stroke={farStroke} strokeWidth={2.2} dot={false} isAnimationActive={false} />
        <Legend verticalAlign="top" height={28} wrapperStyle={{ fontSize: 12 }} />
      </LineChart>
      <figcaption className="sr-only">Predicted voltage at the near end and at the first pixel around one rising edge.</figcaption>
    </figure>
  );
}
