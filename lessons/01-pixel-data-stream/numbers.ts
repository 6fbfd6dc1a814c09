import { cableCatalogue, CABLE_KINDS, colourBits, type Colour } from "@/lib/sim";
import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { frameTime } from "../numbers/line-formulas";
import type { PlainNumber } from "../numbers/plain-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";

const { bitPeriod, zeroHigh, oneHigh, decisionTime, wordBits, latchGap } = sharedNumbers.sim;
const T_BIT = bitPeriod.value;
const WORD_BITS = wordBits.value;
const WORD_TIME = WORD_BITS * T_BIT;
const PREMISE = "the lesson's worked example (a premise)";

/** A long latch gap some parts need (their datasheets give it); the lesson's frame examples use it. */
const LONG_LATCH = 280e-6;

/** How many bits of a GRB colour word are 1 and 0, and how long the line is high for it. */
function colourWord(colour: Colour) {
  const bits = colourBits([colour], "GRB");
  const ones = [...bits].filter((b) => b === "1").length;
  const zeros = bits.length - ones;
  const source = "count of the GRB word's bits (lib/sim colourBits) × the default high times";
  return {
    ones: q(ones, "", 0, source),
    zeros: q(zeros, "", 0, source),
    onesHigh: q(ones * oneHigh.value, "µs", 1, source),
    zerosHigh: q(zeros * zeroHigh.value, "µs", 1, source),
    high: q(ones * oneHigh.value + zeros * zeroHigh.value, "µs", 1, source),
  };
}

function frameRow(pixels: number) {
  const frame = frameTime(pixels, WORD_BITS, T_BIT, LONG_LATCH);
  const refresh = 1 / frame;
  return {
    pixels: q(pixels, "", 0, PREMISE),
    data: q(pixels * WORD_TIME, "ms", 2, "N × 24 × T_bit"),
    frame: q(frame, "ms", 2, "T_frame = N × 24 × T_bit + T_latch"),
    refresh: q(refresh, "Hz", Math.max(0, 2 - Math.floor(Math.log10(refresh))), "f = 1 / T_frame, to three figures"),
  };
}

/** Most pixels one output can refresh at `rate` with a latch gap of `latch`. */
function pixelsFor(rate: number, latch: number) {
  const available = 1 / rate - latch;
  const exact = available / WORD_TIME;
  const source = "N_max = (1 / f − T_latch) / (24 × T_bit), rounded down";
  return {
    rate: q(rate, "Hz", 0, PREMISE),
    period: q(1 / rate, "ms", 3, "1 / f"),
    available: q(available, "ms", 3, "1 / f − T_latch"),
    exact: q(exact, "", 1, source),
    max: q(Math.floor(exact), "", 0, source),
  };
}

/** The figure's bits, whose length `figureSlots` quotes. */
export const FIGURE_BITS = "01101000";
const smooth = pixelsFor(60, LONG_LATCH);
const PIXEL_CURRENT = 60e-3;
const POWERED_PIXELS = 300;
const LATE_LENGTH = 10;
const delays = CABLE_KINDS.map((kind) => LATE_LENGTH * cableCatalogue[kind].delayPerMetre);
const channelBits = WORD_BITS / 3;

export const numbers = {
  margin: {
    zero: q(decisionTime.value - zeroHigh.value, "µs", 1, "decision time − 0-bit high time"),
    one: q(oneHigh.value - decisionTime.value, "µs", 1, "1-bit high time − decision time"),
  },
  figureSlots: q(FIGURE_BITS.length, "", 0, "the length of the pulse-train figure's bit string"),
  channel: {
    bits: q(channelBits, "", 0, "24-bit word over three channels"),
    levels: q(2 ** channelBits, "", 0, "2 to the power of the channel's bits"),
    top: q(2 ** channelBits - 1, "", 0, "the highest channel value"),
  },
  redWord: colourWord([200, 0, 0]),
  wordTime: q(WORD_TIME, "µs", 0, "24 × T_bit"),
  longLatch: q(LONG_LATCH, "µs", 0, "a latch gap some parts need (their datasheets)"),
  rows: { p100: frameRow(100), p200: frameRow(200), p500: frameRow(500), p1000: frameRow(1000) },
  smooth: { ...smooth, oneMore: q(smooth.max.value + 1, "", 0, "one pixel more than N_max") },
  greenWord: colourWord([0, 170, 0]),
  late: {
    length: q(LATE_LENGTH, "m", 0, PREMISE),
    least: q(Math.min(...delays), "ns", 0, "length × the catalogue's smallest delay per metre"),
    most: q(Math.max(...delays), "ns", 0, "length × the catalogue's largest delay per metre"),
  },
  power: {
    perPixel: q(PIXEL_CURRENT, "mA", 0, "rule of thumb of the trade for a three-LED 5 V pixel at full white"),
    pixels: q(POWERED_PIXELS, "", 0, PREMISE),
    total: q(POWERED_PIXELS * PIXEL_CURRENT, "A", 0, "pixels × current per pixel"),
  },
} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";

/**
 * Each learner's premises for the quick checks, away from the worked examples above them (the
 * frame table's pixel counts, the default bit period, the smooth refresh rate), and the answers
 * computed from them.
 */
export const checkGivens = {
  bitRate: [1.0e-6, 1.1e-6, 1.2e-6, 1.3e-6, 1.4e-6].map((period) => ({
    period: q(period, "µs", 2, GIVEN),
    rate: q(1 / period, "kHz", 1, "f = 1 / T"),
  })),
  frameTime: [150, 250, 300, 400, 600].map((pixels) => ({ ...frameRow(pixels), pixels: q(pixels, "", 0, GIVEN) })),
  refresh: [120, 240, 360, 450, 700].map((pixels) => ({ ...frameRow(pixels), pixels: q(pixels, "", 0, GIVEN) })),
  maxPixels: [30, 45, 50, 75, 90].map((rate) => {
    const row = pixelsFor(rate, latchGap.value);
    return { ...row, rate: q(rate, "Hz", 0, GIVEN), nextUp: q(row.max.value + 1, "", 0, "N_max + 1, the rounded-up count that no longer fits") };
  }),
};

export const plainNumbers: PlainNumber[] = [
  { text: "the 128s place, then 64, 32, 16, 8, 4, 2, 1", why: "binary place values" },
  { text: "red 200, green 0, blue 0", why: "the worked example's colour (a premise)" },
  { text: "Write 200 in binary", why: "the worked example's colour" },
  { text: "200 − 128 = 72 → 1 (128s)", why: "the worked conversion to binary; course-numbers.test.ts checks its result against colourBits" },
  { text: "72 − 64 = 8 → 1 (64s)", why: "the worked conversion to binary" },
  { text: "8 < 32 → 0; 8 < 16 → 0", why: "the worked conversion to binary" },
  { text: "8 − 8 = 0 → 1 (8s)", why: "the worked conversion to binary" },
  { text: "(4s, 2s, 1s)", why: "the worked conversion to binary" },
  { text: "So 200 =", why: "the worked conversion to binary" },
  { text: "red 0, green 170, blue 0. 170 is", why: "the quick check's colour (a premise)" },
  { text: "30 to 60 Hz", why: "refresh rates installers aim for (common practice of the trade, as the text says)" },
  { text: "rule 1 or 3", why: "refers to the numbered list above it" },
  { text: "a high time of 0.55 µs for a 0", why: "a poor setting the lab asks the learner to explain (a premise no computation uses)" },
];
