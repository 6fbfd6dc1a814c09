/**
 * The receiver rule of docs/simulator.md ("The receiver rule"), written independently of lib/sim:
 * a pulse starts when the pin rises through highThreshold·VDD and ends when it next falls through
 * lowThreshold·VDD; re-crossings shorter than deglitchTime neither end nor start a pulse; a pulse
 * narrower than minPulse is a glitch; a slot with exactly one pulse and no glitch is 1 when the width
 * exceeds decisionTime, else 0; anything else is x.
 * A pulse belongs to the slot in which it starts, slots being the driver's slots shifted by the
 * line's delay.
 */
import type { Waveform } from "./waveform-compare";

export interface DecodeSettings {
  supplyVoltage: number;
  highThreshold: number;
  lowThreshold: number;
  deglitchTime: number;
  minPulse: number;
  decisionTime: number;
  leadIn: number;
  bitPeriod: number;
  bitCount: number;
  /** Shift of the slots at the far end: the line delay. */
  slotOffset: number;
}

export interface Pulse {
  start: number;
  end: number;
}

function crossingTime(t0: number, v0: number, t1: number, v1: number, level: number): number {
  return t0 + ((level - v0) / (v1 - v0)) * (t1 - t0);
}

/** Alternating rise/fall events of the hysteresis comparator (rise first). */
function comparatorEvents(wave: Waveform, high: number, low: number): number[] {
  const events: number[] = [];
  let isHigh = wave.value[0] >= high;
  if (isHigh) events.push(wave.time[0]);
  for (let i = 1; i < wave.time.length; i++) {
    const v0 = wave.value[i - 1];
    const v1 = wave.value[i];
    if (!isHigh && v1 >= high && v0 < high) {
      events.push(crossingTime(wave.time[i - 1], v0, wave.time[i], v1, high));
      isHigh = true;
    } else if (isHigh && v1 <= low && v0 > low) {
      events.push(crossingTime(wave.time[i - 1], v0, wave.time[i], v1, low));
      isHigh = false;
    }
  }
  return events;
}

/** Drops each excursion (a crossing followed by the opposite crossing) shorter than the deglitch time. */
function deglitch(events: number[], deglitchTime: number): number[] {
  const kept: { time: number; rising: boolean }[] = [];
  events.forEach((time, i) => {
    const rising = i % 2 === 0;
    const last = kept[kept.length - 1];
    if (last && last.rising !== rising && time - last.time < deglitchTime) kept.pop();
    else kept.push({ time, rising });
  });
  return kept.map((event) => event.time);
}

export function findPulses(wave: Waveform, settings: DecodeSettings): Pulse[] {
  const high = settings.highThreshold * settings.supplyVoltage;
  const low = settings.lowThreshold * settings.supplyVoltage;
  const events = deglitch(comparatorEvents(wave, high, low), settings.deglitchTime);
  const pulses: Pulse[] = [];
  for (let i = 0; i < events.length; i += 2) {
    pulses.push({ start: events[i], end: i + 1 < events.length ? events[i + 1] : Infinity });
  }
  return pulses;
}

export interface DecodedBit {
  received: "0" | "1" | "x";
  width: number | null;
}

export function decodeWaveform(wave: Waveform, settings: DecodeSettings): { decoded: string; bits: DecodedBit[] } {
  const slots: Pulse[][] = Array.from({ length: settings.bitCount }, () => []);
  for (const pulse of findPulses(wave, settings)) {
    const slot = Math.floor((pulse.start - settings.leadIn - settings.slotOffset) / settings.bitPeriod);
    if (slot >= 0 && slot < settings.bitCount) slots[slot].push(pulse);
  }
  const bits = slots.map((pulses): DecodedBit => {
    if (pulses.length !== 1) return { received: "x", width: null };
    const width = pulses[0].end - pulses[0].start;
    if (width < settings.minPulse || !Number.isFinite(width)) return { received: "x", width };
    return { received: width > settings.decisionTime ? "1" : "0", width };
  });
  return { decoded: bits.map((bit) => bit.received).join(""), bits };
}

/**
 * The judgements of docs/simulator.md ("The receiver: two judgements") by brute force: the run
 * decodes as sent at every switching point s of the band, stepped every `step` volts, each read
 * with rise level s + h/2 and fall level s − h/2. With no hysteresis, `edgeBump` (V) stands in for
 * it, as the simulator ignores turns smaller than that on an edge.
 */
export function decodesAcrossBand(
  wave: Waveform,
  settings: DecodeSettings,
  sent: string,
  band: { lowest: number; highest: number; hysteresis: number },
  options: { step: number; edgeBump: number },
): boolean {
  const half = Math.max(band.hysteresis, options.edgeBump) / 2;
  const vdd = settings.supplyVoltage;
  for (let s = band.lowest; s <= band.highest + 1e-9; s += options.step) {
    const at = { ...settings, highThreshold: (s + half) / vdd, lowThreshold: (s - half) / vdd };
    if (decodeWaveform(wave, at).decoded !== sent) return false;
  }
  return true;
}

/**
 * A run's outcome in the simulator's terms, judged by brute force over the bands of
 * docs/simulator.md for the run's supply: guaranteed (0.3–0.7 of VDD, no hysteresis) and typical
 * (the simulator's stated assumption, 0.4–0.6 of VDD with 0.05 of VDD of hysteresis). No input
 * filter: the simulator never credits one.
 */
export function outcomeByBruteForce(wave: Waveform, settings: DecodeSettings, sent: string): "guaranteed" | "typical" | "fails" {
  const vdd = settings.supplyVoltage;
  const unfiltered = { ...settings, deglitchTime: 0 };
  const options = { step: 0.01 * vdd, edgeBump: 0.02 * vdd };
  const typical = decodesAcrossBand(wave, unfiltered, sent, { lowest: 0.4 * vdd, highest: 0.6 * vdd, hysteresis: 0.05 * vdd }, options);
  if (!typical) return "fails";
  return decodesAcrossBand(wave, unfiltered, sent, { lowest: 0.3 * vdd, highest: 0.7 * vdd, hysteresis: 0 }, options) ? "guaranteed" : "typical";
}
