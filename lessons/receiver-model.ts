import { OUTCOME_WORDS, RECEIVER_DEFAULTS } from "@/lib/sim";

/**
 * The receiver model as the lessons teach it (lessons 2 and 5 print the same block), with every
 * figure taken from the simulator's own defaults, for a pixel at `supply` volts.
 */

const fraction = (x: number) => x.toFixed(2).replace(/0$/, "");
const volts = (v: number) => `${v.toFixed(2)} V`;

export function receiverLevels(supply: number) {
  const d = RECEIVER_DEFAULTS;
  const top = (d.typicalSwitchingPoint + d.typicalSpread) * supply;
  const bottom = (d.typicalSwitchingPoint - d.typicalSpread) * supply;
  const hysteresis = d.typicalHysteresis * supply;
  return {
    high: d.highThreshold * supply,
    low: d.lowThreshold * supply,
    typicalTop: top,
    typicalBottom: bottom,
    hysteresis,
    /** The highest level at which a typical pixel reads a rise, and the lowest at which it reads a fall. */
    highestRise: top + hysteresis / 2,
    lowestFall: bottom - hysteresis / 2,
    /** Where a pixel switching at the top of the typical band reads a fall. */
    topFall: top - hysteresis / 2,
  };
}

const at5 = receiverLevels(5);
const d = RECEIVER_DEFAULTS;

export const RECEIVER_MODEL_MARKDOWN = `
## Two judgements of every run

The course's simulator, the workbench and the labs judge every run two ways, and always say the result in the same words:

- **"${OUTCOME_WORDS.guaranteed}"** (guaranteed): the run decodes for a pixel that switches *anywhere* between its low threshold (${fraction(d.lowThreshold)} × VDD, ${volts(at5.low)} at 5 V) and its high threshold (${fraction(d.highThreshold)} × VDD, ${volts(at5.high)}), with no hysteresis, and nothing turns back through that band inside a pulse or a gap. The datasheet promises nothing more, so this is what a design can promise on every part.
- **"${OUTCOME_WORDS.typical}"** (typical): the run decodes for a pixel that switches between ${fraction(d.typicalSwitchingPoint - d.typicalSpread)} × VDD and ${fraction(d.typicalSwitchingPoint + d.typicalSpread)} × VDD (${volts(at5.typicalBottom)} to ${volts(at5.typicalTop)} at 5 V) with ${fraction(d.typicalHysteresis)} × VDD (${volts(at5.hysteresis)}) of hysteresis: such a pixel reads a rise once the input passes its switching point plus half the hysteresis, and a fall once it drops below the switching point minus half. No datasheet gives these figures: they are the course's stated assumption of where most parts switch, spread over parts and temperature.
- **"${OUTCOME_WORDS.fails}"**: even a typical pixel reads a wrong bit.

No datasheet promises a filter against short glitches either, so none is assumed: ringing that turns back through a switching point for a few nanoseconds counts as much as a long dip. Each judgement comes with its own margins, in time and in volts: how far the run stays from being misread at the worst switching point of its band. Both sets are on the workbench under the scope view.
`;
