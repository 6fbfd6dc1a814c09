"use client";

import { useEffect, useRef, useState } from "react";
import type { SimInput } from "@/lib/sim";
import type { LiveRun, RunSpan } from "./live-run";
import type { SimulationChannel } from "./simulation-channel";
import { openSimulationChannel } from "./simulation-worker-client";

export type LiveSimulation = {
  /** The latest run the worker finished; while `pending`, the one before the current input. */
  result: LiveRun | null;
  /** The current input has not been simulated yet. */
  pending: boolean;
  /** Why the current input could not be simulated, in the simulator's words. */
  error: string | null;
  /** For the run in `result`: from handing its input to the worker to having it back (ms). */
  roundTripMs: number | null;
};

type Settled = { key: string; run: LiveRun | null; error: string | null; roundTripMs: number | null };

/**
 * Simulates `input` in a Web Worker and re-simulates whenever it or the span changes (compared by
 * value). Only the newest counts: older results are dropped, never shown after a newer one.
 * `quality: "preview"` (for runs redrawn while a control moves) takes half the solver steps and
 * stays within about 1 % of VDD; `firstBits` solves only the start of a long pattern (see
 * lib/sim/README.md, "Drag previews"). Grading always runs at full accuracy on the server.
 */
export function useLiveSimulation(input: SimInput | null, { quality = "grade", firstBits }: Partial<RunSpan> = {}): LiveSimulation {
  const key = input === null ? null : `${quality}:${firstBits ?? "all"}:${JSON.stringify(input)}`;
  const [settled, setSettled] = useState<Settled | null>(null);
  const channel = useRef<SimulationChannel | null>(null);
  const latest = useRef({ input, span: { quality, firstBits } });
  latest.current = { input, span: { quality, firstBits } };

  useEffect(() => {
    const opened = openSimulationChannel((update) =>
      setSettled((previous) =>
        update.kind === "result"
          ? { key: update.key, run: update.run, error: null, roundTripMs: update.roundTripMs }
          : { key: update.key, run: previous?.run ?? null, error: update.message, roundTripMs: null },
      ),
    );
    channel.current = opened;
    return () => {
      opened.close();
      channel.current = null;
    };
  }, []);

  useEffect(() => {
    const { input: current, span } = latest.current;
    if (key !== null && current) channel.current?.submit({ key, input: current, span });
  }, [key]);

  if (key === null) return { result: null, pending: false, error: null, roundTripMs: null };
  const current = settled?.key === key;
  return {
    result: settled?.run ?? null,
    pending: !current,
    error: current ? settled.error : null,
    roundTripMs: settled?.roundTripMs ?? null,
  };
}
