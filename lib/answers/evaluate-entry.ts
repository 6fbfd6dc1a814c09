import { isConstantNode, isFunctionNode, isOperatorNode, isParenthesisNode, isSymbolNode, type MathNode } from "mathjs";
import { quantityMath, type QuantityUnit } from "./quantity-math";

export type EntryValue = number | QuantityUnit;

type Arithmetic = {
  add(a: EntryValue, b: EntryValue): EntryValue;
  subtract(a: EntryValue, b: EntryValue): EntryValue;
  multiply(a: EntryValue, b: EntryValue): EntryValue;
  divide(a: EntryValue, b: EntryValue): EntryValue;
  pow(a: EntryValue, b: number): EntryValue;
  unaryMinus(a: EntryValue): EntryValue;
  sqrt(a: EntryValue): EntryValue;
  log(a: EntryValue, base?: EntryValue): EntryValue;
  log10(a: EntryValue): EntryValue;
  exp(a: EntryValue): EntryValue;
};

// mathjs's typings describe every overload over matrices too; entries only ever hold numbers and units.
const math = quantityMath as unknown as Arithmetic;

export class EntryError extends Error {
  override name = "EntryError";
}

const operators: Record<string, (...args: EntryValue[]) => EntryValue> = {
  add: (a, b) => math.add(a, b),
  subtract: (a, b) => math.subtract(a, b),
  multiply: (a, b) => math.multiply(a, b),
  divide: (a, b) => math.divide(a, b),
  pow: (a, b) => {
    if (typeof b !== "number") throw new EntryError("an exponent must be a plain number");
    return math.pow(a, b);
  },
  unaryMinus: (a) => math.unaryMinus(a),
  unaryPlus: (a) => a,
};

// ln is what the lessons write; mathjs calls the natural logarithm log.
const functions: Record<string, { arity: readonly [number, number]; apply: (...args: EntryValue[]) => EntryValue }> = {
  sqrt: { arity: [1, 1], apply: (a) => math.sqrt(a) },
  ln: { arity: [1, 1], apply: (a) => math.log(a) },
  log: { arity: [1, 2], apply: (a, base) => (base === undefined ? math.log(a) : math.log(a, base)) },
  log10: { arity: [1, 1], apply: (a) => math.log10(a) },
  exp: { arity: [1, 1], apply: (a) => math.exp(a) },
};

const constants: Record<string, number> = { pi: Math.PI };

/**
 * Evaluates a parsed entry over a whitelist: numbers, unit names, + − × ÷ ^, brackets, pi and a
 * few functions (sqrt, ln/log, log10, exp). Anything else (assignments, function definitions,
 * property access, matrices, strings, other functions) is refused rather than evaluated.
 */
export function evaluateEntry(node: MathNode): EntryValue {
  if (isConstantNode(node)) {
    if (typeof node.value !== "number") throw new EntryError("only numbers are allowed as constants");
    return node.value;
  }
  if (isParenthesisNode(node)) return evaluateEntry(node.content);
  if (isSymbolNode(node)) {
    if (Object.hasOwn(constants, node.name)) return constants[node.name]!;
    if (!quantityMath.Unit.isValuelessUnit(node.name)) throw new EntryError(`unknown unit ${node.name}`);
    return quantityMath.unit(node.name);
  }
  if (isOperatorNode(node)) {
    if (!Object.hasOwn(operators, node.fn)) throw new EntryError(`operator ${node.fn} is not allowed`);
    return operators[node.fn]!(...node.args.map(evaluateEntry));
  }
  if (isFunctionNode(node)) {
    const name = isSymbolNode(node.fn) ? node.fn.name : "";
    const known = Object.hasOwn(functions, name) ? functions[name]! : null;
    if (!known || node.args.length < known.arity[0] || node.args.length > known.arity[1]) {
      throw new EntryError(`function ${name || "expression"} is not allowed here`);
    }
    return known.apply(...node.args.map(evaluateEntry));
  }
  throw new EntryError(`${node.type} is not allowed`);
}
