import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { assembleMeasurements } from '../../src/io/assembleMeasurements.js';
import { loadJobFile } from '../../src/io/jobFile.js';
import type { RawBeam } from '../../src/io/types.js';

/** A 30° grid written with a φ = 360° column (as many exports do): the seam merges φ 0 and 360. */
function seamBeam(id: string, seamOffsetDb: number): RawBeam {
  const t: number[] = [], p: number[] = [];
  for (let th = 0; th <= 180; th += 30) for (let ph = 0; ph <= 360; ph += 30) { t.push(th); p.push(ph); }
  const values = Float64Array.from(t, (th, i) => (p[i] === 360 ? 10 + seamOffsetDb : 10) + th / 100);
  return { unit: 'PX-01', beam: id, frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', thetaDeg: Float64Array.from(t), phiDeg: Float64Array.from(p), values, file: `b${id}.csv`, firstLine: 2 };
}

describe('conflicting samples at one direction are never silent (issue 12)', () => {
  it('a φ = 360° column 20 dB above φ = 0° warns for that beam, naming both rows and values', () => {
    const r = assembleMeasurements([seamBeam('0', 0), seamBeam('1', 20), seamBeam('2', 0.3)], []);
    const differs = r.warnings.filter((w) => w.code === 'duplicate-differs');
    expect(differs.map((w) => w.file)).toEqual(['b1.csv']);
    // 5 ordinary rows (θ 30…150) hold φ 0 and φ 360, and both poles are written at every φ
    // including 360: 7 merged directions 20 dB apart.
    expect(differs[0].message).toMatch(/^beam '1': 7 directions hold samples more than 0.5 dB apart, merged by power average: /);
    expect(differs[0].message).toContain('θ 30°, φ 0°: row 14 of the beam (θ 30, φ 0 as written) 10.3 dBm vs row 26 of the beam (θ 30, φ 360 as written) 30.3 dBm (20.00 dB apart)');
    // Power average of 10.3 and 30.3 dBm: 10·log10((10^1.03 + 10^3.03)/2) = 27.3 dBm (Eq. 1 of mergeSamples).
    const m = r.measurements[0];
    const k = Array.from(m.grid.thetaDeg).findIndex((t, i) => t === 30 && m.grid.phiDeg[i] === 0);
    expect(m.beams[1].values[k]).toBeCloseTo(10 * Math.log10((10 ** 1.03 + 10 ** 3.03) / 2), 9);
  });

  it('one repeated row appended to one beam of a multi-beam set (another angle set) is checked too', () => {
    const beams = [seamBeam('0', 0), seamBeam('1', 0), seamBeam('2', 0)];
    const b = beams[2];
    b.thetaDeg = Float64Array.from([...b.thetaDeg, 60]);
    b.phiDeg = Float64Array.from([...b.phiDeg, 90]);
    b.values = Float64Array.from([...b.values, 100]);
    const r = assembleMeasurements(beams, []);
    const w = r.warnings.filter((x) => x.code === 'duplicate-differs');
    expect(w).toHaveLength(1);
    expect(w[0].message).toContain("beam '2': 1 direction holds samples more than 0.5 dB apart");
    expect(w[0].message).toContain('(θ 60, φ 90 as written) 100 dBm');
  });

  it('merge rules: first, last, refuse', () => {
    const pick = (rule: 'first' | 'last') => {
      const r = assembleMeasurements([seamBeam('0', 20)], [], { mergeRule: rule });
      const m = r.measurements[0];
      const k = Array.from(m.grid.thetaDeg).findIndex((t, i) => t === 30 && m.grid.phiDeg[i] === 0);
      return { v: m.beams[0].values[k], w: r.warnings.find((x) => x.code === 'duplicate-differs')!.message };
    };
    expect(pick('first').v).toBe(10.3);
    expect(pick('first').w).toContain('merged by the first sample');
    expect(pick('last').v).toBe(30.3);
    const refused = assembleMeasurements([seamBeam('0', 20), seamBeam('1', 0)], [], { mergeRule: 'refuse' });
    expect(refused.measurements).toEqual([]);
    expect(refused.errors).toHaveLength(1);
    expect(refused.errors[0].message).toContain("beam '0' with 7 directions whose samples differ by more than 0.5 dB");
    // Within 0.5 dB nothing is refused: the default-rule warning-free path.
    expect(assembleMeasurements([seamBeam('0', 0.4)], [], { mergeRule: 'refuse' }).measurements).toHaveLength(1);
  });

  it('the job file sets merge_rule and rejects an unknown rule with its line', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sc-merge-'));
    fs.writeFileSync(path.join(dir, 'a.yaml'), 'merge_rule: last\n');
    fs.writeFileSync(path.join(dir, 'b.yaml'), 'quantity: eirp\nmerge_rule: median\n');
    expect(loadJobFile(path.join(dir, 'a.yaml')).job?.mergeRule).toBe('last');
    const bad = loadJobFile(path.join(dir, 'b.yaml'));
    expect(bad.errors).toHaveLength(1);
    expect(bad.errors[0].line).toBe(2);
    expect(bad.errors[0].message).toContain('merge_rule');
    fs.rmSync(dir, { recursive: true, force: true });
  });
});

