import type { LessonInput } from "../schema";
import { lab } from "./lab";

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

On a long run, the far end of the line eventually settles at the driver's level, 3.3 V, which is below 3.5 V. The only thing that can lift the pixel's input over its threshold is the **first arrival**, the doubled incident wave:

V_far(1) = 2 × V × Z0 / (R_src + Z0) = V × (1 − Γ_s).

For this to exceed 3.5 V with V = 3.3 V we need 1 − Γ_s > 3.5 / 3.3 = 1.061, so Γ_s must be **negative**, below −0.061. That means R_src < 0.886 × Z0: the source must be a little *below* a match. A perfect match delivers exactly 3.3 V, which fails.

Now look at the two cables again with 3.3 V:

- **Beside ground with 250 Ω**: Γ_s = +0.50. The far end climbs a staircase from below, 3.3 × (1 − 0.5^n): 1.65 V, 2.48 V, 2.89 V, … towards 3.3 V. It **never crosses 3.5 V**. Every bit decodes as "x". That is the "slow, rounded edge" installers see on a scope, and with a 3.3 V driver it is fatal.
- **Beside ground with 33 Ω**: Γ_s = −0.20. First arrival 3.3 × 1.20 = 3.95 V. Above 3.5 V by 0.45 V: the pixel reads the pulse.
- **Lone lead with 250 Ω**: Γ_s = −0.11. First arrival 3.3 × 1.11 = 3.67 V. Over the threshold, by 0.17 V. It works, but with a thin margin.
- **Lone lead with 33 Ω**: Γ_s = −0.70. The first arrival tries for 5.6 V (the clamp diodes catch it near 5.7 V), then the ring swings back down. In the linear picture the dip during the high reaches 3.3 × (1 − 0.49) = 1.70 V and the ring-back during the low reaches 3.3 × 0.49 = 1.60 V, above the 1.5 V low threshold. The clamps absorb some of that energy, so in the course simulator the ringing crosses the thresholds only briefly, for less than the pixel's deglitch time. The bits may decode on your bench and fail on a pixel with a shorter filter. "Poorly" is the right word.
`,
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "A 3.3 V controller pin (30 Ω) drives 10 m of lone lead into a 5 V pixel. Step through the E24 resistors: below about 40 Ω the far end rings through the thresholds; above about 280 Ω the first arrival no longer reaches 3.5 V.",
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
        "The same pin and pixel on 10 m of data beside ground. Now the working values are small: above about 50 Ω the first arrival no longer clears the 3.5 V threshold, and above about 64 Ω the far end climbs a staircase towards 3.3 V that never reaches it.",
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
      explanation: "2 × 3.3 V × 351 / (280 + 351) = 2316.6 / 631 ≈ 3.67 V: over a 5 V pixel's 3.5 V threshold by only 0.17 V.",
    },
    {
      kind: "text",
      markdown: `
## The 3.3 V design window

The analysis gives a window with two edges, one from each failure.

**Upper edge (the first arrival must clear the threshold with margin m):** 3.3 × (1 − Γ_s) ≥ 3.5 + m. With m = 0.3 V this gives Γ_s ≤ −0.152, which is R_src ≤ 0.737 × Z0.

**Lower edge (the ringing must not climb back out of the low region with margin m):** in the linear picture the ring-back after a falling edge peaks near 3.3 × Γ_s². Asking 3.3 × Γ_s² ≤ 1.5 − m = 1.2 V gives |Γ_s| ≤ 0.60, which is R_src ≥ 0.248 × Z0.

So, at 3.3 V into a 5 V pixel, **R_src between about a quarter and three-quarters of Z0**. Subtract the driver's 30 Ω:

| cable | Z0 | R_s window (0.3 V margin) | field rule |
| --- | --- | --- | --- |
| lone lead | 351 Ω | about 57 Ω to 229 Ω | 250 Ω: just outside the 0.3 V margin, still decodes |
| data beside ground | 93.8 Ω | 0 Ω to about 39 Ω | 33 Ω: inside |
| twisted pair | 99.4 Ω | 0 Ω to about 43 Ω | |
| 75 Ω coax | 75.0 Ω | 0 Ω to about 25 Ω | |
| three-core | 70.3 Ω | 0 Ω to about 22 Ω | |

In this arithmetic the windows for lone lead and data beside ground **do not overlap**, and in the simulator they meet at most at one value on the edge of both, with no margin to spare on either. That is the sentence to take away: **no single resistor suits every cable** at 3.3 V. A controller sold with a 33 Ω resistor on its outputs is right for a cable with a ground beside the data and wrong for a lone lead, and vice versa for one fitted with 270 Ω.

The course simulator agrees with this arithmetic closely on data beside ground. On the lone lead it finds the window a little wider at the bottom (about 39 Ω at 10 m), because the clamp diodes absorb part of the ringing that the linear formula ignores. That is a gift of the pixel's protection circuit, not something to design for.
`,
    },
    {
      kind: "check",
      id: "beside-ground-limit",
      prompt:
        "At 3.3 V into a 5 V pixel, the first arrival clears 3.5 V only while R_src < 0.886 × Z0. For data beside ground (Z0 = 93.8 Ω) and a 30 Ω pin, what is the largest series resistor that still lets the pixel see a high at all?",
      answer: { value: 0.886 * 93.8 - 30, unit: "ohm", tolerance: 0.03 },
      hint: "Largest R_src = 0.886 × Z0; then subtract the pin's 30 Ω.",
      explanation: "0.886 × 93.8 Ω = 83.1 Ω; 83.1 Ω − 30 Ω ≈ 53 Ω. With zero margin, that is; for 0.3 V of margin the limit is about 39 Ω.",
    },
    {
      kind: "text",
      markdown: `
