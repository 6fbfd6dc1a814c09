import type { LessonInput } from "../schema";
import { lab } from "./lab";

export const lesson = {
  slug: "transmission-line",
  number: 4,
  title: "The cable is a transmission line",
  summary:
    "Why a few metres of cable stop behaving like a lump of capacitance: per-metre inductance and capacitance, characteristic impedance, propagation delay, and why the same copper gives 350 Ω as a lone lead and 94 Ω beside a ground conductor.",
  minutes: 45,
  blocks: [
    {
      kind: "text",
      markdown: `
## The edge takes time to travel

Lesson 3 ended with a warning: when the edge is fast compared with the time a signal needs to cross the cable, the cable is not a lump of capacitance any more. This lesson builds the model that replaces it, the **transmission line**. It is the most important idea in the course, and it is less mysterious than its reputation.

Start with one plain fact: nothing travels instantly. When the driver switches, the change travels down the cable as a wave, at a large fraction of the speed of light, but still at a finite speed. On the cables in this course that is between about 0.18 and 0.27 metres per nanosecond. The driver's edge lasts 3 ns. By the time the driver has finished switching, the front of the wave is less than a metre down the cable. The far end of a 10 m run has not heard anything yet.

So for a while, the driver cannot "see" the pixel at all. It cannot see the cable's total capacitance either: most of the cable has not been reached. What it does see is the thing this lesson is about.

## Inductance and capacitance, per metre

Any pair of conductors, the data conductor and whatever carries its return current, has two properties spread evenly along its length:

- **capacitance per metre, C′**: the two conductors are close and separated by insulation, so every metre stores charge when there is a voltage between them;
- **inductance per metre, L′**: current going out on one conductor and back on the other encloses a loop, and every metre of loop stores energy in a magnetic field, which resists any change of current.

The prime (′) means "per metre". The course catalogue computes both from each cable's geometry; for a data conductor with a ground conductor touching it in one jacket, C′ = 59.5 pF/m and L′ = 523 nH/m.

Cut the cable into short slices in your mind. Each slice is a small series inductance followed by a small capacitance to the return. Push a step into one end: the first slice's inductance lets current build up only gradually, the current charges the first slice's capacitance, which then pushes current through the next inductance, and so on down the line. The step moves from slice to slice as a wave.

### The speed of the wave

Working that chain of slices through (a standard textbook derivation) gives the wave's speed and, more usefully for us, its **delay per metre**:

v = 1 / √(L′ × C′)  and  delay per metre = √(L′ × C′).

For the cable above: √(523 × 10⁻⁹ H/m × 59.5 × 10⁻¹² F/m) = √(3.11 × 10⁻¹⁷) s/m = 5.58 ns/m.

For lines whose field runs through air and insulation (all of ours), the delay depends only on the material: delay per metre = √ε_eff / c, where c is the speed of light (299,792,458 m/s, which is 3.336 ns per metre) and ε_eff is the **effective relative permittivity**, a weighted average of the insulation's and the air's. The catalogue's figure of 2.8 for this cable gives √2.8 × 3.336 ns/m = 5.58 ns/m, the same answer from the other side.

### Characteristic impedance

Now the key result. As the wave front moves along the line, it leaves the line behind it charged to the step's voltage V. Each metre takes a charge C′ × V, and the front covers v metres each second, so the driver must supply a steady current

I = C′ × V × v = V × C′ / √(L′ × C′) = V × √(C′ / L′).

The current is proportional to the voltage, exactly as if the driver were connected to a resistor. That resistor is the line's **characteristic impedance**:

Z0 = V / I = √(L′ / C′).

For our cable: Z0 = √(523 nH/m ÷ 59.5 pF/m) = √8,790 Ω² ≈ 93.8 Ω.

Z0 is not a resistance you can measure with a meter, and it does not depend on the length. It is what the line looks like to the driver **while the wave is travelling**, before anything has come back from the far end. No energy is lost in it either: the energy goes into charging the line and building the magnetic field, and it travels with the wave.

### Worked example: what the driver launches

A 5 V buffer (20 Ω) drives that cable through a 33 Ω series resistor. For the first moments, the driver sees 20 Ω + 33 Ω = 53 Ω in series with Z0 = 93.8 Ω, a plain voltage divider. The step launched onto the line is

V_launch = 5 V × 93.8 / (53 + 93.8) = 5 V × 0.639 ≈ 3.19 V.

This 3.19 V wave now travels to the far end at 5.58 ns/m. What happens when it gets there is lesson 5.
`,
    },
    {
      kind: "check",
      id: "z0-from-per-metre",
      prompt: "A cable has L′ = 520 nH/m and C′ = 52 pF/m. What is its characteristic impedance?",
      answer: { value: Math.sqrt(520e-9 / 52e-12), unit: "ohm", tolerance: 0.02 },
      hint: "Z0 = √(L′ / C′); keep the units as H/m and F/m.",
      explanation: "520 × 10⁻⁹ / 52 × 10⁻¹² = 10,000 Ω², and √10,000 = 100 Ω.",
    },
    {
      kind: "check",
      id: "delay-per-metre",
      prompt: "What is the delay per metre of that same cable (L′ = 520 nH/m, C′ = 52 pF/m)?",
      answer: { value: Math.sqrt(520e-9 * 52e-12), unit: "ns/m", tolerance: 0.02 },
      hint: "Delay per metre = √(L′ × C′).",
      explanation: "√(520 × 10⁻⁹ × 52 × 10⁻¹²) = √(2.704 × 10⁻¹⁷) s/m = 5.2 × 10⁻⁹ s/m = 5.2 ns/m.",
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

with ε0 = 8.854 pF/m and μ0 = 4π × 10⁻⁷ H/m the constants of free space, and acosh the inverse hyperbolic cosine (a key on most scientific calculators). For a coaxial cable with centre conductor d inside a dielectric of outer diameter D:

Z0 = (60 / √ε_r) × ln(D / d).

### Worked example: data beside ground

Two 20 AWG conductors, 0.812 mm in diameter (ASTM B258), each in a 0.4 mm PVC wall, touching side by side. Their centres are one diameter plus two walls apart:

- D = 0.812 mm + 2 × 0.4 mm = 1.612 mm, so D / d = 1.985
- acosh(1.985) = 1.308
- with ε_eff = 2.8 (the catalogue's estimate for PVC and the air around it): Z0 = (120 / √2.8) × 1.308 = 71.7 × 1.308 ≈ 93.8 Ω
- C′ = π × 8.854 pF/m × 2.8 / 1.308 ≈ 59.5 pF/m; L′ = 4 × 10⁻⁷ H/m × 1.308 ≈ 523 nH/m

Exactly the figures used above.

### Worked example: a data lead on its own

Now run a 22 AWG data lead on its own, its return an 18 AWG ground wire about 10 mm away (the formula for unequal conductors is a little longer; the catalogue uses it). The conductors are about twelve times farther apart than in the cable above, the field is mostly in air (ε_eff about 1.2), and the result is Z0 ≈ 350 Ω, with C′ of only 10.4 pF/m and L′ of 1.28 µH/m. Same copper, same signal, almost four times the impedance. That difference is the root of the field rule of lesson 6.

### Worked example: 75 Ω coax

A 0.644 mm solid centre in solid polyethylene (ε_r = 2.25, a textbook value) of 4.2 mm outer diameter: ln(4.2 / 0.644) = 1.875, and Z0 = (60 / 1.5) × 1.875 ≈ 75 Ω. Its delay, √2.25 × 3.336 ns/m ≈ 5.0 ns/m, depends only on the polyethylene.

## The course's cables

The catalogue the simulator uses, computed from each cable's geometry with the formulas above (conductor resistance from the AWG table and the resistivity of annealed copper):

| cable (kind) | Z0 (Ω) | C′ (pF/m) | L′ (nH/m) | delay (ns/m) | R′ (mΩ/m) |
| --- | --- | --- | --- | --- | --- |
| data lead on its own (lone-lead) | 351 | 10.4 | 1281 | 3.65 | 74 |
| data beside ground (beside-ground) | 93.8 | 59.5 | 523 | 5.58 | 67 |
| twisted pair (twisted-pair) | 99.4 | 52.3 | 517 | 5.20 | 168 |
| 75 Ω coax (coax-75) | 75.0 | 66.7 | 375 | 5.00 | 65 |
| round three-core (three-core) | 70.3 | 79.4 | 393 | 5.58 | 50 |

Some notes on the rows:

- **Twisted pair** here is one pair of a data-network cable: data on one conductor, ground on its twisted partner. Such cables are made for 100 Ω between the two conductors of a pair (the figure of the TIA-568 cabling standards), and the catalogue's 99 Ω agrees.
- **Three-core**: in a round cable of data, ground and supply, the data core touches both others, and at the speed of an edge both carry its return current (the supply conductor is tied to ground through the supply's capacitors). Two returns mean more capacitance, 4/3 of the two-core value, and less inductance: Z0 drops to about 70 Ω.
- **R′**, the resistance per metre, is tiny next to Z0: 10 m of data beside ground has 0.67 Ω. For runs of the lengths in this course the lines are very nearly lossless. The simulator includes the loss anyway.

### Worked example: from per-metre figures to Z0 and delay

For the round three-core cable the table gives L′ = 393 nH/m and C′ = 79.4 pF/m. Then Z0 = √(393 × 10⁻⁹ ÷ 79.4 × 10⁻¹²) = √4,950 Ω² ≈ 70 Ω, and delay = √(393 × 10⁻⁹ × 79.4 × 10⁻¹²) ≈ 5.59 ns/m (the catalogue's 70.3 Ω and 5.58 ns/m come from unrounded figures).

Compared with data beside ground, the second return raised C′ by a third and cut L′ by a quarter: their ratio, and Z0, fell from 93.8 Ω to 70.3 Ω, while their product, and so the delay, stayed put, because the insulation is the same. **Geometry moves L′ and C′ in opposite directions and sets Z0; the material sets their product, and with it the delay.** That is why the catalogue's impedances span 70 to 351 Ω while its delays stay between 3.65 and 5.58 ns/m.
`,
    },
    {
      kind: "figure",
      figure: "cable-compare",
      caption:
        "The same 5 V driver, 33 Ω resistor and 10 m length on each cable of the catalogue. The far-end traces differ only because the geometry differs. Change the length and see which differences grow.",
      params: {
        cables: ["lone-lead", "beside-ground", "twisted-pair", "coax-75", "three-core"],
        length: 10,
        seriesResistance: 33,
        highVoltage: 5,
        outputResistance: 20,
        edgeTime: 3e-9,
        supplyVoltage: 5,
        bits: "0101",
        slider: { field: "length", min: 1, max: 25, step: 1 },
      },
    },
    {
      kind: "check",
      id: "run-delay",
      prompt: "How long does an edge take to travel the length of a 12 m run of data-beside-ground cable (5.58 ns/m)?",
      answer: { value: 12 * 5.58e-9, unit: "ns", tolerance: 0.02 },
      hint: "One-way delay = length × delay per metre.",
      explanation: "12 m × 5.58 ns/m ≈ 67 ns.",
    },
    {
      kind: "check",
      id: "launched-step",
      prompt:
        "A 5 V driver with 20 Ω of output resistance drives a 93.8 Ω line through a 33 Ω resistor. How large is the step it launches onto the line?",
      answer: { value: (5 * 93.8) / (53 + 93.8), unit: "V", tolerance: 0.02 },
      hint: "Until anything returns from the far end the line is a 93.8 Ω resistor: use the voltage divider.",
      explanation: "V = 5 V × 93.8 / (20 + 33 + 93.8) = 5 V × 93.8 / 146.8 ≈ 3.19 V.",
    },
    {
      kind: "text",
      markdown: `
## When is a cable a transmission line?

Every cable is a transmission line; the question is whether it matters. It matters when the edge is short compared with the time the wave needs to cross the cable. Compare the one-way delay with the rise time. A rule of thumb from high-speed design textbooks says the line must be treated as a transmission line once its one-way delay exceeds about one sixth of the rise time (other texts say a quarter or a half; the boundary is a judgement, not a law).

For the 3 ns edge of a 5 V buffer, one sixth is 0.5 ns, which is

0.5 ns ÷ 5.58 ns/m ≈ 0.09 m

of data-beside-ground cable. Nine centimetres! Every data run an installer builds is far longer than that. On a 10 m run, the one-way delay is 55.8 ns and a reflection needs 112 ns to come back: nearly forty times the edge. The wave picture is not a refinement for these runs; it is the only correct one.

### Why the round trip is the measure

A reflection returns to the driver one round trip, 2 T_d, after the edge set off. If the edge is still rising then, the reflection folds into it; if not, it shows as a separate step. Round trip below rise time is the rule's "half" form; the one-sixth form wants it below a third. For the 3.3 V controller pin (a 4 ns edge, from the course's driver list) on twisted pair (5.20 ns/m), the round trip equals the edge at 4 ns ÷ (2 × 5.20 ns/m) = 0.38 m, and the one-sixth rule stops at 0.67 ns ÷ 5.20 ns/m = 0.13 m.

## Total capacitance, and what the driver really sees

Ten metres of data beside ground holds 10 × 59.5 pF = 595 pF. Lesson 3's RC picture would have the driver charge all 595 pF through its resistance at once. The transmission-line picture says something different: for the first 112 ns, the driver sees only 93.8 Ω; the line charges section by section as the wave moves, and the total capacitance "appears" only after the wave has gone to the far end and back several times.

The two pictures agree in the long run. If the source resistance is much larger than Z0, each round trip adds only a small step, and the steps trace out the RC curve with the cable's total capacitance. If the source resistance is close to or below Z0, the first step is already large, and the RC picture badly underestimates how fast the far end moves and says nothing about the overshoot that follows. Which case you are in decides what your resistor does, and that is why the next two lessons matter.

### Worked example: lesson 3's short lead as a staircase

Lesson 3's 5 V buffer (20 Ω), 330 Ω and 2 m of data beside ground gave an RC rise time of about 95 ns. As a line: R_src = 350 Ω, T_d = 11.2 ns, and returning waves meet Γ_s = (350 − 93.8) / (350 + 93.8) = +0.577 at the driver (lesson 5). The far end climbs 5 V × (1 − 0.577^n): 2.11 V at 11.2 ns, 3.33 V at 33.5 ns, 4.04 V at 55.8 ns, 4.44 V at 78.1 ns, 4.68 V at 100.5 ns. It passes 10 % at the first step and 90 % at the fifth: a rise of 8 × T_d ≈ 89 ns against RC's 95 ns (which also counted the pixel's 5 pF). Four round trips fit inside the rise, so the steps are small and many: the staircase is the RC curve drawn in steps. Without the 330 Ω, RC promises a clean 5.5 ns edge; the line delivers a first step of 8.2 V: lesson 5.

## Summing up

- A cable has inductance and capacitance per metre, L′ and C′, set by its geometry and insulation.
- A step travels along it as a wave with delay per metre √(L′ × C′) = √ε_eff / c: 3.65 ns/m for a lone lead in air, about 5 to 5.6 ns/m for jacketed cables.
- While the wave travels, the line looks to the driver like a resistor Z0 = √(L′ / C′), whatever the line's length.
- Conductors far apart give high Z0 (a lone lead, 351 Ω); conductors close together give low Z0 (data beside ground, 94 Ω; three-core, 70 Ω).
- With edges of a few nanoseconds, any run longer than about ten centimetres is a transmission line.

## The lab

Your company's standard asks for a data cable whose characteristic impedance lies between 85 Ω and 110 Ω, with no more than 5.7 ns/m of delay and no more than 65 pF/m. The controller is a 3.3 V pin with a 33 Ω resistor already fitted. Pick a cable from the catalogue that meets the standard, check it on the workbench (the scope view shows what each cable does to the same signal), and answer the two questions about the run.
`,
    },
    {
      kind: "check",
      id: "round-trip-length",
      prompt:
        "A 3.3 V controller pin switches in 4 ns. At what length of twisted pair (5.20 ns/m) does the round trip equal the rise time?",
      answer: { value: 4e-9 / (2 * 5.2e-9), unit: "m", tolerance: 0.02 },
      hint: "Round trip = 2 × length × delay per metre; set it equal to 4 ns.",
      explanation: "Length = 4 ns ÷ (2 × 5.20 ns/m) ≈ 0.38 m. Any longer and reflections come back after the edge has finished, as separate steps.",
    },
    {
      kind: "check",
      id: "effective-permittivity",
      prompt:
        "A cable's delay is 5.58 ns/m. Light in vacuum takes 3.336 ns per metre. What is the cable's effective relative permittivity? (A plain number.)",
      answer: { value: (5.58 / 3.336) ** 2, unit: "", tolerance: 0.02 },
      hint: "Delay per metre = √ε_eff × 3.336 ns/m; solve for ε_eff.",
      explanation: "5.58 / 3.336 = 1.673; squared, ε_eff ≈ 2.80.",
    },
  ],
  lab,
} satisfies LessonInput;
