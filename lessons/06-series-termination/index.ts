import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { cableCatalogue, RECEIVER_DEFAULTS, type CableKind } from "@/lib/sim";
import { receiverLevels } from "../receiver-model";
import { PIN_3V3_WINDOW, zFraction } from "../source-window";

const levels = receiverLevels(5);
const minPulseNs = Math.round(RECEIVER_DEFAULTS.minPulse * 1e9);
const PIN = 30;
const window = { ...PIN_3V3_WINDOW, highestGamma: (PIN_3V3_WINDOW.upper - 1) / (PIN_3V3_WINDOW.upper + 1), deepestGamma: (PIN_3V3_WINDOW.lower - 1) / (PIN_3V3_WINDOW.lower + 1) };
const ohms = (value: number) => `${Math.max(0, value).toFixed(0)} Ω`;

const fieldRule: Partial<Record<CableKind, string>> = { "lone-lead": "≈ 250 Ω: inside", "beside-ground": "≈ 33 Ω: at the lower edge" };
const windowRows = (["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"] as const).map((kind) => {
  const z0 = cableCatalogue[kind].z0;
  return { label: cableCatalogue[kind].label, z0, from: ohms(window.lower * z0 - PIN), to: ohms(window.upper * z0 - PIN), fieldRule: fieldRule[kind] ?? "" };
});

/** The four field-rule cases at 3.3 V by the bounce arithmetic: first and second arrival at the open end. */
const cases = [
  { label: "Beside ground with 250 Ω", kind: "beside-ground" as const, series: 250 },
  { label: "Beside ground with 33 Ω", kind: "beside-ground" as const, series: 33 },
  { label: "Lone lead with 250 Ω", kind: "lone-lead" as const, series: 250 },
  { label: "Lone lead with 33 Ω", kind: "lone-lead" as const, series: 33 },
].map(({ label, kind, series }) => {
  const z0 = cableCatalogue[kind].z0;
  const gamma = (PIN + series - z0) / (PIN + series + z0);
  const arrival = (n: number) => 3.3 * (1 - gamma ** n);
  const gammaText = `${gamma > 0 ? "+" : "−"}${Math.abs(gamma).toFixed(2)}`;
  const story =
    gamma > 0
      ? `No overshoot: the far end climbs a staircase from below, ${[1, 2, 3, 4].map((n) => `${arrival(n).toFixed(2)} V`).join(", ")}, … towards 3.3 V, so slowly that a 1 bit's pulse starts too late to read as a 1 at the top of the typical band. That is the "slow, rounded edge" installers see on a scope; at 3.3 V it is fatal.`
      : arrival(2) < levels.lowestFall
        ? `The first arrival reaches ${arrival(1).toFixed(2)} V, but the second falls to ${arrival(2).toFixed(2)} V, below every level where a typical pixel reads a fall: every pulse breaks (lesson 5's classic failing run).`
        : `First arrival ${arrival(1).toFixed(2)} V, ${(arrival(1) - levels.highestRise).toFixed(2)} V above the highest typical rise level; second arrival ${arrival(2).toFixed(2)} V, ${(arrival(2) - levels.topFall).toFixed(2)} V above the highest typical fall level. It works on typical pixels.`;
  return { label, gammaText, story };
});