## Why a 5 V driver tolerates much more

Repeat the argument with a 5 V driver (a level shifter, lesson 2) into the same 5 V pixel. Now the far end settles at 5 V, well above 3.5 V. The first arrival no longer has to do the work alone: if it falls short, the staircase climbs past the threshold a round trip or two later. The pixel still reads the pulse; it just reads it late.

How late does not matter, as long as the *falling* edge is delayed by about the same amount, and with thresholds at 0.7 and 0.3 of a 5 V swing it is (lesson 3): the staircase down crosses 1.5 V after as many round trips as the staircase up needed to cross 3.5 V. The pulse width survives. So with a 5 V driver most 10 m runs decode across the whole range of 33 Ω to 249 Ω, on every cable in the catalogue.

The limit comes back only when the staircase becomes too slow to finish within a 0 bit. Count it: the far end after n arrivals is 5 × (1 − Γ_s^n), which passes 3.5 V when Γ_s^n < 0.3. The nth arrival comes (2n − 1) one-way delays after the switch. The driver's fall, 0.4 µs after the switch for a 0 bit, reaches the far end one delay later, at 0.4 µs + T_d. The crossing must come before that, and early enough to leave a pulse the pixel can measure.

### Worked example: three-core, 15 m, 5 V

- one-way delay: T_d = 15 m × 5.58 ns/m = 83.7 ns; the fall of a 0 bit reaches the far end at 400 ns + 83.7 ns ≈ 484 ns
- with 330 Ω: R_src = 350 Ω, Γ_s = (350 − 70.3) / (350 + 70.3) = 0.665; 0.665² = 0.44, 0.665³ = 0.29 < 0.3, so the third arrival crosses, at 5 × 83.7 ns ≈ 419 ns. The pulse starts only 65 ns before the far end turns down: it decodes, with a thin timing margin.
- with 390 Ω: R_src = 410 Ω, Γ_s = (410 − 70.3) / (410 + 70.3) = 0.707; 0.707³ = 0.35, 0.707⁴ = 0.25, so only the fourth arrival would cross, at 7 × 83.7 ns ≈ 586 ns. The fall has arrived at 484 ns. A 0 bit never clears the threshold: the 0s decode as "x".

This is the same physics as lesson 3's large RC (15 m of three-core is 1,190 pF), and the reason the high-capacitance three-core cable and runs of 15 m and more can still fail at a few hundred ohms even with a 5 V driver. This is the **opposite pull** of a long, high-capacitance, low-impedance cable: the ringing argument wants R_src up near Z0, which is small; anything much bigger, and the cable's capacitance makes the edge too slow.
`,
    },
    {
      kind: "check",
      id: "staircase-arrival",
      prompt:
        "A 5 V driver with R_src = 350 Ω drives 15 m of three-core cable (Z0 = 70.3 Ω, 5.58 ns/m). The third arrival is the first above 3.5 V. How long after the driver switches does it arrive?",
      answer: { value: 5 * 15 * 5.58e-9, unit: "ns", tolerance: 0.02 },
      hint: "The nth arrival comes (2n − 1) one-way delays after the switch.",
      explanation: "One way: 15 m × 5.58 ns/m = 83.7 ns. Third arrival: 5 × 83.7 ns ≈ 419 ns. The 0 bit's fall reaches the far end at 400 ns + 83.7 ns ≈ 484 ns, so the pixel sees a pulse of barely 65 ns before the far end turns down.",
    },
    {
      kind: "text",
      markdown: `
## When the field rule applies, honestly

Put it all together and the rule of thumb gets its fine print:

1. It is **series termination**: ≈ 250 Ω is near a match for a lone lead (351 Ω with a 30 Ω driver), ≈ 33 Ω is near a match for a cable with ground beside the data (94 Ω). Choose by the cable's Z0, not by habit.
2. It is **decisive at 3.3 V into a 5 V pixel**, where only the doubled first arrival clears the threshold. Then the source must be a little below the match (R_src between about 0.25 and 0.74 of Z0 for a 0.3 V margin), and a resistor meant for another cable fails outright.
3. With a **5 V driver** most runs of about 10 m decode across 33 Ω to 249 Ω; the choice then mostly sets the overshoot and clamp current, not whether bits arrive.
4. **Long, high-capacitance runs** (three-core, 15 m and more) can still fail at a few hundred ohms even at 5 V, because the staircase is too slow for a 0 bit: it must clear the threshold before the driver's fall reaches the far end.
5. Up to **2–3 m**, one-way delays are around 10–15 ns; a little ringing dies out long before the pixel decides, and nearly anything works.

The course simulator is a teaching model. Before an installation is signed off, the run is confirmed on the bench with an oscilloscope at the first pixel (lesson 8).

## The lab

A 3.3 V controller pin drives a long run of a lone data lead to a 5 V pixel. Choose an E24 resistor that decodes every bit with at least 0.3 V of voltage margin and 120 ns of timing margin, without ringing that crosses a threshold (even if the pixel's deglitch filter would hide it) and with less than 5 mA driven into the pixel's clamp diodes. Use the window arithmetic first, then confirm it on the workbench. Your variant's length differs from your neighbour's; the window barely moves with length on this cable, and it is worth asking yourself why.
`,
    },
  ],
  lab,
} satisfies LessonInput;
