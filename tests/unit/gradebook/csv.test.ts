import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { assembleGradebook, gradebookCsv, gradebookFileName, gradebookItems, type LearnerRow } from "@/lib/gradebook";

const items = gradebookItems(getCourse());
const now = new Date("2026-03-01T09:30:00Z");

function bookOf(names: string[]) {
  const learners: LearnerRow[] = names.map((name, i) => ({
    learnerId: `l${i}`,
    name,
    email: `l${i}@school.example`,
    active: true,
    enrolledAt: now,
    lastLessonActivityAt: null,
  }));
  return assembleGradebook({
    items,
    learners,
    cells: [{ learnerId: "l0", kind: "lab", slug: items[0].slug, bestScore: 87, passed: true, attempts: 2, failedAttempts: 1, lastActivityAt: now, benchStatus: null }],
    cohortStartsOn: "2026-03-01",
    now,
  });
}

describe("grade book CSV", () => {
  const tricky = ['Ana "Sparks" Oduya, jr.', "Line\nbreak", "=1+2", "+44 20 0000", "@handle", "-5", " padded "];
  const text = gradebookCsv(bookOf(tricky));

  it("starts with a byte order mark and ends lines with CRLF", () => {
    expect(text.startsWith("\uFEFF")).toBe(true);
    expect(text.split("\r\n")[0]).toContain("Learner,E-mail,Account,");
  });

  it("reads back to the same names through a CSV parser, quotes and commas intact", () => {
    const parsed = Papa.parse<string[]>(text.slice(1), { newline: "\r\n" });
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header.slice(0, 5)).toEqual(["Learner", "E-mail", "Account", `Lab 1 (${items[0].title}) best score`, "Lab 1 passed"]);
    expect(header).toHaveLength(3 + items.length * 2 + 4);
    expect(rows.map((row) => row[0])).toEqual([
      'Ana "Sparks" Oduya, jr.',
      "Line\nbreak",
      "'=1+2",
      "'+44 20 0000",
      "'@handle",
      "'-5",
      " padded ",
    ]);
    expect(rows[0].slice(3, 5)).toEqual(["87", "yes"]);
    expect(rows[1].slice(3, 5)).toEqual(["", "no"]);
  });

  it("quotes a field with a quote by doubling it (RFC 4180)", () => {
    expect(text).toContain('"Ana ""Sparks"" Oduya, jr."');
    expect(text).toContain("\"'=1+2\"");
  });
});

describe("download file name", () => {
  it("is plain ASCII from the cohort's name and the date", () => {
    expect(gradebookFileName("Data lines — January evenings", now)).toBe("gradebook-data-lines-january-evenings-2026-03-01.csv");
    expect(gradebookFileName("Façade & Co. «night»", now)).toBe("gradebook-facade-co-night-2026-03-01.csv");
    expect(gradebookFileName("———", now)).toBe("gradebook-cohort-2026-03-01.csv");
  });
});
