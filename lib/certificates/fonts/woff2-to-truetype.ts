import { brotliDecompressSync } from "node:zlib";

// Turns a WOFF2 file back into the plain TrueType font it was made from, following the W3C "WOFF
// File Format 2.0" recommendation (sections 4 and 5: table directory, transformed glyf/loca and
// hmtx). The PDF embedder subsets fonts by copying raw glyf records, which a WOFF2 file does not
// have, so the app's own web font is decoded here first.

const knownTags = [
  "cmap", "head", "hhea", "hmtx", "maxp", "name", "OS/2", "post", "cvt ", "fpgm", "glyf", "loca", "prep", "CFF ",
  "VORG", "EBDT", "EBLC", "gasp", "hdmx", "kern", "LTSH", "PCLT", "VDMX", "vhea", "vmtx", "BASE", "GDEF", "GPOS",
  "GSUB", "EBSC", "JSTF", "MATH", "CBDT", "CBLC", "COLR", "CPAL", "SVG ", "sbix", "acnt", "avar", "bdat", "bloc",
  "bsln", "cvar", "fdsc", "feat", "fmtx", "fvar", "gvar", "hsty", "just", "lcar", "mort", "morx", "opbd", "prop",
  "trak", "Zapf", "Silf", "Glat", "Gloc", "Feat", "Sill",
];

export class FontDecodeError extends Error {
  override name = "FontDecodeError";
}

class Reader {
  offset = 0;
  constructor(private readonly bytes: Buffer) {}

  private need(count: number): void {
    if (this.offset + count > this.bytes.length) throw new FontDecodeError("The WOFF2 data ends early.");
  }
  u8(): number {
    this.need(1);
    return this.bytes[this.offset++]!;
  }
  u16(): number {
    this.need(2);
    const value = this.bytes.readUInt16BE(this.offset);
    this.offset += 2;
    return value;
  }
  i16(): number {
    this.need(2);
    const value = this.bytes.readInt16BE(this.offset);
    this.offset += 2;
    return value;
  }
  u32(): number {
    this.need(4);
    const value = this.bytes.readUInt32BE(this.offset);
    this.offset += 4;
    return value;
  }
  take(count: number): Buffer {
    this.need(count);
    const slice = this.bytes.subarray(this.offset, this.offset + count);
    this.offset += count;
    return slice;
  }
  /** UIntBase128: 7 bits a byte, most significant first, at most five bytes, no leading zeros. */
  base128(): number {
    let value = 0;
    for (let i = 0; i < 5; i++) {
      const byte = this.u8();
      if (i === 0 && byte === 0x80) throw new FontDecodeError("A WOFF2 number has a leading zero.");
      value = value * 128 + (byte & 0x7f);
      if ((byte & 0x80) === 0) return value;
    }
    throw new FontDecodeError("A WOFF2 number runs past five bytes.");
  }
  /** 255UInt16: one byte for small values, escape codes for larger ones. */
  u255(): number {
    const code = this.u8();
    if (code === 253) return this.u16();
    if (code === 255) return 253 + this.u8();
    if (code === 254) return 506 + this.u8();
    return code;
  }
}

type DirectoryEntry = { tag: string; origLength: number; storedLength: number; transformed: boolean };

function readDirectory(reader: Reader, numTables: number): DirectoryEntry[] {
  const entries: DirectoryEntry[] = [];
  for (let i = 0; i < numTables; i++) {
    const flags = reader.u8();
    const tagIndex = flags & 0x3f;
    const version = flags >> 6;
    const tag = tagIndex === 63 ? reader.take(4).toString("latin1") : knownTags[tagIndex];
    if (!tag) throw new FontDecodeError(`Unknown WOFF2 table index ${tagIndex}.`);
    const origLength = reader.base128();
    // glyf and loca are transformed unless marked with version 3; every other table only with a non-zero version.
    const transformed = tag === "glyf" || tag === "loca" ? version !== 3 : version !== 0;
    const storedLength = transformed ? reader.base128() : origLength;
    entries.push({ tag, origLength, storedLength, transformed });
  }
  return entries;
}

const withSign = (flag: number, value: number) => (flag & 1 ? value : -value);

type Point = { x: number; y: number; onCurve: boolean };

