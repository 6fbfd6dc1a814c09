import { readFileSync } from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { describe, expect, it } from "vitest";
import { FontDecodeError, woff2ToTrueType } from "@/lib/certificates/fonts/woff2-to-truetype";

// The decoded font must draw every glyph exactly as the WOFF2 file does (read by fontkit's own
// WOFF2 reader, an independent implementation) and be a well-formed sfnt by the OpenType
// specification's checksum rules ("Calculating checksums", OpenType spec, table directory).

const fontFile = (subset: string) =>
  readFileSync(path.resolve("node_modules/@fontsource-variable/inter/files", `inter-${subset}-wght-normal.woff2`));

function sum32(buffer: Buffer): number {
  let sum = 0;
  for (let i = 0; i < buffer.length; i += 4) sum = (sum + buffer.readUInt32BE(i)) >>> 0;
  return sum;
}

describe("WOFF2 to TrueType", { timeout: 60_000 }, () => {
  for (const subset of ["latin", "latin-ext", "cyrillic"]) {
    it(`keeps every glyph's outline and advance (${subset})`, () => {
      const woff2 = fontFile(subset);
      const fromWoff2 = fontkit.create(woff2);
      const fromTrueType = fontkit.create(woff2ToTrueType(woff2));
      expect(fromTrueType.numGlyphs).toBe(fromWoff2.numGlyphs);
      expect(fromTrueType.characterSet).toEqual(fromWoff2.characterSet);
      let compared = 0;
      for (let id = 0; id < fromWoff2.numGlyphs; id++) {
        const a = fromWoff2.getGlyph(id);
        const b = fromTrueType.getGlyph(id);
        expect(b.path.toSVG(), `glyph ${id}`).toBe(a.path.toSVG());
        expect(b.advanceWidth, `glyph ${id}`).toBe(a.advanceWidth);
        compared += 1;
      }
      expect(compared).toBeGreaterThan(100);
    });
  }

  it("writes a table directory whose checksums hold and a whole-file checksum of 0xB1B0AFBA", () => {
    const font = woff2ToTrueType(fontFile("latin"));
    const numTables = font.readUInt16BE(4);
    let headOffset = -1;
    for (let i = 0; i < numTables; i++) {
      const record = 12 + i * 16;
      const tag = font.toString("latin1", record, record + 4);
      const offset = font.readUInt32BE(record + 8);
      const length = font.readUInt32BE(record + 12);
      const table = Buffer.alloc(Math.ceil(length / 4) * 4);
      font.copy(table, 0, offset, offset + length);
      if (tag === "head") {
        headOffset = offset;
        table.writeUInt32BE(0, 8);
      }
      expect(sum32(table), tag).toBe(font.readUInt32BE(record + 4));
    }
    expect(headOffset).toBeGreaterThan(0);
    expect(font.length % 4).toBe(0);
    expect(sum32(font)).toBe(0xb1b0afba);
  });

  it("refuses data that is not WOFF2", () => {
    expect(() => woff2ToTrueType(new Uint8Array(64))).toThrow(FontDecodeError);
    expect(() => woff2ToTrueType(fontFile("latin").subarray(0, 200))).toThrow();
  });
});
