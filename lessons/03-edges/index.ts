import { bufferRun } from "../choice-check-runs";
import { buffer5v } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { checkGivens, numbers } from "./numbers";

const { sim, pixel } = sharedNumbers;

export const lesson = {
  slug: "edges",
  number: 3,
  title: "Edges: rise time and RC",
  summary:
    "Why a data edge is never vertical, how the resistance of the driver and the series resistor combine with capacitance into a time constant, what that does to the pulse widths a pixel measures, and where the simple RC picture stops being true.",
  minutes: 40,
  numbers: lessonNumbers(numbers),
  blocks: [
    {
      kind: "text",
      markdown: `
## No edge is vertical

Lesson 1 drew the data signal as clean rectangles, and lesson 2 said where the pixel draws its thresholds. Real edges take time to climb from low to high and fall back. How much time, and what decides it, is the subject of this lesson. It is the first place where the components you choose, above all the series resistor, change what the pixel sees.

### Rise time

The **rise time** of an edge is the time it takes to go from 10 % to 90 % of its final swing. The **fall time** is the same for a falling edge, 90 % down to 10 %. Measuring between 10 % and 90 % rather than 0 % and 100 % avoids the slow, hard-to-pin-down start and finish of a real edge; it is the convention used by oscilloscopes and datasheets alike, and by the course simulator.

The driver itself is not instantaneous. The course simulator models a controller output or buffer as a voltage that ramps between 0 V and its high level in an **edge time** ({{buffer.edge}} for the 5 V buffers in these labs, {{pin.edge}} for a 3.3 V controller pin; these are the course's driver models, chosen to be typical rather than taken from one part) behind an **output resistance** ({{buffer.resistance}} and {{pin.resistance}} in the same models). At the driver's own pin, with nothing connected, you would see a {{buffer.edge}} edge. Everything connected to the pin slows it down.

## Resistance and capacitance

Whatever the driver pushes into has **capacitance**: charge must flow into it before its voltage can rise. The pixel's input has a few picofarads ({{sim.inputCapacitance}} in the course simulator). A cable has much more: its two conductors, close together and separated by insulation, form a long thin capacitor. The course catalogue gives about {{beside.capacitance|bare}} pF per metre for a data conductor with a ground conductor beside it in one jacket, so {{shortLead.length}} of it holds as much as {{pixelsInTwoMetres}} pixel inputs.

The charge has to arrive through **resistance**: the driver's output resistance plus any resistor you fit in series with the data line. A resistance R feeding a capacitance C from a step of V volts charges it along the curve

v(t) = V × (1 − e^(−t/τ)), with the **time constant** τ = R × C.

After one time constant the capacitor has reached {{charged.one}} of the way, after two {{charged.two}}, after three {{charged.three}}. It never quite arrives, which is why rise time is measured 10 % to 90 %.

### The rise-time rule

Solve the curve for the 10 % and 90 % points: v = 0.1 V at t = τ × ln(1/0.9) = {{tenPercentAt}} τ, and v = 0.9 V at t = τ × ln(10) = {{ninetyPercentAt}} τ. The difference is

t_rise = τ × ln 9 ≈ {{textbook.ln9}} × τ = {{textbook.ln9}} × R × C.

That is the one formula to remember from this lesson: **rise time ≈ {{textbook.ln9}} R C**. It is a textbook result for a single resistor charging a single capacitor, and the same for the fall.

### Worked example: a short lead

A 5 V buffer ({{buffer.resistance}}) feeds a pixel through a {{shortLead.series}} series resistor and {{shortLead.length}} of cable with {{beside.capacitance}}.

- Resistance: R = {{buffer.resistance}} + {{shortLead.series}} = {{shortLead.resistance}}
- Capacitance: C = {{shortLead.length}} × {{beside.capacitance}} + {{sim.inputCapacitance}} = {{shortLead.cableCapacitance}} + {{sim.inputCapacitance}} = {{shortLead.capacitance}}
- Time constant: τ = {{shortLead.resistance}} × {{shortLead.capacitance}} = {{shortLead.tau}}
- Rise time: {{textbook.ln9}} × {{shortLead.tau}} ≈ {{shortLead.rise}}

The {{buffer.edge}} edge of the buffer has become a {{shortLead.rise}} edge at the pixel. Take away the series resistor and the same arithmetic gives τ = {{buffer.resistance}} × {{shortLead.capacitance}} = {{bare.tau}} and a rise of about {{bare.rise}}, close to the driver's own edge.
`,
    },
    {
      kind: "figure",
      figure: "rc-edge",
      caption:
        "A {{sim.zeroHigh}} pulse (a 0 bit) from a 5 V driver of {{buffer.resistance}} through the series resistor into {{shortLead.capacitance}}. Move the resistor and watch the 10–90 % rise time and the points where the pulse crosses the pixel's thresholds.",
      params: {
        highVoltage: buffer5v.highVoltage,
        outputResistance: buffer5v.outputResistance,
        seriesResistance: numbers.shortLead.series.value,
        capacitance: numbers.shortLead.capacitance.value,
        supplyVoltage: pixel.vdd.value,
        highThreshold: sim.highThreshold.value,
        lowThreshold: sim.lowThreshold.value,
        highTime: sim.zeroHigh.value,
        slider: { field: "seriesResistance", min: 0, max: 3300, step: 10 },
      },
    },
    {
      kind: "check",
      id: "time-constant",
      prompt: "A {{buffer.resistance}} driver feeds {{given.capacitance}} through a {{given.series}} series resistor. What is the time constant τ?",
      givens: checkGivens.timeConstant.map((given) => ({ numbers: given, answer: { value: given.tau.value, unit: "ns", tolerance: 0.02 } })),
      hint: "Add the resistances in series, then τ = R × C.",
      explanation: "R = {{buffer.resistance}} + {{given.series}} = {{given.resistance}}. τ = {{given.resistance}} × {{given.capacitance|unit=F|exp=-12|dp=0}} = {{given.tau|unit=s|exp=-9}} = {{given.tau}}.",
    },
    {
      kind: "check",
      id: "rise-time",
      prompt: "Another lead's RC has a time constant of {{given.tau}}. What 10–90 % rise time does it give?",
      givens: checkGivens.riseTime.map((given) => ({ numbers: given, answer: { value: given.rise.value, unit: "ns", tolerance: 0.03 } })),
      hint: "t_rise = τ × ln 9 ≈ {{textbook.ln9}} × τ.",
      explanation: "{{textbook.ln9}} × {{given.tau}} ≈ {{given.rise}} (exactly, ln 9 × {{given.tau}} = {{given.rise|dp=1}}).",
    },
    {
      kind: "text",
      markdown: `
## What a slow edge does to the bits

A pixel does not care about rise time as such. It cares about *when* the voltage crosses its thresholds, because the interval between the upward crossing of the high threshold and the downward crossing of the low threshold is the pulse width it measures (lesson 1). A slow edge moves both crossings.

### Time to cross a threshold

From the charging curve, the time to climb from 0 to a level v_th is

t = τ × ln(V / (V − v_th)).

And on the way down, starting from V, the time to fall to v_th is t = τ × ln(V / v_th).

For a 5 V driver into a 5 V pixel (thresholds {{pixel.high}} and {{pixel.low}}):

- rising to {{pixel.high}}: τ × ln({{buffer.volts|bare}} / {{symmetric.gap|bare}}) = {{symmetric.crossing}} τ
- falling to {{pixel.low}}: τ × ln({{buffer.volts|bare}} / {{pixel.low|bare}}) = {{symmetric.crossing}} τ

The two delays are **equal**. The pulse arrives late but with its width intact, because the {{sim.highThreshold}} and {{sim.lowThreshold}} thresholds sit symmetrically in the swing. This is the good news of this lesson: for a full-swing driver, a symmetric RC edge delays the pulse without distorting it, as long as the edge has time to finish.

### When the edge cannot finish

It stops being harmless when the edge is slow compared with the pulse. A 0 bit is high for only {{sim.zeroHigh}}. If the voltage has not reached the high threshold by the time the driver falls again, the pixel sees no pulse at all and the slot decodes as "x". For a full-swing 5 V driver that needs {{symmetric.crossing}} τ < {{sim.zeroHigh}}, so τ must stay well under {{symmetric.tauLimit}}. Long before that limit, the pulse stops reaching the full {{buffer.volts}} before it falls, so the fall starts lower, crosses {{pixel.low}} sooner and the measured width shrinks. Every nanosecond lost comes out of the {{sim.timingMargin}} timing margin.

### When the thresholds are not symmetric

The delays are equal only when the driver's swing is centred on the thresholds. Suppose the driver only reaches {{weak.volts}} (a weak output, or a 5 V buffer on a sagging supply) while the pixel runs at {{pixel.vdd}}:

- rising to {{pixel.high}}: τ × ln({{weak.volts|bare}} / {{weak.riseGap|bare}}) = {{weak.rise}} τ
- falling to {{pixel.low}}: τ × ln({{weak.volts|bare}} / {{pixel.low|bare}}) = {{weak.fall}} τ

The rising crossing is late by {{weak.shrink}} τ more than the falling one, so **every pulse shrinks by about {{weak.shrink}} τ**. With τ = {{weak.tau}} that is {{weak.lost}} gone from every pulse: a 1 bit's {{sim.timingMargin}} margin drops to {{weak.left}}, and nothing else has gone wrong yet. And with a 3.3 V driver into a 5 V pixel, the RC curve approaches {{pin.volts}} and never crosses {{pixel.high}} at all: no amount of waiting helps. That is lesson 2's problem seen through the edge.
`,
    },
    {
      kind: "check",
      id: "cable-capacitance",
      prompt:
        "A pixel ({{sim.inputCapacitance}} input) sits at the end of {{fourMetres.length}} of cable with {{beside.capacitance|bare}} pF per metre. What total capacitance does the driver have to charge, in the RC picture?",
      answer: { value: numbers.fourMetres.capacitance.value, unit: "pF", tolerance: 0.02 },
      hint: "Capacitance per metre times length, plus the pixel's input.",
      explanation: "{{fourMetres.length}} × {{beside.capacitance}} = {{fourMetres.cableCapacitance}}; plus {{sim.inputCapacitance}} gives {{fourMetres.capacitance}}.",
    },
    {
      kind: "check",
      id: "largest-resistance",
      prompt:
        "With that {{fourMetres.capacitance}} load, what is the largest total resistance (driver plus series resistor) that keeps the 10–90 % rise time at or under {{fourMetres.riseLimit}}?",
      answer: { value: numbers.fourMetres.largestR.value, unit: "ohm", tolerance: 0.03 },
      hint: "Rearrange t_rise = {{textbook.ln9}} × R × C for R.",
      explanation: "R = t_rise / ({{textbook.ln9}} × C) = {{fourMetres.riseLimit}} / ({{textbook.ln9}} × {{fourMetres.capacitance}}) ≈ {{fourMetres.largestRByRule}} (with ln 9 in place of {{textbook.ln9}}: {{fourMetres.largestR}}).",
    },
    {
      kind: "text",
      markdown: `
## Why fit a series resistor at all?

If resistance only slows edges, why does nearly every well-built controller output have a resistor in series with the data line? There are two reasons. The second, and larger, is the subject of lessons 5 and 6: on a long cable, the resistor controls reflections. The first is protection, and it works through the same resistance.

A pixel's data input has **clamp diodes**, one to its ground and one to its supply, that conduct when the input is driven outside the supply range. They protect the chip from small excursions, but they are not meant to carry much current. Two everyday situations push current through them:

- **The pixel is unpowered while the controller is on.** The strip's supply is off or its fuse has blown, but the controller still sends data. The driver pushes current through the upper clamp diode into the dead pixel's supply rail. This is called back-powering, and it can partly power the chip in strange ways.
- **The line overshoots.** On a cable, as lesson 5 shows, the far end can swing well above the supply rail for a few nanoseconds, and the clamp diode catches it.

The series resistor limits that current. Take a silicon diode's forward drop as about {{textbook.diodeDrop}} (a textbook figure). With the pixel unpowered and a 5 V driver of {{buffer.resistance}}:

- with no series resistor: I ≈ ({{buffer.volts}} − {{textbook.diodeDrop}}) / {{buffer.resistance}} ≈ {{clamp.bare}}, far beyond what an input clamp is built for;
- with {{shortLead.series}} in series: I ≈ ({{buffer.volts}} − {{textbook.diodeDrop}}) / ({{buffer.resistance}} + {{shortLead.series}}) ≈ {{clamp.fitted}}.

So the resistor trades edge speed for protection. In this lesson's lab you find the window where both are acceptable. The course simulator reports the peak clamp current of every run so you can see it.
`,
    },
    {
      kind: "caution",
      title: "An unpowered strip is not always dead",
      markdown: `
Back-powering works both ways: a strip whose supply is switched off can still be partly alive through its data input, and a strip whose supply is on carries enough current to burn a careless connection. Before changing wiring, disconnect the strip's supply and the data lead. Low-voltage DC at high current can start fires: keep every supply feed fused as the supply and strip manufacturers' instructions require. Any work on the mains side of the power supplies is for a licensed electrician, and local electrical codes and the manufacturers' instructions take precedence over this course.
`,
    },
    {
      kind: "check",
      id: "clamp-current",
      prompt:
        "A 5 V driver ({{buffer.resistance}}) is connected through {{given.series}} to a pixel whose supply is off. Taking the clamp diode's forward drop as {{textbook.diodeDrop}}, about how much current flows into the pixel's input?",
      givens: checkGivens.clampCurrent.map((given) => ({ numbers: given, answer: { value: given.current.value, unit: "mA", tolerance: 0.03 } })),
      hint: "The voltage left after the diode drop, divided by the total series resistance.",
      explanation: "({{buffer.volts}} − {{textbook.diodeDrop}}) / ({{buffer.resistance}} + {{given.series}}) = {{clamp.drive}} / {{given.resistance}} ≈ {{given.current}}.",
    },
    {
      kind: "choice",
      id: "pick-edge-trace",
      ask: "pick-trace",
      prompt: "The same buffer drives the same cable through four different series resistors. Each trace below is the far end of one of them. Which trace belongs to the run described?",
      hint: "More resistance in front of the cable's capacitance makes the edge slower; with very little, the far end overshoots.",
      explanation: "The edge slows as the series resistance grows: almost none overshoots and rings, a moderate one gives a clean step, a large one climbs slowly.",
      runs: [bufferRun("beside-ground", 5, 0), bufferRun("beside-ground", 5, 100), bufferRun("beside-ground", 5, 330), bufferRun("beside-ground", 5, 1000)],
    },
    {
      kind: "choice",
      id: "predict-edge",
      ask: "predict",
      prompt: "Before the simulator draws it: what will the far end of this run look like at the first pixel's data pin?",
      hint: "Compare the source resistance (driver plus resistor) with the cable's impedance.",
      explanation: "A source far below the cable's impedance overshoots and rings; one close to it gives a clean step; one far above it climbs in steps, one per round trip.",
      runs: [bufferRun("beside-ground", 2, 0), bufferRun("beside-ground", 8, 100), bufferRun("beside-ground", 8, 330), bufferRun("three-core", 2, 330)],
    },
    {
      kind: "text",
      markdown: `
## Where the RC picture stops

Everything above treats the cable as one lump of capacitance that charges all at once. That is a good model only when the cable is **electrically short**: when a signal travels from one end to the other and back again in a time that is small compared with the edge. Signals on these cables travel at roughly {{catalogue.speedLeast|bare}} to {{catalogue.speedMost|bare}} metres per nanosecond (lesson 4 derives the figures), so a {{shortLead.length}} cable has a round trip of roughly {{shortRoundTrip.least|bare}} to {{shortRoundTrip.most}}.

A rule of thumb found in high-speed design textbooks is to treat a connection as a lumped capacitance only while its one-way delay is below about a sixth of the rise time; some texts use a quarter or a half. Apply it to the worked example above: a {{shortLead.rise}} edge on a {{shortLead.length}} cable whose one-way delay is about {{shortLead.delay}}. The delay is under a sixth of {{shortLead.rise}} ({{shortLead.sixth}}), so the RC picture holds. Without the resistor, the edge is about {{buffer.edge}}, far shorter than the {{shortLead.delay}} delay, and the RC picture is simply wrong: the cable is no longer a lump but a **transmission line**, and the edge reaches the pixel in steps and ringing that an RC curve cannot show.

That is where the next three lessons go. The RC arithmetic of this lesson stays useful, though, in two ways:

1. On a long cable with a large series resistor (much larger than the cable's impedance, lesson 4), the stepwise edge of the transmission line averages out to almost exactly the RC curve, with C the total capacitance of the cable. The RC rise time tells you how slow it will be.
2. It gives you the upper limit of the series resistor: too large and the edges get so slow that pulses shrink or vanish.

### Worked example: a long run, in the RC picture

{{longRun.length}} of the same cable holds {{longRun.length|bare}} × {{beside.capacitance}} + {{sim.inputCapacitance}} = {{longRun.capacitance}}. Through {{longRun.series}} (plus {{buffer.resistance}} of driver, {{longRun.resistance}}):

- τ = {{longRun.resistance}} × {{longRun.capacitance}} = {{longRun.tau|dp=0}}; rise ≈ {{textbook.ln9}} × {{longRun.tau|dp=0}} ≈ {{longRun.rise}}
- crossing {{pixel.high}} takes {{symmetric.crossing}} × {{longRun.tau|dp=0}} ≈ {{longRun.crossing}} of a 0 bit's {{sim.zeroHigh|unit=ns|dp=0}}

A 0 bit reaches only {{longRun.reached}} of its swing before the driver falls again. On the workbench this run at {{buffer.volts}} still **works on typical pixels**, with little room left, and is no longer guaranteed: the {{longRun.capacitance}} of a long cable is why long runs and large resistors do not mix. Lesson 6 returns to this case with the full transmission-line picture and shows why the answer changes completely when the driver is {{pin.volts}}.

## Summing up

- Rise time is measured from 10 % to 90 %; for a resistance charging a capacitance it is **{{textbook.ln9}} × R × C**.
- R is the driver's output resistance plus the series resistor; C is the pixel's input plus the cable's capacitance (per metre × length), in the lumped picture.
- With a full-swing driver and thresholds at {{sim.highThreshold}} and {{sim.lowThreshold}} of the supply, a slow edge delays a pulse without shrinking it, until the edge is too slow to finish in a 0 bit's {{sim.zeroHigh}}.
- Asymmetric levels (a weak or low driver) shrink every pulse by a fraction of τ.
- The series resistor also limits current through the pixel's clamp diodes.
- The lumped RC picture holds only for cables that are short compared with the edge; beyond that, the cable is a transmission line.
`,
    },
  ],
  lab,
} satisfies LessonInput;