/** The point coordinates of a simple glyph from its flag bytes and the triplet-coded glyph stream. */
function decodeTriplets(flags: Reader, glyphs: Reader, count: number): Point[] {
  const points: Point[] = [];
  let x = 0;
  let y = 0;
  for (let i = 0; i < count; i++) {
    const raw = flags.u8();
    const onCurve = (raw & 0x80) === 0;
    const flag = raw & 0x7f;
    let dx: number;
    let dy: number;
    if (flag < 10) {
      dx = 0;
      dy = withSign(flag, ((flag & 14) << 7) + glyphs.u8());
    } else if (flag < 20) {
      dx = withSign(flag, (((flag - 10) & 14) << 7) + glyphs.u8());
      dy = 0;
    } else if (flag < 84) {
      const b0 = flag - 20;
      const b1 = glyphs.u8();
      dx = withSign(flag, 1 + (b0 & 0x30) + (b1 >> 4));
      dy = withSign(flag >> 1, 1 + ((b0 & 0x0c) << 2) + (b1 & 0x0f));
    } else if (flag < 120) {
      const b0 = flag - 84;
      dx = withSign(flag, 1 + (Math.floor(b0 / 12) << 8) + glyphs.u8());
      dy = withSign(flag >> 1, 1 + (((b0 % 12) >> 2) << 8) + glyphs.u8());
    } else if (flag < 124) {
      const b1 = glyphs.u8();
      const b2 = glyphs.u8();
      dx = withSign(flag, (b1 << 4) + (b2 >> 4));
      dy = withSign(flag >> 1, ((b2 & 0x0f) << 8) + glyphs.u8());
    } else {
      dx = withSign(flag, glyphs.u16());
      dy = withSign(flag >> 1, glyphs.u16());
    }
    x += dx;
    y += dy;
    points.push({ x, y, onCurve });
  }
  return points;
}

/** A simple glyph in TrueType's own layout (flags without repeats; short coordinates where they fit). */
function encodeSimpleGlyph(params: {
  endPoints: number[];
  points: Point[];
  instructions: Buffer;
  bbox: [number, number, number, number];
  overlap: boolean;
}): Buffer {
  const { endPoints, points, instructions, bbox } = params;
  const flags: number[] = [];
  const xBytes: number[] = [];
  const yBytes: number[] = [];
  const pushDelta = (bytes: number[], delta: number) => {
    if (Math.abs(delta) <= 255) bytes.push(Math.abs(delta));
    else bytes.push((delta >> 8) & 0xff, delta & 0xff);
  };
  let previous = { x: 0, y: 0 };
  points.forEach((point, index) => {
    let flag = point.onCurve ? 0x01 : 0;
    if (index === 0 && params.overlap) flag |= 0x40;
    const dx = point.x - previous.x;
    const dy = point.y - previous.y;
    // Bit 0x10/0x20 means "same as before" for a long delta and "positive" for a one-byte one.
    if (dx === 0) flag |= 0x10;
    else if (Math.abs(dx) <= 255) flag |= 0x02 | (dx > 0 ? 0x10 : 0);
    if (dy === 0) flag |= 0x20;
    else if (Math.abs(dy) <= 255) flag |= 0x04 | (dy > 0 ? 0x20 : 0);
    if (dx !== 0) pushDelta(xBytes, dx);
    if (dy !== 0) pushDelta(yBytes, dy);
    flags.push(flag);
    previous = point;
  });
  const head = Buffer.alloc(10 + endPoints.length * 2 + 2);
  head.writeInt16BE(endPoints.length, 0);
  bbox.forEach((value, i) => head.writeInt16BE(value, 2 + i * 2));
  endPoints.forEach((value, i) => head.writeUInt16BE(value, 10 + i * 2));
  head.writeUInt16BE(instructions.length, 10 + endPoints.length * 2);
  return Buffer.concat([head, instructions, Buffer.from(flags), Buffer.from(xBytes), Buffer.from(yBytes)]);
}

/** The composite record as stored, up to and including its last component. */
function readCompositeRecord(composites: Reader): { bytes: Buffer; hasInstructions: boolean } {
  const start = composites.offset;
  let hasInstructions = false;
  for (;;) {
    const flags = composites.u16();
    composites.u16();
    let size = flags & 0x0001 ? 4 : 2;
    if (flags & 0x0008) size += 2;
    else if (flags & 0x0040) size += 4;
    else if (flags & 0x0080) size += 8;
    composites.take(size);
    if (flags & 0x0100) hasInstructions = true;
    if (!(flags & 0x0020)) break;
  }
  const end = composites.offset;
  composites.offset = start;
  return { bytes: composites.take(end - start), hasInstructions };
}

