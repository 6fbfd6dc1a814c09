import { OUTCOME_WORDS, RECEIVER_DEFAULTS } from "@/lib/sim";

/**
 * The receiver model as the lessons teach it (lessons 2 and 5 print the same block), with every
 * figure taken from the simulator's own defaults, for a pixel at `supply` volts. The block quotes
 * them as placeholders of the shared numbers (lessons/numbers/shared-numbers.ts).
 */

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

export const RECEIVER_MODEL_MARKDOWN = `
## Two judgements of every run

The course's simulator, the workbench and the labs judge every run two ways, and always say the result in the same words:

- **"${OUTCOME_WORDS.guaranteed}"** (guaranteed): the run decodes for a pixel that switches *anywhere* between its low threshold ({{sim.lowThreshold}} × VDD, {{pixel.low|dp=2}} at {{pixel.vdd}}) and its high threshold ({{sim.highThreshold}} × VDD, {{pixel.high|dp=2}}), with no hysteresis, and nothing turns back through that band inside a pulse or a gap. The datasheet promises nothing more, so this is what a design can promise on every part.
- **"${OUTCOME_WORDS.typical}"** (typical): the run decodes for a pixel that switches between {{typical.bottomFraction}} × VDD and {{typical.topFraction}} × VDD ({{typical.bottom}} to {{typical.top}} at {{pixel.vdd}}) with {{typical.hysteresisFraction}} × VDD ({{typical.hysteresis}}) of hysteresis: such a pixel reads a rise once the input passes its switching point plus half the hysteresis, and a fall once it drops below the switching point minus half. No datasheet gives these figures: they are the course's stated assumption of where most parts switch, spread over parts and temperature.
- **"${OUTCOME_WORDS.fails}"**: even a typical pixel reads a wrong bit.

No datasheet promises a filter against short glitches either, so none is assumed: ringing that turns back through a switching point for a few nanoseconds counts as much as a long dip. Each judgement comes with its own margins, in time and in volts: how far the run stays from being misread at the worst switching point of its band. Both sets are on the workbench under the scope view.
`;
