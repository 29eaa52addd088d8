import { describe, it, expect } from 'vitest';
import { readFile, readdir } from 'node:fs/promises';
import { join } from 'node:path';
import { expectClose } from '../helpers/expectClose.js';
import { assembleMeasurements, readExportFile } from '../../src/io/index.js';
import type { RawBeam } from '../../src/io/index.js';
import type { SourceFile } from '../../src/types.js';

// The committed demo build reads back, through the real readers, to the numbers that
// scripts/make-demo.mjs computed for it (its own regular-grid weights, step percentile).

const DEMO = join(import.meta.dirname, '..', '..', 'fixtures', 'demo');

async function filesUnder(d: string): Promise<string[]> {
  const out: string[] = [];
  for (const e of await readdir(d, { withFileTypes: true })) {
    const p = join(d, e.name);
    if (e.isDirectory()) out.push(...(await filesUnder(p)));
    else if (/\.(csv|txt)$/.test(e.name)) out.push(p);
  }
  return out;
}

describe('fixtures/demo', () => {
  it('reads without errors into 8 measurements of 16 beams on the 2,522-point 5° grid, matching the generator', async () => {
    const expected = JSON.parse(await readFile(join(DEMO, 'expected-metrics.json'), 'utf8')).units as {
      unit: string; frequencyHz: number; peakDbm: number; p50Dbm: number;
    }[];
    const raw: RawBeam[] = [];
    const sources: SourceFile[] = [];
    for (const f of await filesUnder(DEMO)) {
      const r = await readExportFile(f, { inputRoot: DEMO });
      expect(r.errors, r.file).toEqual([]);
      raw.push(...r.beams);
      sources.push({ path: r.file, sha256: r.sha256 });
    }
    const all = assembleMeasurements(raw, sources);
    expect(all.errors).toEqual([]);
    // θ/φ pair exports also give their components as tagged measurements; the totals are checked here.
    const asm = { ...all, measurements: all.measurements.filter((m) => m.polarization === undefined) };
    expect(asm.measurements.length).toBe(expected.length);
    for (const e of expected) {
      const m = asm.measurements.find((x) => x.unit === e.unit && x.frequencyHz === e.frequencyHz);
      expect(m, `${e.unit} @ ${e.frequencyHz}`).toBeDefined();
      expect(m!.beams.length).toBe(16);
      // Reference file, "Grids": 5° constant step → 2,522 directions.
      expect(m!.grid.thetaDeg.length).toBe(2522);
      const n = m!.grid.thetaDeg.length;
      const tsp = new Float64Array(n).fill(-Infinity);
      for (const b of m!.beams) for (let i = 0; i < n; i++) tsp[i] = Math.max(tsp[i], b.values[i]);
      const order = Array.from(tsp.keys()).sort((a, b) => tsp[a] - tsp[b]);
      let c = 0;
      let p50 = NaN;
      for (const i of order) {
        c += m!.grid.weightSr[i];
        if (c >= 2 * Math.PI * (1 - 1e-12)) {
          p50 = tsp[i];
          break;
        }
      }
      // Both sides round to 0.01 dB; the pol-pair unit's total is a power sum of printed parts.
      expectClose(p50, e.p50Dbm, 0.006, `${e.unit} 50 %-tile`);
      expectClose(Math.max(...tsp), e.peakDbm, 0.006, `${e.unit} peak`);
    }
  });
});
