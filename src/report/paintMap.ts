import { PNG } from 'pngjs';
import type { Rgb } from './colorMap.js';

/** Grey levels for unmeasured pixels: light base with darker diagonal hatching (reads in grey print). */
const UNMEASURED_BASE = 226;
const UNMEASURED_HATCH = 150;
export const HATCH_PERIOD_PX = 7;

/**
 * Paint a classified map into an RGB PNG. `colorOf(k)` gives the colour of pixel k, or null for
 * unmeasured (hatched grey); pixels outside the ellipse (`outside(k)`) are white.
 * Cost: O(pixels) plus PNG deflate.
 */
export function paintPng(
  width: number,
  height: number,
  colorOf: (k: number) => Rgb | null,
  outside: (k: number) => boolean,
): Buffer {
  const png = new PNG({ width, height, colorType: 2, inputColorType: 6 });
  const data = png.data;
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      const k = j * width + i;
      const o = 4 * k;
      data[o + 3] = 255;
      if (outside(k)) {
        data[o] = data[o + 1] = data[o + 2] = 255;
        continue;
      }
      const c = colorOf(k);
      if (c === null) {
        const g = (i + j) % HATCH_PERIOD_PX < 2 ? UNMEASURED_HATCH : UNMEASURED_BASE;
        data[o] = data[o + 1] = data[o + 2] = g;
      } else {
        data[o] = c[0];
        data[o + 1] = c[1];
        data[o + 2] = c[2];
      }
    }
  }
  // Sub filter and a middle deflate level: maps are blocky and compress well; adaptive filtering
  // at level 9 costs several times more for a few per cent of size.
  return PNG.sync.write(png, { colorType: 2, inputColorType: 6, filterType: 1, deflateLevel: 6 });
}
