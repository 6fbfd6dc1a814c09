// A camera's Exif block (JEITA CP-3451, the Exif standard, on the TIFF 6.0 layout) written into a
// JPEG, so tests can send a photo that carries an orientation and a GPS position the way a phone's
// photo does, and check what is left of them after upload.

/** Latitude 51° 28′ 38.00″ N, as three rationals: the bytes a test looks for afterwards. */
export const gpsLatitude = [
  [51, 1],
  [28, 1],
  [3800, 100],
] as const;

function u16(value: number): number[] {
  return [(value >> 8) & 0xff, value & 0xff];
}

function u32(value: number): number[] {
  return [(value >>> 24) & 0xff, (value >>> 16) & 0xff, (value >>> 8) & 0xff, value & 0xff];
}

/** One 12-byte IFD entry (TIFF 6.0 §2): tag, type, count, then the value or its offset. */
function entry(tag: number, type: number, count: number, value: number[]): number[] {
  return [...u16(tag), ...u16(type), ...u32(count), ...value, ...Array(4 - value.length).fill(0)];
}

const SHORT = 3;
const LONG = 4;
const ASCII = 2;
const RATIONAL = 5;

/** The Exif APP1 payload, big-endian: IFD0 with Orientation and the GPS IFD pointer; the GPS IFD with a latitude. */
function exifPayload(orientation: number): number[] {
  const ifd0At = 8;
  const gpsIfdAt = ifd0At + 2 + 2 * 12 + 4;
  const rationalsAt = gpsIfdAt + 2 + 2 * 12 + 4;
  const tiff = [
    ...[0x4d, 0x4d, 0x00, 0x2a],
    ...u32(ifd0At),
    ...u16(2),
    ...entry(0x0112, SHORT, 1, u16(orientation)),
    ...entry(0x8825, LONG, 1, u32(gpsIfdAt)),
    ...u32(0),
    ...u16(2),
    ...entry(0x0001, ASCII, 2, [0x4e, 0x00]),
    ...entry(0x0002, RATIONAL, 3, u32(rationalsAt)),
    ...u32(0),
    ...gpsLatitude.flatMap(([numerator, denominator]) => [...u32(numerator), ...u32(denominator)]),
  ];
  return [...Buffer.from("Exif\0\0", "latin1"), ...tiff];
}

/** `jpeg` with an Exif APP1 segment placed right after its start-of-image marker. */
export function withExif(jpeg: Uint8Array, params: { orientation: number }): Buffer {
  if (jpeg[0] !== 0xff || jpeg[1] !== 0xd8) throw new Error("not a JPEG: no start-of-image marker");
  const payload = exifPayload(params.orientation);
  const segment = [0xff, 0xe1, ...u16(payload.length + 2), ...payload];
  return Buffer.concat([jpeg.subarray(0, 2), Buffer.from(segment), jpeg.subarray(2)]);
}

/** Whether `bytes` hold the latitude written by withExif (its rationals, in order). */
export function holdsGpsLatitude(bytes: Uint8Array): boolean {
  const needle = Buffer.from(gpsLatitude.flatMap(([numerator, denominator]) => [...u32(numerator), ...u32(denominator)]));
  return Buffer.from(bytes).includes(needle);
}
