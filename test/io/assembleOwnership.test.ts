import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { assembleMeasurements } from '../../src/io/assembleMeasurements.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import { FIXTURES } from './readHelpers.js';

const FILE = path.join(FIXTURES, 'io', 'long.csv');

async function read() {
  const r = await readExportFile(FILE, { inputRoot: path.dirname(FILE) });
  expect(r.errors).toEqual([]);
  return r;
}

describe('assembleMeasurements and the raw value arrays', () => {
  it('consumeRaw merges in place and gives the same measurement as the default, which leaves the raw beams untouched', async () => {
    const a = await read();
    const b = await read();
    const rawB = b.beams.map((x) => Array.from(x.values));
    const consumed = assembleMeasurements(a.beams, [{ path: a.file, sha256: a.sha256 }], { consumeRaw: true });
    const plain = assembleMeasurements(b.beams, [{ path: b.file, sha256: b.sha256 }]);
    expect(consumed.errors).toEqual([]);
    expect(a.beams.every((x) => x.values.length === 0)).toBe(true);
    expect(b.beams.map((x) => Array.from(x.values))).toEqual(rawB);
    const m = consumed.measurements[0];
    expect(m.beams[0].values.length).toBe(m.grid.thetaDeg.length);
    expect(plain.measurements[0].beams.map((x) => [x.id, Array.from(x.values)])).toEqual(m.beams.map((x) => [x.id, Array.from(x.values)]));
  });

  it('an array passed for two beams (two units) is never merged in place, even with consumeRaw', async () => {
    const a = await read();
    const b = await read();
    const twice = a.beams.flatMap((x) => [x, { ...x, unit: `${x.unit}-copy` }]);
    const both = assembleMeasurements(twice, [{ path: a.file, sha256: a.sha256 }], { consumeRaw: true });
    const one = assembleMeasurements(b.beams, [{ path: b.file, sha256: b.sha256 }]);
    expect(both.errors).toEqual([]);
    expect(both.measurements.length).toBe(2);
    const want = one.measurements[0].beams.map((x) => [x.id, Array.from(x.values)]);
    for (const m of both.measurements) expect(m.beams.map((x) => [x.id, Array.from(x.values)])).toEqual(want);
  });
});

describe('assembleMeasurements: rows that literally repeat a direction', () => {
  it("'duplicate-merged' counts the repeats and names the first of the largest differences in row order", () => {
    // 30° grid written θ-major with every pole sample (pole aliases are merged, not literal
    // repeats); rows (60, 90) and (120, 0) repeated out of order, the later one twice, both
    // 0.25 dB off: the tie goes to the earlier row, as a scan of every row in order finds it.
    // Oracle: the rule stated in literalDuplicates (count of repeats, largest |Δ|, first row at it).
    const t: number[] = [], p: number[] = [];
    for (let th = 0; th <= 180; th += 30) for (let ph = 0; ph < 360; ph += 30) { t.push(th); p.push(ph); }
    const values = t.map((th, i) => (th === 0 || th === 180 ? 12 : 10 + (i % 7) / 4)); // equal pole samples: no conflict
    const at = (th: number, ph: number) => t.findIndex((x, i) => x === th && p[i] === ph);
    const extra: [number, number, number][] = [[120, 0, values[at(120, 0)] + 0.25], [60, 90, values[at(60, 90)] - 0.25], [120, 0, values[at(120, 0)] + 0.1]];
    for (const [th, ph, v] of extra) { t.push(th); p.push(ph); values.push(v); }
    const beam = {
      unit: 'LD-1', beam: '0', frequencyHz: 28e9, quantity: 'eirp' as const, valueUnit: 'dBm' as const,
      thetaDeg: Float64Array.from(t), phiDeg: Float64Array.from(p), values: Float64Array.from(values), file: 'ld.csv', firstLine: 2,
    };
    const r = assembleMeasurements([beam], [{ path: 'ld.csv', sha256: '' }]);
    expect(r.errors).toEqual([]);
    const w = r.warnings.filter((x) => x.code === 'duplicate-merged');
    expect(w.length).toBe(1);
    expect(w[0].message).toContain("beam '0': 3 rows repeat a direction with values up to 0.25 dB apart (at θ 120°, φ 0°;");
  });
});
