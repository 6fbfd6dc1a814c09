import { labChoicesSchemaFor, type Lab, type LabChoices, type LabVariant } from "@/lessons";
import { invalidInput, issuesOf } from "./input-error";

/**
 * The learner's choices checked against what their variant of the lab offers (E-series value in
 * range, cable or driver on offer, timing on the control's steps). Throws a 422 naming each field
 * as `choices.<run>.<field>`.
 */
export function parseLabChoices(lab: Lab, variant: LabVariant, choices: unknown): LabChoices {
  const parsed = labChoicesSchemaFor(lab, variant).safeParse(choices);
  if (!parsed.success) throw invalidInput(issuesOf(parsed.error, ["choices"]));
  return parsed.data as LabChoices;
}
