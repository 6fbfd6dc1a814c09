import { describe, expect, it } from "vitest";
import { detectSeparator, maxRosterRows, parseRosterCsv, type RosterEntry } from "@/lib/enrolment/roster-csv";

function entriesOf(text: string): RosterEntry[] {
  const parsed = parseRosterCsv(text);
  if (!parsed.ok) throw new Error(`expected a roster, got: ${parsed.problem}`);
  return parsed.entries;
}

function problemOf(text: string): string {
  const parsed = parseRosterCsv(text);
  if (parsed.ok) throw new Error("expected the file to be refused");
  return parsed.problem;
}

describe("separators", () => {
  it("reads commas, semicolons and tabs, whichever the header uses", () => {
    for (const separator of [",", ";", "\t"]) {
      const entries = entriesOf(`name${separator}email\nIda Marsh${separator}ida@school.example\n`);
      expect(entries).toEqual([{ row: 2, name: "Ida Marsh", email: "ida@school.example", problem: null }]);
    }
  });

  it("ignores separators inside quotes when choosing", () => {
    expect(detectSeparator('"Marsh, Ida";ida@school.example')).toBe(";");
    expect(detectSeparator('"a;b;c",x')).toBe(",");
    expect(detectSeparator("justone")).toBe(",");
  });
});

describe("headers", () => {
  it("accepts the usual spellings of the two columns, in any order and case", () => {
    for (const header of ["Name,E-mail", "E-Mail Address;Full name", "EMAIL,learner", "student name\te_mail", "Name,Mail"]) {
      const separator = header.includes(";") ? ";" : header.includes("\t") ? "\t" : ",";
      const [nameFirst] = header.toLowerCase().split(separator);
      const values = /mail/.test(nameFirst!) ? ["ida@school.example", "Ida Marsh"] : ["Ida Marsh", "ida@school.example"];
      const [entry] = entriesOf(`${header}\n${values.join(separator)}`);
      expect(entry, header).toMatchObject({ name: "Ida Marsh", email: "ida@school.example", problem: null });
    }
  });

  it("joins first and last name columns", () => {
    const [entry] = entriesOf("First name,Last name,Email\nIda,Marsh,ida@school.example\n");
    expect(entry).toMatchObject({ name: "Ida Marsh", email: "ida@school.example" });
  });

  it("ignores extra columns it does not know", () => {
    const [entry] = entriesOf("id,name,phone,email\n7,Ida Marsh,555 0100,ida@school.example\n");
    expect(entry).toMatchObject({ name: "Ida Marsh", email: "ida@school.example", problem: null });
  });

  it("reads a file without a header when one column holds addresses", () => {
    const parsed = parseRosterCsv("Ida Marsh,ida@school.example\nOle Brandt,ole@school.example\n");
    expect(parsed).toMatchObject({ ok: true, hasHeader: false });
    expect(entriesOf("Ida Marsh,ida@school.example\n").map((entry) => entry.row)).toEqual([1]);
  });

  it("refuses a file whose columns cannot be found, saying what is expected", () => {
    expect(problemOf("who,where\nIda,Leeds\n")).toMatch(/first line should name them/);
    expect(problemOf("email\nida@school.example\n")).toMatch(/no name column/);
    expect(problemOf("name,email\n")).toMatch(/no learners/);
    expect(problemOf("")).toBe("The file is empty.");
    expect(problemOf("\uFEFF \n\n")).toBe("The file is empty.");
  });
});

describe("text as spreadsheets write it", () => {
  it("drops a byte-order mark so the first header is still recognised", () => {
    const [entry] = entriesOf("\uFEFFname;e-mail\r\nIda Marsh;ida@school.example\r\n");
    expect(entry).toMatchObject({ name: "Ida Marsh", email: "ida@school.example", problem: null });
  });

  it("keeps separators and quotes inside quoted fields", () => {
    const entries = entriesOf('name,email\n"Marsh, Ida",ida@school.example\n"Ole ""Bench"" Brandt",ole@school.example\n');
    expect(entries.map((entry) => entry.name)).toEqual(["Marsh, Ida", 'Ole "Bench" Brandt']);
  });

  it("trims spaces around values and skips blank lines, keeping spreadsheet row numbers", () => {
    const entries = entriesOf("name , email\n\n  Ida Marsh  ,  ida@school.example \n,\nOle Brandt,ole@school.example\n");
    expect(entries).toEqual([
      { row: 3, name: "Ida Marsh", email: "ida@school.example", problem: null },
      { row: 5, name: "Ole Brandt", email: "ole@school.example", problem: null },
    ]);
  });

  it("counts a quoted line break as part of one row", () => {
    const entries = entriesOf('name,email\n"Ida\nMarsh",ida@school.example\nOle Brandt,ole@school.example\n');
    expect(entries.map((entry) => entry.row)).toEqual([2, 3]);
  });
});

describe("malformed rows", () => {
  it("flags a row with too few fields", () => {
    const [entry] = entriesOf("name;email\nIda Marsh\n");
    expect(entry!.problem).toBe("This row has 1 field; a name and an e-mail separated by semicolons are needed.");
  });

  it("flags a row with more filled fields than the header, hinting at the missing quotes", () => {
    const [entry] = entriesOf("name,email\nMarsh, Ida,ida@school.example\n");
    expect(entry!.problem).toMatch(/has 3 fields but the header has 2.*quotes/);
  });

  it("accepts trailing empty fields a spreadsheet adds", () => {
    const [entry] = entriesOf("name,email\nIda Marsh,ida@school.example,,\n");
    expect(entry!.problem).toBeNull();
  });

  it("flags an unclosed quote and says how many lines it swallowed", () => {
    const entries = entriesOf('name,email\nIda Marsh,ida@school.example\n"Ole Brandt,ole@school.example\nEve Lund,eve@school.example\n');
    expect(entries).toHaveLength(2);
    expect(entries[0]!.problem).toBeNull();
    expect(entries[1]!.problem).toMatch(/never closed.*The 2 lines after it/);
  });

  it("refuses more rows than one import takes", () => {
    const rows = Array.from({ length: maxRosterRows + 1 }, (_, i) => `P${i},p${i}@school.example`);
    expect(problemOf(`name,email\n${rows.join("\n")}`)).toMatch(/at most 10000/);
  });
});
