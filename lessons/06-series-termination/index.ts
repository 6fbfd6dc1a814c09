import { bufferRun, courseFixes, pinRun } from "../choice-check-runs";
import { controllerPin3v3 } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { checkGivens, numbers } from "./numbers";

const pin = { highVoltage: controllerPin3v3.highVoltage, outputResistance: controllerPin3v3.outputResistance, edgeTime: controllerPin3v3.edgeTime };

export const lesson = {
  slug: "series-termination",
  number: 6,
  title: "Series termination",
  summary:
    "Matching the driver and its series resistor to the cable, why the field rule of about {{field.lone}} on a lone lead and about {{field.beside}} beside ground works (and when it does not), why a 5 V driver forgives almost anything, and why no single resistor suits every cable.",
  minutes: 50,
  numbers: lessonNumbers(numbers),
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

At the near end (the controller side of the cable), the voltage sits at V / 2 for one full round trip before the returning wave lifts it to V. On {{run.length}} of lone lead that is a plateau of {{plateau}} at half level. Nothing is connected there, so nothing minds; but it has two consequences every installer should know:

- **Never tap a pixel partway along a series-terminated run.** A pixel in the middle would see the half-level plateau, which for a 5 V driver is {{halfLevel}}, right in the undefined band. Series termination works for one receiver at the far end, which is exactly the pixel-chain situation.
- **Don't judge the run by probing at the controller.** The near-end step looks ugly by design. Probe at the pixel (lesson 8).

### The arithmetic

Matching asks for R_s = Z0 − R_out:

- lone lead (Z0 ≈ {{lone.z0}}), 3.3 V pin of {{pin.resistance}}: R_s = {{lone.z0|bare}} − {{pin.resistance|bare}} = {{match.lone.series}};
- data beside ground (Z0 ≈ {{beside.z0}}), same pin: R_s = {{beside.z0|bare}} − {{pin.resistance|bare}} ≈ {{match.beside.series}}.

You cannot buy a {{match.lone.series}} resistor in most drawers. Resistors come in the **E-series** of preferred values (IEC 60063): the E12 series has twelve values per decade, 10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82; E24 adds 11, 13, 16, 20, 24, 30, 36, 43, 51, 62, 75, 91; E96 has ninety-six for 1 % parts. The nearest E12 values to {{match.lone.series}} are {{match.lone.below}} and {{match.lone.above}}; to {{match.beside.series}}, {{match.beside.below}} and {{match.beside.above}}. Which neighbour to pick is not a matter of rounding, as the next sections show.
`,
    },
    {
      kind: "check",
      id: "matching-resistor",
      prompt: "A driver with {{pin.resistance}} of output resistance drives a lone lead of Z0 = {{lone.z0}}. What series resistor matches the source to the line?",
      answer: { value: numbers.match.lone.series.value, unit: "ohm", tolerance: 0.02 },
      hint: "Matching means R_out + R_s = Z0.",
      explanation: "R_s = {{lone.z0}} − {{pin.resistance}} = {{match.lone.series}}. The nearest E12 values are {{match.lone.below}} and {{match.lone.above}}.",
    },
    {
      kind: "text",
      markdown: `
## The field rule

Installers pass on a rule of thumb (common practice of the trade; no published source): on a run of about {{run.length}}, a data lead run **on its own** decodes well with a series resistor of about **{{field.lone}}** and poorly with about {{field.beside}}; the same lead run **beside a ground conductor** in one cable corrupts with about {{field.lone}} and decodes with about **{{field.beside}}**; and up to 2 or 3 m nearly anything works.

That rule sounds like superstition. It is not; it is series termination, seen from the field. Check it against the catalogue:

- **Lone lead**, Z0 ≈ {{lone.z0}}. With {{field.lone}} and a {{pin.resistance}} driver, R_src = {{onLone.field.resistance}}, close to Z0: Γ_s = ({{onLone.field.resistance|bare}} − {{lone.z0|bare}}) / ({{onLone.field.resistance|bare}} + {{lone.z0|bare}}) = {{onLone.field.gamma}}. The far end gets a clean step with a little overshoot. With {{field.beside}}, R_src = {{onLone.small.resistance}}: Γ_s = {{onLone.small.gamma}}, and the far end rings hard.
- **Beside ground**, Z0 ≈ {{beside.z0|dp=0}}. With {{field.beside}}, R_src = {{onBeside.small.resistance}}: Γ_s = {{onBeside.small.gamma}}, a clean step with a small overshoot. With {{field.lone}}, R_src = {{onBeside.field.resistance}}: Γ_s = {{onBeside.field.gamma|sign}}, a staircase.

So each half of the rule is "choose the resistor that roughly matches the cable", and the two cables differ by a factor of {{zRatio}} in Z0. The values that installers learned by trial and error are the matching values, rounded.

## Why 3.3 V makes the rule decisive

Here is the part the rule of thumb leaves out. The pattern above is *decisive*, the difference between working and not working, mainly when the driver's high level sits near or below the pixel's high threshold. The everyday case is a 3.3 V controller pin feeding a 5 V pixel whose guaranteed high threshold is {{pixel.high}} (lesson 2).

On a long run the far end settles at the driver's level, {{pin.volts}}, below {{pixel.high}}: such a run can never **work on every pixel that meets its datasheet**. The most it can do is **work on typical pixels**, which switch somewhere between {{typical.bottom}} and {{typical.top}} (lesson 2). A typical pixel switching at the top of that range reads a rise only above {{typical.highestRise}} and a fall below {{typical.topFall}}. The settled {{pin.volts}} clears the rise level by just {{settledClearance}}; what gives the run real margin is the **first arrival**, the doubled incident wave:

V_far(1) = 2 × V × Z0 / (R_src + Z0) = V × (1 − Γ_s).

For it to clear {{typical.highestRise}} by {{window.margin}} with V = {{pin.volts}}, we need 1 − Γ_s ≥ {{window.needed}}, so Γ_s must be **negative**, below {{window.upperGamma}}: R_src ≤ {{window.upperFraction}} × Z0. The source must sit a little *below* a match. A perfect match delivers exactly {{pin.volts}}.

Now look at the four cases again with {{pin.volts}} (the bounce arithmetic of lesson 5, no clamps):

- **Beside ground with {{field.lone}}**: Γ_s = {{onBeside.field.gamma|sign}}. No overshoot: the far end climbs a staircase from below, {{onBeside.field.staircase.n1}}, {{onBeside.field.staircase.n2}}, {{onBeside.field.staircase.n3}}, {{onBeside.field.staircase.n4}}, … towards {{pin.volts}}, so slowly that a 1 bit's pulse starts too late to read as a 1 at the top of the typical band. That is the "slow, rounded edge" installers see on a scope; at {{pin.volts}} it is fatal.
- **Beside ground with {{field.beside}}**: Γ_s = {{onBeside.small.gamma}}. First arrival {{onBeside.small.first}}, {{onBeside.small.riseMargin}} above the highest typical rise level; second arrival {{onBeside.small.second}}, {{onBeside.small.fallMargin}} above the highest typical fall level. It works on typical pixels.
- **Lone lead with {{field.lone}}**: Γ_s = {{onLone.field.gamma}}. First arrival {{onLone.field.first}}, {{onLone.field.riseMargin}} above the highest typical rise level; second arrival {{onLone.field.second}}, {{onLone.field.fallMargin}} above the highest typical fall level. It works on typical pixels.
- **Lone lead with {{field.beside}}**: Γ_s = {{onLone.small.gamma}}. The first arrival reaches {{onLone.small.first}}, but the second falls to {{onLone.small.second}}, below every level where a typical pixel reads a fall: every pulse breaks (lesson 5's classic failing run).

The second arrival matters as much as the first: after the doubled wave lifts the far end, the wave returning from the driver pulls it down by V × Γ_s², and it must not fall back through {{typical.topFall}}, where a typical pixel switching at the top of its range reads the end of the pulse.
`,
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "A 3.3 V controller pin ({{pin.resistance}}) drives {{run.length}} of lone lead into a 5 V pixel. Step through the E24 resistors and watch the verdict: with small resistors the far end rings back down through the typical band; near a match the first arrival no longer lifts the far end clear of it.",
      params: {
        cable: "lone-lead",
        length: numbers.run.length.value,
        seriesResistance: numbers.field.beside.value,
        ...pin,
        supplyVoltage: sharedNumbers.pixel.vdd.value,
        bits: "01100",
        slider: { field: "seriesResistance", series: "E24", min: 10, max: 1000 },
      },
    },
    {
      kind: "figure",
      figure: "series-termination",
      caption:
        "The same pin and pixel on {{run.length}} of data beside ground. Now the working values are small: near and above a match the far end climbs a staircase towards {{pin.volts}}, too slowly for the 1 bits to read as 1 where a typical pixel switches high in its range.",
      params: {
        cable: "beside-ground",
        length: numbers.run.length.value,
        seriesResistance: numbers.field.beside.value,
        ...pin,
        supplyVoltage: sharedNumbers.pixel.vdd.value,
        bits: "01100",
        slider: { field: "seriesResistance", series: "E24", min: 10, max: 1000 },
      },
    },
    {
      kind: "check",
      id: "first-arrival-3v3",
      prompt:
        "A 3.3 V pin ({{pin.resistance}}) drives a {{lone.z0}} lone lead through {{given.series}}. What voltage does the first arrival reach at the open far end?",
      givens: checkGivens.firstArrival.map((given) => ({ numbers: given, answer: { value: given.first.value, unit: "V", tolerance: 0.02 } })),
      hint: "V_far(1) = 2 × V × Z0 / (R_src + Z0).",
      explanation:
        "2 × {{pin.volts}} × {{lone.z0|bare}} / ({{given.resistance|bare}} + {{lone.z0|bare}}) ≈ {{given.first}}, against a 5 V pixel's {{pixel.high}} threshold; and the first arrival lasts only a round trip before the next one pulls it back.",
    },
    {
      kind: "text",
      markdown: `
## The 3.3 V design window

The analysis gives a window with two edges, one from each failure, for typical pixels with a margin m of {{window.margin}}.

**Upper edge (the first arrival must clear the highest typical rise level with margin m):** {{pin.volts|bare}} × (1 − Γ_s) ≥ {{typical.highestRise|bare}} + m. This gives Γ_s ≤ {{window.upperGamma}}, which is R_src ≤ {{window.upperFraction}} × Z0.

**Lower edge (the second arrival must stay above the highest typical fall level with margin m):** {{pin.volts|bare}} × (1 − Γ_s²) ≥ {{typical.topFall|bare}} + m gives |Γ_s| ≤ {{window.lowerGamma}}, which is R_src ≥ {{window.lowerFraction}} × Z0.

So, at {{pin.volts}} into a 5 V pixel, **R_src between about {{window.lowerFraction}} and {{window.upperFraction}} of Z0**: a little below a match. Subtract the driver's {{pin.resistance}}:

| cable | Z0 | R_s window ({{window.margin}} margin, typical pixels) | field rule |
| --- | --- | --- | --- |
| Data lead on its own | {{lone.z0|dp=1}} | {{window.lone.low}} to {{window.lone.high}} | ≈ {{field.lone}}: inside |
| Data beside ground | {{beside.z0}} | {{window.beside.low}} to {{window.beside.high}} | ≈ {{field.beside}}: at the lower edge |
| Twisted pair | {{twisted.z0}} | {{window.twisted.low}} to {{window.twisted.high}} |  |
| 75 Ω coax | {{coax.z0}} | {{window.coax.low}} to {{window.coax.high}} |  |
| Round three-core cable | {{threeCore.z0}} | {{window.threeCore.low}} to {{window.threeCore.high}} |  |

The windows for lone lead and data beside ground **do not overlap**. That is the sentence to take away: **no single resistor suits every cable** at {{pin.volts}}. A controller sold with a {{field.beside}} resistor on its outputs is right for a cable with a ground beside the data and wrong for a lone lead, and vice versa for one fitted with {{match.lone.below}}.

The arithmetic leaves out the pixel's input capacitance, the clamp diodes and the cable's loss; the workbench has them all, and on these runs it lands within one E24 step of the window (the course's tests hold it to that): at {{run.length}}, the E24 values with which it works on typical pixels with {{window.margin}} to spare run from {{simulator.loneLowest}} to {{simulator.loneHighest}} on the lone lead and from {{simulator.besideLowest}} to {{simulator.besideHighest}} beside ground. And a window for typical pixels is still not a guarantee: on every cable, a level shifter to 5 V (lesson 2) is what makes the run **work on every pixel that meets its datasheet**.
`,
    },
    {
      kind: "check",
      id: "beside-ground-limit",
      prompt: "At {{pin.volts}} into a 5 V pixel, the first arrival clears the highest typical rise level by {{window.margin}} only while R_src ≤ {{window.upperFraction}} × Z0. For data beside ground (Z0 = {{beside.z0}}) and a {{pin.resistance}} pin, what is the largest series resistor that keeps that margin?",
      answer: { value: numbers.window.beside.high.value, unit: "ohm", tolerance: 0.03 },
      hint: "Largest R_src = {{window.upperFraction}} × Z0; then subtract the pin's {{pin.resistance}}.",
      explanation: "{{window.upperFraction}} × {{beside.z0}} = {{window.besideSource}}; {{window.besideSource}} − {{pin.resistance}} ≈ {{window.beside.high}}. Above it the far end still reaches {{pin.volts}}, but with less than {{window.margin}} to spare at the top of the typical band.",
    },
    {
      kind: "text",
      markdown: `
## Why a 5 V driver tolerates much more

Repeat the argument with a 5 V driver (a level shifter, lesson 2) into the same 5 V pixel. Now the far end settles at {{buffer.volts}}, well above {{pixel.high}}. The first arrival no longer has to do the work alone: if it falls short, the staircase climbs past the threshold a round trip or two later. The pixel still reads the pulse; it just reads it late.

How late matters less than you might fear, as long as the *falling* edge is delayed by about the same amount, and with thresholds at {{sim.highThreshold}} and {{sim.lowThreshold}} of a {{buffer.volts}} swing it is (lesson 3): the staircase down crosses {{pixel.low}} after as many round trips as the staircase up needed to cross {{pixel.high}}. The pulse width largely survives. So with a 5 V driver every cable of the catalogue **works on every pixel that meets its datasheet** at {{run.length}} with {{fiveVolt.low}}, and the lone lead, near its match, still does with {{fiveVolt.high}}.

With {{fiveVolt.high}} on the low-impedance cables the staircase is slow enough to cost the guarantee. Its steps cross the band over several round trips, and a 0 bit's fall starts while the last steps of its rise are still arriving: the two staircases add, and the far end falls in steps that turn a little back up on the way. A pixel switching just there could see an extra edge. Those runs still **work on typical pixels**; the three-core cable, slowest of all, fails.

The limit comes back only when the staircase becomes too slow to finish within a 0 bit. Count it: the far end after n arrivals is {{buffer.volts|bare}} × (1 − Γ_s^n), which passes {{pixel.high}} when Γ_s^n < {{fiveVolt.passAt}}. The nth arrival comes (2n − 1) one-way delays after the switch. The driver's fall, {{sim.zeroHigh}} after the switch for a 0 bit, reaches the far end one delay later, at {{sim.zeroHigh}} + T_d. The crossing must come before that, and early enough to leave a pulse the pixel can measure.

### Worked example: three-core, {{threeCoreRun.length}}, {{buffer.volts}}

- one-way delay: T_d = {{threeCoreRun.length}} × {{threeCore.delay}} = {{threeCoreRun.delay}}; the fall of a 0 bit reaches the far end at {{sim.zeroHigh|unit=ns|dp=0}} + {{threeCoreRun.delay}} ≈ {{threeCoreRun.fall}}
- with {{threeCoreRun.fast.series}}: R_src = {{threeCoreRun.fast.resistance}}, Γ_s = ({{threeCoreRun.fast.resistance|bare}} − {{threeCore.z0|bare}}) / ({{threeCoreRun.fast.resistance|bare}} + {{threeCore.z0|bare}}) = {{threeCoreRun.fast.gamma}}; {{threeCoreRun.fast.gamma}}{{threeCoreRun.fast.previous|sup}} = {{threeCoreRun.fast.before}}, {{threeCoreRun.fast.gamma}}{{threeCoreRun.fast.arrival|sup}} = {{threeCoreRun.fast.at}} < {{fiveVolt.passAt}}, so arrival {{threeCoreRun.fast.arrival}} crosses, at {{threeCoreRun.fast.factor}} × {{threeCoreRun.delay}} ≈ {{threeCoreRun.fast.crossing}}. The pulse starts only {{threeCoreRun.fast.lead}} before the far end turns down: shorter than the {{sim.minPulse|unit=ns|dp=0}} a pixel needs to count a pulse at all, so the 0 bits are lost.
- with {{threeCoreRun.slow.series}}: R_src = {{threeCoreRun.slow.resistance}}, Γ_s = ({{threeCoreRun.slow.resistance|bare}} − {{threeCore.z0|bare}}) / ({{threeCoreRun.slow.resistance|bare}} + {{threeCore.z0|bare}}) = {{threeCoreRun.slow.gamma}}; {{threeCoreRun.slow.gamma}}{{threeCoreRun.slow.previous|sup}} = {{threeCoreRun.slow.before}}, {{threeCoreRun.slow.gamma}}{{threeCoreRun.slow.arrival|sup}} = {{threeCoreRun.slow.at}}, so only arrival {{threeCoreRun.slow.arrival}} would cross, at {{threeCoreRun.slow.factor}} × {{threeCoreRun.delay}} ≈ {{threeCoreRun.slow.crossing}}. The fall has arrived at {{threeCoreRun.fall}}. A 0 bit never clears the threshold: the 0s decode as "x".

On the workbench the limit lies lower still, because the falling staircase also takes round trips to get down through the band (step through the resistors in the figure of this lesson with a three-core cable in mind, or try it in the capstone). This is the same physics as lesson 3's large RC ({{threeCoreRun.length}} of three-core is {{threeCoreRun.capacitance}}), and the reason the high-capacitance three-core cable and runs of {{threeCoreRun.length}} and more can still fail at a few hundred ohms even with a 5 V driver. This is the **opposite pull** of a long, high-capacitance, low-impedance cable: the ringing argument wants R_src up near Z0, which is small; anything much bigger, and the cable's capacitance makes the edge too slow.
`,
    },
    {
      kind: "check",
      id: "staircase-arrival",
      prompt:
        "A 5 V driver with R_src = {{given.resistance}} drives {{threeCoreRun.length}} of three-core cable (Z0 = {{threeCore.z0}}, {{threeCore.delay}}). Arrival n = {{given.arrival|bare}} is the first above {{pixel.high}}. How long after the driver switches does it arrive?",
      givens: checkGivens.staircaseArrival.map((given) => ({ numbers: given, answer: { value: given.crossing.value, unit: "ns", tolerance: 0.02 } })),
      hint: "The nth arrival comes (2n − 1) one-way delays after the switch.",
      explanation:
        "One way: {{threeCoreRun.length}} × {{threeCore.delay}} = {{threeCoreRun.delay}}. Arrival {{given.arrival}}: {{given.factor}} × {{threeCoreRun.delay}} ≈ {{given.crossing}}. The 0 bit's fall reaches the far end at {{sim.zeroHigh|unit=ns|dp=0}} + {{threeCoreRun.delay}} ≈ {{threeCoreRun.fall}}: compare the two to see how much of the pulse the pixel gets.",
    },
    {
      kind: "choice",
      id: "pick-termination-trace",
      ask: "pick-trace",
      prompt: "The same buffer drives the same run of twisted pair through three different series resistors. Each trace below is the far end of one of them. Which trace belongs to the run described?",
      hint: "The matched resistor makes the source equal the cable's impedance: the far end steps once to the full level.",
      explanation: "Below the match the far end overshoots and rings; at the match it steps once; well above it, it climbs a staircase.",
      runs: [bufferRun("twisted-pair", 15, 0), bufferRun("twisted-pair", 15, 82), bufferRun("twisted-pair", 15, 330)],
    },
    {
      kind: "choice",
      id: "diagnose-termination",
      ask: "diagnose",
      prompt: "This run flickers on site. The far end, as the simulator draws it, is below. Which one change makes it work on every pixel that meets its datasheet?",
      hint: "Compare the source resistance with the cable's impedance, and the settled level with the threshold.",
      explanation: "A resistor far above the match makes a staircase: a third of it comes near the match. A controller pin whose level stays below the threshold is fixed only by a driver with a higher level.",
      runs: [bufferRun("beside-ground", 20, 220), bufferRun("lone-lead", 20, 1000), pinRun("three-core", 10, 47), bufferRun("three-core", 20, 220)],
      fixes: courseFixes,
    },
    {
      kind: "text",
      markdown: `
## When the field rule applies, honestly

Put it all together and the rule of thumb gets its fine print:

1. It is **series termination**: ≈ {{field.lone}} is near a match for a lone lead ({{lone.z0}} with a {{pin.resistance}} driver), ≈ {{field.beside}} is near a match for a cable with ground beside the data ({{beside.z0|dp=0}}). Choose by the cable's Z0, not by habit.
2. It is **decisive at 3.3 V into a 5 V pixel**, which can at best work on typical pixels. Then the source must be a little below the match (R_src between about {{window.lowerFraction}} and {{window.upperFraction}} of Z0 for a {{window.margin}} margin), and a resistor meant for another cable fails outright. A level shifter makes the run guaranteed.
3. With a **5 V driver** runs of about {{run.length}} are guaranteed with resistors up to about a match; well above it, a slow staircase costs the guarantee on low-impedance cables. The choice then mostly sets the overshoot and clamp current, and how much margin the guarantee keeps.
4. **Long, high-capacitance runs** (three-core, {{threeCoreRun.length}} and more) can still fail at a few hundred ohms even at {{buffer.volts}}, because the staircase is too slow for a 0 bit: it must clear the threshold before the driver's fall reaches the far end.
5. Up to **2–3 m**, one-way delays are around {{shortRuns.least|bare}}–{{shortRuns.most}}, and with a 5 V driver nearly anything works. At 3.3 V the simulator is less kind to a short *lone lead* with a small resistor: the lead's inductance and the pixel's few picofarads ring for tens of nanoseconds, through the typical band. A short cable with ground beside the data, or the resistor the window asks for, settles it.

The course simulator is a teaching model. Before an installation is signed off, the run is confirmed on the bench with an oscilloscope at the first pixel (lesson 8).

## The lab

A 3.3 V controller pin drives a long run of a lone data lead to a 5 V pixel. Choose an E24 resistor with which the run works on typical pixels, every bit with at least {{lab.voltageMargin}} of voltage margin and {{lab.timingMargin}} of timing margin, and with the clamp current under the course's limit. A 3.3 V pin cannot make it guaranteed, and the lab says so. Use the window arithmetic first, then confirm it on the workbench. Your variant's length differs from your neighbour's; the window barely moves with length on this cable, and it is worth asking yourself why.
`,
    },
  ],
  lab,
} satisfies LessonInput;