function boundingBox(points: Point[]): [number, number, number, number] {
  if (points.length === 0) return [0, 0, 0, 0];
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  return [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
}

const pad4 = (buffer: Buffer) => (buffer.length % 4 === 0 ? buffer : Buffer.concat([buffer, Buffer.alloc(4 - (buffer.length % 4))]));

/** Rebuilds glyf and loca from the transformed glyf table (WOFF2 section 5.1), with each glyph's xMin for hmtx. */
function rebuildGlyf(data: Buffer): { glyf: Buffer; loca: Buffer; indexFormat: number; xMins: number[] } {
  const header = new Reader(data);
  header.u16();
  const optionFlags = header.u16();
  const numGlyphs = header.u16();
  const indexFormat = header.u16();
  const sizes = Array.from({ length: 7 }, () => header.u32());
  const streams: Reader[] = [];
  let offset = header.offset;
  for (const size of sizes) {
    streams.push(new Reader(data.subarray(offset, offset + size)));
    offset += size;
  }
  const [nContours, nPoints, flagStream, glyphStream, compositeStream, bboxStream, instructionStream] = streams as [
    Reader, Reader, Reader, Reader, Reader, Reader, Reader,
  ];
  const bitmapLength = 4 * Math.floor((numGlyphs + 31) / 32);
  const bboxBitmap = bboxStream.take(bitmapLength);
  const overlapBitmap = optionFlags & 1 ? data.subarray(offset, offset + Math.floor((numGlyphs + 7) / 8)) : null;
  const bitSet = (bitmap: Buffer, index: number) => (bitmap[index >> 3]! & (0x80 >> (index & 7))) !== 0;
  const readBox = (): [number, number, number, number] => [bboxStream.i16(), bboxStream.i16(), bboxStream.i16(), bboxStream.i16()];

  const glyphs: Buffer[] = [];
  const xMins: number[] = [];
  for (let index = 0; index < numGlyphs; index++) {
    const contours = nContours.i16();
    if (contours === 0) {
      glyphs.push(Buffer.alloc(0));
      xMins.push(0);
    } else if (contours < 0) {
      const record = readCompositeRecord(compositeStream);
      const bbox = readBox();
      const instructions = record.hasInstructions ? instructionStream.take(glyphStream.u255()) : null;
      const head = Buffer.alloc(10);
      head.writeInt16BE(-1, 0);
      bbox.forEach((value, i) => head.writeInt16BE(value, 2 + i * 2));
      const parts = [head, record.bytes];
      if (instructions) parts.push(Buffer.from([instructions.length >> 8, instructions.length & 0xff]), instructions);
      glyphs.push(Buffer.concat(parts));
      xMins.push(bbox[0]);
    } else {
      const endPoints: number[] = [];
      let total = 0;
      for (let c = 0; c < contours; c++) {
        total += nPoints.u255();
        endPoints.push(total - 1);
      }
      const points = decodeTriplets(flagStream, glyphStream, total);
      const instructions = instructionStream.take(glyphStream.u255());
      const bbox = bitSet(bboxBitmap, index) ? readBox() : boundingBox(points);
      const overlap = overlapBitmap !== null && bitSet(overlapBitmap, index);
      glyphs.push(encodeSimpleGlyph({ endPoints, points, instructions, bbox, overlap }));
      xMins.push(bbox[0]);
    }
  }

  const padded = glyphs.map(pad4);
  const loca = Buffer.alloc((numGlyphs + 1) * (indexFormat === 0 ? 2 : 4));
  let position = 0;
  for (let index = 0; index <= numGlyphs; index++) {
    if (indexFormat === 0) loca.writeUInt16BE(position / 2, index * 2);
    else loca.writeUInt32BE(position, index * 4);
    if (index < numGlyphs) position += padded[index]!.length;
  }
  if (indexFormat === 0 && position / 2 > 0xffff) throw new FontDecodeError("The glyphs do not fit a short loca table.");
  return { glyf: Buffer.concat(padded), loca, indexFormat, xMins };
}

/** Rebuilds hmtx from its transformed form (WOFF2 section 5.4): left side bearings left out equal the glyph's xMin. */
function rebuildHmtx(data: Buffer, numHMetrics: number, xMins: number[]): Buffer {
  const reader = new Reader(data);
  const flags = reader.u8();
  const advances = Array.from({ length: numHMetrics }, () => reader.u16());
  const proportional = Array.from({ length: numHMetrics }, (_, i) => (flags & 1 ? xMins[i]! : reader.i16()));
  const monospaced = Array.from({ length: xMins.length - numHMetrics }, (_, i) => (flags & 2 ? xMins[numHMetrics + i]! : reader.i16()));
  const out = Buffer.alloc(numHMetrics * 4 + monospaced.length * 2);
  advances.forEach((advance, i) => {
    out.writeUInt16BE(advance, i * 4);
    out.writeInt16BE(proportional[i]!, i * 4 + 2);
  });
  monospaced.forEach((bearing, i) => out.writeInt16BE(bearing, numHMetrics * 4 + i * 2));
  return out;
}

function checksum(buffer: Buffer): number {
  const padded = pad4(buffer);
  let sum = 0;
  for (let i = 0; i < padded.length; i += 4) sum = (sum + padded.readUInt32BE(i)) >>> 0;
  return sum;
}

/** Lays the tables out as an sfnt file: sorted directory, 4-byte aligned tables, head's checksum adjustment. */
function assembleSfnt(flavor: number, tables: Map<string, Buffer>): Buffer {
  const tags = [...tables.keys()].sort();
  const numTables = tags.length;
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const header = Buffer.alloc(12 + numTables * 16);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(numTables, 4);
  header.writeUInt16BE(searchRange, 6);
  header.writeUInt16BE(entrySelector, 8);
  header.writeUInt16BE(numTables * 16 - searchRange, 10);
  const head = tables.get("head");
  if (head) head.writeUInt32BE(0, 8);
  let offset = header.length;
  const bodies: Buffer[] = [];
  tags.forEach((tag, i) => {
    const table = tables.get(tag)!;
    const record = 12 + i * 16;
    header.write(tag, record, 4, "latin1");
    header.writeUInt32BE(checksum(table), record + 4);
    header.writeUInt32BE(offset, record + 8);
    header.writeUInt32BE(table.length, record + 12);
    bodies.push(pad4(table));
    offset += pad4(table).length;
  });
  const font = Buffer.concat([header, ...bodies]);
  if (head) {
    const headOffset = header.readUInt32BE(12 + tags.indexOf("head") * 16 + 8);
    font.writeUInt32BE((0xb1b0afba - checksum(font)) >>> 0, headOffset + 8);
  }
  return font;
}

export function woff2ToTrueType(woff2: Uint8Array): Buffer {
  const reader = new Reader(Buffer.from(woff2.buffer, woff2.byteOffset, woff2.byteLength));
  if (reader.u32() !== 0x774f4632) throw new FontDecodeError("Not a WOFF2 file.");
  const flavor = reader.u32();
  if (flavor === 0x74746366) throw new FontDecodeError("WOFF2 font collections are not supported.");
  reader.u32();
  const numTables = reader.u16();
  reader.u16();
  reader.u32();
  const totalCompressedSize = reader.u32();
  reader.take(2 + 2 + 4 * 5);
  const directory = readDirectory(reader, numTables);
  const data = brotliDecompressSync(reader.take(totalCompressedSize));

  const stored = new Map<string, Buffer>();
  let offset = 0;
  for (const entry of directory) {
    stored.set(entry.tag, data.subarray(offset, offset + entry.storedLength));
    offset += entry.storedLength;
  }
  if (offset > data.length) throw new FontDecodeError("The WOFF2 tables are longer than their data.");

  const tables = new Map<string, Buffer>();
  for (const entry of directory) {
    if (!entry.transformed) tables.set(entry.tag, Buffer.from(stored.get(entry.tag)!));
  }
  const glyfEntry = directory.find((entry) => entry.tag === "glyf");
  let xMins: number[] = [];
  if (glyfEntry?.transformed) {
    const rebuilt = rebuildGlyf(stored.get("glyf")!);
    tables.set("glyf", rebuilt.glyf);
    tables.set("loca", rebuilt.loca);
    xMins = rebuilt.xMins;
    tables.get("head")?.writeInt16BE(rebuilt.indexFormat, 50);
  }
  const hmtxEntry = directory.find((entry) => entry.tag === "hmtx");
  if (hmtxEntry?.transformed) {
    const hhea = tables.get("hhea");
    if (!hhea || xMins.length === 0) throw new FontDecodeError("A transformed hmtx table needs hhea and a transformed glyf table.");
    tables.set("hmtx", rebuildHmtx(stored.get("hmtx")!, hhea.readUInt16BE(34), xMins));
  }
  return assembleSfnt(flavor, tables);
}
