import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { assembleGradebook, gradebookItems, type CellRow, type LearnerRow } from "@/lib/gradebook";

const now = new Date("2026-03-10T12:00:00Z");
const items = gradebookItems(getCourse());
const recent = new Date("2026-03-09T10:00:00Z");
const longAgo = new Date("2026-02-01T10:00:00Z");

function learner(id: string, overrides: Partial<LearnerRow> = {}): LearnerRow {
  return {
    learnerId: id,
    name: `Learner ${id}`,
    email: `${id}@school.example`,
    active: true,
    enrolledAt: new Date("2026-01-05T00:00:00Z"),
    lastLessonActivityAt: null,
    ...overrides,
  };
}

function labCell(learnerId: string, slug: string, overrides: Partial<CellRow> = {}): CellRow {
  return {
    learnerId,
    kind: "lab",
    slug,
    bestScore: 40,
    passed: false,
    attempts: 2,
    failedAttempts: 2,
    lastActivityAt: recent,
    benchStatus: null,
    ...overrides,
  };
}

const assemble = (learners: LearnerRow[], cells: CellRow[]) =>
  assembleGradebook({ items, learners, cells, cohortStartsOn: "2026-01-12", now });

describe("the course's columns", () => {
  it("are its eight labs and two bench exercises in lesson order, each lab before its lesson's bench work", () => {
    expect(items.map((item) => item.label)).toEqual([
      "Lab 1", "Lab 2", "Lab 3", "Lab 4", "Lab 5", "Lab 6", "Lab 7", "Bench 7", "Lab 8", "Bench 8",
    ]);
    expect(items.filter((item) => item.kind === "lab")).toHaveLength(8);
    expect(new Set(items.map((item) => item.key)).size).toBe(items.length);
  });
});

describe("assembling the grid from aggregate rows", () => {
  const [lab1, lab2, lab3] = items.filter((item) => item.kind === "lab");
  const bench7 = items.find((item) => item.kind === "bench")!;

  it("puts each row's figures under its item and leaves untouched items empty", () => {
    const book = assemble(
      [learner("a"), learner("b")],
      [
        labCell("a", lab1.slug, { bestScore: 91, passed: true, attempts: 3, failedAttempts: 2 }),
        labCell("a", lab3.slug, { bestScore: 35 }),
        { ...labCell("a", bench7.slug), kind: "bench", bestScore: 80, passed: true, attempts: 1, failedAttempts: 0, benchStatus: "accepted" },
      ],
    );
    const [a, b] = book.rows;
    const column = (key: string) => items.findIndex((item) => item.key === key);
    expect(a.cells[column(lab1.key)]).toMatchObject({ state: "passed", bestScore: 91, attempts: 3 });
    expect(a.cells[column(lab2.key)]).toMatchObject({ state: "not-started", bestScore: null, attempts: 0 });
    expect(a.cells[column(lab3.key)]).toMatchObject({ state: "trying", bestScore: 35 });
    expect(a.cells[column(bench7.key)]).toMatchObject({ state: "passed", bestScore: 80 });
    expect(a.passedCount).toBe(2);
    expect(a.totalScore).toBe(Math.round((91 + 35 + 80) / items.length));
    expect(a.lastActivityAt).toEqual(recent);
    expect(b.cells.every((cell) => cell.state === "not-started")).toBe(true);
    expect(b.totalScore).toBe(0);
  });

  it("keeps the learners' order and ignores rows of items the course no longer has", () => {
    const book = assemble([learner("z"), learner("a")], [labCell("a", "a-retired-lab", { bestScore: 100, passed: true })]);
    expect(book.rows.map((row) => row.learner.id)).toEqual(["z", "a"]);
    expect(book.rows[1].passedCount).toBe(0);
  });

  it("names a lab failed five times without a pass, and only that lab", () => {
    const book = assemble(
      [learner("a")],
      [
        labCell("a", lab1.slug, { attempts: 5, failedAttempts: 5 }),
        labCell("a", lab2.slug, { attempts: 4, failedAttempts: 4 }),
        labCell("a", lab3.slug, { attempts: 8, failedAttempts: 7, passed: true, bestScore: 70 }),
      ],
    );
    const [row] = book.rows;
    expect(row.standing).toBe("stuck");
    expect(row.attention).toEqual([{ kind: "failing", itemKey: lab1.key, itemLabel: "Lab 1", itemTitle: lab1.title, failedAttempts: 5 }]);
    expect(row.cells[0].state).toBe("stuck");
    expect(row.cells[1].state).toBe("trying");
    expect(book.counts.stuck).toBe(1);
  });

  it("flags a week without activity, counting lesson reading as activity", () => {
    const book = assemble(
      [learner("idle"), learner("reading", { lastLessonActivityAt: recent }), learner("never")],
      [labCell("idle", lab1.slug, { lastActivityAt: longAgo }), labCell("reading", lab1.slug, { lastActivityAt: longAgo })],
    );
    const [idle, reading, never] = book.rows;
    expect(idle.attention).toEqual([{ kind: "idle", idleDays: 37, lastActivityAt: longAgo }]);
    expect(reading.attention).toEqual([]);
    expect(reading.standing).toBe("on-track");
    expect(never.attention).toEqual([{ kind: "idle", idleDays: 57, lastActivityAt: null }]);
    expect(never.standing).toBe("stuck");
  });

  it("calls a learner who has not begun, inside the first week, not started", () => {
    const book = assembleGradebook({ items, learners: [learner("new")], cells: [], cohortStartsOn: "2026-03-08", now });
    expect(book.rows[0].standing).toBe("not-started");
    expect(book.rows[0].attention).toEqual([]);
  });

  it("raises nothing for a learner who has passed every item, or whose account is switched off", () => {
    const everything: CellRow[] = items.map((item) => ({
      ...labCell("done", item.slug, { bestScore: 90, passed: true, lastActivityAt: longAgo }),
      kind: item.kind,
      benchStatus: item.kind === "bench" ? "accepted" : null,
    }));
    const book = assemble(
      [learner("done"), learner("off", { active: false })],
      [...everything, labCell("off", lab1.slug, { attempts: 6, failedAttempts: 6, lastActivityAt: longAgo })],
    );
    const [done, off] = book.rows;
    expect(done.standing).toBe("complete");
    expect(done.passedCount).toBe(items.length);
    expect(done.attention).toEqual([]);
    expect(off.standing).toBe("switched-off");
    expect(off.attention).toEqual([]);
    expect(book.counts).toMatchObject({ complete: 1, "switched-off": 1, stuck: 0 });
  });

  it("shows bench work by its review status", () => {
    const states = (["draft", "submitted", "returned", "accepted"] as const).map((benchStatus) => {
      const book = assemble(
        [learner("a")],
        [{ ...labCell("a", bench7.slug), kind: "bench", benchStatus, passed: benchStatus === "accepted" }],
      );
      return book.rows[0].cells[items.indexOf(bench7)].state;
    });
    expect(states).toEqual(["draft", "waiting", "returned", "passed"]);
  });
});
