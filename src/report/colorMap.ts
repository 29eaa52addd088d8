/**
 * Colour maps for the report, built once as 256-entry lookup tables.
 *
 * `lumen` (our own sequential map): a straight path in OKLab from a dark blue-violet to a light
 * yellow. OKLab is built so that Euclidean distance approximates perceived difference, so equal
 * steps along a straight line are perceptually uniform, and its lightness L rises linearly
 * along the path (monotone: the map reads correctly in grey-scale print). Chroma is reduced
 * where a colour would leave the sRGB gamut, which keeps L exact and only softens saturation.
 * Source: B. Ottosson, "A perceptual color space for image processing" (2020), OKLab
 * matrices (from MEMORY; the tests check that the forward and inverse transforms are mutual
 * inverses and that white maps to L = 1, a = b = 0). sRGB transfer: IEC 61966-2-1.
 *
 * `grey`: plain lightness ramp, for reports that will only ever be printed in grey.
 */

export type ColorMapName = 'lumen' | 'grey';
export type Rgb = [number, number, number];

/** sRGB transfer (IEC 61966-2-1): linear [0,1] → encoded [0,1]. */
function encodeSrgb(c: number): number {
  return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
}

function decodeSrgb(c: number): number {
  return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
}

/** OKLab → linear sRGB (may fall outside [0,1] when out of gamut). */
export function oklabToLinearSrgb(L: number, a: number, b: number): Rgb {
  const l = (L + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const m = (L - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const s = (L - 0.0894841775 * a - 1.291485548 * b) ** 3;
  return [
    4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s,
    -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s,
    -0.0041960863 * l - 0.7034186147 * m + 1.707614701 * s,
  ];
}

/** Encoded sRGB bytes → OKLab [L, a, b]; used by the tests and the grey-scale check. */
export function srgbToOklab(rgb: Rgb): Rgb {
  const [r, g, b] = rgb.map((v) => decodeSrgb(v / 255));
  const l = Math.cbrt(0.4122214708 * r + 0.5363325363 * g + 0.0514459929 * b);
  const m = Math.cbrt(0.2119034982 * r + 0.6806995451 * g + 0.1073969566 * b);
  const s = Math.cbrt(0.0883024619 * r + 0.2817188376 * g + 0.6299787005 * b);
  return [
    0.2104542553 * l + 0.793617785 * m - 0.0040720468 * s,
    1.9779984951 * l - 2.428592205 * m + 0.4505937099 * s,
    0.0259040371 * l + 0.7827717662 * m - 0.808675766 * s,
  ];
}

const inGamut = (c: Rgb): boolean => c.every((v) => v >= -1e-6 && v <= 1 + 1e-6);

/** The OKLab colour at L, hue angle (deg) and chroma, with chroma reduced into the sRGB gamut. */
function gamutColor(L: number, hueDeg: number, chroma: number): Rgb {
  const h = (hueDeg * Math.PI) / 180;
  let c = chroma;
  let lin = oklabToLinearSrgb(L, c * Math.cos(h), c * Math.sin(h));
  while (!inGamut(lin) && c > 0) {
    c = Math.max(0, c - 0.002);
    lin = oklabToLinearSrgb(L, c * Math.cos(h), c * Math.sin(h));
  }
  return lin.map((v) => Math.round(255 * encodeSrgb(Math.min(1, Math.max(0, v))))) as Rgb;
}

function buildLumen(): Uint8Array {
  const lut = new Uint8Array(256 * 3);
  for (let i = 0; i < 256; i++) {
    const t = i / 255;
    // Lightness 0.30 → 0.93 linear; hue turns 285° (violet) → 100° (yellow) through blue-green.
    const rgb = gamutColor(0.3 + 0.63 * t, 285 - 185 * t, 0.11 + 0.05 * Math.sin(Math.PI * t));
    lut.set(rgb, 3 * i);
  }
  return lut;
}

function buildGrey(): Uint8Array {
  const lut = new Uint8Array(256 * 3);
  for (let i = 0; i < 256; i++) lut.set(gamutColor(0.25 + 0.7 * (i / 255), 0, 0), 3 * i);
  return lut;
}

const LUTS: Record<ColorMapName, Uint8Array> = { lumen: buildLumen(), grey: buildGrey() };

/** The 256×RGB lookup table of a named colour map. */
export function colorMapLut(name: ColorMapName): Uint8Array {
  return LUTS[name];
}

/** Entry 0 … 255 of a lookup table for t ∈ [0, 1] (clamped); the rule colorAt uses. */
export const lutIndex = (t: number): number => Math.round(255 * Math.min(1, Math.max(0, t)));

/** Colour of t ∈ [0, 1] (clamped) from a colour map. */
export function colorAt(name: ColorMapName, t: number): Rgb {
  const i = 3 * lutIndex(t);
  const lut = LUTS[name];
  return [lut[i], lut[i + 1], lut[i + 2]];
}

/**
 * Categorical colours for beams: 12 hues at alternating lightness so that neighbouring beam
 * indices differ in grey too. Regions also carry the beam id as text, so the map stays
 * readable when colours repeat (more than 12 beams) or in grey-scale print.
 */
export const CATEGORICAL: Rgb[] = Array.from({ length: 12 }, (_, k) =>
  gamutColor([0.86, 0.7, 0.78][k % 3], ((k * 5) % 12) * 30 + 15, 0.13),
);

export function rgbHex([r, g, b]: Rgb): string {
  return '#' + [r, g, b].map((v) => v.toString(16).padStart(2, '0')).join('');
}

function buildDiverging(): Uint8Array {
  const lut = new Uint8Array(256 * 3);
  for (let i = 0; i < 256; i++) {
    const u = (i / 255) * 2 - 1; // −1 … +1
    const a = Math.abs(u);
    // Light neutral centre, darker and more saturated toward both ends (blue below, orange-red above).
    lut.set(gamutColor(0.96 - 0.46 * a, u < 0 ? 255 : 40, 0.15 * Math.sqrt(a)), 3 * i);
  }
  return lut;
}

/** Diverging map for differences (reference comparison): t = 0.5 is zero difference. */
export const DIVERGING_LUT = buildDiverging();

export function divergingAt(t: number): Rgb {
  const i = 3 * lutIndex(t);
  return [DIVERGING_LUT[i], DIVERGING_LUT[i + 1], DIVERGING_LUT[i + 2]];
}

/**
 * Line colours for overlaid curves on white paper (one per unit in the build summary): eight OKLab
 * hue/lightness pairs picked so that neighbours in the list differ in hue by 90° or more and the
 * list spans lightness 0.42–0.72 (red, blue, green, orange, purple, teal, brown, pink); darker than
 * CATEGORICAL (which fills map regions) so that thin lines stay visible.
 */
const LINE_HUE_L: [number, number][] = [[25, 0.52], [260, 0.5], [145, 0.56], [65, 0.72], [315, 0.45], [195, 0.62], [50, 0.42], [350, 0.68]];
export const LINE_COLORS: string[] = LINE_HUE_L.map(([h, L]) => rgbHex(gamutColor(L, h, 0.16)));
