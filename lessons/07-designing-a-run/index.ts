import { bufferRun, courseFixes, pinRun } from "../choice-check-runs";
import { controllerPin3v3 } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import type { LessonInput } from "../schema";
import { bench } from "./bench";
import { lab } from "./lab";
import { checkGivens, numbers } from "./numbers";

export const lesson = {
  slug: "designing-a-run",
  number: 7,
  title: "Designing a run",
  summary:
    "A step-by-step method for choosing the cable and a standard resistor value for each data run of an installation, checking the margins on paper, powering the strip safely, and knowing when a single-ended run has reached its limit.",
  minutes: 50,
  numbers: lessonNumbers(numbers),
  blocks: [
    {
      kind: "text",
      markdown: `
## From physics to a procedure

The last five lessons built the physics one piece at a time. This lesson turns it into a method you can apply on a site survey with a calculator, before a metre of cable is pulled. It has seven steps. None of them is new; the value is in doing them in order, for every run, and writing the answers down.

### Step 1: know the two ends

Write down, for the driver: its high level (3.3 V pin or 5 V buffer), its output resistance and its edge time. A controller's datasheet may give them; otherwise measure the output resistance from the drop under a known load, or use the course's typical figures ({{pin.resistance}} for a 3.3 V pin, {{buffer.resistance}} for a 5 V buffer, as in the labs). For the pixel: its supply at the strip's input (measure it under load; it is often below nominal), and its thresholds from its datasheet (the course uses {{sim.highThreshold}} and {{sim.lowThreshold}} of the supply).

### Step 2: choose the cable

Prefer a cable that **carries the data's return beside it**: a two-core cable with data and ground in one jacket, one pair of a twisted-pair data cable (data on one conductor, ground on its partner), or coax. Three reasons:

- its characteristic impedance is fixed by its construction, so your calculation holds on site;
- the loop between data and return is small, so it picks up little noise and radiates little;
- the ground conductor gives the data a clean reference (lesson 2).

A lone data lead is the cable to avoid. Its impedance depends on where it happens to lie relative to its return. With the two-wire formula for unequal conductors (a {{lone.gauge}} AWG lead, an {{lone.returnGauge}} AWG return, ε_eff ≈ {{lone.permittivity}}), the catalogue's {{lone.z0}} holds at {{lone.spacing}}; at {{loneAt.near.spacing}} the figure is about {{loneAt.near.z0}} and at {{loneAt.far.spacing}} about {{loneAt.far.z0}}. A lead that wanders between those spacings along its route has no single Z0 to match.

### Step 3: compute the line

From the catalogue (lesson 4) or the cable's datasheet: Z0, delay per metre and capacitance per metre. Then for your length: the one-way delay T_d = length × delay per metre, and the total capacitance.

### Step 4: fix the driver

If the pixels run at {{pixel.vdd}}, use a 5 V driver: a level shifter at the controller (lesson 2). It turns the resistor choice from a knife edge into a wide window (lesson 6). If you must drive 5 V pixels from a 3.3 V pin, the run can at best work on typical pixels, only through the doubled first arrival, and the resistor window is narrow.

### Step 5: compute the resistor window

- **5 V driver into 5 V pixels**: aim for R_src ≈ Z0 (R_s = Z0 − R_out), which removes the ringing; anything from about half to about twice that decodes on ordinary lengths. Check the staircase (step 6) if R_src is well above Z0.
- **3.3 V driver into 5 V pixels**: R_src between about {{window.lower}} × Z0 and {{window.upper}} × Z0 for {{window.margin}} of voltage margin on typical pixels (lesson 6). Below it the ringing falls back through the typical band; above it the first arrival no longer lifts the far end clear of it. No resistor makes it guaranteed; write "works on typical pixels" in the installation file and recommend a level shifter.

### Step 6: check the slow side

Wherever R_src is larger than Z0, the far end climbs a staircase: after n arrivals it stands at V × (1 − Γ_s^n), and the nth arrival comes (2n − 1) × T_d after the switch. A 0 bit's fall reaches the far end at {{sim.zeroHigh}} + T_d; the pixel threshold must be crossed well before that, and with a 3.3 V driver the first arrival must do it.

### Step 7: choose the standard value, then confirm on the bench

Pick the E-series value (IEC 60063) nearest the middle of the window, not nearest one edge. Consider the resistor's tolerance: IEC 60063 pairs the E12 series with ±{{tolerance.e12}}, E24 with ±{{tolerance.e24}} and E96 with ±{{tolerance.e96}} parts. A {{runB.neighbours.below}} E24 resistor may be anywhere from {{runB.lowest}} to {{runB.highest}}, which is small next to most windows; a value chosen at the very edge of the window is not. Then build it and measure it at the first pixel (lesson 8). The arithmetic and the simulator are models; the bench is the judge.
`,
    },
    {
      kind: "check",
      id: "twisted-pair-limit",
      prompt: "A 3.3 V pin ({{pin.resistance}}) drives one pair of a twisted-pair cable (Z0 = {{twisted.z0}}) into a 5 V pixel. Using the upper edge R_src ≤ {{window.upper}} × Z0 ({{window.margin}} margin on typical pixels), what is the largest series resistor you may fit?",
      answer: { value: numbers.runA.seriesHigh.value, unit: "ohm", tolerance: 0.03 },
      hint: "Largest R_src first, then subtract the pin's own resistance.",
      explanation: "{{window.upper}} × {{twisted.z0}} = {{runA.sourceHigh}}; minus {{pin.resistance}} gives about {{runA.seriesHigh}}. The lower edge is {{window.lower}} × {{twisted.z0}} − {{pin.resistance}} ≈ {{runA.seriesLow}}, so {{runA.series}} sits near the middle.",
    },
    {
      kind: "text",
      markdown: `
## Worked design: three runs from one controller

A shop display has one controller with 3.3 V outputs and three strips of 5 V pixels. The installer has a roll of twisted-pair cable, a roll of two-core cable (data beside ground) and a drawer of E24 resistors.

### Run A: {{runA.length}} of twisted pair, 3.3 V pin direct

- Line: Z0 = {{twisted.z0}}, {{twisted.delay}}; T_d = {{runA.length|bare}} × {{twisted.delay|bare}} ns = {{runA.delay}}; C = {{runA.length|bare}} × {{twisted.capacitance|bare}} pF ≈ {{runA.capacitance}}.
- Window at {{pin.volts}} (typical pixels, {{window.margin}} margin): R_src from {{window.lower}} × {{twisted.z0|bare}} = {{runA.sourceLow}} to {{window.upper}} × {{twisted.z0|bare}} = {{runA.sourceHigh}}, so R_s from {{runA.seriesLow}} to {{runA.seriesHigh}}. The middle of the window is R_src ≈ {{runA.sourceMiddle}}, R_s ≈ {{runA.seriesMiddle}}.
- Choice: {{runA.series}} (E24). R_src = {{runA.source}}; Γ_s = ({{runA.source|bare}} − {{twisted.z0|bare}}) / ({{runA.source|bare}} + {{twisted.z0|bare}}) = {{runA.gamma|sign}}.
- First arrival: {{pin.volts|bare}} × (1 − Γ_s) = {{runA.first}}, {{runA.riseMargin}} over the highest level where a typical pixel reads a rise. Second arrival: {{pin.volts|bare}} × (1 − Γ_s²) = {{runA.second}}, {{runA.fallMargin}} over the highest level where it reads a fall. Both margins clear {{window.margin}}: the run works on typical pixels. It is not guaranteed; a level shifter would make it so.

### Run B: {{runB.length}} of data beside ground, through a 5 V level shifter

The installer fits a one-direction 5 V buffer at the controller for the longest run (lesson 2).

- Line: Z0 = {{beside.z0}}; T_d = {{runB.length|bare}} × {{beside.delay|bare}} ns ≈ {{runB.delay}}; C = {{runB.length|bare}} × {{beside.capacitance|bare}} pF ≈ {{runB.capacitance}}.
- At {{buffer.volts}} aim for a match: R_s = {{beside.z0|bare}} − {{buffer.resistance|bare}} ≈ {{runB.match}}. The E24 neighbours are {{runB.neighbours.below}} and {{runB.neighbours.above}}. Either works at {{buffer.volts}}; take {{runB.neighbours.below}}, which keeps the source just below the match, so any error shows as a slight overshoot rather than a slight staircase (R_src = {{runB.source}}, Γ_s = {{runB.gamma}}).
- First arrival: {{buffer.volts|bare}} × {{runB.oneMinusGamma}} = {{runB.first}}. A clean step with a {{runB.overshoot}} overshoot; no staircase, so the {{runB.capacitance}} never shows as a slow edge.

### Run C: {{runC.length}} of data beside ground, 3.3 V pin direct

- T_d = {{runC.length|bare}} × {{beside.delay|bare}} ns ≈ {{runC.delay}}. A short run: reflections settle quickly. The 3.3 V driver still needs the window of lesson 6: R_s from {{runC.seriesLow}} to {{runC.seriesHigh}} for {{window.margin}} of margin on typical pixels.
- Choice: {{runC.series}}, near the middle, the same as a beside-ground run of any length.

Writing the three results in a table for the installation file is part of the job:

| run | cable | length | driver | resistor | predicted first arrival | promise |
| --- | --- | --- | --- | --- | --- | --- |
| A | twisted pair | {{runA.length}} | 3.3 V pin | {{runA.series}} | {{runA.first}} | works on typical pixels |
| B | data beside ground | {{runB.length}} | 5 V buffer | {{runB.neighbours.below}} | {{runB.first}} | works on every pixel that meets its datasheet |
| C | data beside ground | {{runC.length}} | 3.3 V pin | {{runC.series}} | {{runC.first}} | works on typical pixels |
`,
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "Run A as designed: a 3.3 V pin, {{runA.series}} and twisted pair into a 5 V pixel. Stretch the run and watch the first arrival and the margins: the resistor window hardly depends on length, but loss and every imperfection the model leaves out grow with it.",
      params: {
        cable: "twisted-pair",
        length: numbers.runA.length.value,
        seriesResistance: numbers.runA.series.value,
        highVoltage: controllerPin3v3.highVoltage,
        outputResistance: controllerPin3v3.outputResistance,
        edgeTime: controllerPin3v3.edgeTime,
        supplyVoltage: sharedNumbers.pixel.vdd.value,
        bits: "01100",
        slider: { field: "length", min: 2, max: 40, step: 1 },
      },
    },
    {
      kind: "check",
      id: "resistor-tolerance",
      prompt: "A {{runB.neighbours.below}} resistor from the E24 series carries a ±{{tolerance.e24}} tolerance. What is the highest resistance it may actually have?",
      answer: { value: numbers.runB.highest.value, unit: "ohm", tolerance: 0.01 },
      hint: "Nominal × (1 + tolerance).",
      explanation: "{{runB.neighbours.below}} × (1 + {{tolerance.e24|unit=|dp=2}}) = {{runB.highest}}. The window for run B is tens of ohms wide, so this does not matter there.",
    },
    {
      kind: "text",
      markdown: `
## Power: the other half of the design

A data run that decodes perfectly still fails if the strip's supply sags, and a supply run that is too thin is a fire risk, not just a fault. The same Ohm's law that set the ground offset in lesson 2 sets the voltage drop along supply conductors.

### Worked example: voltage drop on a supply feed

A 5 V strip draws {{supply.current}}. It is fed through {{supply.length}} of two-core {{supply.gauge}} AWG cable ({{supply.perMetre}} per conductor, from the AWG table of ASTM B258 and annealed copper's resistivity).

- Loop resistance: out and back, 2 × {{supply.length}} × {{supply.perMetreInOhms}} = {{supply.loop}}
- Voltage drop: {{supply.current}} × {{supply.loop}} ≈ {{supply.drop}}. The strip receives only {{supply.left}}: the pixels dim, shift colour, and their thresholds move.
- Heat: P = I² × R = {{supply.current|bare}}² × {{supply.loop|bare}} ≈ {{supply.heat}} dissipated in the cable.

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
      prompt: "A 5 V strip draws {{given.current}} through {{given.length}} of two-core {{supply.gauge}} AWG cable ({{supply.perMetre}} per conductor). What is the voltage drop in the cable?",
      givens: checkGivens.supplyDrop.map((given) => ({ numbers: given, answer: { value: given.drop.value, unit: "V", tolerance: 0.02 } })),
      hint: "The current flows out on one conductor and back on the other: the loop is twice the length.",
      explanation: "R = 2 × {{given.length}} × {{supply.perMetreInOhms}} = {{given.loop}}; V = {{given.current}} × {{given.loop}} ≈ {{given.drop}}, a large share of a 5 V strip's supply.",
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

Over a differential pair, runs of many tens of metres at {{sim.bitRate}} are routine in the trade (common practice; the transceiver's datasheet gives its own limits).

### A regenerating stage mid-run

The other tool uses the pixel chain itself. Every pixel regenerates the data with fresh edges (lesson 1). A single pixel (or a small board built around one pixel chip) placed partway along a long run, powered locally, receives the data over the first half and sends clean, full-level edges over the second. One long, marginal run becomes two short, comfortable ones. The cost: that pixel takes its {{sim.wordBits}} bits from the stream like any other, so the controller's pixel map must include it, and it needs a supply at that point, with all the cautions of supply wiring.
`,
    },
    {
      kind: "check",
      id: "long-run-delay",
      prompt: "How long is the one-way delay of a {{longTwisted.length}} twisted-pair run ({{twisted.delay}})?",
      answer: { value: numbers.longTwisted.delay.value, unit: "ns", tolerance: 0.02 },
      hint: "Length × delay per metre.",
      explanation: "{{longTwisted.length}} × {{twisted.delay}} = {{longTwisted.delay}}. A staircase needing three arrivals would cross {{longTwisted.factor}} × {{longTwisted.delay}} = {{longTwisted.crossing}} after the switch, after a 0 bit's fall has reached the far end ({{sim.zeroHigh|unit=ns|dp=0}} + {{longTwisted.delay}} = {{longTwisted.fall}}): the 0s would be lost.",
    },
    {
      kind: "choice",
      id: "pick-design-trace",
      ask: "pick-trace",
      prompt: "Four candidate designs for the same twisted-pair run. Each trace below is the far end of one of them. Which trace belongs to the design described?",
      hint: "Read the level first (which driver), then the shape (how the resistor compares with the cable's impedance).",
      explanation: "The 3.3 V pin settles at its own lower level; with the buffer the resistor decides between overshoot, a clean step and a staircase.",
      runs: [bufferRun("twisted-pair", 10, 82), pinRun("twisted-pair", 10, 82), bufferRun("twisted-pair", 10, 0), bufferRun("twisted-pair", 10, 470)],
    },
    {
      kind: "choice",
      id: "diagnose-design",
      ask: "diagnose",
      prompt: "A design that flickers on site. The far end, as the simulator draws it, is below. Which one change makes it work on every pixel that meets its datasheet?",
      hint: "Decide whether the trouble is the level the far end settles at or how slowly it gets there.",
      explanation: "A slow staircase needs less resistance; a level below the threshold needs a driver with a higher level. Another cable changes neither enough here.",
      runs: [bufferRun("coax-75", 10, 470), pinRun("coax-75", 10, 47), bufferRun("beside-ground", 30, 220), pinRun("lone-lead", 20, 47)],
      fixes: courseFixes,
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
