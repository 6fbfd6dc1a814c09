"use client";

import { useState } from "react";
import type { FigureParams } from "@/lessons";
import { FigureFrame } from "./figure-frame";
import { formatQuantity } from "./format-quantity";
import { gridValues, RangeControl } from "./range-control";
import { WaveChart, type Mark, type Note } from "./wave-chart";

type Params = FigureParams<"pulse-train">;

/** What the pixel makes of each slot: a pulse still high at the decision instant is a 1. */
export function readBits(bits: string, highTimes: { zeroHigh: number; oneHigh: number }, decisionTime: number): string {
  return [...bits].map((bit) => ((bit === "1" ? highTimes.oneHigh : highTimes.zeroHigh) > decisionTime ? "1" : "0")).join("");
}

function describeBit(kind: "0" | "1", high: number, decision: number): string {
  const margin = kind === "0" ? decision - high : high - decision;
  const where = high < decision ? "before" : "after";
  const verdict = margin > 0 ? `a margin of ${formatQuantity(margin, "s")}` : `read as ${kind === "0" ? "1" : "0"}`;
  return `${kind} bits are high for ${formatQuantity(high, "s")}, ending ${formatQuantity(Math.abs(high - decision), "s")} ${where} the decision point (${verdict}).`;
}

export function PulseTrainFigure({ params, caption }: { params: Params; caption: string }) {
  const [bits, setBits] = useState(params.bits);
  const [moved, setMoved] = useState(params.slider ? params[params.slider.field] : 0);
  const timing = { zeroHigh: params.zeroHigh, oneHigh: params.oneHigh, ...(params.slider ? { [params.slider.field]: moved } : {}) };
  const { bitPeriod, decisionTime, highVoltage } = params;
  const read = readBits(bits, timing, decisionTime);
  const wrong = [...bits].filter((bit, i) => bit !== read[i]).length;

  const points: [number, number][] = [];
  const marks: Mark[] = [];
  const notes: Note[] = [];
  [...bits].forEach((bit, i) => {
    const start = i * bitPeriod;
    const high = bit === "1" ? timing.oneHigh : timing.zeroHigh;
    points.push([start, 0], [start, highVoltage], [start + high, highVoltage], [start + high, 0]);
    marks.push({ x: start, tone: "ideal", dash: "dotted" });
    marks.push({ x: start + decisionTime, tone: "far", dash: "dashed" });
    notes.push({ x: start + bitPeriod / 2, y: highVoltage * 1.2, text: bit, tone: "ink", bold: true });
    notes.push({ x: start + bitPeriod / 2, y: -0.6, text: read[i] === bit ? read[i]! : `✗ ${read[i]}`, tone: read[i] === bit ? "high" : "warn", bold: true });
  });
  points.push([bits.length * bitPeriod, 0]);

  const controls = (
    <>
      {params.editableBits ? (
        <fieldset>
          <legend className="text-sm font-medium text-ink">Bits sent (press one to flip it)</legend>
          <div className="mt-2 grid max-w-md gap-1" style={{ gridTemplateColumns: `repeat(${Math.min(bits.length, 8)}, minmax(0, 1fr))` }}>
            {[...bits].map((bit, i) => (
              <button
                key={i}
                type="button"
                aria-pressed={bit === "1"}
                aria-label={`Bit ${i + 1}: ${bit}`}
                onClick={() => setBits(bits.slice(0, i) + (bit === "1" ? "0" : "1") + bits.slice(i + 1))}
                className={`h-10 rounded-md border font-mono text-base font-semibold ${
                  bit === "1" ? "border-accent bg-accent text-white" : "border-line-strong bg-surface text-ink"
                }`}
              >
                {bit}
              </button>
            ))}
          </div>
        </fieldset>
      ) : null}
      {params.slider ? (
        <RangeControl
          label={params.slider.field === "oneHigh" ? "High time of a 1 bit" : "High time of a 0 bit"}
          values={gridValues(params.slider.min, params.slider.max, params.slider.step)}
          value={moved}
          format={(value) => formatQuantity(value, "s")}
          onChange={setMoved}
        />
      ) : null}
    </>
  );

  return (
    <FigureFrame
      label="Pulse train"
      caption={caption}
      controls={controls}
      readout={
        <div className="space-y-1">
          <p>
            Decision point {formatQuantity(decisionTime, "s")} after each rising edge. {describeBit("0", timing.zeroHigh, decisionTime)}{" "}
            {describeBit("1", timing.oneHigh, decisionTime)}
          </p>
          <p className="text-ink-soft">Above each slot: the bit sent; below it, the bit the pixel reads (✗ where they differ). Dashed lines: the decision points; dotted: slot boundaries.</p>
          <p className="font-medium">
            Sent <span className="font-mono">{bits}</span>, the pixel reads <span className="font-mono">{read}</span>
            {wrong === 0 ? ": every bit as sent." : `: ${wrong} of ${bits.length} bits wrong.`}
          </p>
        </div>
      }
    >
      <WaveChart
        title={`Driver output for the bits ${bits}`}
        xDomain={[0, bits.length * bitPeriod]}
        yDomain={[-0.9, highVoltage * 1.35]}
        traces={[{ id: "drive", label: "Driver output", points, tone: "signal", width: 2.2 }]}
        marks={marks}
        notes={notes}
        height={260}
      />
    </FigureFrame>
  );
}
