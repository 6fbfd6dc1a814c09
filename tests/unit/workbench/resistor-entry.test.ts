import { describe, expect, it } from "vitest";
import { readResistorEntry, snapToOffer } from "@/components/workbench/resistor-entry";
import { eSeriesValues } from "@/lib/sim";

const e12 = eSeriesValues("E12", 10, 4700);
const e24 = eSeriesValues("E24", 10, 1000);
const e96 = eSeriesValues("E96", 10, 1000);

describe("a typed resistance on a resistor control", () => {
  it("reads the trade's notations and unit words", () => {
    for (const [entry, ohms] of [
      ["47R", 47],
      ["4k7", 4700],
      ["1K", 1000],
      ["47 Ω", 47],
      ["47 ohm", 47],
      ["47 ohms", 47],
      ["150", 150],
    ] as const) {
      expect(readResistorEntry(entry, e12, "E12"), entry).toMatchObject({ ok: true, value: ohms });
    }
    expect(readResistorEntry("4k7", e12, "E12")).toEqual({ ok: true, value: 4700, note: "Set to 4.7 kΩ, an E12 value." });
  });

  it("snaps to the nearest value on offer by ratio and says so", () => {
    // 4.3 kΩ: 400 Ω from 3.9 kΩ and 400 Ω from 4.7 kΩ, but 10 % above one and 9 % below the other.
    expect(snapToOffer(4300, e12, "E12")).toEqual({ value: 4700, note: "4.3 kΩ is not an E12 value; snapped to the nearest, 4.7 kΩ." });
    expect(snapToOffer(50, e24, "E24").value).toBe(51);
    expect(snapToOffer(321, e96, "E96")).toEqual({ value: 324, note: "321 Ω is not an E96 value; snapped to the nearest, 324 Ω." });
    expect(snapToOffer(316, e96, "E96").note).toBe("Set to 316 Ω, an E96 value.");
    expect(readResistorEntry("321R", e96, "E96")).toMatchObject({ ok: true, value: 324 });
  });

  it("keeps to the control's range and names its end", () => {
    expect(snapToOffer(2, e24, "E24")).toEqual({ value: 10, note: "2 Ω is below this control's range; set to its lowest value, 10 Ω." });
    expect(snapToOffer(22_000, e24, "E24")).toEqual({ value: 1000, note: "22 kΩ is above this control's range; set to its highest value, 1 kΩ." });
  });

  it("refuses what is not a resistance, with the reason", () => {
    const unreadable = readResistorEntry("lots", e24, "E24");
    expect(unreadable).toMatchObject({ ok: false, message: expect.stringMatching(/^Could not read/) });
    expect(readResistorEntry("47 V", e24, "E24")).toMatchObject({ ok: false, message: expect.stringMatching(/voltage/) });
    expect(readResistorEntry("0R", e24, "E24")).toEqual({ ok: false, message: "A series resistor's value is above 0 Ω." });
  });
});
