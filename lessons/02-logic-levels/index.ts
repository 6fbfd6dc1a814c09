import { bufferRun, courseFixes, pinRun } from "../choice-check-runs";
import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { RECEIVER_MODEL_MARKDOWN, receiverLevels } from "../receiver-model";
import { checkGivens, numbers } from "./numbers";

const typical5 = receiverLevels(5);

export const lesson = {
  slug: "logic-levels",
  title: "Logic levels and noise margin",
  number: 2,
  summary:
    "What voltage a pixel accepts as high and as low, why a 3.3 V controller driving a 5 V pixel lives on the edge, how a level shifter fixes it, and how ground offsets and noise eat the margin that is left.",
  minutes: 40,
  numbers: lessonNumbers(numbers),
  blocks: [
    {
      kind: "text",
      markdown: `
## A pixel does not read volts, it reads regions

Lesson 1 talked about the line being "high" and "low" as if those were obvious. To a pixel's data input they are not fixed voltages but **regions**, and the regions are set by the pixel's own supply voltage, VDD.

A typical datasheet for a digital input gives two numbers as fractions of VDD, and the course simulator uses the same convention:

- the input is **guaranteed to read high** when the voltage is above the **high threshold**, 0.7 × VDD;
- the input is **guaranteed to read low** when the voltage is below the **low threshold**, 0.3 × VDD.

Between the two lies a band where the datasheet promises nothing. A real input does switch somewhere in that band, usually not far from mid-supply (VDD / 2), but where exactly depends on the individual part, its temperature and its supply. Designing for "somewhere near the middle" is designing for luck. The guaranteed thresholds are what you design to, and they are what the labs grade against.

### Worked example: a 5 V pixel

With VDD = 5.0 V:

- high threshold: 0.7 × 5.0 V = 3.5 V
- low threshold: 0.3 × 5.0 V = 1.5 V
- undefined band: 1.5 V to 3.5 V, with mid-supply at 2.5 V

So a 5 V pixel wants its data line above 3.5 V during a high and below 1.5 V during a low. Anything in between, at the moment the pixel looks, is a coin toss.

The same pixel run from a supply that has sagged to 4.5 V (long supply wires, a heavily loaded strip) has thresholds of 3.15 V and 1.35 V. The thresholds move with the supply. Keep that in mind; it comes back twice in this lesson.
`,
    },
    {
      kind: "figure",
      figure: "threshold-bands",
      caption:
        "The input regions of a pixel with a 5 V supply: guaranteed low below 1.5 V, guaranteed high above 3.5 V, undefined between. Move the driver's high level and read the high noise margin; it turns negative below 3.5 V.",
      params: {
        supplyVoltage: 5,
        highThreshold: 0.7,
        lowThreshold: 0.3,
        driverHighVoltage: 3.3,
        slider: { field: "driverHighVoltage", min: 2.5, max: 5.5, step: 0.1 },
      },
    },
    {
      kind: "text",
      markdown: `
## Noise margin

The driver at the other end, the controller's output, has levels of its own: it swings from about 0 V up to its own supply. The difference between what the driver delivers and what the receiver needs is the **noise margin**, and there is one for each state:

- high noise margin: NM_high = V_driver,high − V_threshold,high
- low noise margin: NM_low = V_threshold,low − V_driver,low

The name says what it is for. Anything that disturbs the line (a voltage induced from a nearby power cable, a ground that is not quite at 0 V, the ringing of lesson 5) must stay smaller than the margin, or the pixel reads the wrong state. The margin is the safety factor of the data link.

### Worked example: a 5 V driver into a 5 V pixel

A controller output buffered at 5 V swings from 0 V to 5.0 V. At DC a pixel input draws almost no current, so the driver's output resistance drops almost no voltage and the line reaches the full 5.0 V.

- NM_high = 5.0 V − 3.5 V = 1.5 V
- NM_low = 1.5 V − 0 V = 1.5 V

A volt and a half of margin in both states. That is comfortable, and it is why 5 V signalling into 5 V pixels is forgiving.

### Worked example: a 3.3 V driver into a 5 V pixel

Many modern controllers are built around logic that runs at 3.3 V, and their output pins swing from 0 V to 3.3 V.

- NM_high = 3.3 V − 3.5 V = −0.2 V
- NM_low = 1.5 V − 0 V = 1.5 V

The high margin is **negative**. Even with a perfect wire, the driver cannot reach the level the pixel guarantees to read as high. The low state is fine; the high state is not guaranteed at all.
`,
    },
    {
      kind: "check",
      id: "high-threshold-5v",
      prompt: "A pixel runs from a {{given.supply}} supply and its datasheet guarantees a high above 0.7 × VDD. What is its high threshold?",
      givens: checkGivens.highThreshold.map((given) => ({ numbers: given, answer: { value: given.threshold.value, unit: "V", tolerance: 0.01 } })),
      hint: "Multiply the supply by the fraction.",
      explanation: "0.7 × {{given.supply}} = {{given.threshold}}.",
    },
    {
      kind: "check",
      id: "margin-sagged-supply",
      prompt:
        "The same pixel's supply has sagged to 4.5 V at the strip. A 3.3 V controller drives it. What is the high noise margin now? (It may be positive or negative.)",
      answer: { value: 0.15, unit: "V", tolerance: 0.03 },
      hint: "First the new high threshold, 0.7 × VDD; then subtract it from the driver's 3.3 V.",
      explanation: "High threshold = 0.7 × 4.5 V = 3.15 V. NM_high = 3.3 V − 3.15 V = +0.15 V: positive, but thin.",
    },
    {
      kind: "text",
      markdown: `
## "But it works on my bench"

Installers wire 3.3 V controllers straight into 5 V pixels every day, and often it works. Both facts are true, and the reason is the undefined band. The pixel's input really switches somewhere inside it, usually not far from mid-supply. A part that switches exactly at mid-supply, 2.5 V for a 5 V part, would give the 3.3 V driver

3.3 V − 2.5 V = 0.8 V

of margin. But parts differ, so the course does not judge against one imagined part.
${RECEIVER_MODEL_MARKDOWN}
A 3.3 V driver into a 5 V pixel can therefore at best **work on typical pixels**: its high level sits ${(3.3 - typical5.topFall).toFixed(3)} V above the level (${typical5.topFall.toFixed(3)} V) where a pixel switching at the top of the typical band reads a fall, and ${(3.3 - typical5.highestRise).toFixed(3)} V above where it reads a rise (${typical5.highestRise.toFixed(3)} V), but ${(typical5.high - 3.3).toFixed(1)} V below the guaranteed ${typical5.high.toFixed(1)} V. That is fine on many benches and still not a promise.

The trouble is that even the 0.8 V is not a promise. The next batch of pixels may switch at 2.9 V. A warm strip may switch a little higher. The supply may be set to 5.25 V, which lifts the guaranteed threshold to 0.7 × 5.25 V = 3.675 V and the real switching point with it. And once the signal travels down a few metres of cable, the edge slows and rings, and the 0.8 V has to absorb that too. The run that worked on the bench, on a short lead with one batch of pixels, fails on site on a long cable with another. That is exactly the kind of intermittent fault that wastes days.

Later in the course (lesson 6) you will see that on some cables the far end of a long run briefly rises *above* the driver's level, and that this can lift a 3.3 V signal over a 5 V pixel's threshold. That effect is real and useful, but it depends on the cable and the resistor. It is not a reason to ignore the levels.

## Fixing the levels

There are three common ways to close the gap. In order of preference:

### 1. A level shifter at the controller

A **level shifter** here is simply a logic buffer powered from 5 V whose input accepts 3.3 V logic. Buffers with **TTL-compatible inputs** are made for this: their input guarantees a high above 2.0 V and a low below 0.8 V (the classic TTL input levels, carried into JEDEC's JESD8 interface standards), whatever their own supply. The 3.3 V controller drives the buffer's input; the buffer's output swings the full 0 V to 5 V into the cable.

The margins at each step:

- controller → buffer input: NM_high = 3.3 V − 2.0 V = 1.3 V; NM_low = 0.8 V − 0 V = 0.8 V
- buffer output → pixel: NM_high = 5.0 V − 3.5 V = 1.5 V; NM_low = 1.5 V − 0 V = 1.5 V

Every margin is positive and large. This is the design to aim for. Three details matter:

- use a **one-direction buffer**; the pixel never sends data back, and the automatic two-direction shifters sold for other jobs have weak, slow outputs that struggle to drive a long cable;
- power the buffer from the **same 5 V** that feeds the pixels, with a short ground to the controller;
- place it **at the controller**, so the long cable is driven by the buffer's strong 5 V output. A level shifter at the pixel end would leave the long run at 3.3 V.

### 2. Lower the first pixel's supply

A trick of the trade (common practice, not a standard): feed the first pixel's VDD through a silicon diode, which drops roughly 0.7 V (a textbook figure for a silicon junction at moderate current). The first pixel then runs at about 4.3 V and its high threshold falls to 0.7 × 4.3 V = 3.01 V, so a 3.3 V driver has a margin of 3.3 V − 3.01 V = 0.29 V. That pixel regenerates the data at its own 4.3 V swing for the second pixel, whose 3.5 V threshold leaves 0.8 V of margin. It works, but the margin is thin and the pixel runs dimmer; the level shifter is the better answer.

### 3. Rely on the cable

As noted above, some runs lift the far end above the driver level. Lesson 6 treats this properly. It is a legitimate effect, but a design that works only because of it has to be checked for the exact cable, length and resistor.
`,
    },
    {
      kind: "check",
      id: "shifter-input-margin",
      prompt:
        "A 3.3 V controller whose output high sags to {{given.high}} under load drives a 5 V buffer with TTL-compatible inputs (high guaranteed above 2.0 V). What is the high noise margin at the buffer's input?",
      givens: checkGivens.shifterMargin.map((given) => ({ numbers: given, answer: { value: given.margin.value, unit: "V", tolerance: 0.02 } })),
      hint: "NM_high = driver high level − receiver high threshold.",
      explanation: "{{given.high}} − 2.0 V = {{given.margin}}. The TTL-level input is what makes a 5 V buffer a level shifter.",
    },
    {
      kind: "text",
      markdown: `
## Whose 0 V?

Every threshold above is measured from the **pixel's own ground pin**. Every driver level is measured from the **controller's ground**. If the two grounds are not at the same voltage, the difference adds straight into the signal.

The two grounds differ whenever supply current flows in a conductor they share. Copper has resistance, and a conductor carrying a current I through a resistance R has a voltage V = I × R across it (Ohm's law). The resistance of a copper conductor follows from its cross-section and the resistivity of annealed copper, 1.7241 × 10⁻⁸ Ω·m (the international annealed copper standard); with the conductor diameters of the AWG table (ASTM B258):

| size | diameter | resistance per metre |
| --- | --- | --- |
| 24 AWG | 0.511 mm | 84 mΩ/m |
| 22 AWG | 0.644 mm | 53 mΩ/m |
| 20 AWG | 0.812 mm | 33 mΩ/m |
| 18 AWG | 1.024 mm | 20.9 mΩ/m |
| 16 AWG | 1.291 mm | 13.2 mΩ/m |

(Resistance = resistivity ÷ (π × d² / 4), at 20 °C.)

### Worked example: a ground offset

A controller sits 3 m from the start of a strip. Its ground is tied to the strip through a single 18 AWG conductor, and because the supply was wired at the controller end, the strip's 6 A return current flows back through that same conductor.

- R = 3 m × 20.9 mΩ/m = 0.063 Ω
- V = I × R = 6 A × 0.063 Ω ≈ 0.38 V

The pixel's ground sits about 0.38 V above the controller's. A 3.3 V high from the controller arrives, relative to the pixel's ground, as 3.3 V − 0.38 V = 2.92 V. On a 5 V pixel that already had a negative margin, this pushes the signal down into the undefined band even by the mid-supply reckoning. Worse, the offset changes with what the strip displays: bright scenes draw more current and shift the ground more. The run fails on white and works on dark blue. Many "it flickers only on bright scenes" faults are this.

The cure is to keep **supply current out of the data's ground reference**: feed power to the strip with its own conductors sized for the current, and give the data line its own ground conductor, run right beside it, joining the controller's ground to the first pixel's ground. Lessons 4 and 6 show that this ground conductor does a second, more subtle job too: it sets the cable's characteristic impedance.
`,
    },
    {
      kind: "check",
      id: "ground-offset",
      prompt:
        "A strip draws 4 A, and its return current flows through 2.5 m of 20 AWG conductor (33 mΩ/m) shared with the data ground. By how much does the pixel's ground sit above the controller's?",
      answer: { value: 4 * 2.5 * 0.0333, unit: "V", tolerance: 0.03 },
      hint: "R = length × resistance per metre, then V = I × R.",
      explanation: "R = 2.5 m × 0.0333 Ω/m = 0.083 Ω. V = 4 A × 0.083 Ω ≈ 0.33 V.",
    },
    {
      kind: "caution",
      title: "Current in the wrong conductor",
      markdown: `
A thin conductor made to carry supply current does more than shift a ground reference: it heats. The power turned into heat in a conductor is P = I² × R; in the example above, 6² × 0.063 ≈ 2.3 W spread along 3 m of wire, and far more if the current or the length grows or the gauge shrinks. At the currents large pixel displays draw, an undersized conductor, a crimp that is not fully closed or a screw terminal that has worked loose can overheat and start a fire. Size each supply conductor for its current and length, fuse each feed as the supply and strip manufacturers' instructions require, and check connections for heat under full load. Mains wiring to the power supplies is work for a licensed electrician, and local electrical codes and the manufacturers' instructions take precedence over this course.
`,
    },
    {
      kind: "text",
      markdown: `
## Noise: what the margin is for

The installation environment is not quiet. A data cable run alongside mains cables, motor leads or the switching supply of the strip itself picks up a little of every edge those make. Most of that coupling is small, tenths of a volt at most on a well-laid run, but it is there, it is random and it adds to whatever the cable does to the signal. The noise margin absorbs it. A design with 1.5 V of margin shrugs off a 0.3 V spike; a design with −0.2 V guaranteed margin and 0.8 V "real" margin may not.

Good practice that protects the margin (common practice of the trade):

- keep the data cable away from mains and high-current conductors, and cross them at right angles where they must meet;
- run the data ground right beside the data conductor, never take the "ground" from some other convenient point;
- keep the unshielded tail at each end short.

## Summing up

- A pixel reads **regions**: high above 0.7 × VDD, low below 0.3 × VDD, nothing guaranteed between. For a 5 V pixel: 3.5 V and 1.5 V.
- **Noise margin** is what the driver delivers beyond the threshold. A 5 V driver into a 5 V pixel has 1.5 V in both states; a 3.3 V driver has −0.2 V in the high state.
- Every run is judged two ways: it **works on every pixel that meets its datasheet** (guaranteed), it **works on typical pixels, not guaranteed**, or it **fails**.
- A 3.3 V driver "works" because typical parts switch well below 3.3 V; it can never be guaranteed into a 5 V pixel. That is luck, not design.
- A **5 V buffer with TTL-level inputs** at the controller restores large margins at every step.
- Thresholds are relative to the pixel's ground; supply current in a shared ground conductor moves it, and with it the margin.

## The lab

The workbench shows a controller with two outputs to choose from: its own 3.3 V pin wired direct, and the same signal through a 5 V level shifter. The run to the first pixel is short, and the series resistor fitted suits its cable, so the far end is a clean copy of the driver's level. Pick the driver that decodes every bit with at least 0.5 V of voltage margin, and answer the two questions about its margins. Try the other option too, on the workbench: the scope view shows where the far end settles and the decoded bits show what the pixel makes of it.
`,
    },
    {
      kind: "check",
      id: "mid-supply-margin",
      prompt:
        "Take a 5 V pixel whose input happens to switch exactly at mid-supply, with no hysteresis. How much margin does a controller's high of {{given.high}} have against that switching point?",
      givens: checkGivens.midSupplyMargin.map((given) => ({ numbers: given, answer: { value: given.margin.value, unit: "V", tolerance: 0.02 } })),
      hint: "Mid-supply is VDD / 2.",
      explanation:
        "5.0 V / 2 = {{given.mid}}; {{given.high}} − {{given.mid}} = {{given.margin}}. It is real for that one part, but no datasheet guarantees it: the next part may switch anywhere up to 3.5 V.",
    },
    {
      kind: "choice",
      id: "predict-driver-level",
      ask: "predict",
      prompt: "Before the simulator draws it: what will the far end of this run look like at the first pixel's data pin?",
      hint: "Compare the driver's high level with the pixel's guaranteed high threshold first; only then ask what the cable does.",
      explanation: "A 3.3 V output behind enough resistance settles at its own level, below a 5 V pixel's guaranteed high threshold. The 5 V buffer settles above it.",
      runs: [pinRun("beside-ground", 5, 100), bufferRun("beside-ground", 5, 100), pinRun("three-core", 8, 47), bufferRun("twisted-pair", 8, 0)],
    },
    {
      kind: "choice",
      id: "diagnose-level",
      ask: "diagnose",
      prompt: "An installer sends this run to a 5 V pixel and the first pixels flicker. The far end, as the simulator draws it, is below. Which one change makes it work on every pixel that meets its datasheet?",
      hint: "Look at where the far end settles during a long high, and compare it with the pixel's guaranteed high threshold.",
      explanation: "When the settled level is below the guaranteed threshold, no resistor or cable can lift it: only a driver with a higher level can. When the level is fine but the edge climbs slowly, less resistance does it.",
      runs: [pinRun("three-core", 10, 47), pinRun("beside-ground", 5, 220), pinRun("coax-75", 10, 47), bufferRun("beside-ground", 10, 220)],
      fixes: courseFixes,
    },
  ],
  lab,
} satisfies LessonInput;
