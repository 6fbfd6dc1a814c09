// Turns an uploaded roster file into text, or says plainly why it cannot be read. The content
// decides, not the name: spreadsheets, images and other binary files are refused however they
// are called.

// Below Next's default 1 MB limit on a server action's body, so the limit answered here is ours.
// Five thousand rows of name and e-mail take about 250 kB.
export const maxRosterFileBytes = 900_000;
export const rosterFileLimitLabel = "900 kB";

// Spreadsheet programs on some systems label .csv files as Excel documents; the content check
// below is what keeps real spreadsheets out.
const acceptedTypes = new Set(["", "text/csv", "text/plain", "application/csv", "text/x-csv", "application/vnd.ms-excel"]);

export type RosterFileResult = { ok: true; text: string; fileName: string } | { ok: false; problem: string };

function startsWith(bytes: Uint8Array, signature: number[]): boolean {
  return signature.every((byte, index) => bytes[index] === byte);
}

function decode(bytes: Uint8Array): string {
  if (startsWith(bytes, [0xff, 0xfe])) return new TextDecoder("utf-16le").decode(bytes.subarray(2));
  if (startsWith(bytes, [0xfe, 0xff])) return new TextDecoder("utf-16be").decode(bytes.subarray(2));
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    // Older spreadsheet exports write Western European text in this code page, not UTF-8.
    return new TextDecoder("windows-1252").decode(bytes);
  }
}

function describeBinary(bytes: Uint8Array): string | null {
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWith(bytes, [0xd0, 0xcf, 0x11, 0xe0])) {
    return "This is a spreadsheet file, not CSV. In your spreadsheet program choose “Save as” → CSV (UTF-8), then upload that file.";
  }
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46])) return "This is a PDF, not a CSV file.";
  return null;
}

function hasControlCharacters(text: string): boolean {
  return /[\u0000-\u0008\u000b\u000c\u000e-\u001f]/.test(text);
}

export async function readRosterFile(file: unknown): Promise<RosterFileResult> {
  if (!(file instanceof Blob) || !("name" in file) || (file.size === 0 && file.name === "")) {
    return { ok: false, problem: "Choose a CSV file to upload." };
  }
  const fileName = String(file.name);
  if (file.size === 0) return { ok: false, problem: "The file is empty." };
  if (file.size > maxRosterFileBytes) {
    return { ok: false, problem: `The file is larger than ${rosterFileLimitLabel}. Split it into smaller files and import them one after another.` };
  }
  const type = file.type.split(";")[0]!.trim().toLowerCase();
  if (!acceptedTypes.has(type)) return { ok: false, problem: "Upload a CSV or plain text file (name and e-mail on each line)." };

  const bytes = new Uint8Array(await file.arrayBuffer());
  const binary = describeBinary(bytes);
  if (binary) return { ok: false, problem: binary };
  const text = decode(bytes);
  if (hasControlCharacters(text)) {
    return { ok: false, problem: "This file is not plain text. Save the list as CSV (UTF-8) and upload it again." };
  }
  return { ok: true, text, fileName };
}
