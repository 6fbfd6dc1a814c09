import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { cableCatalogue, OUTCOME_WORDS, RECEIVER_DEFAULTS } from "@/lib/sim";
import { controllerPin3v3 } from "../drivers";
import { COURSE_CLAMP_CURRENT_LIMIT } from "../pass-rule";
import { RECEIVER_MODEL_MARKDOWN, receiverLevels } from "../receiver-model";

const typical5 = receiverLevels(5);
const milliamps = (amps: number) => `${(amps * 1e3).toFixed(0)} mA`;

/** The classic failing run, by this lesson's bounce arithmetic (no clamps). */
const classic = (() => {
  const series = 33;
  const source = controllerPin3v3.outputResistance + series;
  const z0 = cableCatalogue["lone-lead"].z0;
  const gamma = (source - z0) / (source + z0);
  const arrivals = [1, 2, 3, 4].map((n) => controllerPin3v3.highVoltage * (1 - gamma ** n));
  return { driver: controllerPin3v3.outputResistance, series, source, z0, gamma, arrivals };
})();

export const lesson = {
  slug: "reflections",
  number: 5,
  title: "Reflections and ringing",
  summary:
    "What happens when the travelling wave reaches the pixel: reflection coefficients, the bounce diagram, the doubling at an open end, overshoot and ringing, the clamp diodes, and how ringing makes a pixel count a pulse twice.",
  minutes: 45,
  blocks: [
    {
      kind: "text",
      markdown: `
## The wave reaches the end

In lesson 4 the driver launched a step onto the cable and the step set off towards the pixel as a wave, carrying a voltage V and a current V / Z0 in a fixed ratio. This lesson follows it to the far end, and back.

The pixel's data input is, to a wave, almost nothing: a few picofarads and a very high resistance. The wave arrives carrying current V / Z0, and the pixel cannot take that current. Something has to give. What happens is that a second wave, the **reflection**, sets off back towards the driver, of just the size needed to make the current at the far end zero. At an open end, the reflected current must cancel the incident current, and that takes a reflected wave of the *same* voltage as the incident one. The voltage at the end is the sum of the two:

V_far = V_incident + V_reflected = 2 × V_incident.

**The far end of an unterminated line doubles the incident wave.** This one fact explains most of what installers see on long runs, good and bad.

## Reflection coefficients

The general rule, for a line of impedance Z0 ending in any load Z_L, is the **reflection coefficient** (a standard result of transmission-line theory):

Γ = (Z_L − Z0) / (Z_L + Z0),  V_reflected = Γ × V_incident.

Three cases to remember:

| end of the line | Z_L | Γ | voltage at the end |
| --- | --- | --- | --- |
| open (a pixel input) | very large | +1 | doubles |
| short circuit | 0 | −1 | zero |
| matched | equal to Z0 | 0 | no reflection |

The same rule works at the **driver end** for waves coming back. The returning wave meets the driver's output resistance plus the series resistor, R_src, and reflects with

Γ_s = (R_src − Z0) / (R_src + Z0).

If R_src is smaller than Z0, Γ_s is negative: the wave comes back upside down. If R_src equals Z0, nothing comes back at all. That second case is lesson 6.

## The bounce diagram

To follow a step through several reflections, draw a **bounce diagram** (also called a lattice diagram): the cable's length across the page, time running down it. The launched wave is a line sloping from the driver side to the far side, taking one delay T_d to cross. At the far end it reflects (×Γ_L) and slopes back; at the driver it reflects again (×Γ_s); and so on. Label each segment with its voltage and add up, at any point, all the waves that have passed it.

For an open far end (Γ_L = +1) the sum at the far end has a tidy closed form. If the driver's open-circuit step is V and n waves have arrived at the far end,

V_far(n) = V × (1 − Γ_s^n).

(It is a geometric series: each round trip multiplies what comes back by Γ_s.) The waves arrive at T_d, 3 T_d, 5 T_d, and so on.
`,
    },
    {
      kind: "figure",
      figure: "bounce-diagram",
      caption:
        "A 5 V step from a 20 Ω driver into 10 m of lone lead (351 Ω, 36.5 ns one way), open at the pixel. Move the source resistance and watch the far-end voltage after each arrival: ringing below Z0, a clean step at Z0, a staircase above it.",
      params: {
        stepVoltage: 5,
        sourceResistance: 20,
        z0: 351,
        oneWayDelay: 36.5e-9,
        loadReflection: 1,
        arrivals: 8,
        supplyVoltage: 5,
        highThreshold: 0.7,
        slider: { field: "sourceResistance", min: 0, max: 1000, step: 1 },
      },
    },
    {
      kind: "text",
      markdown: `
## Three worked cases

### Case 1: a strong driver on a lone lead

A 5 V buffer (20 Ω), no series resistor, 10 m of lone lead (Z0 = 351 Ω, 3.65 ns/m, so T_d = 36.5 ns).

- Launched: 5 V × 351 / (20 + 351) = 4.73 V
- Γ_s = (20 − 351) / (20 + 351) = −0.892
- Far end after each arrival, V × (1 − Γ_s^n):
  - n = 1 (at 36.5 ns): 5 × (1 + 0.892) = 9.46 V
  - n = 2 (at 110 ns): 5 × (1 − 0.796) = 1.02 V
  - n = 3 (at 183 ns): 5 × (1 + 0.710) = 8.55 V
  - n = 4: 1.83 V; n = 5: 7.83 V …

The far end swings between roughly 9 V and 1 V, crossing both thresholds of a 5 V pixel on every swing, and dies away only slowly because Γ_s is so close to −1. This is **ringing**. Its period is four one-way delays (the sign flips each round trip): 4 × 36.5 ns = 146 ns, a frequency of about 6.8 MHz. On a scope it looks like a damped sine wave sitting on every edge.

### Case 2: a moderate source on a low-impedance cable

A 5 V buffer (20 Ω) through 33 Ω into 10 m of data beside ground (Z0 = 93.8 Ω).

- Γ_s = (53 − 93.8) / (53 + 93.8) = −0.278
- Far end: n = 1: 5 × (1 + 0.278) = 6.39 V; n = 2: 4.61 V; n = 3: 5.11 V; then settles at 5 V.

One overshoot of about 1.4 V above the final level, one small dip, done. The dip stays far above 3.5 V, so the pixel sees one clean pulse.

### Case 3: a large source on the same cable

Same cable, but 270 Ω in series (290 Ω in all).

- Γ_s = (290 − 93.8) / (290 + 93.8) = +0.511
- Far end: 2.44 V, 3.69 V, 4.33 V, 4.66 V, 4.83 V …

No overshoot now: a **staircase**, one step per round trip (112 ns on 10 m), creeping up to 5 V. The far end crosses 3.5 V only at the second arrival, 3 × 55.8 ns ≈ 167 ns after the driver switched. That is lesson 3's slow RC edge, seen step by step.
`,
    },
    {
      kind: "check",
      id: "source-coefficient",
      prompt: "A source of 53 Ω (driver plus series resistor) drives a 93.8 Ω line. What is the reflection coefficient at the source? (A plain number, with its sign.)",
      answer: { value: (53 - 93.8) / (53 + 93.8), unit: "", tolerance: 0.02 },
      hint: "Γ_s = (R_src − Z0) / (R_src + Z0).",
      explanation: "(53 − 93.8) / (53 + 93.8) = −40.8 / 146.8 ≈ −0.278. Negative: returning waves come back inverted.",
    },
    {
      kind: "check",
      id: "first-arrival",
      prompt:
        "With that source (Γ_s = −0.278) and a 5 V driver, what voltage does the open far end reach when the first wave arrives, ignoring the clamp diodes?",
      answer: { value: 5 * (1 - (53 - 93.8) / (53 + 93.8)), unit: "V", tolerance: 0.02 },
      hint: "V_far(1) = V × (1 − Γ_s). Equivalently: twice the launched step.",
      explanation: "5 V × (1 + 0.278) = 6.39 V, which is twice the launched 3.19 V.",
    },
    {
      kind: "check",
      id: "ringing-period",
      prompt: "A 10 m lone lead has 3.65 ns/m of delay. What is the period of the ringing when the source resistance is much lower than Z0?",
      answer: { value: 4 * 10 * 3.65e-9, unit: "ns", tolerance: 0.02 },
      hint: "With Γ_s negative the far-end voltage repeats after two round trips: four one-way delays.",
      explanation: "One way: 10 m × 3.65 ns/m = 36.5 ns. Period: 4 × 36.5 ns = 146 ns (about 6.8 MHz).",
    },
    {
      kind: "text",
      markdown: `
## A bounce diagram, step by step

A fourth case, one wave at a time: the 3.3 V controller pin (30 Ω, from the course's driver list) with 100 Ω in series, into 10 m of lone lead (Z0 = 351 Ω, T_d = 36.5 ns). R_src = 130 Ω, so Γ_s = (130 − 351) / (130 + 351) = −0.459, the pixel end has Γ_L = +1, and the launched step is 3.3 V × 351 / 481 = 2.41 V.

1. At 36.5 ns the 2.41 V wave reaches the pixel and reflects whole: arriving and leaving waves add, and the far end jumps to 4.81 V.
2. At 73 ns the reflection reaches the driver: −0.459 × 2.41 V = −1.10 V sets off back.
3. At 110 ns it arrives doubled: the far end drops by 2.21 V, to 2.60 V. Each later round trip multiplies the wave by Γ_s again.

| arrival n | time after the switch (ns) | step at the far end (V) | far end (V) |
| --- | --- | --- | --- |
| 1 | 36.5 | +4.81 | 4.81 |
| 2 | 110 | −2.21 | 2.60 |
| 3 | 183 | +1.01 | 3.62 |
| 4 | 256 | −0.47 | 3.15 |
| 5 | 329 | +0.21 | 3.37 |
| 6 | 402 | −0.10 | 3.27 |

**When has it settled?** After n arrivals the far end is 3.3 V × |Γ_s|^n from its final level. Within 1 % (our choice, not a standard) needs n > ln 0.01 / ln 0.459 = 5.9: the sixth arrival, at 11 × T_d = 402 ns. A 0 bit is high for only 400 ns (lesson 1), so the falling edge starts its own, upside-down bounce diagram before this one has died; the line is linear and the two simply add.

**Does it decode?** The 2.60 V plateau lies inside the band where pixels switch (lesson 2). A pixel that switches anywhere above it, up to the 3.5 V its datasheet allows, sees the pulse start at 36.5 ns, end at 110 ns and start again at 183 ns: two pulses in one bit slot. Typical pixels switch up to ${typical5.typicalTop.toFixed(2)} V and read the fall at ${typical5.topFall.toFixed(3)} V, so they misread it too: the workbench says "${OUTCOME_WORDS.fails}".
`,
    },
    {
      kind: "check",
      id: "settling-time",
      prompt:
        "In the fourth case (Γ_s = −0.459, T_d = 36.5 ns, open far end), how long after the driver switches does the far end stay within 1 % of its final level?",
      answer: { value: 11 * 10 * 3.65e-9, unit: "ns", tolerance: 0.02 },
      hint: "Find the first n with |Γ_s|^n < 0.01; arrival n comes at (2n − 1) × T_d.",
      explanation: "ln 0.01 / ln 0.459 = 5.9, so n = 6, which arrives at 11 × 36.5 ns ≈ 402 ns: just after a 0 bit's 400 ns high time has ended.",
    },
    {
      kind: "text",
      markdown: `
## Overshoot and the clamp diodes

**Overshoot** is how far the far end rises above the level it finally settles at; **undershoot** is the same below 0 V after a falling edge. Case 1 asks for a 4.5 V overshoot on a 5 V pixel; case 2 for 1.4 V.

Neither happens in full, because the pixel's input has **clamp diodes** (lesson 3): once the pin rises above its supply by a diode drop, roughly 5.7 V on a 5 V pixel (taking 0.7 V as the textbook silicon forward drop), the upper diode conducts and holds it there. A falling edge's undershoot is caught the same way by the lower diode, at about −0.7 V. The clamps do two things:

1. They cap the voltage, and with it some of the ringing: the energy the clamp absorbs does not reflect back.
2. They carry current into the pixel's supply or ground pin, outside the pixel's normal operation. Heat is not the issue: the pulses are a few nanoseconds long, so the average current is tiny. What limits it is the input's rated **injection current**, the most current the clamp structure may carry before it upsets the chip around it (latch-up, disturbed neighbouring inputs). Logic datasheets state it as an absolute maximum input clamp current, ±${milliamps(RECEIVER_DEFAULTS.clampCurrentRating)} for standard CMOS logic (JEDEC JESD7A, from memory); pixel datasheets often give none. The course assumes the same ${milliamps(RECEIVER_DEFAULTS.clampCurrentRating)} for a pixel input and, as common practice derates absolute maximums, holds every lab to half of it: ${milliamps(COURSE_CLAMP_CURRENT_LIMIT)}.

A useful estimate of the clamp current comes from looking back into the line from the far end. For the first arrival, the line looks like a source of 2 × V_launched behind a resistance Z0 (a textbook Thevenin equivalent of a line at its end). With the pin held at 5.7 V:

- case 2: I ≈ (6.39 V − 5.7 V) / 93.8 Ω ≈ 7 mA;
- case 1: I ≈ (9.46 V − 5.7 V) / 351 Ω ≈ 11 mA, and it keeps coming back each cycle of the ringing.

The course simulator models the diodes with the exponential diode law and reports the peak clamp current of every run; case 1's estimate is already above the course's ${milliamps(COURSE_CLAMP_CURRENT_LIMIT)}.

## Ringing that the pixel counts

Overshoot by itself is a stress problem. Ringing becomes a *data* problem when it turns back through the point where a pixel switches. Recall from lesson 2 how the course judges a run:
${RECEIVER_MODEL_MARKDOWN}
Two kinds of ringing break a run:

- **During a high**, the far end rings back down through a switching point: the pixel sees the pulse end early and a new one start when the ringing comes back up. The slot holds two pulses, or a glitch and a pulse, and the bit is lost.
- **During a low**, after the falling edge, the far end rings back up through a switching point: the pixel sees a pulse where none was sent.

### The classic failing run

The trade's best-known failure (common practice of the trade, lesson 6): a 3.3 V controller pin (${classic.driver} Ω) with ${classic.series} Ω in series, into 10 m of lone lead, to a 5 V pixel. R_src = ${classic.source} Ω against Z0 = ${classic.z0.toFixed(0)} Ω, so Γ_s = ${classic.gamma.toFixed(3).replace("-", "−")}. Without clamps, the bounce arithmetic gives the far end after each arrival:

| arrival n | far end, V × (1 − Γ_s^n) |
| --- | --- |
${classic.arrivals.map((v, i) => `| ${i + 1} | ${v.toFixed(2)} V |`).join("\n")}

The first arrival lifts the 3.3 V driver over the 3.5 V threshold, and the second drops it to ${classic.arrivals[1].toFixed(2)} V: below every point where a typical pixel reads a fall (the lowest is ${typical5.lowestFall.toFixed(3)} V). Every pulse breaks. The first arrival stays below the roughly 5.7 V where the upper clamp conducts hard, so here the clamps change little: with them or without, the workbench says "${OUTCOME_WORDS.fails}". The figure draws both.
`,
    },
    {
      kind: "figure",
      figure: "clamp-compare",
      caption:
        "The classic failing run (3.3 V pin, 33 Ω, 10 m of lone lead, 5 V pixel) with the pixel's clamp diodes and without: both far ends fall back through the typical band after the first arrival.",
      params: { cable: "lone-lead", length: 10, seriesResistance: 33, highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9, supplyVoltage: 5, bits: "0110" },
    },
    {
      kind: "figure",
      figure: "clamp-compare",
      caption:
        "Case 1 (5 V buffer, no resistor, 10 m of lone lead) with the clamp diodes and without: the clamps hold the first arrival near 5.7 V and the ringing never comes back through the band, at the cost of current into the pixel's input.",
      params: { cable: "lone-lead", length: 10, seriesResistance: 0, highVoltage: 5, outputResistance: 20, edgeTime: 3e-9, supplyVoltage: 5, bits: "0110" },
    },
    {
      kind: "text",
      markdown: `
### When the clamps rescue the data

Case 1 looks worse on paper: a 5 V buffer with no resistor on the same lead, the arithmetic swinging between about 9.5 V and 1 V. But every real pixel input has its clamp diodes. They catch the first arrival near 5.7 V and absorb most of its energy, so what travels back is far smaller than the arithmetic assumes, and the far end no longer swings down through the band. On the workbench this run **works on every pixel that meets its datasheet**, while driving more current into the clamps than the course's limit allows. The clamps rescue the data at the expense of the input's injection rating; a series resistor (lesson 6) fixes both.

The **voltage margin** of each judgement measures how close a run came: how far the far end stays above the switching points during each high and below them during each low, at the worst switching point of the judgement's band. The run's margin is the smallest over all its bits.

## What decides the ringing

Go back to the three cases. What changed was only R_src relative to Z0:

| R_src vs Z0 | Γ_s | far end |
| --- | --- | --- |
| much smaller | close to −1 | large overshoot, long ringing |
| a little smaller | small negative | one overshoot, settles |
| equal | 0 | clean step, nothing returns |
| larger | positive | staircase, slow |
| much larger | close to +1 | slow staircase (the RC curve) |

Everything here is fixed by two numbers you control: the cable (which sets Z0) and the series resistor (which sets R_src with the driver). Lesson 6 turns that into a design rule. Before it does, notice one more thing in case 1: the first arrival reached 9.46 V, almost twice the driver's level. On a 3.3 V driver that doubling is the only thing that lifts a pixel's input over 3.5 V. Ringing is the price; the doubling is the prize. Lesson 6 shows how to keep the prize and refuse the price.
`,
    },
    {
      kind: "check",
      id: "staircase-second-step",
      prompt:
        "A 5 V driver with Γ_s = +0.511 drives an open-ended line. What is the far-end voltage after the second arrival?",
      answer: { value: 5 * (1 - 0.511 ** 2), unit: "V", tolerance: 0.02 },
      hint: "V_far(n) = V × (1 − Γ_s^n) with n = 2.",
      explanation: "0.511² = 0.261; 5 V × (1 − 0.261) ≈ 3.69 V, just above a 5 V pixel's 3.5 V threshold.",
    },
    {
      kind: "text",
      markdown: `
## Reading reflections on a scope

A scope shows one point's voltage against time. Reflections give themselves away by:

- **flat steps**: nothing changes between arrivals, so the trace moves in flat-topped steps, each one round trip long (73 ns on 10 m of lone lead);
- **timing set by length**: steps at T_d, 3 T_d, 5 T_d, ringing every 4 T_d. Double the cable and the timing doubles; change the resistor and only the step sizes change.

A slow **RC edge** (lesson 3) is a smooth curve, steepest at its start, with no flat parts. A resistor charging a capacitor cannot overshoot, so a trace that goes past its final level and comes back is not an RC edge. Its rise time follows the resistance: 680 Ω instead of 330 Ω behind the 20 Ω buffer doubles R_src from 350 to 700 Ω and doubles the rise, where ringing would keep its period. A staircase with steps too fine to see is the RC curve (lesson 4). Ringing far faster than 4 T_d that ignores the cable's length often comes from the probe's ground lead (lesson 8).

## A common misconception: "a shorter cable rings less"

In the bounce diagram every voltage of the fourth case's table depends only on the driver, the resistor and Z0, not on length. On 5 m of the same lead the far end still jumps to 4.81 V and drops back to 2.60 V; each step just lasts half as long (T_d = 18.3 ns). The cable's resistance barely damps it (10 m of lone lead has 0.74 Ω against 351 Ω). Only when the round trip becomes shorter than the edge (lesson 4) do the steps merge into the edge and the ringing fade. Nor is 4.81 V from a 3.3 V driver interference: the open end doubles the wave. The cure is a matched source (lesson 6), not a shorter cable.
`,
    },
    {
      kind: "text",
      markdown: `
## Summing up

- At an open end such as a pixel input, the wave reflects with Γ = +1 and the far-end voltage **doubles**.
- Returning waves reflect again at the driver with Γ_s = (R_src − Z0) / (R_src + Z0).
- The far end after n arrivals is V × (1 − Γ_s^n): ringing when R_src < Z0, a clean step when R_src = Z0, a staircase when R_src > Z0.
- Ringing has a period of four one-way delays; overshoot is caught by the pixel's clamp diodes, at the cost of current through them.
- Ringing that turns back through a switching point makes the pixel lose pulses or count pulses that were never sent; the clamp diodes can absorb some of it, at the cost of current into the input.

## The lab

A 5 V buffered output drives a long run to the first pixel. Fit a series resistor (E24 series) that keeps the overshoot at the pixel under 10 % of its supply, while keeping the far end's rise time short and every bit decoding. Use the bounce-diagram arithmetic to predict where the window is before you touch the workbench: the resistor that makes Γ_s small, neither much below nor much above zero.
`,
    },
  ],
  lab,
} satisfies LessonInput;
