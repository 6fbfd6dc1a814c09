export { gradeNumericAnswer, parseQuantity, formatInUnit, MAX_ENTRY_LENGTH } from "./parse-quantity";
export { describeExpectedEntry, displayUnit, exampleEntry } from "./quantity-kinds";
export type { NumericGrade, ParsedQuantity, QuantityProblem } from "./parse-quantity";
