/**
 * The speed-ups of the report maps must not change what is drawn: the PNG encoder is checked
 * against an independent decoder (pngjs, PNG spec ISO/IEC 15948), the raster cache against a
 * fresh rasterization, the sampled thumbnail against a direct one, and the shared fonts and
 * layout caches against documents made with plain font bytes.
 */
import { describe, expect, it } from 'vitest';
import PDFDocument from 'pdfkit';
import { PNG } from 'pngjs';
import { encodePng } from '../../src/report/encodePng.js';
import { paintMapPng, HATCH_PERIOD_PX } from '../../src/report/paintMap.js';
import { OUTSIDE, UNMEASURED, rasterizeGrid, insideEllipse } from '../../src/report/mapRaster.js';
import { cachedRaster, downsampleRaster, gridFingerprint } from '../../src/report/rasterCache.js';
import { unitMapThumbnail } from '../../src/report/thumbnail.js';
import { buildUnitMaps } from '../../src/report/unitMaps.js';
import { reportFonts, reportFontSources } from '../../src/report/fonts.js';
import { loadReportSettings, renderUnitPdf } from '../../src/report/index.js';
import type { SphereGrid } from '../../src/types.js';
import { makeMeasurement, makeResult, makeTsp, regularTestGrid } from './fixture.js';

/** Deterministic pseudo-random integers (LCG, Numerical Recipes constants), fixed seed. */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0);
}

function decode(png: Buffer): { width: number; height: number; data: Buffer; colorType: number } {
  const p = PNG.sync.read(png);
  const colorType = png[25]; // IHDR colour type byte (8 signature + 8 chunk header + 9)
  return { width: p.width, height: p.height, data: p.data, colorType };
}

function copyGrid(g: SphereGrid): SphereGrid {
  return { ...g, thetaDeg: g.thetaDeg.slice(), phiDeg: g.phiDeg.slice(), weightSr: g.weightSr.slice() };
}

describe('encodePng', () => {
  it('indexed (≤ 256 colours used) and RGB (more) files decode to the palette colours of every pixel', () => {
    const next = lcg(7);
    for (const colours of [5, 256, 300]) {
      const palette = new Uint8Array(3 * colours);
      for (let k = 0; k < palette.length; k++) palette[k] = next() & 255;
      const w = 37;
      const h = 19;
      const pixels = new Uint16Array(w * h);
      for (let k = 0; k < pixels.length; k++) pixels[k] = k < colours ? k : next() % colours;
      const png = encodePng(w, h, pixels, palette);
      const d = decode(png);
      expect([d.width, d.height]).toEqual([w, h]);
      expect(d.colorType).toBe(colours <= 256 ? 3 : 2);
      for (let k = 0; k < pixels.length; k++) {
        const c = 3 * pixels[k];
        expect([d.data[4 * k], d.data[4 * k + 1], d.data[4 * k + 2], d.data[4 * k + 3]]).toEqual([palette[c], palette[c + 1], palette[c + 2], 255]);
      }
      expect(encodePng(w, h, pixels, palette).equals(png)).toBe(true);
    }
  });

  it('drops unused palette entries (only the colours shown are stored)', () => {
    const palette = Uint8Array.of(1, 2, 3, 4, 5, 6, 7, 8, 9);
    const png = encodePng(2, 1, Uint16Array.of(2, 2), palette);
    const plte = png.indexOf('PLTE', 0, 'latin1');
    expect(png.readUInt32BE(plte - 4)).toBe(3);
    expect([...decode(png).data.subarray(0, 3)]).toEqual([7, 8, 9]);
  });
});

describe('paintMapPng', () => {
  it('paints outside white, unmeasured and valueless points hatched grey, the rest by table entry', () => {
    const w = 16;
    const h = 8;
    const point = new Int32Array(w * h);
    for (let k = 0; k < point.length; k++) point[k] = k % 4 === 0 ? OUTSIDE : k % 4 === 1 ? UNMEASURED : k % 4 === 2 ? 0 : 1;
    const png = paintMapPng(w, h, point, Int16Array.of(1, -1), Uint8Array.of(10, 20, 30, 200, 100, 50));
    const d = decode(png);
    for (let k = 0; k < point.length; k++) {
      const i = k % w;
      const j = Math.floor(k / w);
      const hatch = (i + j) % HATCH_PERIOD_PX < 2 ? 150 : 226;
      const want = point[k] === OUTSIDE ? [255, 255, 255] : point[k] === 0 ? [200, 100, 50] : [hatch, hatch, hatch];
      expect([d.data[4 * k], d.data[4 * k + 1], d.data[4 * k + 2]]).toEqual(want);
    }
  });
});

