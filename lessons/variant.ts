import type { Lab, Scenario } from "./schema";

export interface RunVariant {
  id: string;
  label: string;
  scenario: Scenario;
}

export interface LabVariant {
  lab: string;
  seed: string | null;
  runs: RunVariant[];
}

/**
 * FNV-1a over the seed string, then the murmur3 finaliser: seeds that differ in one character
 * (learner-1, learner-2) must land far apart in the PRNG's state, which FNV alone does not ensure.
 */
function hashSeed(text: string): number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < text.length; i += 1) {
    hash ^= text.charCodeAt(i);
    hash = Math.imul(hash, 0x01000193);
  }
  hash ^= hash >>> 16;
  hash = Math.imul(hash, 0x85ebca6b);
  hash ^= hash >>> 13;
  hash = Math.imul(hash, 0xc2b2ae35);
  hash ^= hash >>> 16;
  return hash >>> 0;
}

/** mulberry32: small, fast and good enough to scatter a handful of lab parameters. */
function mulberry32(state: number): () => number {
  let a = state;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A PRNG drawn from a seed string: the same text always gives the same sequence. */
export function seededRandom(text: string): () => number {
  return mulberry32(hashSeed(text));
}

function pick<T>(items: readonly T[], random: () => number): T {
  return items[Math.floor(random() * items.length)];
}

/** Steps on a grid from min, so a length like 7.5 m stays exactly representable as text. */
function pickOnGrid(min: number, max: number, step: number, random: () => number): number {
  const count = Math.floor((max - min) / step + 1e-9) + 1;
  const index = Math.floor(random() * count);
  return Number((min + index * step).toFixed(6));
}

/** The author's default scenario of every run: what the lesson's worked answer refers to. */
export function defaultVariant(lab: Lab): LabVariant {
  return { lab: lab.slug, seed: null, runs: lab.runs.map((r) => ({ id: r.id, label: r.label, scenario: r.scenario })) };
}

/**
 * The concrete scenario a learner works on: deterministic in (lab, seed), so the grader can
 * rebuild it from the stored seed, and different between learners so answers cannot be copied.
 * The lab slug is mixed into the seed so one learner's variants of different labs are unrelated.
 */
export function labVariant(lab: Lab, seed: string): LabVariant {
  const random = mulberry32(hashSeed(`${lab.slug}\u0000${seed}`));
  const runs = lab.runs.map((run): RunVariant => {
    const scenario: Scenario = { ...run.scenario };
    const { length, cable, driver } = run.variant;
    if (length) scenario.length = pickOnGrid(length.min, length.max, length.step, random);
    if (cable) scenario.cable = pick(cable, random);
    if (driver) scenario.driver = pick(driver, random);
    return { id: run.id, label: run.label, scenario };
  });
  return { lab: lab.slug, seed, runs };
}
