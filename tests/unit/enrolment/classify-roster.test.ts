import { describe, expect, it } from "vitest";
import { classifyRoster, countRoster, emptyRosterContext, rosterEmails, type RosterContext } from "@/lib/enrolment/classify-roster";
import { parseRosterCsv } from "@/lib/enrolment/roster-csv";

function classify(text: string, context: Partial<RosterContext> = {}) {
  const parsed = parseRosterCsv(text);
  if (!parsed.ok) throw new Error(parsed.problem);
  return classifyRoster(parsed.entries, { ...emptyRosterContext, ...context });
}

describe("classifying roster rows", () => {
  it("marks well-formed new people valid and normalises their address", () => {
    const rows = classify("name,email\nIda Marsh, Ida.Marsh@School.Example \n");
    expect(rows).toEqual([{ row: 2, name: "Ida Marsh", email: "ida.marsh@school.example", status: "valid", reason: null }]);
  });

  it("gives invalid rows their reason", () => {
    const rows = classify("name,email\n,nobody@school.example\nIda Marsh,\nOle Brandt,ole-at-school\nEve,eve@school.example,extra\n");
    expect(rows.map((row) => [row.row, row.status, row.reason])).toEqual([
      [2, "invalid", "The name is missing."],
      [3, "invalid", "The e-mail address is missing."],
      [4, "invalid", "“ole-at-school” is not an e-mail address."],
      [5, "invalid", expect.stringMatching(/3 fields/)],
    ]);
  });

  it("refuses names longer than the account form allows", () => {
    const [row] = classify(`name,email\n${"x".repeat(121)},long@school.example\n`);
    expect(row).toMatchObject({ status: "invalid", reason: "Use at most 120 characters." });
  });

  it("keeps the first of two rows with one address and names it in the second", () => {
    const rows = classify("name,email\nIda Marsh,ida@school.example\nIda M.,IDA@school.example\n");
    expect(rows.map((row) => row.status)).toEqual(["valid", "duplicate"]);
    expect(rows[1]!.reason).toBe("Same e-mail address as row 2.");
  });

  it("does not count an invalid row as the first occurrence", () => {
    const rows = classify("name,email\n,ida@school.example\nIda Marsh,ida@school.example\n");
    expect(rows.map((row) => row.status)).toEqual(["invalid", "valid"]);
  });

  it("flags people the school already has, most specific reason first", () => {
    const rows = classify(
      "name,email\nA,in.cohort@school.example\nB,in.school@school.example\nD,invited@school.example\nE,new@school.example\n",
      {
        inCohort: new Set(["in.cohort@school.example"]),
        inSchool: new Set(["in.school@school.example", "in.cohort@school.example"]),
        invited: new Set(["invited@school.example"]),
      },
    );
    expect(rows.map((row) => [row.status, row.reason])).toEqual([
      ["duplicate", "Already in this cohort."],
      ["duplicate", expect.stringMatching(/^Already has an account at this school/)],
      ["duplicate", "Already has an open invitation to this school."],
      ["valid", null],
    ]);
  });

  it("counts each status", () => {
    const rows = classify("name,email\nA,a@school.example\nA,a@school.example\n,b@school.example\n");
    expect(countRoster(rows)).toEqual({ valid: 1, duplicate: 1, invalid: 1, total: 3 });
  });

  it("looks up only well-formed addresses, once each, lower-cased", () => {
    const parsed = parseRosterCsv("name,email\nA,A@School.example\nB,a@school.example\nC,not-an-address\nD,d@school.example,x\n");
    if (!parsed.ok) throw new Error(parsed.problem);
    expect(rosterEmails(parsed.entries)).toEqual(["a@school.example"]);
  });
});
