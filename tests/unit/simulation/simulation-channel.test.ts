/**
 * The page's side of the live simulation: while a control is dragged, only the newest position
 * reaches the worker, one at a time, with the span it asked for; a reply for a position that has
 * since moved on is never drawn.
 */
import { describe, expect, it } from "vitest";
import type { LiveRun, SimulationReply, SimulationRequest } from "@/components/simulation/live-run";
import { DRAG_SPAN, FULL_SPAN } from "@/components/simulation/run-spans";
import { SimulationChannel, type ChannelUpdate } from "@/components/simulation/simulation-channel";
import type { SimInput } from "@/lib/sim";

function harness() {
  const posted: SimulationRequest[] = [];
  const delivered: ChannelUpdate[] = [];
  let id = 0;
  const channel = new SimulationChannel({ post: (request) => posted.push(request) }, () => (id += 1), (update) => delivered.push(update));
  const answer = (request: SimulationRequest): SimulationReply => ({ id: request.id, ok: true, run: { span: request.span } as LiveRun });
  return { channel, posted, delivered, answer };
}

const at = (ohms: number): SimInput => ({ seriesResistance: ohms, cable: { kind: "lone-lead", length: 10 }, signal: { bits: "0110" } });

describe("SimulationChannel", () => {
  it("sends one request at a time and, of the positions passed meanwhile, only the newest", () => {
    const { channel, posted, delivered, answer } = harness();
    channel.submit({ key: "33", input: at(33), span: DRAG_SPAN });
    for (const ohms of [39, 47, 56, 68]) channel.submit({ key: String(ohms), input: at(ohms), span: DRAG_SPAN });
    expect(posted.map((request) => request.input.seriesResistance)).toEqual([33]);

    channel.receive(answer(posted[0]));
    expect(posted.map((request) => request.input.seriesResistance)).toEqual([33, 68]);
    // The reply for 33 Ω came after the control had moved on: not drawn.
    expect(delivered).toEqual([]);

    channel.receive(answer(posted[1]));
    expect(delivered.map((update) => update.key)).toEqual(["68"]);
  });

  it("passes the span with each request: a drag preview, then the full run once the control is let go", () => {
    const { channel, posted, delivered, answer } = harness();
    channel.submit({ key: "preview:68", input: at(68), span: DRAG_SPAN });
    channel.submit({ key: "full:68", input: at(68), span: FULL_SPAN });
    channel.receive(answer(posted[0]));
    channel.receive(answer(posted[1]));
    expect(posted.map((request) => request.span)).toEqual([DRAG_SPAN, FULL_SPAN]);
    expect(delivered).toHaveLength(1);
    expect(delivered[0].kind === "result" && delivered[0].run.span).toEqual(FULL_SPAN);
  });

  it("does not send again what is already with the worker", () => {
    const { channel, posted, delivered, answer } = harness();
    channel.submit({ key: "68", input: at(68), span: DRAG_SPAN });
    channel.submit({ key: "82", input: at(82), span: DRAG_SPAN });
    channel.submit({ key: "68", input: at(68), span: DRAG_SPAN });
    channel.receive(answer(posted[0]));
    expect(posted).toHaveLength(1);
    expect(delivered.map((update) => update.key)).toEqual(["68"]);
  });
});
