export { useLiveSimulation, type LiveSimulation } from "./use-live-simulation";
export type { LiveRun, RunSpan } from "./live-run";
export { DRAG_SPAN, FULL_SPAN } from "./run-spans";
