// A real PNG of deterministic noise: it does not compress, so an upload of it spans many network
// chunks, and the same seed always gives the same bytes.
import { PNG } from "pngjs";

export function noisyPhoto(width: number, height: number, seed = 7): Buffer {
  const png = new PNG({ width, height });
  let state = seed >>> 0;
  for (let i = 0; i < png.data.length; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    png.data[i] = i % 4 === 3 ? 255 : state >>> 24;
  }
  return PNG.sync.write(png);
}
