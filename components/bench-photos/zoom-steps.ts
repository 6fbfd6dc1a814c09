/** Screen pixels per photo pixel, or "fit": the whole photo in the frame, whatever the frame's size. */
export type Zoom = number | "fit";

type Size = { width: number; height: number };

// Doubling steps read as whole percentages; 400 % is enough to read a scope's smallest readout.
const steps = [0.25, 0.5, 1, 2, 4];
export const maxZoom = steps[steps.length - 1]!;

/** The factor at which the whole photo fits the frame; never above 1, so a small photo is not blown up. */
export function fitZoom(photo: Size, frame: Size): number {
  return Math.max(Math.min(1, frame.width / photo.width, frame.height / photo.height), 0.01);
}

function settle(scale: number, fit: number): Zoom {
  return scale <= fit * 1.001 ? "fit" : Math.min(scale, Math.max(maxZoom, fit));
}

// A press must visibly change the photo: a step closer than this to the current zoom is passed over.
const leastChange = 1.2;

export function zoomIn(scale: number, fit: number): Zoom {
  return settle(steps.find((step) => step > scale * leastChange) ?? maxZoom, fit);
}

export function zoomOut(scale: number, fit: number): Zoom {
  return settle(steps.findLast((step) => step < scale / leastChange) ?? fit, fit);
}

/** A wheel turn zooms continuously, one notch (about 100 pixels of delta) by a fifth. */
export function zoomByWheel(scale: number, fit: number, deltaPixels: number): Zoom {
  return settle(scale * Math.exp((-deltaPixels * Math.LN2) / 380), fit);
}

export function describeZoom(zoom: Zoom, fit: number): string {
  const percent = (scale: number) => `${Math.round(scale * 100)} %`;
  return zoom === "fit" ? `Fit · ${percent(fit)}` : percent(zoom);
}
