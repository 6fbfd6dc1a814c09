export type SimInputIssue = { path: string; message: string };

/** Bad simulator input; `issues` name each offending field by its dotted path. */
export class SimInputError extends Error {
  readonly issues: SimInputIssue[];

  constructor(issues: SimInputIssue[]) {
    super(`invalid simulator input: ${issues.map((issue) => `${issue.path || "(input)"}: ${issue.message}`).join("; ")}`);
    this.name = "SimInputError";
    this.issues = issues;
  }
}

/** The case would need more solver steps (or output points) than the fixed budget allows. */
export class SimSolveBudgetError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "SimSolveBudgetError";
  }
}
