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
