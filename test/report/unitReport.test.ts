import { describe, expect, it } from 'vitest';
import { loadReportSettings, renderUnitPdf, ReportSettingsError } from '../../src/report/index.js';
import { fmt } from '../../src/report/format.js';
import type { UnitReportInput } from '../../src/report/reportTypes.js';
import { makeMeasurement, makeResult, makeTsp } from './fixture.js';
import { pdfPages } from './pdfText.js';

const DATE = '2026-02-03T04:05:06Z';

function input(opts: Parameters<typeof makeMeasurement>[0] = {}, pass = true): UnitReportInput {
  const measurement = makeMeasurement(opts);
  const tsp = makeTsp(measurement);
  return { result: makeResult(measurement, tsp, pass), measurement, tsp, generatedAt: DATE, toolVersion: '0.1.0-test' };
}

describe('renderUnitPdf', () => {
  const settings = loadReportSettings({ creationDate: DATE });

  it('holds the unit, the verdict and the numbers of the UnitResult, with a footer on every page', async () => {
    const inp = input();
    const r = inp.result;
    const pages = await pdfPages(await renderUnitPdf(inp, settings));
    expect(pages.length).toBe(4); // title+checks+files, TSP map+CDF, best beam+coverage, beams+quality
    const all = pages.join('\n');
    expect(all).toContain('QX-07');
    expect(pages[0]).toContain('PASS');
    expect(all).toContain('28.000 GHz');
    for (const p of r.tsp.percentiles) expect(all).toContain(fmt(p.value));
    for (const c of r.checks) {
      expect(all).toContain(c.name);
      expect(all).toContain(c.marginUnit === 'fraction' ? `${fmt(100 * c.value!, 1)} %` : fmt(c.value));
    }
    for (const b of r.beams) {
      expect(all).toContain(fmt(b.peak.value));
      expect(all).toContain(fmt(b.trpDbm));
    }
    expect(all).toContain(fmt(r.tsp.peak.value));
    expect(all).toContain(`${fmt(100 * r.tsp.coverage[0].efficiency, 1)} %`);
    expect(all).toContain('ab12cd34ef56');
    expect(all).toContain('φ = 360° samples merged into φ = 0°');
    pages.forEach((text, k) => {
      expect(text).toContain(`page ${k + 1} of 4`);
      expect(text).toContain('not a regulatory conformance or RF-exposure assessment');
      expect(text).toContain('Unit QX-07');
    });
    // Symbols from the embedded font survive extraction (they would be lost with a standard 14 font).
    expect(all).toContain('θ');
    expect(all).toContain('4π');
  });

  it('says FAIL for a failed unit and draws the EIS curve as a CCDF', async () => {
    const pages = await pdfPages(await renderUnitPdf(input({ quantity: 'eis' }, false), settings));
    expect(pages[0]).toContain('FAIL');
    expect(pages[0]).toContain('✗ FAIL');
    expect(pages.join(' ')).toContain('CCDF of the total scan pattern (EIS)');
  });

  it('shows the unmeasured part of a partial sphere and TRP as not reported', async () => {
    const inp = input({ thetaMaxDeg: 150 });
    inp.result.grid.fullSphere = false;
    const all = (await pdfPages(await renderUnitPdf(inp, settings))).join(' ');
    expect(all).toContain('not measured');
    expect(all).toContain('partial sphere');
    expect(all).toContain('TRP is not reported');
  });

  it('renders the optional analysis sections when present and skips them otherwise', async () => {
    const plain = (await pdfPages(await renderUnitPdf(input(), settings))).join(' ');
    expect(plain).not.toContain('Coverage holes');
    expect(plain).not.toContain('reference unit');
    const inp = input();
    inp.result.holes = [{ solidAngleSr: 0.1234, thetaDeg: 172.5, phiDeg: 40, worst: 3.21, nearestBeam: 'b4' }];
    inp.result.reference = { unit: 'GOLD-1', deltas: { p50: -0.42, peak: 0.11 } };
    inp.result.frequencyTrend = [{ frequencyHz: 27e9, p50: 17.1 }, { frequencyHz: 29e9, p50: 16.4 }];
    inp.referenceDelta = Float64Array.from(inp.tsp.values, (v, i) => (i % 50) / 10 - 2.5);
    const pages = await pdfPages(await renderUnitPdf(inp, settings));
    const all = pages.join(' ');
    expect(all).toContain('Coverage holes');
    expect(all).toContain('0.1234');
    expect(all).toContain('H1');
    expect(all).toContain('Difference from the reference unit GOLD-1');
    expect(all).toContain('-0.42');
    expect(all).toContain('Metrics versus frequency');
    expect(all).toContain('27.000 GHz');
    expect(pages.length).toBeGreaterThanOrEqual(5);
  });

  it('leaves out switched-off sections', async () => {
    const s = loadReportSettings({ creationDate: DATE, sections: { tspMap: false, bestBeamMap: false, coverage: false } });
    const pages = await pdfPages(await renderUnitPdf(input(), s));
    const all = pages.join(' ');
    expect(all).not.toContain('Total scan pattern over the sphere');
    expect(all).not.toContain('Best beam per direction');
    expect(all).toContain('CDF of the total scan pattern');
    expect(pages.length).toBe(3);
  });

  it('is byte-identical for the same creation date and differs for another', async () => {
    const inp = input();
    const a = await renderUnitPdf(inp, settings);
    const b = await renderUnitPdf(inp, settings);
    expect(a.equals(b)).toBe(true);
    const c = await renderUnitPdf(inp, loadReportSettings({ creationDate: '2026-02-04T00:00:00Z' }));
    expect(a.equals(c)).toBe(false);
  });
});

describe('loadReportSettings', () => {
  it('loads the template defaults and merges overrides per section', () => {
    const s = loadReportSettings({ title: 'Bench 3', sections: { holes: false } });
    expect(s.title).toBe('Bench 3');
    expect(s.pageSize).toBe('A4');
    expect(s.sections.holes).toBe(false);
    expect(s.sections.cdf).toBe(true);
  });

  it('rejects wrong values with the key and what was expected', () => {
    expect(() => loadReportSettings({ pageSize: 'A5' as 'A4' })).toThrow(ReportSettingsError);
    expect(() => loadReportSettings({ pageSize: 'A5' as 'A4' })).toThrow("report settings: pageSize: found 'A5', expected A4 or Letter");
    expect(() => loadReportSettings({ sections: { cdf: 'yes' as unknown as boolean } })).toThrow('sections.cdf');
    expect(() => loadReportSettings({ colour: 'x' } as never)).toThrow('colour');
  });

  it('Letter pages are 8.5 × 11 in', async () => {
    const inp = input();
    const pdf = await renderUnitPdf(inp, loadReportSettings({ pageSize: 'Letter', creationDate: DATE }));
    expect(pdf.toString('latin1')).toContain('/MediaBox [0 0 612 792]');
  });
});
