export { gradeNumericAnswer, parseQuantity, formatInUnit, MAX_ENTRY_LENGTH } from "./parse-quantity";
export type { NumericGrade, ParsedQuantity, QuantityProblem } from "./parse-quantity";
