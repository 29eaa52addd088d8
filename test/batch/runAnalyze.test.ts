/**
 * runAnalyze in-process (vitest runs the .ts sources, so the pool runs tasks in-process).
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { runAnalyze, compareUnits, unionSorted } from '../../src/batch/runAnalyze.js';
import { summaryCsv } from '../../src/batch/summaryCsv.js';
import type { UnitResult } from '../../src/types.js';

/** An isotropic beam: EIRP constant over a 15° grid, one row per direction. */
function rows(unit: string, beam: string, valueDbm: number): string[] {
  const out: string[] = [];
  for (let t = 0; t <= 180; t += 15) for (let f = 0; f < 360; f += 15) out.push(`${unit},${beam},${t},${f},${valueDbm}`);
  return out;
}

describe('runAnalyze', () => {
  it('merges work groups that turn out to hold the same unit (unit column across top-level files)', async () => {
    const input = mkdtempSync(path.join(tmpdir(), 'spherecov-ra-'));
    const header = 'unit,beam,theta_deg,phi_deg,eirp_dbm';
    writeFileSync(path.join(input, 'first.csv'), [header, ...rows('PX-9', 'a', 10)].join('\n') + '\n');
    writeFileSync(path.join(input, 'second.csv'), [header, ...rows('PX-9', 'b', 13)].join('\n') + '\n');
    const out = mkdtempSync(path.join(tmpdir(), 'spherecov-ra-out-'));
    const { results, exitCode } = await runAnalyze({ input, outDir: out, pdf: false, jobs: 2, percentilesPct: [50] });
    expect(exitCode).toBe(0);
    expect(results.units).toHaveLength(1);
    const u = results.units[0];
    expect(u.beams.map((b) => b.id).sort()).toEqual(['a', 'b']);
    // Isotropic beams: TSP = 13 dBm everywhere; TRP of an isotropic pattern equals its EIRP
    // (definition of TRP, DESIGN.md: (1/4π) Σ w·10^(EIRP/10)).
    expect(u.tsp.percentiles[0].value).toBe(13);
    expect(u.beams.find((b) => b.id === 'b')!.trpDbm).toBeCloseTo(13, 9);
    expect(u.beams.find((b) => b.id === 'a')!.bestShare).toBe(0);
    expect(u.beams.find((b) => b.id === 'a')!.neverBest).toBe(true);
    expect(JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')).units).toHaveLength(1);
  });

  it('orders units by name (code point), then frequency, no frequency first', () => {
    const u = (unit: string, frequencyHz: number | null) => ({ unit, frequencyHz }) as UnitResult;
    const list = [u('b', 28e9), u('a', 39e9), u('a', null), u('B', 1), u('a', 28e9)];
    expect(list.sort(compareUnits).map((x) => [x.unit, x.frequencyHz])).toEqual([
      ['B', 1], ['a', null], ['a', 28e9], ['a', 39e9], ['b', 28e9],
    ]);
    expect(unionSorted([50, 10], undefined, [10, 85])).toEqual([10, 50, 85]);
  });
});

describe('summaryCsv', () => {
  it('writes one row per unit with percentiles, coverage, the peak beam TRP and the worst check', () => {
    const unit = {
      unit: '=cmd', frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', solidAngleSr: 2 * Math.PI,
      beams: [
        { id: '0', peak: { value: 20, thetaDeg: 0, phiDeg: 0 }, trpDbm: 10, bestShare: 0.2 },
        { id: '1', peak: { value: 22, thetaDeg: 10, phiDeg: 0 }, trpDbm: 11, bestShare: 0.3 },
      ],
      tsp: {
        peak: { value: 22, thetaDeg: 10, phiDeg: 0 },
        percentiles: [{ levelPct: 50, value: 12.5 }, { levelPct: 10, value: null }],
        coverage: [{ threshold: -3, efficiency: 0.4 }],
        relativeCoverage: [],
        curve: [],
      },
      checks: [{ status: 'fail' }, { status: 'not-evaluable' }, { status: 'pass' }],
      verdict: 'fail', worstCheck: { name: '-margin', margin: -1.5 },
      grid: { points: 100 },
    } as unknown as UnitResult;
    const lines = summaryCsv([unit]).split('\r\n');
    expect(lines[0]).toBe('\uFEFFunit,frequency_hz,quantity,value_unit,beams,points,measured_solid_angle_sr,measured_fraction,'
      + 'peak,peak_theta_deg,peak_phi_deg,p50,p10,coverage_at_-3,peak_beam,peak_beam_trp_dbm,verdict,checks_failed,'
      + 'checks_not_evaluable,worst_check,worst_margin,worst_margin_unit,worst_margin_db,full_sphere,unmeasured_sr,missing_points,warnings,error_location,error_message');
    // 2π sr at the CSV resolution of 1e-4 sr. Half the sphere measured (2π sr): the verdict says it was reached on a partial sphere (issue 12).
    expect(lines[1]).toBe(`'=cmd,28000000000,eirp,dBm,2,100,6.2832,0.5,22,10,0,12.5,,0.4,1,11,fail (partial sphere),1,1,'-margin,-1.5,dB,-1.5,no,6.2832,0,0,,`);
  });
});
