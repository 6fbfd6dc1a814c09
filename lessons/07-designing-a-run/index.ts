import type { LessonInput } from "../schema";
import { bench } from "./bench";
import { lab } from "./lab";
import { receiverLevels } from "../receiver-model";
import { PIN_3V3_WINDOW, zFraction } from "../source-window";

const levels = receiverLevels(5);
const signed = (x: number) => `${x < 0 ? "−" : "+"}${Math.abs(x).toFixed(3)}`;

/** A 3.3 V pin (30 Ω) through `series` into an open line of `z0`: lesson 5's first two arrivals. */
function pinRun(series: number, z0: number) {
  const source = 30 + series;
  const gamma = (source - z0) / (source + z0);
  return { series, source, gamma, first: 3.3 * (1 - gamma), second: 3.3 * (1 - gamma ** 2) };
}

const runA = {
  ...pinRun(47, 99.4),
  windowFrom: PIN_3V3_WINDOW.lower * 99.4,
  windowTo: PIN_3V3_WINDOW.upper * 99.4,
  middle: ((PIN_3V3_WINDOW.lower + PIN_3V3_WINDOW.upper) / 2) * 99.4,
};
const runC = pinRun(47, 93.8);

export const lesson = {
  slug: "designing-a-run",
  number: 7,
  title: "Designing a run",
  summary:
    "A step-by-step method for choosing the cable and a standard resistor value for each data run of an installation, checking the margins on paper, powering the strip safely, and knowing when a single-ended run has reached its limit.",
  minutes: 50,
  blocks: [
    {
      kind: "text",
      markdown: `
## From physics to a procedure

The last five lessons built the physics one piece at a time. This lesson turns it into a method you can apply on a site survey with a calculator, before a metre of cable is pulled. It has seven steps. None of them is new; the value is in doing them in order, for every run, and writing the answers down.

### Step 1: know the two ends

Write down, for the driver: its high level (3.3 V pin or 5 V buffer), its output resistance and its edge time. A controller's datasheet may give them; otherwise measure the output resistance from the drop under a known load, or use the course's typical figures (30 Ω for a 3.3 V pin, 20 Ω for a 5 V buffer, as in the labs). For the pixel: its supply at the strip's input (measure it under load; it is often below nominal), and its thresholds from its datasheet (the course uses 0.7 and 0.3 of the supply).

### Step 2: choose the cable

Prefer a cable that **carries the data's return beside it**: a two-core cable with data and ground in one jacket, one pair of a twisted-pair data cable (data on one conductor, ground on its partner), or coax. Three reasons:

- its characteristic impedance is fixed by its construction, so your calculation holds on site;
- the loop between data and return is small, so it picks up little noise and radiates little;
- the ground conductor gives the data a clean reference (lesson 2).

A lone data lead is the cable to avoid. Its impedance depends on where it happens to lie relative to its return. With the two-wire formula for unequal conductors (a 22 AWG lead, an 18 AWG return, ε_eff ≈ 1.2), the catalogue's 351 Ω holds at 10 mm; at 5 mm the figure is about 274 Ω and at 30 mm about 471 Ω. A lead that wanders between those spacings along its route has no single Z0 to match.

### Step 3: compute the line

From the catalogue (lesson 4) or the cable's datasheet: Z0, delay per metre and capacitance per metre. Then for your length: the one-way delay T_d = length × delay per metre, and the total capacitance.

### Step 4: fix the driver

If the pixels run at 5 V, use a 5 V driver: a level shifter at the controller (lesson 2). It turns the resistor choice from a knife edge into a wide window (lesson 6). If you must drive 5 V pixels from a 3.3 V pin, the run can at best work on typical pixels, only through the doubled first arrival, and the resistor window is narrow.

### Step 5: compute the resistor window

- **5 V driver into 5 V pixels**: aim for R_src ≈ Z0 (R_s = Z0 − R_out), which removes the ringing; anything from about half to about twice that decodes on ordinary lengths. Check the staircase (step 6) if R_src is well above Z0.
- **3.3 V driver into 5 V pixels**: R_src between about ${zFraction(PIN_3V3_WINDOW.lower)} × Z0 and ${zFraction(PIN_3V3_WINDOW.upper)} × Z0 for 0.3 V of voltage margin on typical pixels (lesson 6). Below it the ringing falls back through the typical band; above it the first arrival no longer lifts the far end clear of it. No resistor makes it guaranteed; write "works on typical pixels" in the installation file and recommend a level shifter.

### Step 6: check the slow side

Wherever R_src is larger than Z0, the far end climbs a staircase: after n arrivals it stands at V × (1 − Γ_s^n), and the nth arrival comes (2n − 1) × T_d after the switch. A 0 bit's fall reaches the far end at 0.4 µs + T_d; the pixel threshold must be crossed well before that, and with a 3.3 V driver the first arrival must do it.

### Step 7: choose the standard value, then confirm on the bench

Pick the E-series value (IEC 60063) nearest the middle of the window, not nearest one edge. Consider the resistor's tolerance: IEC 60063 pairs the E12 series with ±10 %, E24 with ±5 % and E96 with ±1 % parts. A 68 Ω E24 resistor may be anywhere from 64.6 Ω to 71.4 Ω, which is small next to most windows; a value chosen at the very edge of the window is not. Then build it and measure it at the first pixel (lesson 8). The arithmetic and the simulator are models; the bench is the judge.
`,
    },
    {
      kind: "check",
      id: "twisted-pair-limit",
      prompt: `A 3.3 V pin (30 Ω) drives one pair of a twisted-pair cable (Z0 = 99.4 Ω) into a 5 V pixel. Using the upper edge R_src ≤ ${zFraction(PIN_3V3_WINDOW.upper)} × Z0 (0.3 V margin on typical pixels), what is the largest series resistor you may fit?`,
      answer: { value: PIN_3V3_WINDOW.upper * 99.4 - 30, unit: "ohm", tolerance: 0.03 },
      hint: "Largest R_src first, then subtract the pin's own resistance.",
      explanation: `${zFraction(PIN_3V3_WINDOW.upper)} × 99.4 Ω = ${(PIN_3V3_WINDOW.upper * 99.4).toFixed(1)} Ω; minus 30 Ω gives about ${(PIN_3V3_WINDOW.upper * 99.4 - 30).toFixed(0)} Ω. The lower edge is ${zFraction(PIN_3V3_WINDOW.lower)} × 99.4 Ω − 30 Ω ≈ ${(PIN_3V3_WINDOW.lower * 99.4 - 30).toFixed(0)} Ω, so 47 Ω sits near the middle.`,
    },
    {
      kind: "text",
      markdown: `
## Worked design: three runs from one controller

A shop display has one controller with 3.3 V outputs and three strips of 5 V pixels. The installer has a roll of twisted-pair cable, a roll of two-core cable (data beside ground) and a drawer of E24 resistors.

### Run A: 12 m of twisted pair, 3.3 V pin direct

- Line: Z0 = 99.4 Ω, 5.20 ns/m; T_d = 12 × 5.20 ns = 62.4 ns; C = 12 × 52.3 pF ≈ 628 pF.
- Window at 3.3 V (typical pixels, 0.3 V margin): R_src from ${zFraction(PIN_3V3_WINDOW.lower)} × 99.4 = ${runA.windowFrom.toFixed(1)} Ω to ${zFraction(PIN_3V3_WINDOW.upper)} × 99.4 = ${runA.windowTo.toFixed(1)} Ω, so R_s from ${(runA.windowFrom - 30).toFixed(0)} Ω to ${(runA.windowTo - 30).toFixed(0)} Ω. The middle of the window is R_src ≈ ${runA.middle.toFixed(0)} Ω, R_s ≈ ${(runA.middle - 30).toFixed(0)} Ω.
- Choice: ${runA.series} Ω (E24). R_src = ${runA.source} Ω; Γ_s = (${runA.source} − 99.4) / (${runA.source} + 99.4) = ${signed(runA.gamma)}.
- First arrival: 3.3 × (1 − Γ_s) = ${runA.first.toFixed(2)} V, ${(runA.first - levels.highestRise).toFixed(2)} V over the highest level where a typical pixel reads a rise. Second arrival: 3.3 × (1 − Γ_s²) = ${runA.second.toFixed(2)} V, ${(runA.second - levels.topFall).toFixed(2)} V over the highest level where it reads a fall. Both margins clear 0.3 V: the run works on typical pixels. It is not guaranteed; a level shifter would make it so.

### Run B: 18 m of data beside ground, through a 5 V level shifter

The installer fits a one-direction 5 V buffer at the controller for the longest run (lesson 2).

- Line: Z0 = 93.8 Ω; T_d = 18 × 5.58 ns ≈ 100 ns; C = 18 × 59.5 pF ≈ 1,071 pF.
- At 5 V aim for a match: R_s = 93.8 − 20 ≈ 74 Ω. The E24 neighbours are 68 Ω and 75 Ω. Either works at 5 V; take 68 Ω, which keeps the source just below the match, so any error shows as a slight overshoot rather than a slight staircase (R_src = 88 Ω, Γ_s = −0.032).
- First arrival: 5 × 1.032 = 5.16 V. A clean step with a 0.16 V overshoot; no staircase, so the 1,071 pF never shows as a slow edge.

### Run C: 2.5 m of data beside ground, 3.3 V pin direct

- T_d = 2.5 × 5.58 ns ≈ 14 ns. A short run: reflections settle quickly. The 3.3 V driver still needs the window of lesson 6: R_s from ${(PIN_3V3_WINDOW.lower * 93.8 - 30).toFixed(0)} Ω to ${(PIN_3V3_WINDOW.upper * 93.8 - 30).toFixed(0)} Ω for 0.3 V of margin on typical pixels.
- Choice: ${runC.series} Ω, near the middle, the same as a beside-ground run of any length.

Writing the three results in a table for the installation file is part of the job:

| run | cable | length | driver | resistor | predicted first arrival | promise |
| --- | --- | --- | --- | --- | --- | --- |
| A | twisted pair | 12 m | 3.3 V pin | ${runA.series} Ω | ${runA.first.toFixed(2)} V | works on typical pixels |
| B | data beside ground | 18 m | 5 V buffer | 68 Ω | 5.16 V | works on every pixel that meets its datasheet |
| C | data beside ground | 2.5 m | 3.3 V pin | ${runC.series} Ω | ${runC.first.toFixed(2)} V | works on typical pixels |
`,
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "Run A as designed: a 3.3 V pin, 47 Ω and twisted pair into a 5 V pixel. Stretch the run and watch the first arrival and the margins: the resistor window hardly depends on length, but loss and every imperfection the model leaves out grow with it.",
      params: {
        cable: "twisted-pair",
        length: 12,
        seriesResistance: 47,
        highVoltage: 3.3,
        outputResistance: 30,
        edgeTime: 4e-9,
        supplyVoltage: 5,
        bits: "01100",
        slider: { field: "length", min: 2, max: 40, step: 1 },
      },
    },
    {
      kind: "check",
      id: "resistor-tolerance",
      prompt: "A 68 Ω resistor from the E24 series carries a ±5 % tolerance. What is the highest resistance it may actually have?",
      answer: { value: 68 * 1.05, unit: "ohm", tolerance: 0.01 },
      hint: "Nominal × (1 + tolerance).",
      explanation: "68 Ω × 1.05 = 71.4 Ω. The window for run B is tens of ohms wide, so this does not matter there.",
    },
    {
      kind: "text",
      markdown: `
## Power: the other half of the design

A data run that decodes perfectly still fails if the strip's supply sags, and a supply run that is too thin is a fire risk, not just a fault. The same Ohm's law that set the ground offset in lesson 2 sets the voltage drop along supply conductors.

### Worked example: voltage drop on a supply feed

A 5 V strip draws 10 A. It is fed through 5 m of two-core 18 AWG cable (20.9 mΩ/m per conductor, from the AWG table of ASTM B258 and annealed copper's resistivity).

- Loop resistance: out and back, 2 × 5 m × 0.0209 Ω/m = 0.209 Ω
- Voltage drop: 10 A × 0.209 Ω ≈ 2.09 V. The strip receives less than 3 V: the pixels dim, shift colour, and their thresholds move.
- Heat: P = I² × R = 10² × 0.209 ≈ 21 W dissipated in the cable.

The answers installers use are **heavier conductors**, **shorter feeds**, **higher supply voltages with local regulation** where the product allows, and **power injection**: feeding the strip at several points, each feed sized and fused for its own current. Injecting power does not change the data design, with one rule: every injection point's negative must join the strip's ground, and the data ground conductor must not become a path for supply current (lesson 2).
`,
    },
    {
      kind: "caution",
      title: "Supply design is safety work",
      markdown: `
Low-voltage DC at high current can start fires. A conductor too thin for its current, a connector run beyond its rating, or a feed without a fuse sized to protect its conductor can overheat inside a ceiling, a sign or a display case. Size each conductor for its current and length, fuse every feed as the supply and strip manufacturers' instructions require, keep injection wiring mechanically secure, and check connections for heat under full load. Power supplies connect to the mains: installing or altering mains wiring is work for a licensed electrician. Local electrical codes and the manufacturers' instructions take precedence over this course. The simulator is a teaching model; confirm every run on the bench.
`,
    },
    {
      kind: "check",
      id: "supply-drop",
      prompt: "A 5 V strip draws 10 A through 5 m of two-core 18 AWG cable (20.9 mΩ/m per conductor). What is the voltage drop in the cable?",
      answer: { value: 10 * 2 * 5 * 0.0209, unit: "V", tolerance: 0.02 },
      hint: "The current flows out on one conductor and back on the other: the loop is twice the length.",
      explanation: "R = 2 × 5 m × 0.0209 Ω/m = 0.209 Ω; V = 10 A × 0.209 Ω ≈ 2.09 V, far too much for a 5 V strip.",
    },
    {
      kind: "text",
      markdown: `
## When single-ended signalling runs out

Everything so far is **single-ended** signalling: one data conductor, its voltage measured against a ground. It has limits that no resistor can move:

- **Ground offsets grow with distance and current.** The pixel reads the data against its own ground. Over tens of metres, with supply currents flowing somewhere in the ground system, the two ends' grounds drift apart by tenths of a volt or more, straight out of the noise margin (lesson 2).
- **Noise pickup grows with length.** Every metre beside a mains cable or a switching supply adds a little.
- **The 3.3 V window closes.** The first arrival is all that lifts the far end clear of where typical pixels switch, and the smallest loss or mismatch eats the margin.

For a 5 V driver on a good cable, trade practice puts the comfortable limit of a single-ended run somewhere around 10 to 20 metres; beyond that installers reach for other tools (common practice of the trade, not a standard). There are two.

### Differential transceivers

A **differential** link sends the data as two opposite signals on a twisted pair: one conductor goes up as the other goes down. The receiver looks only at the *difference* between them. Noise that couples into both conductors alike, and the ground offset between the two ends, appear the same on both and cancel (within the receiver's common-mode range).

The open standard most used for this is TIA-485-A (often called RS-485): its receivers must read a difference of ±200 mV correctly anywhere within a common-mode range of −7 V to +12 V. At the controller, a transceiver turns the single-ended data into a differential pair; at the far end, a second transceiver turns it back, right beside the first pixel, so the single-ended part of the run is only centimetres long. Three things change in the design:

- the pair is **terminated at the far end** with a resistor across it equal to the pair's differential impedance (about 100 Ω for a data-network cable), not with a series resistor at the driver: the transceiver's strong output can feed the matched load directly;
- the far-end transceiver **needs power** at the far end, normally from the strip's own supply;
- the data still reaches the first pixel as a short single-ended hop, which now works easily.

Over a differential pair, runs of many tens of metres at 800 kHz are routine in the trade (common practice; the transceiver's datasheet gives its own limits).

### A regenerating stage mid-run

The other tool uses the pixel chain itself. Every pixel regenerates the data with fresh edges (lesson 1). A single pixel (or a small board built around one pixel chip) placed partway along a long run, powered locally, receives the data over the first half and sends clean, full-level edges over the second. One long, marginal run becomes two short, comfortable ones. The cost: that pixel takes its 24 bits from the stream like any other, so the controller's pixel map must include it, and it needs a supply at that point, with all the cautions of supply wiring.
`,
    },
    {
      kind: "check",
      id: "long-run-delay",
      prompt: "How long is the one-way delay of a 25 m twisted-pair run (5.20 ns/m)?",
      answer: { value: 25 * 5.2e-9, unit: "ns", tolerance: 0.02 },
      hint: "Length × delay per metre.",
      explanation: "25 m × 5.20 ns/m = 130 ns. A staircase needing three arrivals would cross 5 × 130 ns = 650 ns after the switch, after a 0 bit's fall has reached the far end (400 ns + 130 ns = 530 ns): the 0s would be lost.",
    },
    {
      kind: "text",
      markdown: `
## Summing up

- Follow the seven steps for every run: the two ends, the cable, the line constants, the driver, the resistor window, the slow side, the standard value and the bench.
- Choose cables with the return beside the data; a lone lead has no dependable Z0.
- With a 5 V driver aim for R_src ≈ Z0; at 3.3 V into 5 V pixels, R_src between a quarter and three-quarters of Z0.
- Supply conductors are part of the design: compute their drop and their heat, fuse every feed, and leave mains work to licensed electricians.
- When single-ended runs reach their limit, use a differential link (TIA-485-A transceivers over a terminated twisted pair) or a regenerating stage mid-run.

## The lab and the bench exercise

The lab is the second series-termination case: a long run of cable with ground beside the data, driven straight from a 3.3 V pin. Choose a resistor from the E96 series; the window is narrow and sits at the small end.

The bench exercise asks you to build one run of your own design, measure it at the first pixel and submit your numbers with a scope photo. Your instructor reviews it.
`,
    },
  ],
  lab,
  bench,
} satisfies LessonInput;
