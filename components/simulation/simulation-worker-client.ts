import type { SimulationReply } from "./live-run";
import { SimulationChannel, type ChannelUpdate } from "./simulation-channel";

// One worker for the page, shared by every live figure on it; each figure talks through its own
// channel, so one figure's drag never drops another figure's result.
let worker: Worker | null = null;
const channels = new Set<SimulationChannel>();
let lastId = 0;

function startWorker(): Worker {
  const started = new Worker(new URL("./simulation.worker.ts", import.meta.url), { type: "module", name: "line-simulator" });
  started.onmessage = (event: MessageEvent<SimulationReply>) => {
    for (const channel of channels) if (channel.receive(event.data)) return;
  };
  started.onerror = (event) => {
    event.preventDefault();
    worker = null;
    started.terminate();
    for (const channel of channels) channel.fail(`The simulator stopped in this browser (${event.message || "no details"}). Reload the page to start it again.`);
  };
  return started;
}

export function openSimulationChannel(deliver: (update: ChannelUpdate) => void): SimulationChannel {
  const channel = new SimulationChannel(
    { post: (request) => (worker ??= startWorker()).postMessage(request) },
    () => (lastId += 1),
    deliver,
    () => channels.delete(channel),
  );
  channels.add(channel);
  return channel;
}
