/**
 * The content check of bench photos against files made by a real encoder: chromium's canvas
 * exports PNG, JPEG and WebP (lossy and lossless), and each must be recognised with its true
 * pixel size. Files that are not images, or only look like one by their first bytes, must not.
 */
import { chromium, type Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readImageContent } from "@/lib/uploads/image-content";

let browser: Browser;

async function encodeInBrowser(type: string, width: number, height: number, quality?: number): Promise<Uint8Array> {
  const page = await browser.newPage();
  try {
    const bytes = await page.evaluate(
      async ({ type, width, height, quality }) => {
        const canvas = document.createElement("canvas");
        canvas.width = width;
        canvas.height = height;
        const context = canvas.getContext("2d")!;
        context.fillStyle = "#10302f";
        context.fillRect(0, 0, width, height);
        context.strokeStyle = "#e8c547";
        context.beginPath();
        context.moveTo(0, height * 0.8);
        context.lineTo(width * 0.3, height * 0.8);
        context.lineTo(width * 0.33, height * 0.15);
        context.lineTo(width, height * 0.2);
        context.stroke();
        const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, type, quality));
        return blob ? [...new Uint8Array(await blob.arrayBuffer())] : [];
      },
      { type, width, height, quality },
    );
    return new Uint8Array(bytes);
  } finally {
    await page.close();
  }
}

beforeAll(async () => {
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu"] });
});

afterAll(async () => {
  await browser?.close();
});

describe("reading an image's type and size from its bytes", () => {
  it.each([
    ["image/png", 640, 360, undefined],
    ["image/jpeg", 1280, 720, 0.85],
    ["image/webp", 800, 601, 0.8],
    ["image/webp", 333, 222, 1],
  ] as const)("recognises %s at %ix%i encoded by chromium", async (type, width, height, quality) => {
    const bytes = await encodeInBrowser(type, width, height, quality);
    expect(bytes.length).toBeGreaterThan(32);
    expect(readImageContent(bytes)).toEqual({ contentType: type, width, height });
  });

  // Chromium writes extended (VP8X) WebP and baseline JPEG only; the other layouts are built byte
  // by byte from their specifications.
  it("reads simple lossy and lossless WebP headers (RFC 9649 §2.5–2.6; RFC 6386 §9.1)", () => {
    const riff = (chunk: string, payload: number[]) => {
      const bytes = new Uint8Array(20 + payload.length);
      bytes.set(new TextEncoder().encode(`RIFF\0\0\0\0WEBP${chunk}\0\0\0\0`));
      bytes.set(payload, 20);
      return bytes;
    };
    const lossy = riff("VP8 ", [0x50, 0x2a, 0x00, 0x9d, 0x01, 0x2a, 0x4d, 0x01, 0xde, 0x00, 0, 0]);
    expect(readImageContent(lossy)).toEqual({ contentType: "image/webp", width: 333, height: 222 });
    const bits = (333 - 1) | ((222 - 1) << 14);
    const lossless = riff("VP8L", [0x2f, bits & 0xff, (bits >>> 8) & 0xff, (bits >>> 16) & 0xff, (bits >>> 24) & 0xff, 0, 0, 0, 0, 0]);
    expect(readImageContent(lossless)).toEqual({ contentType: "image/webp", width: 333, height: 222 });
  });

  it("finds the frame size of a progressive JPEG behind an Exif segment and fill bytes (ITU-T T.81 B.1–B.2)", () => {
    const exif = [0xff, 0xe1, 0x00, 0x0a, ...new TextEncoder().encode("Exif\0\0MM")];
    const frame = [0xff, 0xff, 0xc2, 0x00, 0x11, 0x08, 0x0b, 0xb8, 0x0f, 0xa0, 0x03, 1, 0x22, 0, 2, 0x11, 1, 3, 0x11, 1];
    const jpeg = new Uint8Array([0xff, 0xd8, ...exif, ...frame, 0xff, 0xd9]);
    expect(readImageContent(jpeg)).toEqual({ contentType: "image/jpeg", width: 4000, height: 3000 });
  });

  it("refuses text, an empty file, a bare signature and a GIF", () => {
    const encode = (text: string) => new TextEncoder().encode(text);
    expect(readImageContent(encode("Rise time 14 ns at the first pixel."))).toBeNull();
    expect(readImageContent(new Uint8Array())).toBeNull();
    expect(readImageContent(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))).toBeNull();
    expect(readImageContent(new Uint8Array([0xff, 0xd8, 0xff, 0xd9]))).toBeNull();
    expect(readImageContent(encode("RIFF\u0000\u0000\u0000\u0000WEBPVP8 "))).toBeNull();
    expect(readImageContent(encode("GIF89a\u0001\u0000\u0001\u0000"))).toBeNull();
  });

  it("refuses a PNG header that declares no pixels", () => {
    const header = new Uint8Array(24);
    header.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    header.set(new TextEncoder().encode("IHDR"), 12);
    expect(readImageContent(header)).toBeNull();
  });
});
