export { useLiveSimulation, type LiveSimulation } from "./use-live-simulation";
export type { LiveRun } from "./live-run";
