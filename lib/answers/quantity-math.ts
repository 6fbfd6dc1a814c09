import {
  type Unit,
  addDependencies,
  create,
  divideDependencies,
  expDependencies,
  log10Dependencies,
  logDependencies,
  multiplyDependencies,
  parseDependencies,
  powDependencies,
  sqrtDependencies,
  subtractDependencies,
  unaryMinusDependencies,
  unitDependencies,
} from "mathjs";

/**
 * A mathjs instance built from only the pieces a learner's entry needs: the parser, units and
 * plain arithmetic. Entries are parsed here but never handed to mathjs's own evaluator (see
 * evaluate-entry.ts), so nothing a learner types can reach import, function definitions or scope.
 */
export const quantityMath = create({
  parseDependencies,
  unitDependencies,
  addDependencies,
  subtractDependencies,
  multiplyDependencies,
  divideDependencies,
  powDependencies,
  unaryMinusDependencies,
  sqrtDependencies,
  logDependencies,
  log10Dependencies,
  expDependencies,
});

export type QuantityUnit = Unit;
