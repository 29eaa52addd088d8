import { describe, expect, it } from 'vitest';
import { buildStatistics } from '../../src/limits/buildStatistics.js';
import { cdfCurve, loadReportSettings, renderBuildPdf, unitKey, unitMapThumbnail } from '../../src/report/index.js';
import type { BuildReportInput } from '../../src/report/reportTypes.js';
import { makeMeasurement, makeResult, makeTsp } from './fixture.js';
import { pdfPages } from './pdfText.js';
import { DISTINCT_LINE_STYLES, lineStyle } from '../../src/report/lineStyles.js';
import { LINE_COLORS } from '../../src/report/colorMap.js';

const DATE = '2026-02-03T04:05:06Z';

function buildInput(n: number): BuildReportInput {
  const units = [];
  const thumbnails = new Map();
  const cdfs: Record<string, ReturnType<typeof cdfCurve>> = {};
  for (let k = 0; k < n; k++) {
    const m = makeMeasurement({ unit: `QX-${20 + k}`, beams: 8 + k });
    const tsp = makeTsp(m);
    const r = makeResult(m, tsp, k !== 1);
    units.push(r);
    thumbnails.set(unitKey(r.unit, r.frequencyHz), unitMapThumbnail(m, tsp));
    cdfs[unitKey(r.unit, r.frequencyHz)] = cdfCurve(tsp.values, m.grid.weightSr, r.quantity);
  }
  return { units, thumbnails, cdfs, build: buildStatistics(units), generatedAt: DATE, toolVersion: '0.1.0-test', limitSetName: 'example-programme' };
}

describe('unitMapThumbnail', () => {
  it('is plain data: an equal-area raster with NaN outside the ellipse and finite TSP values inside', () => {
    const m = makeMeasurement();
    const tsp = makeTsp(m);
    const t = unitMapThumbnail(m, tsp);
    expect(t.values).toBeInstanceOf(Float32Array);
    expect(t.values.length).toBe(t.width * t.height);
    expect(Number.isNaN(t.values[0])).toBe(true); // corner: outside the ellipse
    const centre = t.values[(t.height / 2) * t.width + t.width / 2];
    expect(Number.isFinite(centre)).toBe(true);
    // Finite pixels are a π/4 share of the bounding box (ellipse area / rectangle) on a full sphere.
    const inside = Array.from(t.values).filter(Number.isFinite).length / t.values.length;
    expect(Math.abs(inside - Math.PI / 4)).toBeLessThan(0.01);
    expect(structuredClone(t).values[5]).toEqual(t.values[5]);
  });
});

describe('renderBuildPdf', () => {
  it('lists every unit with its verdict and worst margin, the statistics, and a footer on every page', async () => {
    const input = buildInput(5);
    const pages = await pdfPages(await renderBuildPdf(input, loadReportSettings({ creationDate: DATE })));
    expect(pages.length).toBe(2);
    const all = pages.join(' ');
    for (const u of input.units) expect(all).toContain(u.unit);
    expect(all).toContain('FAIL');
    expect(all).toContain('-1.25 dB');
    expect(all).toContain('4 passed, 1 failed');
    const p50 = input.build.stats.find((s) => s.metric === 'p50')!;
    expect(all).toContain(p50.mean!.toFixed(2));
    expect(all).toContain('σ');
    expect(all).toContain('Cpk');
    expect(all).toContain('CDF of every unit');
    expect(all).toContain('one colour scale');
    pages.forEach((t, k) => expect(t).toContain(`page ${k + 1} of 2`));
  });

  it('is byte-identical for the same creation date', async () => {
    const input = buildInput(3);
    const s = loadReportSettings({ creationDate: DATE });
    expect((await renderBuildPdf(input, s)).equals(await renderBuildPdf(input, s))).toBe(true);
  });
});

describe('the CDF overlay identifies every unit', () => {
  it('numbers the units table and keys each curve to its row: number, unit, frequency and verdict in the key', async () => {
    const input = buildInput(5);
    const pages = await pdfPages(await renderBuildPdf(input, loadReportSettings({ creationDate: DATE })));
    const overlay = pages.find((p) => p.includes('CDF of every unit'))!;
    // buildInput names units QX-20 … QX-24 in table order; unit 1 (QX-21) is the failed one.
    const key = overlay.slice(overlay.indexOf('EIRP x'), overlay.indexOf('Each line is one unit'));
    input.units.forEach((u, k) => expect(key).toContain(`${k + 1} ${u.unit} · 28 GHz ${u.verdict === 'fail' ? 'FAIL' : 'PASS'}`));
    expect(pages[0]).toMatch(/# Unit Freq\. Verdict/);
    input.units.forEach((u, k) => expect(pages[0]).toContain(`${k + 1} ${u.unit} 28 GHz`));
  });

  it('gives each of the first 32 units its own colour and dash pattern', () => {
    const styles = Array.from({ length: DISTINCT_LINE_STYLES }, (_, k) => JSON.stringify(lineStyle(k)));
    expect(new Set(styles).size).toBe(32);
    expect(lineStyle(32)).toEqual(lineStyle(0));
    expect(new Set(LINE_COLORS).size).toBe(LINE_COLORS.length);
  });
});

describe('a build with EIRP and EIS results (a unit measured both ways)', () => {
  it('draws one overlay per quantity (CDF for EIRP, CCDF for EIS) and names the quantity in the table and keys', async () => {
    const units = [];
    const thumbnails = new Map();
    const cdfs: Record<string, ReturnType<typeof cdfCurve>> = {};
    for (const quantity of ['eirp', 'eis'] as const) {
      const m = makeMeasurement({ unit: 'QX-30', quantity });
      const tsp = makeTsp(m);
      const r = makeResult(m, tsp);
      units.push(r);
      thumbnails.set(unitKey(r.unit, r.frequencyHz, r.quantity), unitMapThumbnail(m, tsp));
      cdfs[unitKey(r.unit, r.frequencyHz, r.quantity)] = cdfCurve(tsp.values, m.grid.weightSr, r.quantity);
    }
    const input: BuildReportInput = { units, thumbnails, cdfs, build: buildStatistics(units), generatedAt: DATE, toolVersion: '0.1.0-test', limitSetName: null };
    const pages = await pdfPages(await renderBuildPdf(input, loadReportSettings({ creationDate: DATE })));
    const all = pages.join(' ');
    expect(pages[0]).toContain('1 QX-30 (EIRP) 28 GHz');
    expect(pages[0]).toContain('2 QX-30 (EIS) 28 GHz');
    const eirp = all.slice(all.indexOf('CDF of every unit (EIRP)'), all.indexOf('CCDF of every unit (EIS)'));
    const eis = all.slice(all.indexOf('CCDF of every unit (EIS)'));
    // Each overlay keys only its own quantity's unit, by the units table's row number.
    expect(eirp).toContain('1 QX-30 (EIRP) · 28 GHz');
    expect(eirp).not.toContain('QX-30 (EIS)');
    expect(eis).toContain('2 QX-30 (EIS) · 28 GHz');
    expect(all).toContain('Total scan pattern of every unit (EIRP, one colour scale)');
    expect(all).toContain('Total scan pattern of every unit (EIS, one colour scale)');
  });
});
