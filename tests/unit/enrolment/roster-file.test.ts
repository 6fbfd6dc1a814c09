import { describe, expect, it } from "vitest";
import { maxRosterFileBytes, readRosterFile } from "@/lib/enrolment/roster-file";

function file(content: BlobPart, name = "roster.csv", type = "text/csv"): File {
  return new File([content], name, { type });
}

describe("reading an uploaded roster", () => {
  it("reads UTF-8 text and drops its byte-order mark", async () => {
    const result = await readRosterFile(file("\uFEFFname,email\nLucía Marsh,lucia@school.example\n"));
    expect(result).toEqual({ ok: true, fileName: "roster.csv", text: "name,email\nLucía Marsh,lucia@school.example\n" });
  });

  it("reads the older Western European code page when the bytes are not UTF-8", async () => {
    const bytes = new Uint8Array([...Buffer.from("name;email\nLuc"), 0xed, ...Buffer.from("a Marsh;lucia@school.example\n")]);
    const result = await readRosterFile(file(bytes));
    expect(result).toMatchObject({ ok: true, text: "name;email\nLucía Marsh;lucia@school.example\n" });
  });

  it("reads UTF-16 text as spreadsheets' Unicode export writes it", async () => {
    const body = Buffer.from("name\temail\nIda Marsh\tida@school.example\n", "utf16le");
    const result = await readRosterFile(file(new Uint8Array([0xff, 0xfe, ...body]), "roster.txt", "text/plain"));
    expect(result).toMatchObject({ ok: true, text: "name\temail\nIda Marsh\tida@school.example\n" });
  });

  it("accepts the label some systems give .csv files, since the content is checked", async () => {
    expect((await readRosterFile(file("name,email\n", "roster.csv", "application/vnd.ms-excel"))).ok).toBe(true);
  });

  it("refuses what is not a CSV file, with a sentence saying what to do", async () => {
    const cases: [File | string | null, RegExp][] = [
      [null, /Choose a CSV file/],
      ["name,email", /Choose a CSV file/],
      [file("", "empty.csv"), /empty/],
      [file("x".repeat(maxRosterFileBytes + 1)), /larger than 900 kB/],
      [file("name,email", "photo.png", "image/png"), /CSV or plain text/],
      [file(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 0]), "roster.csv"), /spreadsheet file.*CSV \(UTF-8\)/],
      [file(new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d]), "roster.csv"), /PDF/],
      [file(new Uint8Array([0x6e, 0x61, 0x00, 0x01, 0x02]), "roster.csv"), /not plain text/],
    ];
    for (const [input, problem] of cases) {
      const result = await readRosterFile(input);
      expect(result.ok, String(problem)).toBe(false);
      if (!result.ok) expect(result.problem).toMatch(problem);
    }
  });
});
