import type { Driver } from "./schema";

// The two drivers several labs share, defined once so a change reaches every lab that uses them.

export const controllerPin3v3 = {
  id: "pin-3v3",
  label: "3.3 V controller pin",
  highVoltage: 3.3,
  outputResistance: 30,
  edgeTime: 4e-9,
} satisfies Driver;

export const buffer5v = {
  id: "buffer-5v",
  label: "5 V buffered output",
  highVoltage: 5,
  outputResistance: 20,
  edgeTime: 3e-9,
} satisfies Driver;
