import { bufferRun, pinRun } from "../choice-check-runs";
import { buffer5v } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { checkGivens, numbers } from "./numbers";

export const lesson = {
  slug: "transmission-line",
  number: 4,
  title: "The cable is a transmission line",
  summary:
    "Why a few metres of cable stop behaving like a lump of capacitance: per-metre inductance and capacitance, characteristic impedance, propagation delay, and why the same copper gives {{lone.z0}} as a lone lead and {{beside.z0|dp=0}} beside a ground conductor.",
  minutes: 45,
  numbers: lessonNumbers(numbers),
  blocks: [
    {
      kind: "text",
      markdown: `
## The edge takes time to travel

Lesson 3 ended with a warning: when the edge is fast compared with the time a signal needs to cross the cable, the cable is not a lump of capacitance any more. This lesson builds the model that replaces it, the **transmission line**. It is the most important idea in the course, and it is less mysterious than its reputation.

Start with one plain fact: nothing travels instantly. When the driver switches, the change travels down the cable as a wave, at a large fraction of the speed of light, but still at a finite speed. On the cables in this course that is between about {{catalogue.speedLeast|bare}} and {{catalogue.speedMost|bare}} metres per nanosecond. The driver's edge lasts {{buffer.edge}}. By the time the driver has finished switching, the front of the wave is at most {{edgeFront}} down the cable. The far end of a {{run.length}} run has not heard anything yet.

So for a while, the driver cannot "see" the pixel at all. It cannot see the cable's total capacitance either: most of the cable has not been reached. What it does see is the thing this lesson is about.

## Inductance and capacitance, per metre

Any pair of conductors, the data conductor and whatever carries its return current, has two properties spread evenly along its length:

- **capacitance per metre, C′**: the two conductors are close and separated by insulation, so every metre stores charge when there is a voltage between them;
- **inductance per metre, L′**: current going out on one conductor and back on the other encloses a loop, and every metre of loop stores energy in a magnetic field, which resists any change of current.

The prime (′) means "per metre". The course catalogue computes both from each cable's geometry; for a data conductor with a ground conductor touching it in one jacket, C′ = {{beside.capacitance}} and L′ = {{beside.inductance}}.

Cut the cable into short slices in your mind. Each slice is a small series inductance followed by a small capacitance to the return. Push a step into one end: the first slice's inductance lets current build up only gradually, the current charges the first slice's capacitance, which then pushes current through the next inductance, and so on down the line. The step moves from slice to slice as a wave.

### The speed of the wave

Working that chain of slices through (a standard textbook derivation) gives the wave's speed and, more usefully for us, its **delay per metre**:

v = 1 / √(L′ × C′)  and  delay per metre = √(L′ × C′).

For the cable above: √({{beside.inductance|unit=H/m|exp=-9}} × {{beside.capacitance|unit=F/m|exp=-12}}) = √({{besideProduct|sci|bare}}) s/m = {{beside.delay}}.

For lines whose field runs through air and insulation (all of ours), the delay depends only on the material: delay per metre = √ε_eff / c, where c is the speed of light ({{textbook.speedOfLight}}, which is {{textbook.vacuumDelay|bare}} ns per metre) and ε_eff is the **effective relative permittivity**, a weighted average of the insulation's and the air's. The catalogue's figure of {{beside.permittivity}} for this cable gives √{{beside.permittivity}} × {{textbook.vacuumDelay}} = {{beside.delay}}, the same answer from the other side.

### Characteristic impedance

Now the key result. As the wave front moves along the line, it leaves the line behind it charged to the step's voltage V. Each metre takes a charge C′ × V, and the front covers v metres each second, so the driver must supply a steady current

I = C′ × V × v = V × C′ / √(L′ × C′) = V × √(C′ / L′).

The current is proportional to the voltage, exactly as if the driver were connected to a resistor. That resistor is the line's **characteristic impedance**:

Z0 = V / I = √(L′ / C′).

For our cable: Z0 = √({{beside.inductance}} ÷ {{beside.capacitance}}) = √{{besideRatio}} ≈ {{beside.z0}}.

Z0 is not a resistance you can measure with a meter, and it does not depend on the length. It is what the line looks like to the driver **while the wave is travelling**, before anything has come back from the far end. No energy is lost in it either: the energy goes into charging the line and building the magnetic field, and it travels with the wave.

### Worked example: what the driver launches

A 5 V buffer ({{buffer.resistance}}) drives that cable through a {{launch.series}} series resistor. For the first moments, the driver sees {{buffer.resistance}} + {{launch.series}} = {{launch.source}} in series with Z0 = {{beside.z0}}, a plain voltage divider. The step launched onto the line is

V_launch = {{buffer.volts}} × {{beside.z0|bare}} / ({{launch.source|bare}} + {{beside.z0|bare}}) = {{buffer.volts}} × {{launch.fraction}} ≈ {{launch.step}}.

This {{launch.step}} wave now travels to the far end at {{beside.delay}}. What happens when it gets there is lesson 5.
`,
    },
    {
      kind: "check",
      id: "z0-from-per-metre",
      prompt: "A cable has L′ = {{exercise.inductance}} and C′ = {{exercise.capacitance}}. What is its characteristic impedance?",
      answer: { value: numbers.exercise.z0.value, unit: "ohm", tolerance: 0.02 },
      hint: "Z0 = √(L′ / C′); keep the units as H/m and F/m.",
      explanation: "{{exercise.inductance|unit=H/m|exp=-9|bare}} / {{exercise.capacitance|unit=F/m|exp=-12|bare}} = {{exercise.ratio}}, and √{{exercise.ratio|bare}} = {{exercise.z0}}.",
    },
    {
      kind: "check",
      id: "delay-per-metre",
      prompt: "What is the delay per metre of that same cable (L′ = {{exercise.inductance}}, C′ = {{exercise.capacitance}})?",
      answer: { value: numbers.exercise.delay.value, unit: "ns/m", tolerance: 0.02 },
      hint: "Delay per metre = √(L′ × C′).",
      explanation: "√({{exercise.inductance|unit=H/m|exp=-9|bare}} × {{exercise.capacitance|unit=F/m|exp=-12|bare}}) = √({{exercise.product|sci|bare}}) s/m = {{exercise.delay|unit=s/m|exp=-9}} = {{exercise.delay}}.",
    },
    {
      kind: "text",
      markdown: `
## Geometry is everything

L′ and C′ come from the shape of the cable, not from the copper. Two rules of thumb follow straight from the physics:

- **Conductors far apart**: a big loop between them, so high L′; weak coupling, so low C′. High Z0.
- **Conductors close together**: a small loop, low L′; strong coupling, high C′. Low Z0.

For two round conductors of diameter d whose centres are D apart, the textbook two-wire formulas (in the course simulator's catalogue) are

Z0 = (120 / √ε_eff) × acosh(D / d)  C′ = π × ε0 × ε_eff / acosh(D / d)  L′ = (μ0 / π) × acosh(D / d)

with ε0 = {{textbook.epsilon0}} and μ0 = 4π × 10⁻⁷ H/m the constants of free space, and acosh the inverse hyperbolic cosine (a key on most scientific calculators). For a coaxial cable with centre conductor d inside a dielectric of outer diameter D:

Z0 = (60 / √ε_r) × ln(D / d).

### Worked example: data beside ground

Two {{beside.gauge}} AWG conductors, {{beside.diameter}} in diameter (ASTM B258), each in a {{besideGeometry.wall}} PVC wall, touching side by side. Their centres are one diameter plus two walls apart:

- D = {{beside.diameter}} + 2 × {{besideGeometry.wall}} = {{beside.spacing}}, so D / d = {{besideGeometry.ratio}}
- acosh({{besideGeometry.ratio}}) = {{besideGeometry.acosh}}
- with ε_eff = {{beside.permittivity}} (the catalogue's estimate for PVC and the air around it): Z0 = (120 / √{{beside.permittivity}}) × {{besideGeometry.acosh}} = {{besideGeometry.impedanceFactor}} × {{besideGeometry.acosh}} ≈ {{besideGeometry.z0}}
- C′ = π × {{textbook.epsilon0}} × {{beside.permittivity}} / {{besideGeometry.acosh}} ≈ {{besideGeometry.capacitance}}; L′ = 4 × 10⁻⁷ H/m × {{besideGeometry.acosh}} ≈ {{besideGeometry.inductance}}

Exactly the figures used above.

### Worked example: a data lead on its own

Now run a {{lone.gauge}} AWG data lead on its own, its return an {{lone.returnGauge}} AWG ground wire about {{lone.spacing}} away (the formula for unequal conductors is a little longer; the catalogue uses it). Centre to centre, the conductors are about {{loneSpacingRatio}} times farther apart than in the cable above, the field is mostly in air (ε_eff about {{lone.permittivity}}), and the result is Z0 ≈ {{lone.z0}}, with C′ of only {{lone.capacitance}} and L′ of {{lone.inductance|unit=µH/m|dp=2}}. Same copper, same signal, {{loneToBeside}} times the impedance. That difference is the root of the field rule of lesson 6.

### Worked example: 75 Ω coax

A {{coax.diameter}} solid centre in solid polyethylene (ε_r = {{coax.permittivity}}, a textbook value) of {{coax.dielectric}} outer diameter: ln({{coax.dielectric|bare}} / {{coax.diameter|bare}}) = {{coaxGeometry.log}}, and Z0 = (60 / {{coaxGeometry.root}}) × {{coaxGeometry.log}} ≈ {{coaxGeometry.z0}}. Its delay, √{{coax.permittivity}} × {{textbook.vacuumDelay}} ≈ {{coaxGeometry.delay}}, depends only on the polyethylene.

## The course's cables

The catalogue the simulator uses, computed from each cable's geometry with the formulas above (conductor resistance from the AWG table and the resistivity of annealed copper):

| cable (kind) | Z0 (Ω) | C′ (pF/m) | L′ (nH/m) | delay (ns/m) | R′ (mΩ/m) |
| --- | --- | --- | --- | --- | --- |
| data lead on its own (lone-lead) | {{lone.z0|bare}} | {{lone.capacitance|bare}} | {{lone.inductance|bare}} | {{lone.delay|bare}} | {{lone.resistance|bare}} |
| data beside ground (beside-ground) | {{beside.z0|bare}} | {{beside.capacitance|bare}} | {{beside.inductance|bare}} | {{beside.delay|bare}} | {{beside.resistance|bare}} |
| twisted pair (twisted-pair) | {{twisted.z0|bare}} | {{twisted.capacitance|bare}} | {{twisted.inductance|bare}} | {{twisted.delay|bare}} | {{twisted.resistance|bare}} |
| 75 Ω coax (coax-75) | {{coax.z0|bare}} | {{coax.capacitance|bare}} | {{coax.inductance|bare}} | {{coax.delay|bare}} | {{coax.resistance|bare}} |
| round three-core (three-core) | {{threeCore.z0|bare}} | {{threeCore.capacitance|bare}} | {{threeCore.inductance|bare}} | {{threeCore.delay|bare}} | {{threeCore.resistance|bare}} |

Some notes on the rows:

- **Twisted pair** here is one pair of a data-network cable: data on one conductor, ground on its twisted partner. Such cables are made for 100 Ω between the two conductors of a pair (the figure of the TIA-568 cabling standards), and the catalogue's {{twisted.z0|dp=0}} agrees.
- **Three-core**: in a round cable of data, ground and supply, the data core touches both others, and at the speed of an edge both carry its return current (the supply conductor is tied to ground through the supply's capacitors). Two returns mean more capacitance, 4/3 of the two-core value, and less inductance: Z0 drops to about {{threeCore.z0|dp=0}}.
- **R′**, the resistance per metre, is tiny next to Z0: {{run.length}} of data beside ground has {{run.besideResistance}}. For runs of the lengths in this course the lines are very nearly lossless. The simulator includes the loss anyway.

### Worked example: from per-metre figures to Z0 and delay

For the round three-core cable the table gives L′ = {{threeCore.inductance}} and C′ = {{threeCore.capacitance}}. Then Z0 = √({{threeCore.inductance|unit=H/m|exp=-9|bare}} ÷ {{threeCore.capacitance|unit=F/m|exp=-12|bare}}) = √{{threeCoreFromTable.ratio}} ≈ {{threeCoreFromTable.z0}}, and delay = √({{threeCore.inductance|unit=H/m|exp=-9|bare}} × {{threeCore.capacitance|unit=F/m|exp=-12|bare}}) ≈ {{threeCoreFromTable.delay}} (the catalogue's {{threeCore.z0}} and {{threeCore.delay}} come from unrounded figures).

Compared with data beside ground, the second return raised C′ by a third and cut L′ by a quarter: their ratio, and Z0, fell from {{beside.z0}} to {{threeCore.z0}}, while their product, and so the delay, stayed put, because the insulation is the same. **Geometry moves L′ and C′ in opposite directions and sets Z0; the material sets their product, and with it the delay.** That is why the catalogue's impedances span {{catalogue.z0Least|bare}} to {{catalogue.z0Most}} while its delays stay between {{catalogue.delayLeast|bare}} and {{catalogue.delayMost}}.
`,
    },
    {
      kind: "figure",
      figure: "cable-compare",
      caption:
        "The same 5 V driver, {{launch.series}} resistor and {{run.length}} length on each cable of the catalogue. The far-end traces differ only because the geometry differs. Change the length and see which differences grow.",
      params: {
        cables: ["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"],
        length: numbers.run.length.value,
        seriesResistance: numbers.launch.series.value,
        highVoltage: buffer5v.highVoltage,
        outputResistance: buffer5v.outputResistance,
        edgeTime: buffer5v.edgeTime,
        supplyVoltage: sharedNumbers.pixel.vdd.value,
        bits: "0101",
        slider: { field: "length", min: 1, max: 25, step: 1 },
      },
    },
    {
      kind: "check",
      id: "run-delay",
      prompt: "How long does an edge take to travel the length of a {{twelve.length}} run of data-beside-ground cable ({{beside.delay}})?",
      answer: { value: numbers.twelve.delay.value, unit: "ns", tolerance: 0.02 },
      hint: "One-way delay = length × delay per metre.",
      explanation: "{{twelve.length}} × {{beside.delay}} ≈ {{twelve.delay}}.",
    },
    {
      kind: "check",
      id: "launched-step",
      prompt:
        "A 5 V driver with {{buffer.resistance}} of output resistance drives a {{beside.z0}} line through a {{given.series}} resistor. How large is the step it launches onto the line?",
      givens: checkGivens.launchedStep.map((given) => ({ numbers: given, answer: { value: given.step.value, unit: "V", tolerance: 0.02 } })),
      hint: "Until anything returns from the far end the line is a {{beside.z0}} resistor: use the voltage divider.",
      explanation: "V = {{buffer.volts}} × {{beside.z0|bare}} / ({{buffer.resistance|bare}} + {{given.series|bare}} + {{beside.z0|bare}}) = {{buffer.volts}} × {{beside.z0|bare}} / {{given.total|bare}} ≈ {{given.step}}.",
    },
    {
      kind: "text",
      markdown: `
## When is a cable a transmission line?

Every cable is a transmission line; the question is whether it matters. It matters when the edge is short compared with the time the wave needs to cross the cable. Compare the one-way delay with the rise time. A rule of thumb from high-speed design textbooks says the line must be treated as a transmission line once its one-way delay exceeds about one sixth of the rise time (other texts say a quarter or a half; the boundary is a judgement, not a law).

For the {{buffer.edge}} edge of a 5 V buffer, one sixth is {{lumped.sixth}}, which is

{{lumped.sixth}} ÷ {{beside.delay}} ≈ {{lumped.limit}}

of data-beside-ground cable. That is {{lumped.limit|unit=cm|dp=0}}! Every data run an installer builds is far longer than that. On a {{run.length}} run, the one-way delay is {{run.delay}} and a reflection needs {{run.roundTrip}} to come back: {{run.roundTripEdges}} times the edge. The wave picture is not a refinement for these runs; it is the only correct one.

### Why the round trip is the measure

A reflection returns to the driver one round trip, 2 T_d, after the edge set off. If the edge is still rising then, the reflection folds into it; if not, it shows as a separate step. Round trip below rise time is the rule's "half" form; the one-sixth form wants it below a third. For the 3.3 V controller pin (a {{pin.edge}} edge, from the course's driver list) on twisted pair ({{twisted.delay}}), the round trip equals the edge at {{pin.edge}} ÷ (2 × {{twisted.delay}}) = {{pinOnTwisted.roundTripLength}}, and the one-sixth rule stops at {{pinOnTwisted.sixth}} ÷ {{twisted.delay}} = {{pinOnTwisted.lumpedLimit}}.

## Total capacitance, and what the driver really sees

{{run.length}} of data beside ground holds {{run.length|bare}} × {{beside.capacitance}} = {{run.besideCapacitance}}. Lesson 3's RC picture would have the driver charge all {{run.besideCapacitance}} through its resistance at once. The transmission-line picture says something different: for the first {{run.roundTrip}}, the driver sees only {{beside.z0}}; the line charges section by section as the wave moves, and the total capacitance "appears" only after the wave has gone to the far end and back several times.

The two pictures agree in the long run. If the source resistance is much larger than Z0, each round trip adds only a small step, and the steps trace out the RC curve with the cable's total capacitance. If the source resistance is close to or below Z0, the first step is already large, and the RC picture badly underestimates how fast the far end moves and says nothing about the overshoot that follows. Which case you are in decides what your resistor does, and that is why the next two lessons matter.

### Worked example: lesson 3's short lead as a staircase

Lesson 3's 5 V buffer ({{buffer.resistance}}), {{shortLead.series}} and {{shortLead.length}} of data beside ground gave an RC rise time of about {{shortLead.rise}}. As a line: R_src = {{staircase.source}}, T_d = {{staircase.delay}}, and returning waves meet Γ_s = ({{staircase.source|bare}} − {{beside.z0|bare}}) / ({{staircase.source|bare}} + {{beside.z0|bare}}) = {{staircase.gamma|sign}} at the driver (lesson 5). The far end climbs {{buffer.volts}} × (1 − {{staircase.gamma}}^n): {{staircase.steps.n1.far}} at {{staircase.steps.n1.at}}, {{staircase.steps.n2.far}} at {{staircase.steps.n2.at}}, {{staircase.steps.n3.far}} at {{staircase.steps.n3.at}}, {{staircase.steps.n4.far}} at {{staircase.steps.n4.at}}, {{staircase.steps.n5.far}} at {{staircase.steps.n5.at}}. It passes 10 % at the first step and 90 % at step {{staircase.ninetyArrival}}: a rise of {{staircase.riseDelays}} × T_d ≈ {{staircase.rise}} against RC's {{shortLead.rise}} (which also counted the pixel's {{sim.inputCapacitance}}). The rise holds {{staircase.riseRoundTrips}} round trips, so the steps are small and many: the staircase is the RC curve drawn in steps. Without the {{shortLead.series}}, RC promises a clean {{bare.rise}} edge; the line delivers a first step of {{staircase.bareFirstStep}}: lesson 5.

## Summing up

- A cable has inductance and capacitance per metre, L′ and C′, set by its geometry and insulation.
- A step travels along it as a wave with delay per metre √(L′ × C′) = √ε_eff / c: {{lone.delay}} for a lone lead in air, about {{jacketed.least|bare}} to {{jacketed.most}} for jacketed cables.
- While the wave travels, the line looks to the driver like a resistor Z0 = √(L′ / C′), whatever the line's length.
- Conductors far apart give high Z0 (a lone lead, {{lone.z0}}); conductors close together give low Z0 (data beside ground, {{beside.z0|dp=0}}; three-core, {{threeCore.z0|dp=0}}).
- With edges of a few nanoseconds, any run longer than about {{lumped.limit|unit=cm|dp=0}} is a transmission line.

## The lab

Your company's standard asks for a data cable whose characteristic impedance lies between {{standard.minZ0}} and {{standard.maxZ0}}, with no more than {{standard.maxDelay}} of delay and no more than {{standard.maxCapacitance}}. The controller is a 3.3 V pin with a {{standard.series}} resistor already fitted. Pick a cable from the catalogue that meets the standard, check it on the workbench (the scope view shows what each cable does to the same signal), and answer the two questions about the run.
`,
    },
    {
      kind: "check",
      id: "round-trip-length",
      prompt:
        "A controller pin switches in {{given.edge}}. At what length of twisted pair ({{twisted.delay}}) does the round trip equal the rise time?",
      givens: checkGivens.roundTripLength.map((given) => ({ numbers: given, answer: { value: given.length.value, unit: "m", tolerance: 0.02 } })),
      hint: "Round trip = 2 × length × delay per metre; set it equal to {{given.edge}}.",
      explanation: "Length = {{given.edge}} ÷ (2 × {{twisted.delay}}) ≈ {{given.length}}. Any longer and reflections come back after the edge has finished, as separate steps.",
    },
    {
      kind: "check",
      id: "effective-permittivity",
      prompt:
        "A cable's delay is {{given.delay}}. Light in vacuum takes {{textbook.vacuumDelay|bare}} ns per metre. What is the cable's effective relative permittivity? (A plain number.)",
      givens: checkGivens.permittivity.map((given) => ({ numbers: given, answer: { value: given.squared.value, unit: "", tolerance: 0.02 } })),
      hint: "Delay per metre = √ε_eff × {{textbook.vacuumDelay}}; solve for ε_eff.",
      explanation: "{{given.delay|bare}} / {{textbook.vacuumDelay|bare}} = {{given.ratio}}; squared, ε_eff ≈ {{given.squared}}.",
    },
    {
      kind: "choice",
      id: "pick-cable-trace",
      ask: "pick-trace",
      prompt: "The same buffer and resistor drive the same length of four different cables. Each trace below is the far end of one of them. Which trace belongs to the run described?",
      hint: "The cable's impedance decides how the source resistance compares with it, and its delay per metre when the edge arrives.",
      explanation: "Against a high-impedance cable the source looks small and the far end overshoots; against a low-impedance cable the same source looks large and the far end climbs. The delay per metre moves the whole trace in time.",
      runs: [bufferRun("lone-lead", 10, 47), bufferRun("beside-ground", 10, 220), bufferRun("three-core", 10, 47), bufferRun("coax-75", 10, 470)],
    },
    {
      kind: "choice",
      id: "predict-line",
      ask: "predict",
      prompt: "Before the simulator draws it: what will the far end of this run look like at the first pixel's data pin?",
      hint: "Work out the launched step: the source resistance and the cable's impedance divide the driver's voltage.",
      explanation: "A launched step near the full swing doubles at the open far end and overshoots; one near half the swing arrives as a clean step; a small one needs several round trips, a staircase.",
      runs: [bufferRun("lone-lead", 10, 0), bufferRun("twisted-pair", 10, 82), bufferRun("coax-75", 10, 330), pinRun("twisted-pair", 10, 100)],
    },
  ],
  lab,
} satisfies LessonInput;
