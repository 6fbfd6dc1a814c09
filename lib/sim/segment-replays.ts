/**
 * Recorded stretches of a run between two rests of the line. When the whole line has come to
 * the DC state of a flat drive, the solver sets it there exactly and resumes at the next edge;
 * from then until the next rest, what happens depends only on that state and on the edges
 * ahead (ramps sit on the step grid, so equal edges give equal steps). A pulse train repeats
 * the same few stretches, so each is solved once and later copied, step for step the same as
 * solving it again.
 */
export type SegmentRecording = {
  /** The DC state it starts from: after a rising edge (high) or a falling one. */
  startsHigh: boolean;
  /** Ramp starts of its edges, in steps after the first, and their directions. */
  offsets: Int32Array;
  rising: Uint8Array;
  /** Steps from the first edge to the rest that ends it. */
  restAt: number;
  /** Pin trace breakpoints and near-end arrivals after the first edge, in steps after it, up to and with the rest. */
  farSteps: Int32Array;
  farValues: Float64Array;
  arrivalSteps: Int32Array;
  arrivalValues: Float64Array;
  clampCurrentPeak: number;
  /** Step of the clamp current peak after the first edge; −1 when the clamps stay off. */
  clampPeakAt: number;
};

/** Enough for every pattern of neighbouring bits a colour stream produces, and a bound on memory. */
const CAPACITY = 64;

export class SegmentLibrary {
  private readonly recordings: SegmentRecording[] = [];

  add(recording: SegmentRecording): void {
    if (this.recordings.length < CAPACITY) this.recordings.push(recording);
  }

  /** A recording that fits the edges from `first` on (and ends before the run does), or null. */
  find(startsHigh: boolean, rampStart: Int32Array, rising: Uint8Array, first: number, stepCount: number): SegmentRecording | null {
    const edges = rampStart.length;
    const origin = rampStart[first];
    for (const recording of this.recordings) {
      const count = recording.offsets.length;
      if (recording.startsHigh !== startsHigh || first + count > edges || origin + recording.restAt >= stepCount) continue;
      let fits = first + count === edges || rampStart[first + count] - origin > recording.restAt;
      for (let j = 0; fits && j < count; j += 1) {
        fits = rampStart[first + j] - origin === recording.offsets[j] && rising[first + j] === recording.rising[j];
      }
      if (fits) return recording;
    }
    return null;
  }
}
