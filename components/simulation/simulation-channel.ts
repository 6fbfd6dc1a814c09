import type { SimInput } from "@/lib/sim";
import type { LiveRun, RunSpan, SimulationReply, SimulationRequest } from "./live-run";

export type ChannelUpdate =
  | { kind: "result"; key: string; run: LiveRun; roundTripMs: number }
  | { kind: "error"; key: string; message: string };

type Port = { post(request: SimulationRequest): void };

type Job = { key: string; input: SimInput; span: RunSpan };

/**
 * Latest input wins: at most one request per channel is with the worker; an input that arrives
 * meanwhile waits in a single slot, replacing any input still waiting there, so dragging a
 * control never queues every position and the worker never holds a stale one (it only ever
 * receives the newest). A reply to an input that has since been replaced is dropped rather
 * than drawn.
 */
export class SimulationChannel {
  private inFlight: { id: number; key: string; sentAt: number } | null = null;
  private waiting: Job | null = null;
  private latestKey: string | null = null;
  private closed = false;

  constructor(
    private readonly port: Port,
    private readonly nextId: () => number,
    private readonly deliver: (update: ChannelUpdate) => void,
    private readonly onClose: () => void = () => undefined,
  ) {}

  /** `key` names the input and span together: equal keys are the same run. */
  submit(job: Job): void {
    this.latestKey = job.key;
    if (this.inFlight) {
      this.waiting = this.inFlight.key === job.key ? null : job;
      return;
    }
    this.send(job);
  }

  /** Called with every reply from the worker; ignores replies meant for other channels. */
  receive(reply: SimulationReply): boolean {
    if (!this.inFlight || reply.id !== this.inFlight.id) return false;
    const { key, sentAt } = this.inFlight;
    this.inFlight = null;
    if (this.waiting) {
      const next = this.waiting;
      this.waiting = null;
      this.send(next);
    }
    if (this.closed || key !== this.latestKey) return true;
    this.deliver(
      reply.ok
        ? { kind: "result", key, run: reply.run, roundTripMs: performance.now() - sentAt }
        : { kind: "error", key, message: reply.error },
    );
    return true;
  }

  /** When the worker itself fails (it could not load): nothing in flight will ever answer. */
  fail(message: string): void {
    if (this.closed || this.latestKey === null) return;
    this.inFlight = null;
    this.waiting = null;
    this.deliver({ kind: "error", key: this.latestKey, message });
  }

  close(): void {
    this.closed = true;
    this.waiting = null;
    this.onClose();
  }

  private send({ key, input, span }: Job): void {
    const id = this.nextId();
    this.inFlight = { id, key, sentAt: performance.now() };
    this.port.post({ id, input, span });
  }
}