describe('raster cache and thumbnails', () => {
  it('a grid with the same content (other arrays) gets the same raster, equal to a fresh one', () => {
    const g = regularTestGrid(5);
    const a = cachedRaster(g, 300, 0);
    const b = cachedRaster(copyGrid(g), 300, 0);
    expect(b).toBe(a);
    expect(Buffer.from(a.point.buffer).equals(Buffer.from(rasterizeGrid(g, 300, 0).point.buffer))).toBe(true);
    const other = copyGrid(g);
    other.phiDeg[5] += 1e-9;
    expect(gridFingerprint(other)).not.toBe(gridFingerprint(g));
    expect(cachedRaster(g, 300, 90)).not.toBe(a);
  });

  it('a thumbnail sampled from the unit raster agrees with a direct projection (full sphere and partial)', () => {
    for (const thetaMaxDeg of [180, 120]) {
      const g = regularTestGrid(5, thetaMaxDeg);
      const direct = rasterizeGrid(g, 240, 0);
      const sampled = downsampleRaster(rasterizeGrid(g, 800, 0), 240);
      expect([sampled.width, sampled.height]).toEqual([240, 120]);
      let differ = 0;
      for (let k = 0; k < direct.point.length; k++) {
        const i = k % 240;
        const j = Math.floor(k / 240);
        // Same ellipse: outside exactly where the direct raster is outside.
        expect(sampled.point[k] === OUTSIDE).toBe(!insideEllipse(i, j, 240, 120));
        if (sampled.point[k] !== direct.point[k]) differ++;
      }
      // Only pixels whose centre lies within half a source pixel (0.17 target pixel) of a cell
      // edge may differ: about 2 · 0.17 / 3.3 per axis for 5° cells 3.3 pixels wide at 240 px.
      expect(differ / direct.point.length).toBeLessThan(0.08);
      // Equal area is kept: each hemisphere covers the same number of pixels either way.
      const north = (r: Int32Array) => r.filter((p) => p >= 0 && g.thetaDeg[p] < 90).length;
      expect(Math.abs(north(sampled.point) - north(direct.point)) / north(direct.point)).toBeLessThan(0.01);
      if (thetaMaxDeg === 180) expect(sampled.point.includes(UNMEASURED)).toBe(false);
    }
  });

  it('unitMapThumbnail is sampled from the raster the unit report drew, and is the direct one otherwise', () => {
    const m = makeMeasurement();
    const tsp = makeTsp(m);
    const direct = unitMapThumbnail(m, tsp);
    buildUnitMaps(m, tsp, { widthPx: 800, centerPhiDeg: 0, colorMap: 'lumen', threshold: 15 });
    const sampled = unitMapThumbnail(m, tsp);
    const expected = downsampleRaster(rasterizeGrid(m.grid, 800, 0), 240);
    for (let k = 0; k < sampled.values.length; k++) {
      const p = expected.point[k];
      expect(Object.is(sampled.values[k], p >= 0 ? Math.fround(tsp.values[p]) : NaN)).toBe(true);
    }
    let same = 0;
    for (let k = 0; k < direct.values.length; k++) if (Object.is(direct.values[k], sampled.values[k])) same++;
    expect(same / direct.values.length).toBeGreaterThan(0.92);
    // Another unit's TSP on the same grid is not affected by this unit's raster.
    const tsp2 = makeTsp(m);
    expect(Buffer.from(unitMapThumbnail(m, tsp2).values.buffer).equals(Buffer.from(direct.values.buffer))).toBe(true);
  });
});

describe('shared fonts', () => {
  async function doc(fonts: { regular: Uint8Array; bold: Uint8Array }, text: string): Promise<Buffer> {
    const d = new PDFDocument({ info: { CreationDate: new Date(0) } });
    d.registerFont('R', fonts.regular);
    d.registerFont('B', fonts.bold);
    d.font('R').fontSize(9).text(text).font('B').text(`${text} θ φ Ω ≥ σ`);
    const chunks: Buffer[] = [];
    d.on('data', (c: Buffer) => chunks.push(c));
    await new Promise((r) => d.on('end', r).end());
    return Buffer.concat(chunks);
  }

  it('a document made with the once-parsed fonts equals one made from the TTF bytes', async () => {
    const shared = reportFontSources();
    expect(shared.regular.length).toBeLessThan(100); // the hook is active in this environment
    const text = 'Total scan pattern 28 GHz, EIRP 23.45 dBm at θ 40.0°';
    expect((await doc(shared, text)).equals(await doc(reportFonts(), text))).toBe(true);
  });

  it('a unit PDF does not depend on what was rendered before it in the same thread', async () => {
    const settings = loadReportSettings({ creationDate: '2026-02-03T04:05:06Z' });
    const make = (unit: string, beams: number, quantity: 'eirp' | 'eis') => {
      const measurement = makeMeasurement({ unit, beams, quantity });
      const tsp = makeTsp(measurement);
      return { result: makeResult(measurement, tsp, true), measurement, tsp, generatedAt: '2026-02-03T04:05:06Z', toolVersion: '0.1.0-test' };
    };
    const a = make('QX-31', 6, 'eirp');
    const first = await renderUnitPdf(a, settings);
    await renderUnitPdf(make('QX-32 ÆØ', 11, 'eis'), settings);
    expect((await renderUnitPdf(a, settings)).equals(first)).toBe(true);
  });
});
