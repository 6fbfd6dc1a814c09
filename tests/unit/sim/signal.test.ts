import { describe, expect, it } from "vitest";
import { colourBits } from "@/lib/sim";
import { bitSlots } from "@/lib/sim/signal";

describe("colour encoding", () => {
  it("sends 24 bits per pixel, most significant bit first, in the given byte order", () => {
    expect(colourBits([[255, 0, 1]], "RGB")).toBe("11111111" + "00000000" + "00000001");
    expect(colourBits([[255, 0, 1]], "GRB")).toBe("00000000" + "11111111" + "00000001");
    expect(colourBits([[0x12, 0x34, 0x56]], "BRG")).toBe("01010110" + "00010010" + "00110100");
  });

  it("concatenates pixels in order", () => {
    const bits = colourBits([[1, 2, 3], [128, 64, 32]], "RGB");
    expect(bits).toHaveLength(48);
    expect(bits.slice(24)).toBe("10000000" + "01000000" + "00100000");
  });
});

describe("the pulse train", () => {
  it("starts bit i at leadIn + i·bitPeriod and falls after the 0-high or 1-high time", () => {
    const slots = bitSlots("01", { bitPeriod: 1.25e-6, zeroHigh: 0.4e-6, oneHigh: 0.8e-6, leadIn: 1e-6 });
    expect(slots[0]).toEqual({ sent: 0, start: 1e-6, fall: 1.4e-6 });
    expect(slots[1].start).toBeCloseTo(2.25e-6, 15);
    expect(slots[1].fall).toBeCloseTo(3.05e-6, 15);
  });
});