describe('mergeConflicts on a shared build (issue 18: the merged points are found once per build)', () => {
  it('equals a scan of every sample, for several beams of one build, ties and NaN included', async () => {
    const { buildSphereGrid } = await import('../../src/sphere/buildGrid.js');
    // 15° grid written θ-major with φ = 360 columns and every pole sample; rows repeated out of order.
    const t: number[] = [], p: number[] = [];
    for (let th = 0; th <= 180; th += 15) for (let ph = 0; ph <= 360; ph += 15) { t.push(th); p.push(ph); }
    for (const [th, ph] of [[45, 30], [90, 0], [45, 30]]) { t.push(th); p.push(ph); }
    const build = buildSphereGrid(Float64Array.from(t), Float64Array.from(p));
    await check(build, t);
    // The same with the samples point by point (no φ = 360 column, the repeated row beside its
    // first): mergeSamples' segments then give the merged groups.
    const t2: number[] = [], p2: number[] = [];
    for (let th = 0; th <= 180; th += 15) for (let ph = 0; ph < 360; ph += 15) {
      t2.push(th); p2.push(ph);
      if (th === 45 && ph === 30) { t2.push(th); p2.push(ph); }
    }
    const build2 = buildSphereGrid(Float64Array.from(t2), Float64Array.from(p2));
    const { rawOrderKind } = await import('../../src/sphere/mergeSamples.js');
    expect(rawOrderKind(build2)).toBe(2);
    await check(build2, t2);
  });

  async function check(build: import('../../src/sphere/buildGrid.js').GridBuild, t: number[]): Promise<void> {
    const { mergeConflicts } = await import('../../src/sphere/mergeConflicts.js');
    // The oracle: the straightforward scan over all samples in file order (lowest/highest first seen wins).
    const oracle = (v: Float64Array) => {
      const lo = new Map<number, number>(), hi = new Map<number, number>();
      v.forEach((x, i) => {
        if (!Number.isFinite(x)) return;
        const q = build.pointOf[i];
        if (!lo.has(q) || x < v[lo.get(q)!]) lo.set(q, i);
        if (!hi.has(q) || x > v[hi.get(q)!]) hi.set(q, i);
      });
      return [...lo.keys()].sort((a, b) => a - b)
        .filter((q) => lo.get(q) !== hi.get(q) && v[hi.get(q)!] - v[lo.get(q)!] > 0.5)
        .map((q) => ({ point: q, low: lo.get(q)!, high: hi.get(q)!, lowDb: v[lo.get(q)!], highDb: v[hi.get(q)!] }));
    };
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (let beam = 0; beam < 6; beam++) {
      // Values on a 0.25 dB step (ties are common), a few NaN samples.
      const v = Float64Array.from(t, () => (rnd() < 0.03 ? NaN : Math.round(rnd() * 8) / 4));
      const want = oracle(v);
      const got = mergeConflicts(build, v, 0.5, 1000);
      expect(got.count).toBe(want.length);
      expect([...got.worst].sort((a, b) => a.point - b.point)).toEqual(want);
    }
  }
});