export const lesson = {
  slug: "series-termination",
  number: 6,
  title: "Series termination",
  summary:
    "Matching the driver and its series resistor to the cable, why the field rule of about 250 Ω on a lone lead and about 33 Ω beside ground works (and when it does not), why a 5 V driver forgives almost anything, and why no single resistor suits every cable.",
  minutes: 50,
  blocks: [
    {
      kind: "text",
      markdown: `
## The idea: absorb the reflection where it returns

Lesson 5 ended with a table: everything the far end does is fixed by the source reflection coefficient Γ_s = (R_src − Z0) / (R_src + Z0), where R_src is the driver's output resistance plus the series resistor. Make R_src equal to Z0 and Γ_s is zero. That is **series termination** (also called source termination), and it is why a resistor sits at the controller end of every well-designed data output.

Follow a step through a matched line with the bounce diagram:

1. The driver launches V × Z0 / (R_src + Z0) = V / 2: half the driver's level.
2. The half-height wave reaches the open far end and doubles: the pixel sees **V**, the full level, in one clean step, one delay after the driver switched.
3. The reflected wave, also V / 2, travels back and reaches the source. There Γ_s = 0: nothing reflects. The line is now at V everywhere and stays there.

One clean step at the pixel, no overshoot, no ringing, whatever the length. The resistor does not *remove* the reflection from the far end; the far end needs it, because the doubling is what brings the pixel to full level. The resistor *absorbs* the reflection when it comes home, so it cannot bounce again.

### The price: the half-level plateau

At the near end (the controller side of the cable), the voltage sits at V / 2 for one full round trip before the returning wave lifts it to V. On 10 m of lone lead that is a plateau of 73 ns at half level. Nothing is connected there, so nothing minds; but it has two consequences every installer should know:

- **Never tap a pixel partway along a series-terminated run.** A pixel in the middle would see the half-level plateau, which for a 5 V driver is 2.5 V, right in the undefined band. Series termination works for one receiver at the far end, which is exactly the pixel-chain situation.
- **Don't judge the run by probing at the controller.** The near-end step looks ugly by design. Probe at the pixel (lesson 8).

### The arithmetic

Matching asks for R_s = Z0 − R_out:

- lone lead (Z0 ≈ 351 Ω), 3.3 V pin of 30 Ω: R_s = 351 − 30 = 321 Ω;
- data beside ground (Z0 ≈ 93.8 Ω), same pin: R_s = 93.8 − 30 ≈ 64 Ω.

You cannot buy a 321 Ω resistor in most drawers. Resistors come in the **E-series** of preferred values (IEC 60063): the E12 series has twelve values per decade, 10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82; E24 adds 11, 13, 16, 20, 24, 30, 36, 43, 51, 62, 75, 91; E96 has ninety-six for 1 % parts. The nearest E12 values to 321 Ω are 270 Ω and 330 Ω; to 64 Ω, 56 Ω and 68 Ω. Which neighbour to pick is not a matter of rounding, as the next sections show.
`,
    },
    {
      kind: "check",
      id: "matching-resistor",
      prompt: "A driver with 30 Ω of output resistance drives a lone lead of Z0 = 351 Ω. What series resistor matches the source to the line?",
      answer: { value: 351 - 30, unit: "ohm", tolerance: 0.02 },
      hint: "Matching means R_out + R_s = Z0.",
      explanation: "R_s = 351 Ω − 30 Ω = 321 Ω. The nearest E12 values are 270 Ω and 330 Ω.",
    },
    {
      kind: "text",
      markdown: `
## The field rule

Installers pass on a rule of thumb (common practice of the trade; no published source): on a run of about 10 m, a data lead run **on its own** decodes well with a series resistor of about **250 Ω** and poorly with about 33 Ω; the same lead run **beside a ground conductor** in one cable corrupts with about 250 Ω and decodes with about **33 Ω**; and up to 2 or 3 m nearly anything works.

That rule sounds like superstition. It is not; it is series termination, seen from the field. Check it against the catalogue:

- **Lone lead**, Z0 ≈ 351 Ω. With 250 Ω and a 30 Ω driver, R_src = 280 Ω, close to Z0: Γ_s = (280 − 351) / (280 + 351) = −0.11. The far end gets a clean step with a little overshoot. With 33 Ω, R_src = 63 Ω: Γ_s = −0.70, and the far end rings hard.
- **Beside ground**, Z0 ≈ 94 Ω. With 33 Ω, R_src = 63 Ω: Γ_s = −0.20, a clean step with a small overshoot. With 250 Ω, R_src = 280 Ω: Γ_s = +0.50, a staircase.

So each half of the rule is "choose the resistor that roughly matches the cable", and the two cables differ by a factor of almost four in Z0. The values that installers learned by trial and error are the matching values, rounded.

## Why 3.3 V makes the rule decisive

Here is the part the rule of thumb leaves out. The pattern above is *decisive*, the difference between working and not working, mainly when the driver's high level sits near or below the pixel's high threshold. The everyday case is a 3.3 V controller pin feeding a 5 V pixel whose guaranteed high threshold is 3.5 V (lesson 2).

On a long run the far end settles at the driver's level, 3.3 V, below 3.5 V: such a run can never **work on every pixel that meets its datasheet**. The most it can do is **work on typical pixels**, which switch somewhere between ${levels.typicalBottom.toFixed(2)} V and ${levels.typicalTop.toFixed(2)} V (lesson 2). A typical pixel switching at the top of that range reads a rise only above ${levels.highestRise.toFixed(3)} V and a fall below ${levels.topFall.toFixed(3)} V. The settled 3.3 V clears the rise level by just ${(3.3 - levels.highestRise).toFixed(3)} V; what gives the run real margin is the **first arrival**, the doubled incident wave:

V_far(1) = 2 × V × Z0 / (R_src + Z0) = V × (1 − Γ_s).

For it to clear ${levels.highestRise.toFixed(3)} V by 0.3 V with V = 3.3 V, we need 1 − Γ_s ≥ ${((levels.highestRise + 0.3) / 3.3).toFixed(3)}, so Γ_s must be **negative**, below ${window.highestGamma.toFixed(3).replace("-", "−")}: R_src ≤ ${zFraction(window.upper)} × Z0. The source must sit a little *below* a match. A perfect match delivers exactly 3.3 V.

Now look at the four cases again with 3.3 V (the bounce arithmetic of lesson 5, no clamps):

${cases.map((c) => `- **${c.label}**: Γ_s = ${c.gammaText}. ${c.story}`).join("\n")}

The second arrival matters as much as the first: after the doubled wave lifts the far end, the wave returning from the driver pulls it down by V × Γ_s², and it must not fall back through ${levels.topFall.toFixed(3)} V, where a typical pixel switching at the top of its range reads the end of the pulse.
`,
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "A 3.3 V controller pin (30 Ω) drives 10 m of lone lead into a 5 V pixel. Step through the E24 resistors and watch the verdict: with small resistors the far end rings back down through the typical band; near a match the first arrival no longer lifts the far end clear of it.",
      params: {
        cable: "lone-lead",
        length: 10,
        seriesResistance: 33,
        highVoltage: 3.3,
        outputResistance: 30,
        edgeTime: 4e-9,
        supplyVoltage: 5,
        bits: "01100",
        slider: { field: "seriesResistance", series: "E24", min: 10, max: 1000 },
      },
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "The same pin and pixel on 10 m of data beside ground. Now the working values are small: near and above a match the far end climbs a staircase towards 3.3 V, too slowly for the 1 bits to read as 1 where a typical pixel switches high in its range.",
      params: {
        cable: "beside-ground",
        length: 10,
        seriesResistance: 33,
        highVoltage: 3.3,
        outputResistance: 30,
        edgeTime: 4e-9,
        supplyVoltage: 5,
        bits: "01100",
        slider: { field: "seriesResistance", series: "E24", min: 10, max: 1000 },
      },
    },
    {
      kind: "check",
      id: "first-arrival-3v3",
      prompt:
        "A 3.3 V pin (30 Ω) drives a 351 Ω lone lead through 250 Ω. What voltage does the first arrival reach at the open far end?",
      answer: { value: (2 * 3.3 * 351) / (280 + 351), unit: "V", tolerance: 0.02 },
      hint: "V_far(1) = 2 × V × Z0 / (R_src + Z0).",
      explanation: "2 × 3.3 V × 351 / (280 + 351) = 2316.6 / 631 ≈ 3.67 V: over a 5 V pixel's 3.5 V threshold by only 0.17 V, and for a few nanoseconds; what the run can count on is the 0.54 V it clears where typical pixels read a rise.",
    },
    {
      kind: "text",
      markdown: `
## The 3.3 V design window

The analysis gives a window with two edges, one from each failure, for typical pixels with a margin m of 0.3 V.

**Upper edge (the first arrival must clear the highest typical rise level with margin m):** 3.3 × (1 − Γ_s) ≥ ${levels.highestRise.toFixed(3)} + m. This gives Γ_s ≤ ${window.highestGamma.toFixed(3).replace("-", "−")}, which is R_src ≤ ${zFraction(window.upper)} × Z0.

**Lower edge (the second arrival must stay above the highest typical fall level with margin m):** 3.3 × (1 − Γ_s²) ≥ ${levels.topFall.toFixed(3)} + m gives |Γ_s| ≤ ${(-window.deepestGamma).toFixed(3)}, which is R_src ≥ ${zFraction(window.lower)} × Z0.

So, at 3.3 V into a 5 V pixel, **R_src between about ${zFraction(window.lower)} and ${zFraction(window.upper)} of Z0**: a little below a match. Subtract the driver's 30 Ω:

| cable | Z0 | R_s window (0.3 V margin, typical pixels) | field rule |
| --- | --- | --- | --- |
${windowRows.map((row) => `| ${row.label} | ${row.z0.toFixed(1)} Ω | ${row.from} to ${row.to} | ${row.fieldRule} |`).join("\n")}

The windows for lone lead and data beside ground **do not overlap**. That is the sentence to take away: **no single resistor suits every cable** at 3.3 V. A controller sold with a 33 Ω resistor on its outputs is right for a cable with a ground beside the data and wrong for a lone lead, and vice versa for one fitted with 270 Ω.

The arithmetic leaves out the pixel's input capacitance, the clamp diodes and the cable's loss; the workbench has them all, and on these runs it lands within one E24 step of the window (the course's tests hold it to that). And a window for typical pixels is still not a guarantee: on every cable, a level shifter to 5 V (lesson 2) is what makes the run **work on every pixel that meets its datasheet**.
`,
    },
    {
      kind: "check",
      id: "beside-ground-limit",
      prompt: `At 3.3 V into a 5 V pixel, the first arrival clears the highest typical rise level by 0.3 V only while R_src ≤ ${zFraction(window.upper)} × Z0. For data beside ground (Z0 = 93.8 Ω) and a 30 Ω pin, what is the largest series resistor that keeps that margin?`,
      answer: { value: window.upper * 93.8 - 30, unit: "ohm", tolerance: 0.03 },
      hint: `Largest R_src = ${zFraction(window.upper)} × Z0; then subtract the pin's 30 Ω.`,
      explanation: `${zFraction(window.upper)} × 93.8 Ω = ${(window.upper * 93.8).toFixed(1)} Ω; ${(window.upper * 93.8).toFixed(1)} Ω − 30 Ω ≈ ${(window.upper * 93.8 - 30).toFixed(0)} Ω. Above it the far end still reaches 3.3 V, but with less than 0.3 V to spare at the top of the typical band.`,
    },
    {
      kind: "text",
      markdown: `
## Why a 5 V driver tolerates much more

Repeat the argument with a 5 V driver (a level shifter, lesson 2) into the same 5 V pixel. Now the far end settles at 5 V, well above 3.5 V. The first arrival no longer has to do the work alone: if it falls short, the staircase climbs past the threshold a round trip or two later. The pixel still reads the pulse; it just reads it late.

How late matters less than you might fear, as long as the *falling* edge is delayed by about the same amount, and with thresholds at 0.7 and 0.3 of a 5 V swing it is (lesson 3): the staircase down crosses 1.5 V after as many round trips as the staircase up needed to cross 3.5 V. The pulse width largely survives. So with a 5 V driver every cable of the catalogue **works on every pixel that meets its datasheet** at 10 m with 33 Ω, and the lone lead, near its match, still does with 249 Ω.

With 249 Ω on the low-impedance cables the staircase is slow enough to cost the guarantee. Its steps cross the band over several round trips, and a 0 bit's fall starts while the last steps of its rise are still arriving: the two staircases add, and the far end falls in steps that turn a little back up on the way. A pixel switching just there could see an extra edge. Those runs still **work on typical pixels**; the three-core cable, slowest of all, fails.

The limit comes back only when the staircase becomes too slow to finish within a 0 bit. Count it: the far end after n arrivals is 5 × (1 − Γ_s^n), which passes 3.5 V when Γ_s^n < 0.3. The nth arrival comes (2n − 1) one-way delays after the switch. The driver's fall, 0.4 µs after the switch for a 0 bit, reaches the far end one delay later, at 0.4 µs + T_d. The crossing must come before that, and early enough to leave a pulse the pixel can measure.

### Worked example: three-core, 15 m, 5 V

- one-way delay: T_d = 15 m × 5.58 ns/m = 83.7 ns; the fall of a 0 bit reaches the far end at 400 ns + 83.7 ns ≈ 484 ns
- with 330 Ω: R_src = 350 Ω, Γ_s = (350 − 70.3) / (350 + 70.3) = 0.665; 0.665² = 0.44, 0.665³ = 0.29 < 0.3, so the third arrival crosses, at 5 × 83.7 ns ≈ 419 ns. The pulse starts only 65 ns before the far end turns down: shorter than the ${minPulseNs} ns a pixel needs to count a pulse at all, so the 0 bits are lost.
- with 390 Ω: R_src = 410 Ω, Γ_s = (410 − 70.3) / (410 + 70.3) = 0.707; 0.707³ = 0.35, 0.707⁴ = 0.25, so only the fourth arrival would cross, at 7 × 83.7 ns ≈ 586 ns. The fall has arrived at 484 ns. A 0 bit never clears the threshold: the 0s decode as "x".

On the workbench the limit lies lower still, because the falling staircase also takes round trips to get down through the band (step through the resistors in the figure of this lesson with a three-core cable in mind, or try it in the capstone). This is the same physics as lesson 3's large RC (15 m of three-core is 1,190 pF), and the reason the high-capacitance three-core cable and runs of 15 m and more can still fail at a few hundred ohms even with a 5 V driver. This is the **opposite pull** of a long, high-capacitance, low-impedance cable: the ringing argument wants R_src up near Z0, which is small; anything much bigger, and the cable's capacitance makes the edge too slow.
`,
    },
    {
      kind: "check",
      id: "staircase-arrival",
      prompt:
        "A 5 V driver with R_src = 350 Ω drives 15 m of three-core cable (Z0 = 70.3 Ω, 5.58 ns/m). The third arrival is the first above 3.5 V. How long after the driver switches does it arrive?",
      answer: { value: 5 * 15 * 5.58e-9, unit: "ns", tolerance: 0.02 },
      hint: "The nth arrival comes (2n − 1) one-way delays after the switch.",
      explanation: `One way: 15 m × 5.58 ns/m = 83.7 ns. Third arrival: 5 × 83.7 ns ≈ 419 ns. The 0 bit's fall reaches the far end at 400 ns + 83.7 ns ≈ 484 ns, so the pixel sees a pulse of barely 65 ns before the far end turns down: shorter than the ${minPulseNs} ns it needs to count a pulse.`,
    },
    {
      kind: "text",
      markdown: `
## When the field rule applies, honestly

Put it all together and the rule of thumb gets its fine print:

1. It is **series termination**: ≈ 250 Ω is near a match for a lone lead (351 Ω with a 30 Ω driver), ≈ 33 Ω is near a match for a cable with ground beside the data (94 Ω). Choose by the cable's Z0, not by habit.
2. It is **decisive at 3.3 V into a 5 V pixel**, which can at best work on typical pixels. Then the source must be a little below the match (R_src between about ${zFraction(window.lower)} and ${zFraction(window.upper)} of Z0 for a 0.3 V margin), and a resistor meant for another cable fails outright. A level shifter makes the run guaranteed.
3. With a **5 V driver** runs of about 10 m are guaranteed with resistors up to about a match; well above it, a slow staircase costs the guarantee on low-impedance cables. The choice then mostly sets the overshoot and clamp current, and how much margin the guarantee keeps.
4. **Long, high-capacitance runs** (three-core, 15 m and more) can still fail at a few hundred ohms even at 5 V, because the staircase is too slow for a 0 bit: it must clear the threshold before the driver's fall reaches the far end.
5. Up to **2–3 m**, one-way delays are around 10–15 ns, and with a 5 V driver nearly anything works. At 3.3 V the simulator is less kind to a short *lone lead* with a small resistor: the lead's inductance and the pixel's few picofarads ring for tens of nanoseconds, through the typical band. A short cable with ground beside the data, or the resistor the window asks for, settles it.

The course simulator is a teaching model. Before an installation is signed off, the run is confirmed on the bench with an oscilloscope at the first pixel (lesson 8).

## The lab

A 3.3 V controller pin drives a long run of a lone data lead to a 5 V pixel. Choose an E24 resistor with which the run works on typical pixels, every bit with at least 0.3 V of voltage margin and 120 ns of timing margin, and with the clamp current under the course's limit. A 3.3 V pin cannot make it guaranteed, and the lab says so. Use the window arithmetic first, then confirm it on the workbench. Your variant's length differs from your neighbour's; the window barely moves with length on this cable, and it is worth asking yourself why.
`,
    },
  ],
  lab,
} satisfies LessonInput;
