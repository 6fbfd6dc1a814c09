import { readFile } from "node:fs/promises";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import type { Color, PDFDocument, PDFFont, PDFPage } from "pdf-lib";
import { woff2ToTrueType } from "./woff2-to-truetype";

// The certificate is set in the app's own typeface, the Inter files the web pages load. Each file
// covers one script range; the first holds Latin, the others are embedded only when a name or title
// needs a character from them.

const subsets = ["latin", "latin-ext", "cyrillic", "cyrillic-ext", "greek", "greek-ext", "vietnamese"] as const;
const fontDir = path.join(process.cwd(), "node_modules", "@fontsource-variable", "inter", "files");

type LoadedFont = { trueType: Uint8Array; codePoints: ReadonlySet<number> };

let loading: Promise<LoadedFont[]> | undefined;

/** Decoded once per process: a decode costs tens of milliseconds and the files never change. */
function loadFonts(): Promise<LoadedFont[]> {
  loading ??= Promise.all(
    subsets.map(async (subset) => {
      const trueType = woff2ToTrueType(await readFile(path.join(fontDir, `inter-${subset}-wght-normal.woff2`)));
      return { trueType, codePoints: new Set(fontkit.create(Buffer.from(trueType)).characterSet) };
    }),
  ).catch((error: unknown) => {
    loading = undefined;
    throw error;
  });
  return loading;
}

export type TextStyle = { size: number; color: Color };

/** Draws and measures text, switching font file within a line wherever a character needs another script. */
export class CertificateText {
  private constructor(private readonly fonts: { font: PDFFont; codePoints: ReadonlySet<number> }[]) {}

  /** Embeds the Latin file and whichever others `texts` need, as subsets with real, extractable text. */
  static async embed(doc: PDFDocument, texts: string[]): Promise<CertificateText> {
    doc.registerFontkit(fontkit);
    const loaded = await loadFonts();
    const wanted = new Set([0]);
    for (const codePoint of texts.flatMap((text) => [...text].map((char) => char.codePointAt(0)!))) {
      if (loaded[0]!.codePoints.has(codePoint)) continue;
      const index = loaded.findIndex((font) => font.codePoints.has(codePoint));
      if (index > 0) wanted.add(index);
    }
    const fonts = await Promise.all(
      [...wanted].sort((a, b) => a - b).map(async (index) => ({
        font: await doc.embedFont(loaded[index]!.trueType, { subset: true }),
        codePoints: loaded[index]!.codePoints,
      })),
    );
    return new CertificateText(fonts);
  }

  /** Consecutive characters that one font draws; characters no file has fall to the Latin one. */
  private runs(text: string): { font: PDFFont; text: string }[] {
    const runs: { font: PDFFont; text: string }[] = [];
    for (const char of text) {
      const codePoint = char.codePointAt(0)!;
      const font = (this.fonts.find((entry) => entry.codePoints.has(codePoint)) ?? this.fonts[0]!).font;
      const last = runs.at(-1);
      if (last && last.font === font) last.text += char;
      else runs.push({ font, text: char });
    }
    return runs;
  }

  width(text: string, size: number): number {
    return this.runs(text).reduce((sum, run) => sum + run.font.widthOfTextAtSize(run.text, size), 0);
  }

  /** The largest size up to `size` at which the text fits `maxWidth`, not below `minSize`. */
  fitSize(text: string, size: number, maxWidth: number, minSize: number): number {
    const width = this.width(text, size);
    return width <= maxWidth ? size : Math.max(minSize, Math.floor((size * maxWidth) / width * 10) / 10);
  }

  draw(page: PDFPage, text: string, at: { x: number; y: number }, style: TextStyle): void {
    let x = at.x;
    for (const run of this.runs(text)) {
      page.drawText(run.text, { x, y: at.y, size: style.size, font: run.font, color: style.color });
      x += run.font.widthOfTextAtSize(run.text, style.size);
    }
  }

  drawCentred(page: PDFPage, text: string, at: { centreX: number; y: number }, style: TextStyle): void {
    this.draw(page, text, { x: at.centreX - this.width(text, style.size) / 2, y: at.y }, style);
  }

  drawRight(page: PDFPage, text: string, at: { rightX: number; y: number }, style: TextStyle): void {
    this.draw(page, text, { x: at.rightX - this.width(text, style.size), y: at.y }, style);
  }
}
