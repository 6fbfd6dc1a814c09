/** What answering a quick check returns to its form. */
export type QuickCheckState =
  | { status: "idle" }
  | { status: "correct" | "incorrect" | "unreadable" | "error"; message: string; entry: string };

export const idleQuickCheckState: QuickCheckState = { status: "idle" };
