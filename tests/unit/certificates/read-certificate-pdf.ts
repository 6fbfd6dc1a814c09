import { inflateSync } from "node:zlib";
import jsQR from "jsqr";
import { PDFDict, PDFDocument, PDFName, PDFNumber, PDFRawStream } from "pdf-lib";

// Reads a certificate PDF back the way a person's viewer would: its text through pdfjs, its
// embedded fonts by name, and the QR code decoded from the pixels of the embedded image.

export type ReadCertificate = { pageCount: number; pageSize: [number, number]; text: string; fontNames: string[]; qrText: string | null };

async function readText(bytes: Uint8Array): Promise<{ pageCount: number; text: string }> {
  const pdfjs = await import("pdfjs-dist/legacy/build/pdf.mjs");
  const pdf = await pdfjs.getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const content = await (await pdf.getPage(n)).getTextContent();
    pages.push(content.items.map((item) => ("str" in item ? item.str : "")).join(""));
  }
  await pdf.destroy();
  return { pageCount: pdf.numPages, text: pages.join("\n") };
}

/** The RGB image streams of the document (alpha masks are grey), decoded to RGBA pixels. */
function readImages(doc: PDFDocument): { width: number; height: number; rgba: Uint8ClampedArray }[] {
  const images: { width: number; height: number; rgba: Uint8ClampedArray }[] = [];
  for (const [, object] of doc.context.enumerateIndirectObjects()) {
    if (!(object instanceof PDFRawStream)) continue;
    const dict = object.dict;
    if (dict.get(PDFName.of("Subtype")) !== PDFName.of("Image")) continue;
    if (dict.get(PDFName.of("ColorSpace")) !== PDFName.of("DeviceRGB")) continue;
    const width = (dict.get(PDFName.of("Width")) as PDFNumber).asNumber();
    const height = (dict.get(PDFName.of("Height")) as PDFNumber).asNumber();
    const rgb = inflateSync(object.contents);
    const rgba = new Uint8ClampedArray(width * height * 4);
    for (let i = 0; i < width * height; i++) {
      rgba[i * 4] = rgb[i * 3]!;
      rgba[i * 4 + 1] = rgb[i * 3 + 1]!;
      rgba[i * 4 + 2] = rgb[i * 3 + 2]!;
      rgba[i * 4 + 3] = 255;
    }
    images.push({ width, height, rgba });
  }
  return images;
}

function readFontNames(doc: PDFDocument): string[] {
  const names: string[] = [];
  for (const [, object] of doc.context.enumerateIndirectObjects()) {
    if (object instanceof PDFDict && object.get(PDFName.of("Type")) === PDFName.of("FontDescriptor")) {
      const hasFile = object.get(PDFName.of("FontFile2")) !== undefined;
      names.push(`${object.get(PDFName.of("FontName"))?.toString() ?? "?"}${hasFile ? " (embedded)" : ""}`);
    }
  }
  return names;
}

export async function readCertificatePdf(bytes: Uint8Array): Promise<ReadCertificate> {
  const doc = await PDFDocument.load(bytes);
  const { width, height } = doc.getPage(0).getSize();
  const { pageCount, text } = await readText(bytes);
  const qr = readImages(doc)
    .map((image) => jsQR(image.rgba, image.width, image.height))
    .find((decoded) => decoded !== null);
  return { pageCount, pageSize: [width, height], text, fontNames: readFontNames(doc), qrText: qr?.data ?? null };
}
