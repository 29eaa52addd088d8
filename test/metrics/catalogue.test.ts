import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  componentResultMetrics, coverageMetricValues, csvColumn, formatMetric, metricLabel, metricRow, metricsOfUnit, peakBeamIndex, rowKey,
  rowMetrics, statsKey, unitResultMetrics, type MetricInstance,
} from '../../src/metrics/catalogue.js';
import type { CoverageMetrics, UnitResult } from '../../src/types.js';

const beam = (id: string, value: number, trpDbm: number | null) => ({ id, peak: { value, thetaDeg: 90, phiDeg: 0 }, trpDbm, bestShare: 0.5 });
const metrics: CoverageMetrics = {
  peak: { value: 22, thetaDeg: 90, phiDeg: 0 },
  percentiles: [{ levelPct: 50, value: 11.5 }, { levelPct: 2.5, value: 1 }],
  coverage: [{ threshold: -88, efficiency: 0.25 }],
  relativeCoverage: [{ threshold: 19, efficiency: 0.5, dbBelowPeak: 3 }],
  curve: [],
  solidAngleSr: 4 * Math.PI,
  beams: [beam('a', 20, 9), beam('b', 22, 10), beam('c', 22, 11)],
} as unknown as CoverageMetrics;

describe('metric catalogue', () => {
  it('names one metric per output with the published spellings (CONTRACT.md, test/golden)', () => {
    const p50: MetricInstance = { family: 'percentile', param: 50 };
    const cov: MetricInstance = { family: 'coverage', param: -88 };
    expect([rowKey(p50), statsKey(p50), csvColumn(p50)]).toEqual(['p50', 'p50', 'p50']);
    expect([rowKey(cov), statsKey(cov), csvColumn(cov)]).toEqual(['coverage@-88', 'coverage@-88', 'coverage_at_-88']);
    expect([rowKey({ family: 'trpMax' }), statsKey({ family: 'trpMax' }), csvColumn({ family: 'trpMax' })]).toEqual(['trpMaxDbm', 'maxTrp', null]);
    expect(csvColumn({ family: 'relativeCoverage', param: 3 })).toBe('coverage_within_3db_of_peak');
    expect(statsKey({ family: 'check', param: 'peak EIRP' })).toBe('check:peak EIRP');
  });

  it('builds the metric row in output order, numbers in their shortest form', () => {
    expect(Object.keys(metricRow(metrics))).toEqual(['peak', 'p50', 'p2.5', 'coverage@-88', 'relativeCoverage@3dB', 'trpBestBeamDbm', 'trpMaxDbm']);
    expect(metricRow(metrics).trpBestBeamDbm).toBe(10); // first beam whose peak is the TSP peak
    expect(metricRow(metrics).trpMaxDbm).toBe(11);
    expect(rowMetrics(metrics).map((m) => m.key)).toEqual(Object.keys(metricRow(metrics)));
  });

  it('adds the weakest beam peak by the quantity sense', () => {
    const worst = (q: 'eirp' | 'eis') => coverageMetricValues(metrics, q).find((v) => v.metric.family === 'worstBeamPeak')?.value;
    expect(worst('eirp')).toBe(20);
    expect(worst('eis')).toBe(22);
    expect(peakBeamIndex(metrics)).toBe(1);
  });

  it('labels and formats by the metric, not by its key', () => {
    expect(metricLabel({ family: 'percentile', param: 50 }, 'dBm')).toBe('50 %-tile (dBm)');
    expect(metricLabel({ family: 'coverage', param: 8 }, 'dBm')).toBe('coverage ≥ 8 dBm');
    expect(formatMetric({ family: 'coverage', param: 8 }, 0.6125)).toBe('61.3 %');
    expect(formatMetric({ family: 'coverage', param: 8 }, 0.0125, 'delta')).toBe('1.25 pt');
    expect(formatMetric({ family: 'peak' }, -0.001, 'delta')).toBe('0.00 dB');
    expect(formatMetric({ family: 'check', param: 'c', unit: 'fraction' }, 0.55)).toBe('55.0 %');
    expect(formatMetric({ family: 'peak' }, null)).toBe('—');
  });

  it('writes a unit result\'s metric fields in the published order, and reads them back unchanged', () => {
    const removal = [{ percentileLossDb: 0.5, coverageLoss: 0.01 }, undefined, undefined];
    const fields = unitResultMetrics(metrics, removal);
    // Key order is what results.json prints (CONTRACT.md; test/golden holds it byte for byte).
    expect(Object.keys(fields)).toEqual(['solidAngleSr', 'beams', 'tsp']);
    expect(Object.keys(fields.tsp)).toEqual(['peak', 'percentiles', 'coverage', 'relativeCoverage', 'curve']);
    const withLimit = unitResultMetrics({ ...metrics, coverageAtLevelLimit: { levelPct: 50, threshold: 10, efficiency: 0.6 } });
    expect(Object.keys(withLimit.tsp)).toEqual(['peak', 'percentiles', 'coverage', 'relativeCoverage', 'coverageAtLevelLimit', 'curve']);
    expect(Object.keys(fields.beams[0])).toEqual(['id', 'peak', 'trpDbm', 'bestShare', 'removal', 'neverBest']);
    expect(fields.beams.map((b) => b.neverBest)).toEqual([false, false, false]);
    expect(unitResultMetrics({ ...metrics, beams: [{ ...metrics.beams[0], bestShare: 0 }] }).beams[0].neverBest).toBe(true);
    const back = metricsOfUnit({ ...fields } as UnitResult);
    expect({ ...back, beams: back.beams.map(({ id, peak, trpDbm, bestShare }) => ({ id, peak, trpDbm, bestShare })) }).toEqual(metrics);
  });

  it('writes a polarization component without the curve, beams by id, peak and best share', () => {
    const c = componentResultMetrics(metrics);
    expect(Object.keys(c.tsp)).toEqual(['peak', 'percentiles', 'coverage', 'relativeCoverage']);
    expect(c.beams[1]).toEqual({ id: 'b', peak: { value: 22, thetaDeg: 90, phiDeg: 0 }, bestShare: 0.5 });
  });

  it('no source file outside the catalogue spells a metric key or decodes one', () => {
    const root = path.resolve(__dirname, '../../src');
    const files: string[] = [];
    const walk = (d: string): void => {
      for (const e of readdirSync(d)) {
        const p = path.join(d, e);
        if (statSync(p).isDirectory()) walk(p); else if (p.endsWith('.ts')) files.push(p);
      }
    };
    walk(root);
    const offenders = files.filter((f) => !f.endsWith(path.join('metrics', 'catalogue.ts'))).filter((f) => {
      const code = readFileSync(f, 'utf8').replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
      return /coverage@|coverage_at_|relativeCoverage@|'maxTrp'|'minBeamPeak'|trpMaxDbm|trpBestBeamDbm|\/overage\/|`check:/.test(code);
    });
    expect(offenders.map((f) => path.relative(root, f))).toEqual([]);
  });
});
