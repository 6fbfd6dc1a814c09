import type { CableKind } from "./cable-kinds";
import { buffer5v, controllerPin3v3 } from "./drivers";
import type { CheckRun } from "./schema";

// Runs for the lessons' non-numeric quick checks, written as the installer would set them up.

export function bufferRun(cable: CableKind, length: number, seriesResistance: number): CheckRun {
  return { driver: buffer5v, cable, length, seriesResistance };
}

export function pinRun(cable: CableKind, length: number, seriesResistance: number): CheckRun {
  return { driver: controllerPin3v3, cable, length, seriesResistance };
}

/** The changes every diagnose check offers: three times the resistance or a third of it, twisted pair, a level shifter. */
export const courseFixes = { resistanceFactor: 3, cable: "twisted-pair" } as const;
