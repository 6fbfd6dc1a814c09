"use client";

import { useMemo, useState } from "react";
import type { FigureParams } from "@/lessons";
import { FigureFrame } from "./figure-frame";
import { formatQuantity, formatVolts } from "./format-quantity";
import { gridValues, RangeControl } from "./range-control";
import { WaveChart } from "./wave-chart";

type Params = FigureParams<"probe-ground">;

/**
 * A ramp edge driving R (the source), L (the probe's ground lead) and C (the probe tip) in series;
 * the scope shows the voltage on C. Integrated with fourth-order Runge–Kutta on a step well below
 * both the ring period and the edge time.
 */
export function probeResponse(p: Omit<Params, "slider">, horizon: number) {
  const { stepVoltage: V, sourceResistance: R, groundLeadInductance: L, probeCapacitance: C, edgeTime } = p;
  const ringFrequency = 1 / (2 * Math.PI * Math.sqrt(L * C));
  const damping = (R / 2) * Math.sqrt(C / L);
  const dt = Math.min(1 / ringFrequency / 60, edgeTime / 20, horizon / 600);
  const source = (t: number) => (t <= 0 ? 0 : t >= edgeTime ? V : (V * t) / edgeTime);
  // state: [current through L, voltage on C]
  const slope = (t: number, i: number, v: number) => [(source(t) - R * i - v) / L, i / C] as const;
  const shown: [number, number][] = [[0, 0]];
  let i = 0;
  let v = 0;
  let peak = 0;
  for (let t = 0; t < horizon; t += dt) {
    const k1 = slope(t, i, v);
    const k2 = slope(t + dt / 2, i + (dt / 2) * k1[0], v + (dt / 2) * k1[1]);
    const k3 = slope(t + dt / 2, i + (dt / 2) * k2[0], v + (dt / 2) * k2[1]);
    const k4 = slope(t + dt, i + dt * k3[0], v + dt * k3[1]);
    i += (dt / 6) * (k1[0] + 2 * k2[0] + 2 * k3[0] + k4[0]);
    v += (dt / 6) * (k1[1] + 2 * k2[1] + 2 * k3[1] + k4[1]);
    peak = Math.max(peak, v);
    shown.push([t + dt, v]);
  }
  const thin = Math.max(1, Math.floor(shown.length / 800));
  return {
    ringFrequency,
    damping,
    overshoot: Math.max(0, peak - V),
    shown: shown.filter((_, k) => k % thin === 0),
    trueEdge: [[0, 0], [edgeTime, V], [horizon, V]] as const,
  };
}

export function ProbeGroundFigure({ params, caption }: { params: Params; caption: string }) {
  const [moved, setMoved] = useState(params[params.slider.field]);
  const p = { ...params, [params.slider.field]: moved };
  const isLead = params.slider.field === "groundLeadInductance";
  // One fixed time axis for every slider position, long enough for the slowest ring on offer.
  const horizon = useMemo(() => {
    const slowest = { ...params, [params.slider.field]: params.slider.max };
    return params.edgeTime + 5 * 2 * Math.PI * Math.sqrt(slowest.groundLeadInductance * slowest.probeCapacitance);
  }, [params]);
  const response = useMemo(() => probeResponse({ ...params, [params.slider.field]: moved }, horizon), [params, moved, horizon]);

  return (
    <FigureFrame
      label="What a probe's ground lead does to an edge"
      caption={caption}
      controls={
        <RangeControl
          label={isLead ? "Ground lead inductance" : "Probe tip capacitance"}
          values={gridValues(params.slider.min, params.slider.max, params.slider.step)}
          value={moved}
          format={(value) => formatQuantity(value, isLead ? "H" : "F")}
          onChange={setMoved}
        />
      }
      readout={
        <div className="space-y-1">
          <p>
            Ring frequency f = 1 / (2π √(L·C)) = {formatQuantity(response.ringFrequency, "Hz")}; damping ζ = (R/2) √(C/L) ={" "}
            {response.damping.toFixed(2)}.
          </p>
          <p className="font-medium">
            {response.overshoot > 0.01 * p.stepVoltage
              ? `The scope shows ${formatVolts(response.overshoot)} of overshoot (${Math.round((response.overshoot / p.stepVoltage) * 100)} %) that is not on the line.`
              : "The scope shows the edge without ringing: what you see is what is on the line."}
          </p>
        </div>
      }
    >
      <WaveChart
        title="The true edge and what the probe shows"
        xDomain={[0, horizon]}
        yDomain={[-0.3, p.stepVoltage * 1.5]}
        traces={[
          { id: "true", label: "Edge on the line", points: response.trueEdge, tone: "ideal", dash: "dashed", width: 1.6 },
          { id: "probe", label: "What the scope shows", points: response.shown, tone: "signal", width: 2.2 },
        ]}
      />
    </FigureFrame>
  );
}
