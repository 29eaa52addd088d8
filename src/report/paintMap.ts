import { encodePng } from './encodePng.js';
import { OUTSIDE } from './mapRaster.js';

/** Grey levels for unmeasured pixels: light base with darker diagonal hatching (reads in grey print). */
const UNMEASURED_BASE = 226;
const UNMEASURED_HATCH = 150;
export const HATCH_PERIOD_PX = 7;

/** Palette slots before the colour table: white (outside the ellipse), hatch base, hatch line. */
const WHITE = 0;
const HATCH_BASE = 1;
const HATCH_LINE = 2;
const FIRST_COLOR = 3;

const paletteCache = new WeakMap<Uint8Array, Uint8Array>();

/** White, the two hatch greys, then the colour table (RGB triples). */
function paletteFor(table: Uint8Array): Uint8Array {
  let p = paletteCache.get(table);
  if (!p) {
    p = new Uint8Array(table.length + 3 * FIRST_COLOR);
    p.set([255, 255, 255, UNMEASURED_BASE, UNMEASURED_BASE, UNMEASURED_BASE, UNMEASURED_HATCH, UNMEASURED_HATCH, UNMEASURED_HATCH]);
    p.set(table, 3 * FIRST_COLOR);
    paletteCache.set(table, p);
  }
  return p;
}

/**
 * Paint a classified map into a PNG. `point[k]` is what pixel k shows: a grid point index, or
 * UNMEASURED / OUTSIDE (MapRaster.point); `pointColor[p]` is the entry of `table` (RGB triples)
 * for grid point p, or −1 when that point has no value. Outside the ellipse: white; unmeasured or
 * no value: grey with diagonal hatching (period HATCH_PERIOD_PX, two pixels dark).
 * The colour of each grid point is chosen once, not once per pixel; the PNG is indexed when the
 * map uses at most 256 colours (encodePng), which shows the same pixels at a third of the deflate work.
 * Cost: O(pixels) plus the deflate.
 * @example paintMapPng(2, 1, Int32Array.of(0, OUTSIDE), Int16Array.of(0), Uint8Array.of(0, 0, 255)) // blue, white
 */
export function paintMapPng(width: number, height: number, point: Int32Array, pointColor: ArrayLike<number>, table: Uint8Array): Buffer {
  const pixels = new Uint16Array(width * height);
  for (let j = 0; j < height; j++) {
    const row = j * width;
    for (let i = 0; i < width; i++) {
      const p = point[row + i];
      if (p === OUTSIDE) {
        pixels[row + i] = WHITE;
        continue;
      }
      const c = p < 0 ? -1 : pointColor[p];
      pixels[row + i] = c >= 0 ? FIRST_COLOR + c : (i + j) % HATCH_PERIOD_PX < 2 ? HATCH_LINE : HATCH_BASE;
    }
  }
  return encodePng(width, height, pixels, paletteFor(table));
}

/** A table of RGB triples from a list of colours. */
export function colorTable(colors: readonly (readonly [number, number, number])[]): Uint8Array {
  const t = new Uint8Array(3 * colors.length);
  colors.forEach((c, k) => t.set(c, 3 * k));
  return t;
}
