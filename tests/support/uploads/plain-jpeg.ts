// A real baseline JPEG of flat mid-grey, written byte by byte (ITU-T T.81 Annex B): one component,
// a quantisation table of ones and the smallest Huffman tables there are, a DC table whose only
// code "0" means "no change" and an AC table whose only code "0" means "end of block". Every 8×8
// block is therefore the two bits 00; the scan is padded with 1 bits to a whole byte (F.1.2.3).

const marker = (code: number, payload: number[]) => [0xff, code, (payload.length + 2) >> 8, (payload.length + 2) & 0xff, ...payload];
const onlyOneCode = (tableClassAndId: number) => [tableClassAndId, 1, ...new Array<number>(15).fill(0), 0x00];

export function plainJpeg(width: number, height: number): Uint8Array {
  const blocks = Math.ceil(width / 8) * Math.ceil(height / 8);
  const scan = new Uint8Array(Math.ceil((blocks * 2) / 8)).fill(0xff);
  for (let bit = 0; bit < blocks * 2; bit += 1) scan[bit >> 3]! &= ~(0x80 >> (bit & 7));
  return new Uint8Array([
    0xff, 0xd8,
    ...marker(0xe0, [...new TextEncoder().encode("JFIF\0"), 1, 1, 0, 0, 1, 0, 1, 0, 0]),
    ...marker(0xdb, [0x00, ...new Array<number>(64).fill(1)]),
    ...marker(0xc0, [8, height >> 8, height & 0xff, width >> 8, width & 0xff, 1, 1, 0x11, 0]),
    ...marker(0xc4, onlyOneCode(0x00)),
    ...marker(0xc4, onlyOneCode(0x10)),
    ...marker(0xda, [1, 1, 0x00, 0, 63, 0]),
    ...scan,
    0xff, 0xd9,
  ]);
}
