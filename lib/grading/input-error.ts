import type { z } from "zod";
import { AppError } from "@/lib/http/errors";

export type InputIssue = { path: string; message: string };

/** A 422 whose field errors are keyed by the full dotted path of each bad value ("choices.main.seriesResistance"). */
export function invalidInput(issues: InputIssue[]): AppError {
  // No prototype: a field named "__proto__" or "constructor" in hostile input must stay a plain key.
  const fieldErrors: Record<string, string[]> = Object.create(null);
  for (const issue of issues) (fieldErrors[issue.path] ??= []).push(issue.message);
  const first = issues[0];
  const summary = first ? `${first.path || "the request"}: ${first.message}` : undefined;
  return new AppError("invalid-input", summary, fieldErrors);
}

/** Each issue at its dotted path; a key that is not allowed is reported at its own path. */
export function issuesOf(error: z.ZodError, prefix: readonly PropertyKey[] = []): InputIssue[] {
  const at = (path: readonly PropertyKey[]) => [...prefix, ...path].map(String).join(".");
  return error.issues.flatMap((issue) =>
    issue.code === "unrecognized_keys"
      ? issue.keys.map((key) => ({ path: at([...issue.path, key]), message: "is not expected here" }))
      : [{ path: at(issue.path), message: issue.message }],
  );
}
