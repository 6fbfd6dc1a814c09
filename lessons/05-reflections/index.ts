import { bufferRun, courseFixes, pinRun } from "../choice-check-runs";
import { OUTCOME_WORDS } from "@/lib/sim";
import { buffer5v, controllerPin3v3 } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import { RECEIVER_MODEL_MARKDOWN } from "../receiver-model";
import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { checkGivens, numbers } from "./numbers";

const pin = { highVoltage: controllerPin3v3.highVoltage, outputResistance: controllerPin3v3.outputResistance, edgeTime: controllerPin3v3.edgeTime };
const buffer = { highVoltage: buffer5v.highVoltage, outputResistance: buffer5v.outputResistance, edgeTime: buffer5v.edgeTime };
const { pixel } = sharedNumbers;

export const lesson = {
  slug: "reflections",
  number: 5,
  title: "Reflections and ringing",
  summary:
    "What happens when the travelling wave reaches the pixel: reflection coefficients, the bounce diagram, the doubling at an open end, overshoot and ringing, the clamp diodes, and how ringing makes a pixel count a pulse twice.",
  minutes: 45,
  numbers: lessonNumbers(numbers),
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
        "A {{buffer.volts}} step from a {{buffer.resistance}} driver into {{run.length}} of lone lead ({{lone.z0}}, {{case1.delay}} one way), open at the pixel. Move the source resistance and watch the far-end voltage after each arrival: ringing below Z0, a clean step at Z0, a staircase above it.",
      params: {
        stepVoltage: buffer5v.highVoltage,
        sourceResistance: buffer5v.outputResistance,
        z0: sharedNumbers.lone.z0.value,
        oneWayDelay: numbers.case1.delay.value,
        loadReflection: 1,
        arrivals: 8,
        supplyVoltage: pixel.vdd.value,
        highThreshold: sharedNumbers.sim.highThreshold.value,
        slider: { field: "sourceResistance", min: 0, max: 1000, step: 1 },
      },
    },
    {
      kind: "text",
      markdown: `
## Three worked cases

### Case 1: a strong driver on a lone lead

A 5 V buffer ({{buffer.resistance}}), no series resistor, {{run.length}} of lone lead (Z0 = {{lone.z0}}, {{lone.delay}}, so T_d = {{case1.delay}}).

- Launched: {{buffer.volts}} × {{lone.z0|bare}} / ({{buffer.resistance|bare}} + {{lone.z0|bare}}) = {{case1.launched}}
- Γ_s = ({{buffer.resistance|bare}} − {{lone.z0|bare}}) / ({{buffer.resistance|bare}} + {{lone.z0|bare}}) = {{case1.gamma}}
- Far end after each arrival, V × (1 − Γ_s^n):
  - n = 1 (at {{case1.delay}}): {{buffer.volts|bare}} × (1 + {{case1.powers.p1|abs}}) = {{case1.far.n1}}
  - n = 2 (at {{case1.at.n2}}): {{buffer.volts|bare}} × (1 − {{case1.powers.p2}}) = {{case1.far.n2}}
  - n = 3 (at {{case1.at.n3}}): {{buffer.volts|bare}} × (1 + {{case1.powers.p3|abs}}) = {{case1.far.n3}}
  - n = 4: {{case1.far.n4}}; n = 5: {{case1.far.n5}} …

The far end swings between roughly {{case1.far.n1|dp=0}} and {{case1.far.n2|dp=0}}, crossing both thresholds of a 5 V pixel on every swing, and dies away only slowly because Γ_s is so close to −1. This is **ringing**. Its period is four one-way delays (the sign flips each round trip): 4 × {{case1.delay}} = {{case1.period}}, a frequency of about {{case1.frequency}}. On a scope it looks like a damped sine wave sitting on every edge.

### Case 2: a moderate source on a low-impedance cable

A 5 V buffer ({{buffer.resistance}}) through {{case2.series}} into {{run.length}} of data beside ground (Z0 = {{beside.z0}}).

- Γ_s = ({{case2.resistance|bare}} − {{beside.z0|bare}}) / ({{case2.resistance|bare}} + {{beside.z0|bare}}) = {{case2.gamma}}
- Far end: n = 1: {{buffer.volts|bare}} × (1 + {{case2.gamma|abs}}) = {{case2.far.n1}}; n = 2: {{case2.far.n2}}; n = 3: {{case2.far.n3}}; then settles at {{buffer.volts}}.

One overshoot of about {{case2.overshoot}} above the final level, one small dip, done. The dip stays far above {{pixel.high}}, so the pixel sees one clean pulse.

### Case 3: a large source on the same cable

Same cable, but {{case3.series}} in series ({{case3.resistance}} in all).

- Γ_s = ({{case3.resistance|bare}} − {{beside.z0|bare}}) / ({{case3.resistance|bare}} + {{beside.z0|bare}}) = {{case3.gamma|sign}}
- Far end: {{case3.far.n1}}, {{case3.far.n2}}, {{case3.far.n3}}, {{case3.far.n4}}, {{case3.far.n5}} …

No overshoot now: a **staircase**, one step per round trip ({{case3.roundTrip}} on {{run.length}}), creeping up to {{buffer.volts}}. The far end crosses {{pixel.high}} only at arrival {{case3.crossArrival}}, {{case3.crossFactor}} × {{case3.delay}} ≈ {{case3.crossAt}} after the driver switched. That is lesson 3's slow RC edge, seen step by step.
`,
    },
    {
      kind: "check",
      id: "source-coefficient",
      prompt: "A source of {{given.resistance}} (driver plus series resistor) drives a {{beside.z0}} line. What is the reflection coefficient at the source? (A plain number, with its sign.)",
      givens: checkGivens.sourceCoefficient.map((given) => ({ numbers: given, answer: { value: given.gamma.value, unit: "", tolerance: 0.02 } })),
      hint: "Γ_s = (R_src − Z0) / (R_src + Z0).",
      explanation: "({{given.resistance|bare}} − {{beside.z0|bare}}) / ({{given.resistance|bare}} + {{beside.z0|bare}}) = {{given.numerator}} / {{given.denominator}} ≈ {{given.gamma}}. Negative: returning waves come back inverted.",
    },
    {
      kind: "check",
      id: "first-arrival",
      prompt:
        "A 5 V driver behind a source with Γ_s = {{given.gamma}} drives an open-ended line. What voltage does the far end reach when the first wave arrives, ignoring the clamp diodes?",
      givens: checkGivens.firstArrival.map((given) => ({ numbers: given, answer: { value: given.n1.value, unit: "V", tolerance: 0.02 } })),
      hint: "V_far(1) = V × (1 − Γ_s). Equivalently: twice the launched step.",
      explanation: "{{buffer.volts}} × (1 + {{given.gamma|abs}}) = {{given.n1}}, which is twice the launched {{given.launched}}.",
    },
    {
      kind: "check",
      id: "ringing-period",
      prompt: "A {{given.length}} lone lead has {{lone.delay}} of delay. What is the period of the ringing when the source resistance is much lower than Z0?",
      givens: checkGivens.ringingPeriod.map((given) => ({ numbers: given, answer: { value: given.period.value, unit: "ns", tolerance: 0.02 } })),
      hint: "With Γ_s negative the far-end voltage repeats after two round trips: four one-way delays.",
      explanation: "One way: {{given.length}} × {{lone.delay}} = {{given.delay}}. Period: 4 × {{given.delay}} = {{given.period}} (about {{given.frequency}}).",
    },
    {
      kind: "text",
      markdown: `
## A bounce diagram, step by step

A fourth case, one wave at a time: the 3.3 V controller pin ({{pin.resistance}}, from the course's driver list) with {{case4.series}} in series, into {{run.length}} of lone lead (Z0 = {{lone.z0}}, T_d = {{case4.delay}}). R_src = {{case4.resistance}}, so Γ_s = ({{case4.resistance|bare}} − {{lone.z0|bare}}) / ({{case4.resistance|bare}} + {{lone.z0|bare}}) = {{case4.gamma}}, the pixel end has Γ_L = +1, and the launched step is {{pin.volts}} × {{lone.z0|bare}} / {{case4.total}} = {{case4.launched}}.

1. At {{case4.delay}} the {{case4.launched}} wave reaches the pixel and reflects whole: arriving and leaving waves add, and the far end jumps to {{case4.rows.n1.far}}.
2. At {{case4.roundTrip}} the reflection reaches the driver: {{case4.gamma}} × {{case4.launched}} = {{case4.returned}} sets off back.
3. At {{case4.rows.n2.at}} it arrives doubled: the far end drops by {{case4.rows.n2.step|abs}}, to {{case4.rows.n2.far}}. Each later round trip multiplies the wave by Γ_s again.

| arrival n | time after the switch (ns) | step at the far end (V) | far end (V) |
| --- | --- | --- | --- |
| 1 | {{case4.rows.n1.at|bare}} | {{case4.rows.n1.step|bare|sign}} | {{case4.rows.n1.far|bare}} |
| 2 | {{case4.rows.n2.at|bare}} | {{case4.rows.n2.step|bare|sign}} | {{case4.rows.n2.far|bare}} |
| 3 | {{case4.rows.n3.at|bare}} | {{case4.rows.n3.step|bare|sign}} | {{case4.rows.n3.far|bare}} |
| 4 | {{case4.rows.n4.at|bare}} | {{case4.rows.n4.step|bare|sign}} | {{case4.rows.n4.far|bare}} |
| 5 | {{case4.rows.n5.at|bare}} | {{case4.rows.n5.step|bare|sign}} | {{case4.rows.n5.far|bare}} |
| 6 | {{case4.rows.n6.at|bare}} | {{case4.rows.n6.step|bare|sign}} | {{case4.rows.n6.far|bare}} |

**When has it settled?** After n arrivals the far end is {{pin.volts}} × |Γ_s|^n from its final level. Within 1 % (our choice, not a standard) needs n > ln 0.01 / ln {{case4.gamma|abs}} = {{case4.settlingRatio}}: arrival {{case4.settledArrival}}, at {{case4.settledFactor}} × T_d = {{case4.settledAt}}. A 0 bit is high for only {{sim.zeroHigh|unit=ns|dp=0}} (lesson 1), so the falling edge starts its own, upside-down bounce diagram before this one has died; the line is linear and the two simply add.

**Does it decode?** The {{case4.rows.n2.far}} plateau lies inside the band where pixels switch (lesson 2). A pixel that switches anywhere above it, up to the {{pixel.high}} its datasheet allows, sees the pulse start at {{case4.rows.n1.at}}, end at {{case4.rows.n2.at}} and start again at {{case4.rows.n3.at}}: two pulses in one bit slot. Typical pixels switch up to {{typical.top}} and read the fall at {{typical.topFall}}, so they misread it too: the workbench says "${OUTCOME_WORDS.fails}".
`,
    },
    {
      kind: "check",
      id: "settling-time",
      prompt:
        "The controller pin now drives the same lead through another resistor: Γ_s = {{given.gamma}}, T_d = {{given.delay}}, open far end. How long after the driver switches does the far end stay within 1 % of its final level?",
      givens: checkGivens.settlingTime.map((given) => ({ numbers: given, answer: { value: given.settledAt.value, unit: "ns", tolerance: 0.02 } })),
      hint: "Find the first n with |Γ_s|^n < 0.01; arrival n comes at (2n − 1) × T_d.",
      explanation: "ln 0.01 / ln {{given.gamma|abs}} = {{given.settlingRatio}}, so n = {{given.settledArrival}}, which arrives at {{given.settledFactor}} × {{given.delay}} ≈ {{given.settledAt}}.",
    },
    {
      kind: "text",
      markdown: `
## Overshoot and the clamp diodes

**Overshoot** is how far the far end rises above the level it finally settles at; **undershoot** is the same below 0 V after a falling edge. Case 1 asks for a {{case1.overshoot}} overshoot on a 5 V pixel; case 2 for {{case2.overshoot}}.

Neither happens in full, because the pixel's input has **clamp diodes** (lesson 3): once the pin rises above its supply by a diode drop, roughly {{pixel.clamp}} on a 5 V pixel (taking {{textbook.diodeDrop}} as the textbook silicon forward drop), the upper diode conducts and holds it there. A falling edge's undershoot is caught the same way by the lower diode, at about −{{textbook.diodeDrop}}. The clamps do two things:

1. They cap the voltage, and with it some of the ringing: the energy the clamp absorbs does not reflect back.
2. They carry current into the pixel's supply or ground pin, outside the pixel's normal operation. Heat is not the issue: the pulses are a few nanoseconds long, so the average current is tiny. What limits it is the input's rated **injection current**, the most current the clamp structure may carry before it upsets the chip around it (latch-up, disturbed neighbouring inputs). Logic datasheets state it as an absolute maximum input clamp current, ±{{clamp.rating}} for standard CMOS logic (JEDEC JESD7A, from memory); pixel datasheets often give none. The course assumes the same {{clamp.rating}} for a pixel input and, as common practice derates absolute maximums, holds every lab to half of it: {{clamp.limit}}.

A useful estimate of the clamp current comes from looking back into the line from the far end. For the first arrival, the line looks like a source of 2 × V_launched behind a resistance Z0 (a textbook Thevenin equivalent of a line at its end). With the pin held at {{pixel.clamp}}:

- case 2: I ≈ ({{case2.far.n1}} − {{pixel.clamp}}) / {{beside.z0}} ≈ {{case2.clampCurrent}};
- case 1: I ≈ ({{case1.far.n1}} − {{pixel.clamp}}) / {{lone.z0}} ≈ {{case1.clampCurrent}}, and it keeps coming back each cycle of the ringing.

The course simulator models the diodes with the exponential diode law and reports the peak clamp current of every run; case 1's estimate is already above the course's {{clamp.limit}}.

## Ringing that the pixel counts

Overshoot by itself is a stress problem. Ringing becomes a *data* problem when it turns back through the point where a pixel switches. Recall from lesson 2 how the course judges a run:
${RECEIVER_MODEL_MARKDOWN}
Two kinds of ringing break a run:

- **During a high**, the far end rings back down through a switching point: the pixel sees the pulse end early and a new one start when the ringing comes back up. The slot holds two pulses, or a glitch and a pulse, and the bit is lost.
- **During a low**, after the falling edge, the far end rings back up through a switching point: the pixel sees a pulse where none was sent.

### The classic failing run

The trade's best-known failure (common practice of the trade, lesson 6): a 3.3 V controller pin ({{pin.resistance}}) with {{classic.series}} in series, into {{run.length}} of lone lead, to a 5 V pixel. R_src = {{classic.resistance}} against Z0 = {{lone.z0}}, so Γ_s = {{classic.gamma}}. Without clamps, the bounce arithmetic gives the far end after each arrival:

| arrival n | far end, V × (1 − Γ_s^n) |
| --- | --- |
| 1 | {{classic.far.n1}} |
| 2 | {{classic.far.n2}} |
| 3 | {{classic.far.n3}} |
| 4 | {{classic.far.n4}} |

The first arrival lifts the 3.3 V driver over the {{pixel.high}} threshold, and the second drops it to {{classic.far.n2}}: below every point where a typical pixel reads a fall (the lowest is {{typical.lowestFall}}). Every pulse breaks. The first arrival stays below the roughly {{pixel.clamp}} where the upper clamp conducts hard, so here the clamps change little: with them or without, the workbench says "${OUTCOME_WORDS.fails}". The figure draws both.
`,
    },
    {
      kind: "figure",
      figure: "clamp-compare",
      caption:
        "The classic failing run (3.3 V pin, {{classic.series}}, {{run.length}} of lone lead, 5 V pixel) with the pixel's clamp diodes and without: both far ends fall back through the typical band after the first arrival.",
      params: { cable: "lone-lead", length: numbers.run.length.value, seriesResistance: numbers.classic.series.value, ...pin, supplyVoltage: pixel.vdd.value, bits: "0110" },
    },
    {
      kind: "figure",
      figure: "clamp-compare",
      caption:
        "Case 1 (5 V buffer, no resistor, {{run.length}} of lone lead) with the clamp diodes and without: the clamps hold the first arrival near {{pixel.clamp}} and the ringing never comes back through the band, at the cost of current into the pixel's input.",
      params: { cable: "lone-lead", length: numbers.run.length.value, seriesResistance: 0, ...buffer, supplyVoltage: pixel.vdd.value, bits: "0110" },
    },
    {
      kind: "text",
      markdown: `
### When the clamps rescue the data

Case 1 looks worse on paper: a 5 V buffer with no resistor on the same lead, the arithmetic swinging between about {{case1.far.n1|dp=1}} and {{case1.far.n2|dp=0}}. But every real pixel input has its clamp diodes. They catch the first arrival near {{pixel.clamp}} and absorb most of its energy, so what travels back is far smaller than the arithmetic assumes, and the far end no longer swings down through the band. On the workbench this run **works on every pixel that meets its datasheet**, while driving more current into the clamps than the course's limit allows. The clamps rescue the data at the expense of the input's injection rating; a series resistor (lesson 6) fixes both.

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

Everything here is fixed by two numbers you control: the cable (which sets Z0) and the series resistor (which sets R_src with the driver). Lesson 6 turns that into a design rule. Before it does, notice one more thing in case 1: the first arrival reached {{case1.far.n1}}, almost twice the driver's level. On a 3.3 V driver that doubling is the only thing that lifts a pixel's input over {{pixel.high}}. Ringing is the price; the doubling is the prize. Lesson 6 shows how to keep the prize and refuse the price.
`,
    },
    {
      kind: "check",
      id: "staircase-second-step",
      prompt:
        "A 5 V driver with Γ_s = {{given.gamma|sign}} drives an open-ended line. What is the far-end voltage after the second arrival?",
      givens: checkGivens.secondStep.map((given) => ({ numbers: given, answer: { value: given.n2.value, unit: "V", tolerance: 0.02 } })),
      hint: "V_far(n) = V × (1 − Γ_s^n) with n = 2.",
      explanation: "{{given.gamma}}² = {{given.squared}}; {{buffer.volts}} × (1 − {{given.squared}}) ≈ {{given.n2}}, against a 5 V pixel's {{pixel.high}} threshold.",
    },
    {
      kind: "choice",
      id: "predict-reflection",
      ask: "predict",
      prompt: "Before the simulator draws it: what will the far end of this run look like at the first pixel's data pin?",
      hint: "Work out the sign of the source's reflection coefficient: (R_source − Z0) / (R_source + Z0).",
      explanation: "A negative source coefficient alternates the reflections: ringing. A positive one adds them in the same direction: a staircase. Near zero, the first arrival is the settled level.",
      runs: [bufferRun("beside-ground", 10, 0), bufferRun("beside-ground", 10, 82), bufferRun("beside-ground", 10, 330), bufferRun("three-core", 10, 220)],
    },
    {
      kind: "choice",
      id: "diagnose-reflection",
      ask: "diagnose",
      prompt: "This run flickers on site. The far end, as the simulator draws it, is below. Which one change makes it work on every pixel that meets its datasheet?",
      hint: "Name the shape first: a staircase that arrives too late, or a level that never reaches the threshold.",
      explanation: "A staircase comes from a source far above the cable's impedance: less resistance brings the first step up. A level below the threshold needs a driver with a higher level.",
      runs: [bufferRun("beside-ground", 20, 220), bufferRun("three-core", 10, 220), pinRun("lone-lead", 10, 47), bufferRun("coax-75", 20, 220)],
      fixes: courseFixes,
    },
    {
      kind: "text",
      markdown: `
## Reading reflections on a scope

A scope shows one point's voltage against time. Reflections give themselves away by:

- **flat steps**: nothing changes between arrivals, so the trace moves in flat-topped steps, each one round trip long ({{case4.roundTrip}} on {{run.length}} of lone lead);
- **timing set by length**: steps at T_d, 3 T_d, 5 T_d, ringing every 4 T_d. Double the cable and the timing doubles; change the resistor and only the step sizes change.

A slow **RC edge** (lesson 3) is a smooth curve, steepest at its start, with no flat parts. A resistor charging a capacitor cannot overshoot, so a trace that goes past its final level and comes back is not an RC edge. Its rise time follows the resistance: {{scope.large}} instead of {{scope.small}} behind the {{buffer.resistance}} buffer doubles R_src from {{scope.smallSource|bare}} to {{scope.largeSource}} and doubles the rise, where ringing would keep its period. A staircase with steps too fine to see is the RC curve (lesson 4). Ringing far faster than 4 T_d that ignores the cable's length often comes from the probe's ground lead (lesson 8).

## A common misconception: "a shorter cable rings less"

In the bounce diagram every voltage of the fourth case's table depends only on the driver, the resistor and Z0, not on length. On {{case4.shortLength}} of the same lead the far end still jumps to {{case4.rows.n1.far}} and drops back to {{case4.rows.n2.far}}; each step just lasts half as long (T_d = {{case4.shortDelay}}). The cable's resistance barely damps it ({{run.length}} of lone lead has {{run.loneResistance}} against {{lone.z0}}). Only when the round trip becomes shorter than the edge (lesson 4) do the steps merge into the edge and the ringing fade. Nor is {{case4.rows.n1.far}} from a 3.3 V driver interference: the open end doubles the wave. The cure is a matched source (lesson 6), not a shorter cable.
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

A 5 V buffered output drives a long run to the first pixel. Fit a series resistor (E24 series) that keeps the overshoot at the pixel under {{lab.maxOvershoot}} of its supply, while keeping the far end's rise time short and every bit decoding. Use the bounce-diagram arithmetic to predict where the window is before you touch the workbench: the resistor that makes Γ_s small, neither much below nor much above zero.
`,
    },
  ],
  lab,
} satisfies LessonInput;
