import type { WaveChunk } from "./wave-chunk";

/**
 * Bit replays: a run that rings throughout never comes to rest, so the rest replays of
 * segment-replays.ts never start; but its state at the start of a bit (every wave in flight, the
 * junctions, the pin) depends on the bits before it less and less, each round trip taking some of
 * the ringing away. Once the state at a bit's first step lies within `tolerance` of the state at an
 * earlier bit's first step, and the bit and the next one's start are the same (same steps from the
 * edge), the solver copies what it solved after the earlier bit (pin trace, waves arriving back at
 * the driver, clamp peak) and takes the line on from the state the earlier bit ended in, instead
 * of solving the bit again. The copy departs from solving again by what the states differ by at
 * most, the line being passive (no wave grows), and those departures die away as ringing does.
 *
 * To have whole states at each bit's first step, the solver ends a chunk there (lib/sim/README.md,
 * "Bit replays").
 */

export type PinState = {
  v1: number;
  v2: number;
  held: boolean;
  heldInput: number;
  heldOutput: number;
  lastWave: number;
  clampCurrent: number;
  branch1: number;
  branch2: number;
};

export type BitSnapshot = {
  step: number;
  /** Fall offset and the steps to the next bit: what must match for a copy. */
  key: string;
  streamOffsets: Int32Array[];
  streamValues: Float64Array[];
  junctions: Float64Array;
  pin: PinState;
  farFrom: number;
  arrivalsFrom: number;
  /** Filled when the bit has been solved through to the next bit's first step. */
  next: BitSnapshot | null;
  farTo: number;
  arrivalsTo: number;
  clampPeak: number;
  /** Clamp peak's step after this snapshot's step; −1 when the clamps stayed off. */
  clampPeakAt: number;
};

/** Largest difference between two run lists over the `length` steps they cover, stopping once it passes `limit`. */
function runsDiffer(aOffsets: Int32Array, aValues: Float64Array, aCount: number, bOffsets: Int32Array, bValues: Float64Array, bCount: number, limit: number): boolean {
  let a = 0;
  let b = 0;
  for (;;) {
    if (Math.abs(aValues[a] - bValues[b]) > limit) return true;
    const aNext = a + 1 < aCount ? aOffsets[a + 1] : Infinity;
    const bNext = b + 1 < bCount ? bOffsets[b + 1] : Infinity;
    if (aNext === Infinity && bNext === Infinity) return false;
    if (aNext <= bNext) a += 1;
    if (bNext <= aNext) b += 1;
  }
}

const near = (a: number, b: number, tolerance: number) => Math.abs(a - b) <= tolerance;

function pinsMatch(a: PinState, b: PinState, tolerance: number): boolean {
  return (
    a.held === b.held &&
    near(a.v1, b.v1, tolerance) &&
    near(a.v2, b.v2, tolerance) &&
    near(a.branch1, b.branch1, tolerance) &&
    near(a.branch2, b.branch2, tolerance) &&
    (a.clampCurrent === 0) === (b.clampCurrent === 0) &&
    (!a.held || (near(a.heldInput, b.heldInput, tolerance) && near(a.heldOutput, b.heldOutput, tolerance))) &&
    near(a.lastWave, b.lastWave, tolerance)
  );
}

export class BitReplays {
  private readonly byKey = new Map<string, BitSnapshot[]>();

  constructor(readonly tolerance: number) {}

  take(step: number, key: string, streams: WaveChunk[], junctions: Float64Array, pin: PinState, farFrom: number, arrivalsFrom: number): BitSnapshot {
    const snapshot: BitSnapshot = {
      step,
      key,
      streamOffsets: streams.map((s) => s.offsets.slice(0, s.count)),
      streamValues: streams.map((s) => s.values.slice(0, s.count)),
      junctions: junctions.slice(),
      pin: { ...pin },
      farFrom,
      arrivalsFrom,
      next: null,
      farTo: -1,
      arrivalsTo: -1,
      clampPeak: 0,
      clampPeakAt: -1,
    };
    const list = this.byKey.get(key);
    if (list) list.push(snapshot);
    else this.byKey.set(key, [snapshot]);
    return snapshot;
  }

  /** An earlier snapshot with the same key, solved through to the next bit, whose state lies within the tolerance of this one. */
  find(key: string, streams: WaveChunk[], junctions: Float64Array, pin: PinState): BitSnapshot | null {
    const list = this.byKey.get(key);
    if (!list) return null;
    const tolerance = this.tolerance;
    search: for (let c = list.length - 1; c >= 0; c -= 1) {
      const candidate = list[c];
      if (candidate.next === null || !pinsMatch(candidate.pin, pin, tolerance)) continue;
      for (let j = 0; j < junctions.length; j += 1) if (!near(candidate.junctions[j], junctions[j], tolerance)) continue search;
      for (let s = 0; s < streams.length; s += 1) {
        const offsets = candidate.streamOffsets[s];
        const stream = streams[s];
        if (runsDiffer(offsets, candidate.streamValues[s], offsets.length, stream.offsets, stream.values, stream.count, tolerance)) continue search;
      }
      return candidate;
    }
    return null;
  }
}

/** Puts a snapshot's waves into the streams' read chunks. */
export function restoreStreams(snapshot: BitSnapshot, streams: WaveChunk[]): void {
  for (let s = 0; s < streams.length; s += 1) {
    const offsets = snapshot.streamOffsets[s];
    streams[s].offsets.set(offsets);
    streams[s].values.set(snapshot.streamValues[s]);
    streams[s].count = offsets.length;
  }
}

/**
 * After a chunk cut short at `cut` steps (a bit's first step), the waves in flight for the next
 * full chunk: what the read chunk still holds from `cut` on, then what was written during the
 * short chunk. Built in `spare`, which becomes the read chunk; returns the chunk left spare.
 */
export function rephase(read: WaveChunk, written: WaveChunk, cut: number, length: number, spare: WaveChunk): WaveChunk {
  spare.count = 0;
  let run = 0;
  while (run + 1 < read.count && read.offsets[run + 1] <= cut) run += 1;
  spare.push(0, read.values[run]);
  for (let k = run + 1; k < read.count; k += 1) spare.push(read.offsets[k] - cut, read.values[k]);
  const tail = length - cut;
  for (let k = 0; k < written.count; k += 1) spare.push(written.offsets[k] + tail, written.values[k]);
  return read;
}
