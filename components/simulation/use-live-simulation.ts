"use client";

import { useEffect, useRef, useState } from "react";
import type { SimInput, SolveQuality } from "@/lib/sim";
import type { LiveRun } from "./live-run";
import type { SimulationChannel } from "./simulation-channel";
import { openSimulationChannel } from "./simulation-worker-client";

export type LiveSimulation = {
  /** The latest run the worker finished; while `pending`, the one before the current input. */
  result: LiveRun | null;
  /** The current input has not been simulated yet. */
  pending: boolean;
  /** Why the current input could not be simulated, in the simulator's words. */
  error: string | null;
  /** From handing the input to the worker to having its result back (ms). */
  roundTripMs: number | null;
};

type Settled = { key: string; run: LiveRun | null; error: string | null; roundTripMs: number | null };

/**
 * Simulates `input` in a Web Worker and re-simulates whenever it changes (compared by value).
 * Only the newest input counts: older results are dropped, never shown after a newer one.
 * `quality: "preview"` (for runs redrawn while a control moves) takes half the solver steps and
 * stays within about 1 % of VDD; grading always runs at full accuracy on the server.
 */
export function useLiveSimulation(input: SimInput | null, { quality = "grade" }: { quality?: SolveQuality } = {}): LiveSimulation {
  const key = input === null ? null : JSON.stringify(input);
  const [settled, setSettled] = useState<Settled | null>(null);
  const channel = useRef<SimulationChannel | null>(null);
  const latestInput = useRef(input);
  latestInput.current = input;

  useEffect(() => {
    const opened = openSimulationChannel(
      (update) =>
        setSettled((previous) =>
          update.kind === "result"
            ? { key: update.key, run: update.run, error: null, roundTripMs: update.roundTripMs }
            : { key: update.key, run: previous?.run ?? null, error: update.message, roundTripMs: null },
        ),
      quality,
    );
    channel.current = opened;
    return () => {
      opened.close();
      channel.current = null;
    };
  }, [quality]);

  useEffect(() => {
    if (key !== null && latestInput.current) channel.current?.submit(key, latestInput.current);
  }, [key]);

  if (key === null) return { result: null, pending: false, error: null, roundTripMs: null };
  const current = settled?.key === key;
  return {
    result: settled?.run ?? null,
    pending: !current,
    error: current ? settled.error : null,
    roundTripMs: current ? settled.roundTripMs : null,
  };
}
