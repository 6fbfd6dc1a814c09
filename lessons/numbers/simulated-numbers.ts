import { quantity, type LessonNumber } from "./lesson-number";
import { simulatedValues } from "./simulated-values";
import { keepSimulated, simulations, type Simulation } from "./simulations";

type Group = keyof typeof simulations;

/** Every recipe's value, recomputed: what lessons/numbers/simulated-values.ts must hold. */
export function computeSimulatedValues(): Record<string, number> {
  return Object.fromEntries(
    Object.entries(simulations).flatMap(([group, recipes]) =>
      Object.entries(recipes).map(([name, recipe]) => [`${group}.${name}`, keepSimulated(recipe.compute())]),
    ),
  );
}

/** A lesson's simulated numbers, from the committed values. */
export function simulatedNumbers<G extends Group>(group: G): Record<keyof (typeof simulations)[G], LessonNumber> {
  const recipes: Record<string, Simulation> = simulations[group];
  return Object.fromEntries(
    Object.entries(recipes).map(([name, recipe]) => {
      const value = simulatedValues[`${group}.${name}`];
      if (value === undefined) throw new Error(`no committed value for ${group}.${name}: run npm run lessons:numbers`);
      return [name, quantity(value, recipe.unit, recipe.decimals, `${recipe.source}; committed in lessons/numbers/simulated-values.ts`)];
    }),
  ) as Record<keyof (typeof simulations)[G], LessonNumber>;
}
