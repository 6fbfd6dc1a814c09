/**
 * A number lesson text may type as it is, because no formula or simulator run produces it: a
 * worked example's premise that no computation uses, a rule of thumb, a figure from a standard,
 * a definition. Listed with the reason, phrase by phrase (the phrase holds the number and enough
 * words around it to say which occurrence is meant); tests/unit/lessons/lesson-numbers.test.ts
 * fails on any other number typed in the text of a lesson whose numbers are converted.
 */
export type PlainNumber = { text: string; why: string };

/** Phrases every lesson may use. Phrases are matched in the text as written, placeholders included. */
export const coursePlainNumbers: PlainNumber[] = [
  { text: "3.3 V controller", why: "name of the course's controller-pin driver (lessons/drivers.ts label)" },
  { text: "3.3 V pin", why: "name of the course's controller-pin driver" },
  { text: "3.3 V driver", why: "name of the course's controller-pin driver" },
  { text: "5 V buffer", why: "name of the course's buffered 5 V driver (lessons/drivers.ts label)" },
  { text: "5 V driver", why: "name of the course's buffered 5 V driver" },
  { text: "5 V pixel", why: "the class of pixel the course's examples drive (the simulator's default supply)" },
  { text: "5 V strip", why: "the class of strip the course's examples power" },
  { text: "level shifter to 5 V", why: "the one-direction 5 V buffer of lesson 2" },
  { text: "5 V level shifter", why: "the one-direction 5 V buffer of lesson 2" },
  { text: "10–90 %", why: "the rise-time convention of oscilloscopes and datasheets" },
  { text: "75 Ω coax", why: "name of a catalogue cable (lib/sim/cables.ts label)" },
  { text: "coax-75", why: "id of a catalogue cable" },
  { text: "10 % to 90 %", why: "the rise-time convention" },
  { text: "10 % and 90 %", why: "the rise-time convention" },
  { text: "90 % down to 10 %", why: "the fall-time convention" },
];
