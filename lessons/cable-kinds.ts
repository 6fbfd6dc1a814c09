import { z } from "zod";

/**
 * The cable kinds of the simulator's catalogue (docs/simulator.md). Kept here as a zod enum so lesson
 * and lab data can be validated without loading the simulator; a unit test holds it equal to the
 * simulator's own `CABLE_KINDS`.
 */
export const LESSON_CABLE_KINDS = ["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"] as const;

export const cableKindSchema = z.enum(LESSON_CABLE_KINDS);
export type CableKind = z.infer<typeof cableKindSchema>;
