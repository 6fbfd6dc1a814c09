import type { Waveform } from "./waveform";

/**
 * The receiver rule of docs/simulator.md at one switching point: a comparator (a pulse starts
 * when the pin rises through its rise level and ends when it next falls through its fall level),
 * an optional deglitch filter (a state that lasts less than the deglitch time neither starts nor
 * ends a pulse), and bit slots that each must hold exactly one pulse, at least `minPulse` wide and
 * followed by a low of at least `minGap`.
 */

export type Pulse = { start: number; end: number | null };

/** A threshold re-crossing the deglitch filter removed: a dip inside a pulse or a spike between pulses. */
export type FilteredCrossing = { kind: "dip" | "spike"; start: number; duration: number };

export type SlotTiming = {
  sent: 0 | 1;
  /** Driver's rising edge (s). */
  start: number;
  /** Driver's falling edge (s). */
  fall: number;
};

export type DecodedBit = {
  sent: 0 | 1;
  received: "0" | "1" | "x";
  width: number | null;
  timingMargin: number | null;
  start: number;
  /** Far-end slot this bit was read in (s): from the driver's edge plus the line delay. */
  slotStart: number;
  slotEnd: number;
  pulses: Pulse[];
  /** The pulse is narrower than `minPulse`. */
  glitch: boolean;
  /** Low time from this bit's pulse to the next pulse (s); null without a complete pulse or after the last one. */
  gap: number | null;
  /** That low is shorter than `minGap`: the pixel cannot tell where this bit ends. */
  shortGap: boolean;
};

export type ReceiverRule = {
  rise: number;
  fall: number;
  deglitchTime: number;
  minPulse: number;
  minGap: number;
  decisionTime: number;
};

export type Decoding = {
  bits: DecodedBit[];
  /** Pulses that start after the last slot: extra bits the pixel would read. */
  extraPulses: Pulse[];
  filtered: FilteredCrossing[];
};

type Transition = { time: number; high: boolean };

function comparatorTransitions(wave: Waveform, rise: number, fall: number): Transition[] {
  const transitions: Transition[] = [];
  let high = wave.value[0] >= rise;
  if (high) transitions.push({ time: wave.time[0], high: true });
  for (let i = 1; i < wave.count; i += 1) {
    const v = wave.value[i];
    const level = high ? fall : rise;
    if (high ? v <= level : v >= level) {
      const v0 = wave.value[i - 1];
      const t0 = wave.time[i - 1];
      const time = v === v0 ? wave.time[i] : t0 + ((level - v0) / (v - v0)) * (wave.time[i] - t0);
      high = !high;
      transitions.push({ time, high });
    }
  }
  return transitions;
}

function deglitch(raw: Transition[], deglitchTime: number): { accepted: Transition[]; filtered: FilteredCrossing[] } {
  const accepted: Transition[] = [];
  const filtered: FilteredCrossing[] = [];
  let high = false;
  for (let k = 0; k < raw.length; k += 1) {
    const transition = raw[k];
    if (transition.high === high) continue;
    const next = raw[k + 1];
    if (next && next.time - transition.time < deglitchTime) {
      filtered.push({ kind: high ? "dip" : "spike", start: transition.time, duration: next.time - transition.time });
      continue;
    }
    accepted.push(transition);
    high = transition.high;
  }
  return { accepted, filtered };
}

function pulsesFrom(transitions: Transition[]): Pulse[] {
  const pulses: Pulse[] = [];
  for (const transition of transitions) {
    if (transition.high) pulses.push({ start: transition.time, end: null });
    else if (pulses.length > 0) pulses[pulses.length - 1].end = transition.time;
  }
  return pulses;
}

function readSlot(pulses: Pulse[], nextStart: number | undefined, rule: ReceiverRule, sent: 0 | 1) {
  const pulse = pulses.length === 1 ? pulses[0] : null;
  if (!pulse || pulse.end === null) {
    return { received: "x" as const, width: null, timingMargin: null, glitch: false, gap: null, shortGap: false };
  }
  const width = pulse.end - pulse.start;
  const glitch = width < rule.minPulse;
  const gap = nextStart === undefined ? null : nextStart - pulse.end;
  const shortGap = gap !== null && gap < rule.minGap;
  const decisionMargin = sent === 1 ? width - rule.decisionTime : rule.decisionTime - width;
  const received = glitch || shortGap ? "x" : width > rule.decisionTime ? "1" : "0";
  return {
    received: received as DecodedBit["received"],
    width,
    timingMargin: Math.min(decisionMargin, width - rule.minPulse, gap === null ? Infinity : gap - rule.minGap),
    glitch,
    gap,
    shortGap,
  };
}

/** Decodes the far-end waveform at one switching point; slot i spans from its bit's start plus `delay` to the next. */
export function decodeWaveform(
  wave: Waveform,
  slots: SlotTiming[],
  bitPeriod: number,
  delay: number,
  rule: ReceiverRule,
): Decoding {
  const { accepted, filtered } = deglitch(comparatorTransitions(wave, rule.rise, rule.fall), rule.deglitchTime);
  const pulses = pulsesFrom(accepted);
  const bits: DecodedBit[] = [];
  let next = 0;
  for (let i = 0; i < slots.length; i += 1) {
    const slotStart = slots[i].start + delay;
    const slotEnd = (i + 1 < slots.length ? slots[i + 1].start : slots[i].start + bitPeriod) + delay;
    const inSlot: Pulse[] = [];
    while (next < pulses.length && pulses[next].start < slotEnd) {
      inSlot.push(pulses[next]);
      next += 1;
    }
    const reading = readSlot(inSlot, pulses[next]?.start, rule, slots[i].sent);
    bits.push({ sent: slots[i].sent, start: slots[i].start, slotStart, slotEnd, pulses: inSlot, ...reading });
  }
  return { bits, extraPulses: pulses.slice(next), filtered };
}
