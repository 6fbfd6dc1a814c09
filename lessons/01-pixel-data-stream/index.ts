import type { LessonInput } from "../schema";
import { lab } from "./lab";

export const lesson = {
  slug: "pixel-data-stream",
  number: 1,
  title: "The pixel data stream",
  summary:
    "How a single wire carries colour to hundreds of pixels: self-clocked bits at 800 kHz, bits told apart by how long they stay high, 24-bit colour words, the latch gap, and what all that means for frame time and refresh rate.",
  minutes: 40,
  blocks: [
    {
      kind: "text",
      markdown: `
## One wire, no clock

An addressable pixel strip looks simple from the outside: power, ground and one data wire. Everything the strip shows arrives on that one data wire as a stream of bits, and every pixel works out for itself where each bit begins and ends. There is no separate clock conductor telling the pixel "sample now". The signal carries its own timing. Engineers call that a *self-clocked* signal, and it is the reason a data run can fail in ways that look like a software fault.

This lesson builds a precise picture of that signal. Everything later in the course (logic levels, edges, cables, reflections, series termination) is about one question: does the waveform that reaches the first pixel's data pin still say what the controller sent? To answer it, you first need to know exactly what was sent and how the pixel reads it.

Throughout the course, numbers come from the course simulator, the same model that grades your labs. Where a figure comes from somewhere else, a standard, a textbook formula or the common practice of the trade, the lesson says so. Real pixel parts differ from one another; always check the datasheet of the part you are installing.

## The bit slot

The controller sends bits one after another in fixed time slots. In the course simulator each slot, the **bit period**, is 1.25 µs long. The bit rate is therefore

f = 1 / 1.25 µs = 800,000 bits per second = 800 kHz.

Every slot starts the same way: the data line goes high. That rising edge is the clock. The pixel sees it and starts timing. What differs between a 0 and a 1 is *how long the line stays high* before it drops again:

| bit | high time | low time | slot |
| --- | --- | --- | --- |
| 0 | 0.40 µs | 0.85 µs | 1.25 µs |
| 1 | 0.80 µs | 0.45 µs | 1.25 µs |

(High times are the course simulator's defaults; the low time is the rest of the slot.)

So a 0 is a short pulse followed by a long low, and a 1 is a long pulse followed by a short low. The trade often calls this stream NRZ; strictly it is a pulse-width code with the clock folded into the data. The line returns low in every slot, so a rising edge arrives every 1.25 µs no matter what the data are. The pixel never loses its place, even after thousands of bits.

## How the pixel decides

Inside the pixel a small timer starts at each rising edge. Somewhere between the two possible high times the pixel decides: if the line is still high, the bit is a 1; if it has already fallen, the bit is a 0. The course simulator models this as a **decision time** of 0.6 µs after the pulse starts. A pulse wider than 0.6 µs is a 1, a narrower one is a 0.

That gives each bit a **timing margin**, the distance between the pulse's real width and the decision time:

- a 0 bit: margin = 0.6 µs − 0.4 µs = 0.2 µs (200 ns);
- a 1 bit: margin = 0.8 µs − 0.6 µs = 0.2 µs (200 ns).

Two hundred nanoseconds sounds like a lot. It is the whole budget for everything that can stretch or shrink a pulse on its way to the pixel: slow edges, ringing, a threshold crossed late on the way up and early on the way down. If the width the pixel measures moves by more than 200 ns towards the decision time, the bit flips. A 0 read as a 1 makes a colour brighter; a 1 read as a 0 dims it. A few of those in every frame look like flicker.

The simulator adds two more rules, which you will meet on the workbench. A pulse narrower than 0.15 µs (the **minimum pulse**) is treated as a glitch, not a bit. A slot that holds no pulse, or two, decodes as "x": the pixel cannot make sense of it, and in a real chain what follows is usually garbage until the next latch.
`,
    },
    {
      kind: "figure",
      figure: "pulse-train",
      caption:
        "Eight bit slots as the controller sends them. Toggle the bits and move the high time of a 1: the dashed line at 0.6 µs after each rising edge is where the pixel decides. Watch the margin shrink as the 1-bit high time approaches it.",
      params: {
        bits: "01101000",
        bitPeriod: 1.25e-6,
        zeroHigh: 0.4e-6,
        oneHigh: 0.8e-6,
        decisionTime: 0.6e-6,
        highVoltage: 5,
        editableBits: true,
        slider: { field: "oneHigh", min: 0.3e-6, max: 1.2e-6, step: 0.05e-6 },
      },
    },
    {
      kind: "check",
      id: "bit-rate",
      prompt: "A controller is set to a bit period of 1.25 µs. What is its bit rate? Give a frequency with its unit.",
      answer: { value: 800e3, unit: "kHz", tolerance: 0.01 },
      hint: "The bit rate is one bit per period: f = 1 / T.",
      explanation: "f = 1 / 1.25 µs = 1 / 1.25×10⁻⁶ s = 800,000 Hz = 800 kHz.",
    },
    {
      kind: "text",
      markdown: `
## From colour to bits

A pixel with three LEDs (red, green, blue) takes one **colour word** of 24 bits: 8 bits per channel, so each channel has 256 levels, 0 to 255. The bits of each channel go out **most significant bit first**, that is, the 128s place, then 64, 32, 16, 8, 4, 2, 1.

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

That word has three 1s and twenty-one 0s. On the wire the line is high for 3 × 0.8 µs + 21 × 0.4 µs = 2.4 µs + 8.4 µs = 10.8 µs out of the word's 24 × 1.25 µs = 30 µs.

Notice that most colour words are mostly 0s. That matters later: the short 0 pulses (0.4 µs high) are the ones a slow edge threatens first.

## The chain: each pixel takes its share

Pixels are wired in a chain: the data output of one goes to the data input of the next. When a stream begins, the first pixel keeps the first 24 bits for itself and passes everything after them to its output, **regenerated**: it sends fresh, clean pulses of its own, not a copy of the distorted waveform it received. The second pixel keeps the next 24 bits and passes on the rest, and so on down the strip.

Two consequences for an installer:

1. The distances between pixels on a strip are short, and each pixel cleans up the signal for the next. The hard part of the data path is almost always the **first run**: the cable from the controller to the first pixel, which may be metres long.
2. An error in that first run is not local. A misread bit early in the stream shifts or corrupts what every pixel after it receives. A bad first run makes the whole strip misbehave, which is why it is so often blamed on the controller or the software.

## The latch gap

How does a pixel know that a frame is complete and that it should show the colour it has been holding? The controller stops sending and holds the data line **low** for a while. That pause is the **latch gap** (also called the reset time). In the course simulator, a low of at least 50 µs latches; some parts need 280 µs or more. When in doubt, a controller set to a long gap suits both kinds, at the cost of a little refresh rate, as you are about to calculate.
`,
    },
    {
      kind: "check",
      id: "word-high-time",
      prompt:
        "A pixel receives the colour word for red 0, green 170, blue 0. 170 is 1010 1010 in binary. For how long in total is the data line high during this 24-bit word? (1-bit high 0.8 µs, 0-bit high 0.4 µs.)",
      answer: { value: 11.2e-6, unit: "us", tolerance: 0.01 },
      hint: "Count the 1s in the whole word (the two zero channels contribute none), then add up 0.8 µs per 1 and 0.4 µs per 0.",
      explanation:
        "1010 1010 has four 1s, so the word has 4 ones and 20 zeros. High time = 4 × 0.8 µs + 20 × 0.4 µs = 3.2 µs + 8.0 µs = 11.2 µs.",
    },
    {
      kind: "text",
      markdown: `
## Frame time and refresh rate

A **frame** is one complete update of every pixel on an output: one colour word per pixel, then a latch gap. Its duration is

T_frame = N × 24 × T_bit + T_latch

with N the number of pixels on that output, T_bit the bit period and T_latch the latch gap. With the 1.25 µs bit period, one pixel's word takes 24 × 1.25 µs = 30 µs, so

T_frame = N × 30 µs + T_latch.

The **refresh rate** is how many frames fit in a second: f_refresh = 1 / T_frame.

### Worked example: 500 pixels

An output drives 500 pixels and uses a 280 µs latch gap.

- Data: 500 × 30 µs = 15,000 µs = 15.00 ms
- Frame: 15.00 ms + 0.28 ms = 15.28 ms
- Refresh: 1 / 15.28 ms = 1 / 0.01528 s ≈ 65.4 Hz

The same arithmetic for other chain lengths (280 µs latch gap):

| pixels on the output | data time | frame time | refresh rate |
| --- | --- | --- | --- |
| 100 | 3.00 ms | 3.28 ms | 305 Hz |
| 200 | 6.00 ms | 6.28 ms | 159 Hz |
| 500 | 15.00 ms | 15.28 ms | 65.4 Hz |
| 1,000 | 30.00 ms | 30.28 ms | 33.0 Hz |

The data time grows in proportion to the chain; the latch gap is a fixed overhead that matters only for short chains.

### Working backwards: how many pixels per output?

Designers usually start from the refresh rate they want. Rearranging:

N_max = (1 / f_refresh − T_latch) / 30 µs

For a smooth 60 Hz with a 280 µs latch gap:

N_max = (16.667 ms − 0.280 ms) / 0.030 ms = 16.387 / 0.030 ≈ 546.2, so at most 546 pixels.

Round *down*: 547 pixels would no longer fit in a 60 Hz frame. Controllers with several outputs exist precisely because a single long chain becomes too slow; splitting a 1,000-pixel display over two outputs of 500 doubles the achievable refresh rate. (What refresh rate looks smooth is a matter of judgement and content; many installers aim for 30 to 60 Hz for moving effects. That figure is common practice of the trade, not a standard.)
`,
    },
    {
      kind: "check",
      id: "frame-time-200",
      prompt: "An output drives 200 pixels with a 280 µs latch gap and a 1.25 µs bit period. What is the frame time?",
      answer: { value: 6.28e-3, unit: "ms", tolerance: 0.01 },
      hint: "T_frame = N × 24 × T_bit + T_latch.",
      explanation: "200 × 24 × 1.25 µs = 6,000 µs = 6.00 ms; plus 0.28 ms of latch gap gives 6.28 ms.",
    },
    {
      kind: "check",
      id: "refresh-200",
      prompt: "For that same 200-pixel output (frame time 6.28 ms), what is the refresh rate?",
      answer: { value: 1 / 6.28e-3, unit: "Hz", tolerance: 0.01 },
      hint: "The refresh rate is the number of frames per second: 1 / T_frame.",
      explanation: "1 / 6.28 ms = 1 / 0.00628 s ≈ 159.2 Hz.",
    },
    {
      kind: "check",
      id: "max-pixels-40hz",
      prompt:
        "You want at least 40 frames per second on one output, with a 50 µs latch gap. How many pixels can the output drive at most? Give a whole number.",
      answer: { value: 831, unit: "", tolerance: 0.002 },
      hint: "N_max = (1 / f − T_latch) / 30 µs, then round down.",
      explanation: "1 / 40 Hz = 25 ms = 25,000 µs. (25,000 µs − 50 µs) / 30 µs = 831.7, rounded down to 831 pixels.",
    },
    {
      kind: "text",
      markdown: `
## What the timing leaves for the cable

Put the pieces together and you have the target for every later lesson. At the first pixel's data pin, in every bit slot, there must be:

1. **one** clean rising crossing into the "high" region, so the pixel starts timing once and only once;
2. a high that lasts long enough on the way down to be measured correctly: for a 0, clearly shorter than the decision time; for a 1, clearly longer;
3. **one** clean falling crossing into the "low" region, and no bump in the low period that could be mistaken for a new pulse.

A cable does two things to this. First, it delays the whole waveform: on a 10 m run the signal arrives tens of nanoseconds late. That does no harm on its own, because every edge is delayed by the same amount and the pixel only measures widths. Second, and this is the trouble, it can delay the rising and falling crossings by *different* amounts, shrink the swing so the thresholds are barely reached, or add ringing that crosses a threshold twice. Each of those eats the 200 ns margin or breaks rule 1 or 3. The next lessons take them one by one: whether the voltage reaches the thresholds at all (lesson 2), how fast it gets there (lesson 3), and what the cable does to the edge on the way (lessons 4 to 6).

## Symptoms in the field

It helps to connect the numbers to what you see on site:

- **Wrong but stable colours** on every pixel: usually byte order or a controller setting. The data decode fine; they just mean something else.
- **Random flashes, flicker, pixels near the start "sparkling"**, worse with some colours than others, sometimes changing when someone touches the cable: bits misread at the first pixel. Colours with many 0 bits stress the short pulses; patterns with many 1s stress the short lows.
- **Everything after a certain pixel frozen or garbled**: a failed pixel or a bad connection at that point in the chain, not the first run.
- **Refresh visibly slow, effects stutter**: too many pixels on one output, the arithmetic of this lesson.

## Power: the other thing a long chain asks for

The data line carries almost no current, but the strip it feeds can draw a great deal. A common rule of thumb of the trade is about 60 mA per three-LED 5 V pixel at full white; the datasheet of your part and a measurement are what count. On that rule, 300 pixels at full white draw 300 × 0.06 A = 18 A. That current flows in the supply conductors, and it also sets how much the "ground" at the far end of a strip sits above the ground at the controller, which lesson 2 shows can eat into your noise margin.
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
