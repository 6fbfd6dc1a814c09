import { bufferRun, pinRun } from "../choice-check-runs";
import { buffer5v } from "../drivers";
import { lessonNumbers } from "../numbers/lesson-numbers";
import { sharedNumbers } from "../numbers/shared-numbers";
import type { LessonInput } from "../schema";
import { lab } from "./lab";
import { checkGivens, FIGURE_BITS, numbers } from "./numbers";

const { sim } = sharedNumbers;

export const lesson = {
  slug: "pixel-data-stream",
  number: 1,
  title: "The pixel data stream",
  summary:
    "How a single wire carries colour to hundreds of pixels: self-clocked bits at {{sim.bitRate}}, bits told apart by how long they stay high, {{sim.wordBits}}-bit colour words, the latch gap, and what all that means for frame time and refresh rate.",
  minutes: 40,
  numbers: lessonNumbers(numbers),
  blocks: [
    {
      kind: "text",
      markdown: `
## One wire, no clock

An addressable pixel strip looks simple from the outside: power, ground and one data wire. Everything the strip shows arrives on that one data wire as a stream of bits, and every pixel works out for itself where each bit begins and ends. There is no separate clock conductor telling the pixel "sample now". The signal carries its own timing. Engineers call that a *self-clocked* signal, and it is the reason a data run can fail in ways that look like a software fault.

This lesson builds a precise picture of that signal. Everything later in the course (logic levels, edges, cables, reflections, series termination) is about one question: does the waveform that reaches the first pixel's data pin still say what the controller sent? To answer it, you first need to know exactly what was sent and how the pixel reads it.

Throughout the course, numbers come from the course simulator, the same model that grades your labs. Where a figure comes from somewhere else, a standard, a textbook formula or the common practice of the trade, the lesson says so. Real pixel parts differ from one another; always check the datasheet of the part you are installing.

## The bit slot

The controller sends bits one after another in fixed time slots. In the course simulator each slot, the **bit period**, is {{sim.bitPeriod}} long. The bit rate is therefore

f = 1 / {{sim.bitPeriod}} = {{sim.bitRate|unit=Hz|bare}} bits per second = {{sim.bitRate}}.

Every slot starts the same way: the data line goes high. That rising edge is the clock. The pixel sees it and starts timing. What differs between a 0 and a 1 is *how long the line stays high* before it drops again:

| bit | high time | low time | slot |
| --- | --- | --- | --- |
| 0 | {{sim.zeroHigh|dp=2}} | {{sim.zeroLow}} | {{sim.bitPeriod}} |
| 1 | {{sim.oneHigh|dp=2}} | {{sim.oneLow}} | {{sim.bitPeriod}} |

(High times are the course simulator's defaults; the low time is the rest of the slot.)

So a 0 is a short pulse followed by a long low, and a 1 is a long pulse followed by a short low. The trade often calls this stream NRZ; strictly it is a pulse-width code with the clock folded into the data. The line returns low in every slot, so a rising edge arrives every {{sim.bitPeriod}} no matter what the data are. The pixel never loses its place, even after thousands of bits.

## How the pixel decides

Inside the pixel a small timer starts at each rising edge. Somewhere between the two possible high times the pixel decides: if the line is still high, the bit is a 1; if it has already fallen, the bit is a 0. The course simulator models this as a **decision time** of {{sim.decisionTime}} after the pulse starts. A pulse wider than {{sim.decisionTime}} is a 1, a narrower one is a 0.

That gives each bit a **timing margin**, the distance between the pulse's real width and the decision time:

- a 0 bit: margin = {{sim.decisionTime}} − {{sim.zeroHigh}} = {{margin.zero}} ({{margin.zero|unit=ns|dp=0}});
- a 1 bit: margin = {{sim.oneHigh}} − {{sim.decisionTime}} = {{margin.one}} ({{margin.one|unit=ns|dp=0}}).

A margin of {{sim.timingMargin}} sounds like a lot. It is the whole budget for everything that can stretch or shrink a pulse on its way to the pixel: slow edges, ringing, a threshold crossed late on the way up and early on the way down. If the width the pixel measures moves by more than {{sim.timingMargin}} towards the decision time, the bit flips. A 0 read as a 1 makes a colour brighter; a 1 read as a 0 dims it. A few of those in every frame look like flicker.

The simulator adds two more rules, which you will meet on the workbench. A pulse narrower than {{sim.minPulse}} (the **minimum pulse**) is treated as a glitch, not a bit. A slot that holds no pulse, or two, decodes as "x": the pixel cannot make sense of it, and in a real chain what follows is usually garbage until the next latch.
`,
    },
    {
      kind: "figure",
      figure: "pulse-train",
      caption:
        "A train of {{figureSlots}} bit slots as the controller sends them. Toggle the bits and move the high time of a 1: the dashed line at {{sim.decisionTime}} after each rising edge is where the pixel decides. Watch the margin shrink as the 1-bit high time approaches it.",
      params: {
        bits: FIGURE_BITS,
        bitPeriod: sim.bitPeriod.value,
        zeroHigh: sim.zeroHigh.value,
        oneHigh: sim.oneHigh.value,
        decisionTime: sim.decisionTime.value,
        highVoltage: buffer5v.highVoltage,
        editableBits: true,
        slider: { field: "oneHigh", min: 0.3e-6, max: 1.2e-6, step: 0.05e-6 },
      },
    },
    {
      kind: "check",
      id: "bit-rate",
      prompt: "A controller is set to a bit period of {{given.period}}. What is its bit rate? Give a frequency with its unit.",
      givens: checkGivens.bitRate.map((given) => ({ numbers: given, answer: { value: given.rate.value, unit: "kHz", tolerance: 0.01 } })),
      hint: "The bit rate is one bit per period: f = 1 / T.",
      explanation: "f = 1 / {{given.period}} = 1 / {{given.period|unit=s|exp=-6}} = {{given.rate}}.",
    },
    {
      kind: "text",
      markdown: `
## From colour to bits

A pixel with three LEDs (red, green, blue) takes one **colour word** of {{sim.wordBits}} bits: {{channel.bits}} bits per channel, so each channel has {{channel.levels}} levels, 0 to {{channel.top}}. The bits of each channel go out **most significant bit first**, that is, the 128s place, then 64, 32, 16, 8, 4, 2, 1.

Not every part takes its channels in the order red, green, blue. Many take green first, then red, then blue; the datasheet gives the **byte order**. If the controller sends in one order and the part expects another, red and green swap: an installation "showing the wrong colours" with otherwise perfect data has a byte-order setting wrong, not a cable problem. Know the difference, because the cable faults you will learn about look different: they are random and come and go.

### Worked example: one colour word

Take the colour red 200, green 0, blue 0, sent to a part that expects green, red, blue.

Write 200 in binary by taking out powers of two from the top:

- 200 − 128 = 72 → 1 (128s)
- 72 − 64 = 8 → 1 (64s)
- 8 < 32 → 0; 8 < 16 → 0
- 8 − 8 = 0 → 1 (8s)
- 0 → 0, 0, 0 (4s, 2s, 1s)

So 200 = 1100 1000. Green 0 = 0000 0000 and blue 0 = 0000 0000. In green, red, blue order the word is

0000 0000 · 1100 1000 · 0000 0000

That word holds {{redWord.ones}} ones and {{redWord.zeros}} zeros. On the wire the line is high for {{redWord.ones}} × {{sim.oneHigh}} + {{redWord.zeros}} × {{sim.zeroHigh}} = {{redWord.onesHigh}} + {{redWord.zerosHigh}} = {{redWord.high}} out of the word's {{sim.wordBits}} × {{sim.bitPeriod}} = {{wordTime}}.

Notice that most colour words are mostly 0s. That matters later: the short 0 pulses ({{sim.zeroHigh}} high) are the ones a slow edge threatens first.

## The chain: each pixel takes its share

Pixels are wired in a chain: the data output of one goes to the data input of the next. When a stream begins, the first pixel keeps the first {{sim.wordBits}} bits for itself and passes everything after them to its output, **regenerated**: it sends fresh, clean pulses of its own, not a copy of the distorted waveform it received. The second pixel keeps the next {{sim.wordBits}} bits and passes on the rest, and so on down the strip.

Two consequences for an installer:

1. The distances between pixels on a strip are short, and each pixel cleans up the signal for the next. The hard part of the data path is almost always the **first run**: the cable from the controller to the first pixel, which may be metres long.
2. An error in that first run is not local. A misread bit early in the stream shifts or corrupts what every pixel after it receives. A bad first run makes the whole strip misbehave, which is why it is so often blamed on the controller or the software.

## The latch gap

How does a pixel know that a frame is complete and that it should show the colour it has been holding? The controller stops sending and holds the data line **low** for a while. That pause is the **latch gap** (also called the reset time). In the course simulator, a low of at least {{sim.latchGap}} latches; some parts need {{longLatch}} or more. When in doubt, a controller set to a long gap suits both kinds, at the cost of a little refresh rate, as you are about to calculate.
`,
    },
    {
      kind: "check",
      id: "word-high-time",
      prompt:
        "A pixel receives the colour word for red 0, green 170, blue 0. 170 is 1010 1010 in binary. For how long in total is the data line high during this {{sim.wordBits}}-bit word? (1-bit high {{sim.oneHigh}}, 0-bit high {{sim.zeroHigh}}.)",
      answer: { value: numbers.greenWord.high.value, unit: "us", tolerance: 0.01 },
      hint: "Count the 1s in the whole word (the two zero channels contribute none), then add up {{sim.oneHigh}} per 1 and {{sim.zeroHigh}} per 0.",
      explanation:
        "1010 1010 has {{greenWord.ones}} ones, so the word has {{greenWord.ones}} ones and {{greenWord.zeros}} zeros. High time = {{greenWord.ones}} × {{sim.oneHigh}} + {{greenWord.zeros}} × {{sim.zeroHigh}} = {{greenWord.onesHigh}} + {{greenWord.zerosHigh}} = {{greenWord.high}}.",
    },
    {
      kind: "text",
      markdown: `
## Frame time and refresh rate

A **frame** is one complete update of every pixel on an output: one colour word per pixel, then a latch gap. Its duration is

T_frame = N × {{sim.wordBits}} × T_bit + T_latch

with N the number of pixels on that output, T_bit the bit period and T_latch the latch gap. With the {{sim.bitPeriod}} bit period, one pixel's word takes {{sim.wordBits}} × {{sim.bitPeriod}} = {{wordTime}}, so

T_frame = N × {{wordTime}} + T_latch.

The **refresh rate** is how many frames fit in a second: f_refresh = 1 / T_frame.

### Worked example: {{rows.p500.pixels}} pixels

An output drives {{rows.p500.pixels}} pixels and uses a {{longLatch}} latch gap.

- Data: {{rows.p500.pixels}} × {{wordTime}} = {{rows.p500.data|unit=µs|dp=0}} = {{rows.p500.data}}
- Frame: {{rows.p500.data}} + {{longLatch|unit=ms|dp=2}} = {{rows.p500.frame}}
- Refresh: 1 / {{rows.p500.frame}} = 1 / {{rows.p500.frame|unit=s|dp=5}} ≈ {{rows.p500.refresh}}

The same arithmetic for other chain lengths ({{longLatch}} latch gap):

| pixels on the output | data time | frame time | refresh rate |
| --- | --- | --- | --- |
| {{rows.p100.pixels}} | {{rows.p100.data}} | {{rows.p100.frame}} | {{rows.p100.refresh}} |
| {{rows.p200.pixels}} | {{rows.p200.data}} | {{rows.p200.frame}} | {{rows.p200.refresh}} |
| {{rows.p500.pixels}} | {{rows.p500.data}} | {{rows.p500.frame}} | {{rows.p500.refresh}} |
| {{rows.p1000.pixels}} | {{rows.p1000.data}} | {{rows.p1000.frame}} | {{rows.p1000.refresh}} |

The data time grows in proportion to the chain; the latch gap is a fixed overhead that matters only for short chains.

### Working backwards: how many pixels per output?

Designers usually start from the refresh rate they want. Rearranging:

N_max = (1 / f_refresh − T_latch) / {{wordTime}}

For a smooth {{smooth.rate}} with a {{longLatch}} latch gap:

N_max = ({{smooth.period}} − {{longLatch|unit=ms|dp=3}}) / {{wordTime|unit=ms|dp=3}} = {{smooth.available|bare}} / {{wordTime|unit=ms|dp=3|bare}} ≈ {{smooth.exact}}, so at most {{smooth.max}} pixels.

Round *down*: {{smooth.oneMore}} pixels would no longer fit in a {{smooth.rate}} frame. Controllers with several outputs exist precisely because a single long chain becomes too slow; splitting a {{rows.p1000.pixels}}-pixel display over two outputs of {{rows.p500.pixels}} nearly doubles the achievable refresh rate, from {{rows.p1000.refresh}} to {{rows.p500.refresh}}. (What refresh rate looks smooth is a matter of judgement and content; many installers aim for 30 to 60 Hz for moving effects. That figure is common practice of the trade, not a standard.)
`,
    },
    {
      kind: "check",
      id: "frame-time-200",
      prompt: "An output drives {{given.pixels}} pixels with a {{longLatch}} latch gap and a {{sim.bitPeriod}} bit period. What is the frame time?",
      givens: checkGivens.frameTime.map((given) => ({ numbers: given, answer: { value: given.frame.value, unit: "ms", tolerance: 0.01 } })),
      hint: "T_frame = N × {{sim.wordBits}} × T_bit + T_latch.",
      explanation: "{{given.pixels}} × {{sim.wordBits}} × {{sim.bitPeriod}} = {{given.data}}; plus {{longLatch|unit=ms|dp=2}} of latch gap gives {{given.frame}}.",
    },
    {
      kind: "check",
      id: "refresh-200",
      prompt: "Another output drives {{given.pixels}} pixels; its frame time is {{given.frame}}. What is its refresh rate?",
      givens: checkGivens.refresh.map((given) => ({ numbers: given, answer: { value: given.refresh.value, unit: "Hz", tolerance: 0.01 } })),
      hint: "The refresh rate is the number of frames per second: 1 / T_frame.",
      explanation: "1 / {{given.frame}} = 1 / {{given.frame|unit=s|dp=5}} ≈ {{given.refresh|dp=1}}.",
    },
    {
      kind: "check",
      id: "max-pixels-40hz",
      prompt:
        "You want at least {{given.rate|bare}} frames per second on one output, with a {{sim.latchGap}} latch gap. How many pixels can the output drive at most? Give a whole number.",
      // Exact: the rounded-up count is the mistake the lesson warns against, so it must not pass.
      givens: checkGivens.maxPixels.map((given) => ({ numbers: given, answer: { value: given.max.value, unit: "", tolerance: 0 } })),
      hint: "N_max = (1 / f − T_latch) / {{wordTime}}, then round down.",
      explanation:
        "1 / {{given.rate}} = {{given.period|unit=µs|dp=0}}. ({{given.period|unit=µs|dp=0}} − {{sim.latchGap}}) / {{wordTime}} = {{given.exact}}, rounded down to {{given.max}} pixels: {{given.nextUp}} would no longer fit in a frame.",
    },
    {
      kind: "choice",
      id: "pick-delay-trace",
      ask: "pick-trace",
      prompt:
        "The same controller sends the same bits down twisted pair of four different lengths. Each trace below is the far end of one of them, drawn by the simulator on the same time axis. Which trace belongs to the run described?",
      hint: "A cable delays the whole waveform: the longer the run, the later the first rising edge arrives.",
      explanation: "Every edge arrives later on a longer run, by the same amount for rising and falling edges, so the widths the pixel measures survive. The run that is longest starts rising last.",
      runs: [bufferRun("twisted-pair", 2, 100), bufferRun("twisted-pair", 10, 100), bufferRun("twisted-pair", 20, 100), bufferRun("twisted-pair", 30, 100)],
    },
    {
      kind: "choice",
      id: "predict-first-pixel",
      ask: "predict",
      prompt: "Before the simulator draws it: what will the far end of this run look like at the first pixel's data pin?",
      hint: "Ask how the driver's level compares with the pixel's high threshold, and how the resistance in front of the cable compares with the cable's impedance.",
      explanation: "The later lessons explain each shape: a driver below the threshold never gets there, a source far below the cable's impedance rings, one far above it climbs a staircase, and one near it gives a clean step.",
      runs: [bufferRun("twisted-pair", 8, 0), bufferRun("twisted-pair", 8, 100), bufferRun("beside-ground", 8, 330), pinRun("beside-ground", 8, 100)],
    },
    {
      kind: "text",
      markdown: `
## What the timing leaves for the cable

Put the pieces together and you have the target for every later lesson. At the first pixel's data pin, in every bit slot, there must be:

1. **one** clean rising crossing into the "high" region, so the pixel starts timing once and only once;
2. a high that lasts long enough on the way down to be measured correctly: for a 0, clearly shorter than the decision time; for a 1, clearly longer;
3. **one** clean falling crossing into the "low" region, and no bump in the low period that could be mistaken for a new pulse.

A cable does two things to this. First, it delays the whole waveform: on a {{late.length}} run the signal arrives {{late.least|bare}} to {{late.most}} late, depending on the cable. That does no harm on its own, because every edge is delayed by the same amount and the pixel only measures widths. Second, and this is the trouble, it can delay the rising and falling crossings by *different* amounts, shrink the swing so the thresholds are barely reached, or add ringing that crosses a threshold twice. Each of those eats the {{sim.timingMargin}} margin or breaks rule 1 or 3. The next lessons take them one by one: whether the voltage reaches the thresholds at all (lesson 2), how fast it gets there (lesson 3), and what the cable does to the edge on the way (lessons 4 to 6).

## Symptoms in the field

It helps to connect the numbers to what you see on site:

- **Wrong but stable colours** on every pixel: usually byte order or a controller setting. The data decode fine; they just mean something else.
- **Random flashes, flicker, pixels near the start "sparkling"**, worse with some colours than others, sometimes changing when someone touches the cable: bits misread at the first pixel. Colours with many 0 bits stress the short pulses; patterns with many 1s stress the short lows.
- **Everything after a certain pixel frozen or garbled**: a failed pixel or a bad connection at that point in the chain, not the first run.
- **Refresh visibly slow, effects stutter**: too many pixels on one output, the arithmetic of this lesson.

## Power: the other thing a long chain asks for

The data line carries almost no current, but the strip it feeds can draw a great deal. A common rule of thumb of the trade is about {{power.perPixel}} per three-LED 5 V pixel at full white; the datasheet of your part and a measurement are what count. On that rule, {{power.pixels}} pixels at full white draw {{power.pixels}} × {{power.perPixel|unit=A|dp=2}} = {{power.total}}. That current flows in the supply conductors, and it also sets how much the "ground" at the far end of a strip sits above the ground at the controller, which lesson 2 shows can eat into your noise margin.
`,
    },
    {
      kind: "caution",
      title: "Supply current and wiring",
      markdown: `
Low-voltage DC is not harmless. At the currents a pixel installation draws (tens of amperes on large displays), an undersized conductor, a loose terminal or a missing fuse can overheat and start a fire. Size every supply conductor for its current, fuse each supply feed as the supply and strip manufacturers' instructions require, and let connections be checked for heat under full load. Wiring on the mains side of a power supply is work for a licensed electrician. Local electrical codes and the manufacturers' instructions take precedence over anything in this course.
`,
    },
    {
      kind: "text",
      markdown: `
## The lab

On the workbench for this lesson a controller is sending a short colour word to the first pixel over a short cable. Its timing settings have been changed by someone who did not know what they were for. You will:

- answer two questions about the frame budget of a chain;
- set the high times for a 0 and a 1 so that the pixel decodes every bit with a comfortable timing margin.

Watch the scope view as you move the controls: the dashed decision line, the width of each pulse and the decoded bits under the trace. When you can say why a high time of 0.55 µs for a 0 is a poor choice even though the pixel still reads it as a 0, you have the point of this lesson.
`,
    },
  ],
  lab,
} satisfies LessonInput;
