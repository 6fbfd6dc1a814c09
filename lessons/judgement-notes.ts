import { RECEIVER_DEFAULTS } from "@/lib/sim";

// Why a lab holds its runs to one judgement or the other (lessons/schema.ts, passRule.judgement),
// in the words the briefs and the workbench show. The two reasons follow from the driver's level.

const percent = (fraction: number) => `${Math.round(fraction * 100)} %`;
const { highThreshold, typicalSwitchingPoint, typicalSpread } = RECEIVER_DEFAULTS;

export const GUARANTEED_WHY = `A 5 V driver into a 5 V pixel clears the datasheet's thresholds with room to spare, so a design can make the promise that holds on every part: the run must work for a pixel switching anywhere between ${percent(RECEIVER_DEFAULTS.lowThreshold)} and ${percent(highThreshold)} of its supply.`;

export const TYPICAL_WHY = `A 3.3 V driver settles below a 5 V pixel's guaranteed high threshold (${percent(highThreshold)} of 5 V), so no resistor can make this run guaranteed: only overshoot ever lifts it above. Typical pixels switch between ${percent(typicalSwitchingPoint - typicalSpread)} and ${percent(typicalSwitchingPoint + typicalSpread)} of their supply, so the run can still work on them; a level shifter to 5 V is what makes such a run guaranteed (lesson 2).`;
