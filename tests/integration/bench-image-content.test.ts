/**
 * The content check of bench photos against files made by a real encoder: chromium's canvas
 * exports PNG, JPEG and WebP (lossy and lossless), and each must be recognised with its true
 * pixel size, and followed to the format's own end. Files that are not images, or only look like
 * one by their first bytes, must not be; bytes appended after the end must show.
 */
import { chromium, type Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readImageContent } from "@/lib/uploads/image-content";
import { concatBytes, htmlPayload, zipArchive } from "../support/uploads/hidden-payloads";
import { noisyPhoto } from "../support/uploads/noisy-photo";
import { plainJpeg } from "../support/uploads/plain-jpeg";

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
    expect(readImageContent(bytes)).toEqual({ contentType: type, width, height, end: bytes.length });
    expect(readImageContent(concatBytes(bytes, htmlPayload))).toEqual({ contentType: type, width, height, end: bytes.length });
    expect(readImageContent(concatBytes(bytes, zipArchive("run.html", htmlPayload)))?.end).toBe(bytes.length);
    expect(readImageContent(bytes.subarray(0, bytes.length - 1))).toBeNull();
  });

  it("decodes the hand-written test JPEG in chromium at the size its header gives", async () => {
    const jpeg = plainJpeg(40, 24);
    expect(readImageContent(jpeg)).toEqual({ contentType: "image/jpeg", width: 40, height: 24, end: jpeg.length });
    const page = await browser.newPage();
    try {
      const decoded = await page.evaluate(async (bytes) => {
        const bitmap = await createImageBitmap(new Blob([new Uint8Array(bytes)], { type: "image/jpeg" }));
        return { width: bitmap.width, height: bitmap.height };
      }, [...jpeg]);
      expect(decoded).toEqual({ width: 40, height: 24 });
    } finally {
      await page.close();
    }
  });

  // Chromium writes extended (VP8X) WebP and baseline JPEG only; the other layouts are built byte
  // by byte from their specifications.
  it("reads simple lossy and lossless WebP headers (RFC 9649 §2.5–2.6; RFC 6386 §9.1)", () => {
    const riff = (chunk: string, payload: number[]) => {
      const bytes = new Uint8Array(20 + payload.length);
      const view = new DataView(bytes.buffer);
      bytes.set(new TextEncoder().encode(`RIFF\0\0\0\0WEBP${chunk}`));
      view.setUint32(4, bytes.length - 8, true);
      view.setUint32(16, payload.length, true);
      bytes.set(payload, 20);
      return bytes;
    };
    const lossy = riff("VP8 ", [0x50, 0x2a, 0x00, 0x9d, 0x01, 0x2a, 0x4d, 0x01, 0xde, 0x00, 0, 0]);
    expect(readImageContent(lossy)).toEqual({ contentType: "image/webp", width: 333, height: 222, end: lossy.length });
    const bits = (333 - 1) | ((222 - 1) << 14);
    const lossless = riff("VP8L", [0x2f, bits & 0xff, (bits >>> 8) & 0xff, (bits >>> 16) & 0xff, (bits >>> 24) & 0xff, 0, 0, 0, 0, 0]);
    expect(readImageContent(lossless)).toEqual({ contentType: "image/webp", width: 333, height: 222, end: lossless.length });
    expect(readImageContent(concatBytes(lossless, htmlPayload))?.end).toBe(lossless.length);
    // A chunk that claims more than the container holds is not a whole WebP.
    const overlong = lossless.slice();
    new DataView(overlong.buffer).setUint32(16, 12, true);
    expect(readImageContent(overlong)).toBeNull();
  });

  it("finds the frame size of a progressive JPEG behind an Exif segment and fill bytes, and its end after the scans (ITU-T T.81 B.1–B.2)", () => {
    // The Exif segment holds a thumbnail's own SOI…EOI, which must not end the picture.
    const exif = [0xff, 0xe1, 0x00, 0x0e, ...new TextEncoder().encode("Exif\0\0MM"), 0xff, 0xd8, 0xff, 0xd9];
    const frame = [0xff, 0xff, 0xc2, 0x00, 0x11, 0x08, 0x0b, 0xb8, 0x0f, 0xa0, 0x03, 1, 0x22, 0, 2, 0x11, 1, 3, 0x11, 1];
    const scanHeader = [0xff, 0xda, 0x00, 0x08, 0x01, 0x01, 0x00, 0x00, 0x3f, 0x00];
    // Entropy-coded data with a stuffed FF00 and a restart marker, both part of the scan (B.1.1.5).
    const scan = [...scanHeader, 0x12, 0xff, 0x00, 0x34, 0xff, 0xd0, 0x56];
    const jpeg = new Uint8Array([0xff, 0xd8, ...exif, ...frame, ...scan, ...scan, 0xff, 0xd9]);
    expect(readImageContent(jpeg)).toEqual({ contentType: "image/jpeg", width: 4000, height: 3000, end: jpeg.length });
    expect(readImageContent(concatBytes(jpeg, new Uint8Array([0xff, 0xd9])))?.end).toBe(jpeg.length);
    expect(readImageContent(new Uint8Array([0xff, 0xd8, ...exif, ...frame, 0xff, 0xd9]))).toBeNull();
    expect(readImageContent(new Uint8Array([0xff, 0xd8, ...exif, ...frame, ...scan]))).toBeNull();
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

  it("refuses a whole PNG whose header declares no pixels", () => {
    const png = noisyPhoto(4, 4);
    expect(readImageContent(png)).toEqual({ contentType: "image/png", width: 4, height: 4, end: png.length });
    png.writeUInt32BE(0, 16);
    expect(readImageContent(png)).toBeNull();
  });

  it("refuses a PNG without image data and one whose chunk types are not letters (PNG §5.3, §5.6)", () => {
    const png = noisyPhoto(4, 4);
    const withoutData = concatBytes(png.subarray(0, 33), png.subarray(png.length - 12));
    expect(readImageContent(withoutData)).toBeNull();
    const mangled = Buffer.from(png);
    mangled.write("ID<T", 37, "latin1");
    expect(readImageContent(mangled)).toBeNull();
  });
});
