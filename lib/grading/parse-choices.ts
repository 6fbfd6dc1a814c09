import { labChoicesSchemaFor, type Lab, type LabChoices, type LabVariant } from "@/lessons";
import { issuesOf, type InputIssue } from "./input-error";

/**
 * The learner's choices checked against what their variant of the lab offers (E-series value in
 * range, cable or driver on offer, timing on the control's steps); each problem is named by its
 * field as `choices.<run>.<field>`.
 */
export function parseLabChoices(lab: Lab, variant: LabVariant, choices: unknown): { choices: LabChoices; issues: InputIssue[] } {
  const parsed = labChoicesSchemaFor(lab, variant).safeParse(choices);
  return parsed.success ? { choices: parsed.data as LabChoices, issues: [] } : { choices: {}, issues: issuesOf(parsed.error, ["choices"]) };
}
