import { bufferRun, courseFixes, pinRun } from "../choice-check-runs";
import { buffer5v } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import type { LessonInput } from "../schema";
import { bench } from "./bench";
import { lab } from "./lab";
import { checkGivens, numbers } from "./numbers";

export const lesson = {
  slug: "on-the-bench",
  number: 8,
  title: "On the bench",
  summary:
    "Measuring a data run with an oscilloscope without fooling yourself: bandwidth and rise time, probe loading, the ground lead, where to probe and what to read; documenting a run with a scope photo; and working safely around supplies and mains equipment.",
  minutes: 50,
  numbers: lessonNumbers(numbers),
  blocks: [
    {
      kind: "text",
      markdown: `
## The bench is the judge

Everything in this course so far has been a model: formulas, bounce diagrams, the simulator that grades your labs. Models leave things out. A real pixel's thresholds are not exactly {{sim.highThreshold}} and {{sim.lowThreshold}} of its supply; a real cable's impedance is not exactly the catalogue's; real connectors add a little inductance and capacitance. Before an installation is signed off, the first pixel of every long run is looked at with an oscilloscope. This lesson is about doing that well, so that what you see is the run and not your measuring setup, and about doing it safely.

## Can your scope see the edge?

An oscilloscope has a **bandwidth**, the frequency at which its response has fallen to about {{threeDb}} (−3 dB). Bandwidth limits how fast an edge it can show. A widely used textbook approximation links the two:

t_rise,scope ≈ {{scopeFactor}} / bandwidth.

- {{scope100.bandwidth}}: {{scopeFactor}} / {{scope100.bandwidth}} = {{scope100.rise}}
- {{scope50.bandwidth}}: {{scope50.rise}}
- {{scope20.bandwidth}}: {{scope20.rise}}

What you see on the screen is not the edge itself but the edge as slowed by the scope (and the probe). For a chain of such stages the rise times combine approximately as a root sum of squares (another textbook approximation):

t_rise,seen ≈ √(t_signal² + t_scope² + t_probe²).

### Worked example

A true {{trueEdge}} edge, a {{scope100.bandwidth}} scope and a probe fast enough to ignore: √({{trueEdge|bare}}² + {{scope100.rise|bare}}²) ns = √{{scope100.sumOfSquares}} ns ≈ {{scope100.seen}}. The scope adds {{scope100.added}}. On a {{scope20.bandwidth}} scope the same edge shows as √({{trueEdge|bare}}² + {{scope20.rise|bare}}²) ns ≈ {{scope20.seen}}: you are measuring the scope. A working habit of the trade (common practice): use a scope whose own rise time is at most a third of the edge you want to measure. For the {{buffer.edge}} edges of a 5 V buffer driving a matched run, that means a scope rise time of {{fastScope.rise}}, {{scopeFactor}} / {{fastScope.rise}} = {{fastScope.bandwidth}} or more; for the tens of nanoseconds of most real runs at the first pixel, {{scope100.bandwidth}} is enough.

The scope's **sample rate** matters too: it must take several samples during the edge. A scope sampling at 1 GS/s takes one sample per nanosecond, enough for a {{trueEdge}} edge. Check the rate at the timebase you use, since many scopes lower it on slow timebases.
`,
    },
    {
      kind: "check",
      id: "scope-rise-time",
      prompt: "Using t_rise ≈ {{scopeFactor}} / bandwidth, what is the rise time of a {{given.bandwidth}} oscilloscope?",
      givens: checkGivens.scopeRise.map((given) => ({ numbers: given, answer: { value: given.rise.value, unit: "ns", tolerance: 0.02 } })),
      hint: "Divide {{scopeFactor}} by the bandwidth in hertz.",
      explanation: "{{scopeFactor}} / {{given.bandwidth|unit=Hz|exp=6}} = {{given.rise|unit=s|exp=-9}} = {{given.rise}}.",
    },
    {
      kind: "check",
      id: "measured-rise",
      prompt: "A true {{trueEdge}} edge is viewed on a {{given.bandwidth}} scope ({{given.rise}}). About what rise time does the screen show?",
      givens: checkGivens.measuredRise.map((given) => ({ numbers: given, answer: { value: given.seen.value, unit: "ns", tolerance: 0.02 } })),
      hint: "Root sum of squares: √(t_signal² + t_scope²).",
      explanation: "√({{trueEdge|bare}}² + {{given.rise|bare}}²) ns = √{{given.sumOfSquares}} ns ≈ {{given.seen}}.",
    },
    {
      kind: "text",
      markdown: `
## The probe is part of the circuit

The usual probe for this work is a **10:1 passive probe**: it divides the voltage by ten, and in return it loads the circuit lightly. Common practice gives such a probe about {{probe.resistance}} in parallel with about {{probe.capacitance}} at its tip (read the figures marked on your probe or in its manual). A 1:1 probe loads far more heavily, with the capacitance of its whole cable at the tip (typically tens of picofarads or more, common practice) and much less bandwidth; do not use one for edges.

The probe's {{probe.resistance}} is nothing to a data line; its {{probe.capacitance}} is not. Recall from lesson 5 that, seen from the far end, the line looks like a source of twice the incident wave behind a resistance Z0. Whatever capacitance hangs on the far end charges through Z0, with a time constant τ = Z0 × C. The pixel's own {{sim.inputCapacitance}} is already there; your probe adds {{probe.capacitance}} more.

### Worked example: the probe slows what it measures

On a lone lead (Z0 ≈ {{lone.z0}}), matched at the source:

- pixel alone: {{textbook.ln9}} × {{lone.z0}} × {{sim.inputCapacitance}} ≈ {{loading.lonePixel}} of rise added at the far end;
- pixel plus probe: {{textbook.ln9}} × {{lone.z0}} × {{probe.withPixel}} ≈ {{loading.loneProbe}}.

On data beside ground (Z0 ≈ {{beside.z0}}) the same probe gives {{textbook.ln9}} × {{beside.z0}} × {{probe.withPixel}} ≈ {{loading.besideProbe}}. The high-impedance lead is the one your probe disturbs most. The consequences are mild (a slightly slower, slightly less ringing edge than without the probe) but real: when a reading is marginal, remember that it was taken with {{probe.capacitance}} more than the pixel normally has. And always **compensate** the probe before use: connect it to the scope's calibrator output and turn its trimmer until the square wave's corners are flat, neither peaked nor rounded (the probe's manual shows how).

## The ground lead

A probe measures the voltage between its tip and its ground clip. The ground clip's lead, typically around {{ground.length}} long, forms a loop with the tip, and a loop has inductance: roughly 1 nH per millimetre of lead is a common rule of thumb (common practice, not a precise figure). Around {{ground.inductance}} of ground lead in series with the probe's {{probe.capacitance}} makes a resonant circuit. Its frequency is

f = 1 / (2π × √(L × C)) = 1 / (2π × √({{ground.inductance}} × {{probe.capacitance}})) ≈ {{ground.frequency}}.

Every fast edge excites it. On the screen you see ringing at about {{ground.frequency}} that **does not exist on the line**: it is made by the measurement. Whether it shows depends on the damping, ζ = (R / 2) × √(C / L), with R the resistance that drives the probe. At the far end of data beside ground, R is about Z0 = {{beside.z0|dp=0}}: ζ ≈ {{ground.besideHalfR|bare}} × √({{probe.capacitance}} / {{ground.inductance}}) ≈ {{ground.besideDamping}}, well under 1, so it rings visibly. At the far end of a lone lead, R ≈ {{lone.z0}} and ζ ≈ {{ground.loneDamping}}: no ringing, just a slightly slower edge.

The cure is a **short ground**: the spring-clip ground tip supplied with most probes, a centimetre or so long, pressed onto the pixel's ground pad right beside the data pad. At about {{ground.spring}} the resonance moves to about {{ground.springFrequency}}, beyond what a {{scope100.bandwidth}} scope shows.
`,
    },
    {
      kind: "figure",
      figure: "probe-ground",
      caption:
        "A clean {{buffer.edge}} edge at the far end of a {{beside.z0|dp=0}} line, as a {{probe.capacitance}} probe shows it through its ground lead. Lengthen the ground lead and watch ringing appear that is not on the line.",
      params: {
        stepVoltage: buffer5v.highVoltage,
        sourceResistance: sharedNumbers.beside.z0.value,
        probeCapacitance: numbers.probe.capacitance.value,
        groundLeadInductance: numbers.ground.inductance.value,
        edgeTime: buffer5v.edgeTime,
        slider: { field: "groundLeadInductance", min: 5e-9, max: 300e-9, step: 5e-9 },
      },
    },
    {
      kind: "check",
      id: "ground-lead-ring",
      prompt: "A probe's {{probe.capacitance}} tip capacitance and a {{given.inductance}} ground lead form a resonant circuit. At what frequency does it ring?",
      givens: checkGivens.groundRing.map((given) => ({ numbers: given, answer: { value: given.frequency.value, unit: "MHz", tolerance: 0.02 } })),
      hint: "f = 1 / (2π × √(L × C)), in henries and farads.",
      explanation: "√({{given.inductance|unit=H|exp=-9|bare}} × {{probe.capacitance|unit=F|exp=-12|bare}}) = {{given.rootLC|unit=s|exp=-9}}; 2π × that = {{given.period|unit=s|exp=-9}}; 1 / {{given.period}} ≈ {{given.frequency}}.",
    },
    {
      kind: "check",
      id: "probe-loading",
      prompt:
        "At the far end of a lone lead (Z0 ≈ {{lone.z0}}), the pixel's {{sim.inputCapacitance}} and a probe's {{given.capacitance}} charge through Z0. About what 10–90 % rise time does that capacitance add?",
      givens: checkGivens.probeLoading.map((given) => ({ numbers: given, answer: { value: given.rise.value, unit: "ns", tolerance: 0.03 } })),
      hint: "τ = Z0 × C with C the total at the far end; rise ≈ {{textbook.ln9}} × τ.",
      explanation: "τ = {{lone.z0}} × {{given.withPixel}} = {{given.tau}}; {{textbook.ln9}} × {{given.tau}} ≈ {{given.rise}}.",
    },
    {
      kind: "choice",
      id: "predict-scope",
      ask: "predict",
      prompt: "You are about to probe the first pixel's data pin of this run. Before the simulator draws it: what shape do you expect on the scope?",
      hint: "Predict from the run's numbers before you look: the driver's level against the threshold, the source resistance against the cable's impedance.",
      explanation: "A prediction made before probing tells a fault in the run from a fault in the measurement: when the scope disagrees with it, check the probe's ground lead first.",
      runs: [bufferRun("lone-lead", 8, 0), bufferRun("twisted-pair", 15, 100), bufferRun("beside-ground", 15, 330), pinRun("twisted-pair", 10, 100)],
    },
    {
      kind: "choice",
      id: "diagnose-bench",
      ask: "diagnose",
      prompt: "The scope on site agrees with the simulator's far end below, and the pixels flicker. Which one change makes it work on every pixel that meets its datasheet?",
      hint: "Name the shape first, then the change that addresses its cause.",
      explanation: "A staircase that arrives too late comes from too much resistance; a settled level below the threshold from the driver. Each has one change that addresses it.",
      runs: [bufferRun("beside-ground", 10, 220), pinRun("beside-ground", 5, 220), bufferRun("three-core", 20, 220), pinRun("lone-lead", 10, 47)],
      fixes: courseFixes,
    },
    {
      kind: "text",
      markdown: `
## Where to probe and what to read

**Probe at the first pixel's data input**, with the ground spring on that pixel's ground pad. That is the waveform the pixel decodes. Probing at the controller shows the near end, which on a series-terminated run sits at half level for a round trip by design (lesson 6) and tells you little about what the pixel receives.

A setup that works for most runs:

1. **Vertical**: 1 V/div, DC coupling, the trace's 0 V a division or two above the bottom of the screen. With a 10:1 probe, make sure the scope knows the probe is 10:1 so its readings are in volts at the tip.
2. **Trigger**: rising edge on the data channel at about half the swing, normal mode (so the screen holds the last triggered sweep).
3. **Timebase for bits**: {{bits.timebase}} shows {{bits.slots}} bit slots across a screen of {{bits.divisions}} divisions. Check that every slot has one clean pulse, that 0s and 1s have the widths of lesson 1, and that nothing rings back across a threshold during the lows.
4. **Timebase for edges**: 5 to 10 ns/div. Measure the **rise time** (10–90 %) with the scope's measurement function or its cursors, and the **overshoot**: the peak minus the level the high settles at.
5. **Thresholds**: put horizontal cursors at {{sim.highThreshold}} × VDD and {{sim.lowThreshold}} × VDD of the pixel's *measured* supply ({{pixel.high}} and {{pixel.low}} for {{pixel.vdd|dp=1}}). The margins of lesson 5 are the distances from the waveform to these lines.
6. **Worst case**: turn on persistence (or infinite persistence) and let the display run for a while with real content: every edge that ever happened stays on screen. A run that looks clean on one sweep may show an occasional ring-back or slow edge that persistence reveals.
7. **The latch gap**: at 20 to 50 µs/div, check that the gap between frames is at least what the pixel needs ({{sim.latchGap}}, or {{longLatch}} for some parts; lesson 1).

## Documenting a run with a scope photo

A scope photo is evidence. An instructor, a client or you in a year's time must be able to read from it what was measured and under what conditions. A good one:

- shows **one rising edge at the first pixel** (or a few bits, if that is the point), big enough to read;
- has the **timebase and volts per division readable** on screen, and the probe ratio right;
- shows the **measurement readouts** (rise time, overshoot, or cursor values) on screen;
- is taken **square-on, in focus, without glare**, or better, saved with the scope's own screenshot function;
- comes with a **note**: the run's name, cable kind and conductor size, length, resistor, driver, pixel supply as measured, date and place.

Take a second photo of the probing itself: probe tip on the data pad, ground spring on the ground pad. It shows the measurement was made where it should be, with a short ground, and it answers the first question any reviewer will ask about ringing on the screen.
`,
    },
    {
      kind: "caution",
      title: "The scope's ground is earth",
      markdown: `
A mains-powered bench oscilloscope connects every probe's ground clip to protective earth through its power cord. Clip it only to a point that is at earth potential or floating with respect to earth, normally the negative of a low-voltage supply whose output is isolated. Clipping it to anything else, such as a supply's positive rail in a system that is earthed elsewhere, creates a short circuit through the scope and its earth conductor that can destroy the scope or the supply and start a fire. Never defeat the scope's protective earth to "float" it.

Never probe the mains side of a power supply with an ordinary passive probe. Measurements on mains-connected circuits need instruments and probes rated for the measurement category (see IEC 61010) and are work for qualified, licensed people under local electrical codes.
`,
    },
    {
      kind: "caution",
      title: "High-current low-voltage supplies",
      markdown: `
The supplies that feed pixel strips can deliver tens of amperes. A probe tip or a loose clip that bridges two adjacent pads can arc, weld or burn. Attach probes with the supply switched off where you can, use insulated tips and the spring ground, keep supply conductors and connectors within their ratings, and keep every feed fused as the supply and strip manufacturers' instructions require. Strips and supplies at full brightness get hot; let them cool before handling. Local electrical codes and the manufacturers' instructions take precedence over this course, and mains wiring belongs to licensed electricians.
`,
    },
    {
      kind: "text",
      markdown: `
## When the bench and the model disagree

They will, a little; that is expected. A few common reasons, roughly in order of how often they explain a difference:

- **The probe and its ground**: ringing at a hundred megahertz or more that the simulator does not show is nearly always the ground lead. Use the spring.
- **The pixel's supply**: thresholds follow VDD. Measure it at the first pixel, under load, and redo the margins.
- **The cable is not the catalogue's**: real cables vary; a lone lead's impedance varies with how it was laid (lesson 7).
- **The driver**: its output resistance and edge time may differ from the course's typical figures. Measure the near-end step on an unloaded output to see its edge.
- **The pixel's input**: its real switching point sits somewhere in the undefined band (lesson 2); a run with a thin guaranteed margin may work on one batch and not another.

If the measurement is worse than the model, believe the measurement and widen the margins: choose a resistor nearer the middle of the window, a better cable, a 5 V driver, or a differential link.

## Summing up

- Scope rise time ≈ {{scopeFactor}} / bandwidth; seen rise ≈ √(signal² + scope² + probe²). Use a scope at least three times faster than the edge.
- A 10:1 passive probe adds about {{probe.capacitance}} (common practice); at the end of a high-impedance lead it visibly slows the edge.
- A long ground lead rings with the probe capacitance at around {{ground.frequency}}; use a short ground spring.
- Probe at the first pixel's data pad with ground on its ground pad, and read rise time, overshoot, widths and threshold margins.
- Document with a readable scope photo plus a note, and a photo of the probing.
- The scope's ground is earth: clip it only where that is safe, never on mains circuits.

## The capstone lab and the bench exercise

The capstone is a small installation: three runs of different cables and lengths from one 3.3 V controller, each needing its own resistor. Every run is graded, and all three must pass. Work each one through the design steps of lesson 7 before you try it.

The bench exercise asks you to document a run properly: a scope photo at the first pixel, the probing photo, and your measured values. Your instructor reviews it against a rubric.
`,
    },
  ],
  lab,
  bench,
} satisfies LessonInput;
