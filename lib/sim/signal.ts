/**
 * The single-wire pixel protocol: colours become 24-bit words sent most significant bit first in
 * the pixel's byte order; each bit starts with a rising edge and falls after the 0-high or
 * 1-high time.
 */
export const BYTE_ORDERS = ["GRB", "RGB", "BRG", "BGR", "RBG", "GBR"] as const;
export type ByteOrder = (typeof BYTE_ORDERS)[number];
export type Colour = readonly [number, number, number];

const channelIndex = { R: 0, G: 1, B: 2 } as const;

/** 24 bits per pixel, most significant bit first, bytes in the given order. */
export function colourBits(colours: readonly Colour[], byteOrder: ByteOrder): string {
  let bits = "";
  for (const colour of colours) {
    for (const channel of byteOrder) {
      bits += colour[channelIndex[channel as keyof typeof channelIndex]].toString(2).padStart(8, "0");
    }
  }
  return bits;
}

export type SignalTiming = {
  bitPeriod: number;
  zeroHigh: number;
  oneHigh: number;
  leadIn: number;
};

export type BitSlot = {
  sent: 0 | 1;
  /** Driver's rising edge starts here (s). */
  start: number;
  /** Driver's falling edge starts here (s). */
  fall: number;
};

export function bitSlots(bits: string, timing: SignalTiming): BitSlot[] {
  return Array.from(bits, (bit, index) => {
    const start = timing.leadIn + index * timing.bitPeriod;
    const sent = bit === "1" ? 1 : 0;
    return { sent, start, fall: start + (sent ? timing.oneHigh : timing.zeroHigh) };
  });
}
