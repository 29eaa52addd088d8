import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expectClose } from '../helpers/expectClose.js';
import {
  applyMeasurementNoise, eisFromEirp, handsetModule, regularGrid, simulateBeams, toExportBeams, writeExport,
} from '../../src/sim/index.js';
import type { ExportBeam, ExportOptions, SampleGrid } from '../../src/sim/index.js';
import { assembleMeasurements, readExportFile } from '../../src/io/index.js';
import type { RawBeam } from '../../src/io/index.js';

// Model data written in every layout the readers accept (CONTRACT.md "Input folder") must
// read back equal to the printed precision: dB values to 2 decimals exactly as printed,
// mW values to 6 significant digits (≤ 2.2e−5 dB), polarization pairs as the power sum of the
// printed components (DESIGN.md polarization rule).

const grid: SampleGrid = regularGrid({ thetaStepDeg: 15, phiStepDeg: 15 }); // poles at every φ
const { model, codebook } = handsetModule({ conductedPowerDbm: 9 });
const sim = applyMeasurementNoise(simulateBeams(model, codebook.slice(0, 3), grid, 28e9), { sigmaDb: 0.2, noiseFloorDbm: -30, seed: 4 });
const beams = toExportBeams(sim);
const r2 = (x: number): number => Math.round(x * 100) / 100;
const key = (t: number, p: number): string => `${Math.round(t * 1e6)}|${Math.round((((p % 360) + 360) % 360) * 1e6)}`;

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'sim-roundtrip-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

/** Writes the table, reads it back, and checks every sample against the expected printed value. */
async function roundTrip(
  name: string,
  exportBeams: ExportBeam[],
  opts: ExportOptions,
  expected: (b: ExportBeam, i: number) => number,
  tolDb: number,
  g: SampleGrid = grid,
): Promise<RawBeam[]> {
  const path = join(dir, 'UNIT-RT', name);
  await writeExport(path, { grid: g, beams: exportBeams }, opts);
  const res = await readExportFile(path, { inputRoot: dir });
  expect(res.errors, `${name}: read errors`).toEqual([]);
  // A θ/φ pair also gives its two components, tagged (src/io/polarizationBeams.ts); the totals are checked here.
  const totals = res.beams.filter((b) => b.polarization === undefined);
  expect(totals.map((b) => b.beam).sort()).toEqual(exportBeams.map((b) => b.id).sort());
  if (opts.layout === 'pol-pair' || opts.layout === 'pol-column') {
    for (const eb of exportBeams) {
      for (const [pol, want] of [['theta', eb.thetaDb!], ['phi', eb.phiDb!]] as const) {
        const c = res.beams.find((b) => b.beam === eb.id && b.polarization === pol)!;
        expect(c, `${name} beam ${eb.id} ${pol} component`).toBeDefined();
        const at = new Map<string, number>();
        for (let i = 0; i < g.thetaDeg.length; i++) at.set(key(g.thetaDeg[i], g.phiDeg[i]), want[i]);
        for (let i = 0; i < c.values.length; i++) expectClose(c.values[i], at.get(key(c.thetaDeg[i], c.phiDeg[i]))!, 0.005 + 1e-9, `${name} beam ${eb.id} ${pol} sample ${i}`); // printed with 2 decimals (or 6 significant mW digits, 2.2e−5 dB): ≤ 0.005 dB
      }
    }
  }
  for (const eb of exportBeams) {
    const rb = totals.find((b) => b.beam === eb.id)!;
    const want = new Map<string, number>();
    for (let i = 0; i < g.thetaDeg.length; i++) want.set(key(g.thetaDeg[i], g.phiDeg[i]), expected(eb, i));
    expect(rb.values.length, `${name} beam ${eb.id}: sample count`).toBe(opts.layout === 'matrix' ? rb.values.length : g.thetaDeg.length);
    for (let i = 0; i < rb.values.length; i++) {
      const w = want.get(key(rb.thetaDeg[i], rb.phiDeg[i]));
      expect(w, `${name}: direction θ ${rb.thetaDeg[i]} φ ${rb.phiDeg[i]} was not written`).toBeDefined();
      expectClose(rb.values[i], w!, tolDb, `${name} beam ${eb.id} sample ${i}`);
    }
  }
  return res.beams;
}

const printed = (b: ExportBeam, i: number): number => r2(b.valuesDb[i]);
const pairSum = (b: ExportBeam, i: number): number => 10 * Math.log10(10 ** (r2(b.thetaDb![i]) / 10) + 10 ** (r2(b.phiDb![i]) / 10));
const EXACT = 1e-9; // decimal text → double → compare with the same rounding: parse error only

describe('writer → reader round trip', () => {
  it('long layout, several beams in one file', async () => {
    const got = await roundTrip('long_28GHz.csv', beams, { layout: 'long' }, printed, EXACT);
    expect(got.every((b) => b.quantity === 'eirp' && b.valueUnit === 'dBm' && b.frequencyHz === 28e9)).toBe(true);
  });

  it('long layout with unit and frequency columns', async () => {
    const got = await roundTrip('with-unit.csv', beams, { layout: 'long', unit: 'SN-77', frequencyHz: 27.25e9 }, printed, EXACT);
    expect(got.every((b) => b.unit === 'SN-77' && b.frequencyHz === 27.25e9)).toBe(true);
  });

  it('polarization pair', async () => {
    await roundTrip('pair.csv', beams, { layout: 'pol-pair' }, pairSum, 1e-9);
  });

  it('long layout with a pol column', async () => {
    await roundTrip('polcol.csv', beams, { layout: 'pol-column' }, pairSum, 1e-9);
  });

  it('azimuth / elevation', async () => {
    await roundTrip('azel.csv', beams, { layout: 'az-el' }, printed, EXACT, regularGrid({ thetaStepDeg: 15, phiStepDeg: 15, phiConvention: '-180-180' }));
  });

  it('matrix, one beam a file, with the quantity metadata line', async () => {
    for (const b of beams) await roundTrip(`beam${b.id}_28GHz.csv`, [b], { layout: 'matrix' }, printed, EXACT);
  });

  it('semicolon with decimal comma, CRLF', async () => {
    await roundTrip('semi.txt', beams, { layout: 'long', delimiter: ';', decimalComma: true, lineEnding: '\r\n' }, printed, EXACT);
  });

  it('linear mW', async () => {
    // 6 significant digits: relative error ≤ 5e−6 → 10·log10(1 + 5e−6) = 2.2e−5 dB.
    await roundTrip('mw.csv', beams, { layout: 'long', linearMw: true }, (b, i) => b.valuesDb[i], 2.2e-5);
  });

  it('EIS', async () => {
    const eis = beams.map((b) => ({ id: b.id, valuesDb: eisFromEirp(b.valuesDb, 9, -95) }));
    const got = await roundTrip('eis.csv', eis, { layout: 'long', quantity: 'eis' }, printed, EXACT);
    expect(got.every((b) => b.quantity === 'eis')).toBe(true);
  });

  it('wide layout: one column per beam, beam ids from the headers', async () => {
    await roundTrip('wide_28GHz.csv', beams, { layout: 'wide' }, printed, EXACT);
  });

  it('wide layout with two polarization columns per beam, under each pair naming', async () => {
    for (const names of [['theta', 'phi'], ['co', 'cross'], ['H', 'V'], ['LHCP', 'RHCP']] as [string, string][]) {
      await roundTrip(`wide_pair_${names[0]}_28GHz.csv`, beams, { layout: 'wide-pair', pairNames: names }, pairSum, 1e-9);
    }
  });

  it('long polarization pair and pol column under other pair names', async () => {
    for (const names of [['co', 'cross'], ['h', 'v'], ['lhcp', 'rhcp']] as [string, string][]) {
      await roundTrip(`pair_${names[0]}_28GHz.csv`, beams, { layout: 'pol-pair', pairNames: names }, pairSum, 1e-9);
      await roundTrip(`polcol_${names[0]}_28GHz.csv`, beams, { layout: 'pol-column', pairNames: names }, pairSum, 1e-9);
    }
  });

  it('wide layout with one column block per frequency', async () => {
    const path = join(dir, 'UNIT-WF', 'wide_blocks.csv');
    const shifted = beams.map((b) => ({ id: b.id, valuesDb: Float64Array.from(b.valuesDb, (v) => v - 1.5) }));
    await writeExport(path, { grid, beams }, { layout: 'wide', frequencyBlocks: [{ frequencyHz: 28e9, beams }, { frequencyHz: 39.5e9, beams: shifted }] });
    const res = await readExportFile(path, { inputRoot: dir });
    expect(res.errors).toEqual([]);
    expect(res.beams.map((b) => `${b.beam}@${b.frequencyHz}`)).toEqual([...beams.map((b) => `${b.id}@28000000000`), ...beams.map((b) => `${b.id}@39500000000`)]);
    for (const rb of res.beams) {
      const src = (rb.frequencyHz === 28e9 ? beams : shifted).find((b) => b.id === rb.beam)!;
      for (let i = 0; i < rb.values.length; i++) expectClose(rb.values[i], r2(src.valuesDb[i]), EXACT, `${rb.beam} ${rb.frequencyHz} ${i}`);
    }
  });

  it('a free-text preamble before the header', async () => {
    const got = await roundTrip('preamble_28GHz.csv', beams, { layout: 'long', preamble: ['Range export (invented)', 'Unit: PRE-1', 'Operator: nobody', ''] }, printed, EXACT);
    expect(got.every((b) => b.unit === 'PRE-1' && b.metadata?.operator === 'nobody')).toBe(true);
  });

  it('assembles into one measurement with each direction once and the printed values', async () => {
    const path = join(dir, 'UNIT-AS', 'all_28GHz.csv');
    await writeExport(path, { grid, beams }, { layout: 'long' });
    const res = await readExportFile(path, { inputRoot: dir });
    const asm = assembleMeasurements(res.beams, [{ path: res.file, sha256: res.sha256 }]);
    expect(asm.errors).toEqual([]);
    expect(asm.measurements.length).toBe(1);
    const m = asm.measurements[0];
    // 15° grid: (180/15 − 1)·(360/15) + 2 = 266 directions (reference file, "Grids").
    expect(m.grid.thetaDeg.length).toBe(266);
    expectClose(m.grid.solidAngleSr, 4 * Math.PI, 1e-9, 'full sphere');
    // Expected per direction: the printed value; the 24 noisy samples of each pole are one
    // direction, merged by power average (the documented rule of src/sphere/mergeSamples).
    for (const b of beams) {
      const sums = new Map<string, { s: number; n: number }>();
      for (let i = 0; i < grid.thetaDeg.length; i++) {
        const t = grid.thetaDeg[i];
        const k = t % 180 === 0 ? `${t}` : key(t, grid.phiDeg[i]);
        const e = sums.get(k) ?? { s: 0, n: 0 };
        e.s += 10 ** (r2(b.valuesDb[i]) / 10);
        e.n += 1;
        sums.set(k, e);
      }
      const mb = m.beams.find((x) => x.id === b.id)!;
      for (let j = 0; j < m.grid.thetaDeg.length; j++) {
        const t = m.grid.thetaDeg[j];
        const e = sums.get(t % 180 === 0 ? `${t}` : key(t, m.grid.phiDeg[j]))!;
        expect(e.n).toBe(t % 180 === 0 ? 24 : 1);
        expectClose(mb.values[j], 10 * Math.log10(e.s / e.n), 1e-9, `beam ${b.id} point ${j}`);
      }
    }
  });
});

describe('round trip over dialects (property)', () => {
  it('any delimiter / decimal mark / line ending / layout reads back the printed values', async () => {
    const fc = await import('fast-check');
    const small = regularGrid({ thetaStepDeg: 30, phiStepDeg: 45 });
    let run = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom<ExportOptions['layout']>('long', 'az-el', 'pol-pair', 'pol-column', 'matrix', 'wide', 'wide-pair'),
        fc.constantFrom(',', ';', '\t'),
        fc.boolean(),
        fc.constantFrom<'\n' | '\r\n'>('\n', '\r\n'),
        fc.array(fc.double({ min: -60, max: 40, noNaN: true }), { minLength: small.thetaDeg.length * 2, maxLength: small.thetaDeg.length * 2 }),
        async (layout, delimiter, comma, lineEnding, vals) => {
          const n = small.thetaDeg.length;
          const t = Float64Array.from(vals.slice(0, n));
          const p = Float64Array.from(vals.slice(n));
          const total = Float64Array.from(t, (x, i) => 10 * Math.log10(10 ** (x / 10) + 10 ** (p[i] / 10)));
          const beam: ExportBeam = { id: '2', valuesDb: total, thetaDb: t, phiDb: p };
          const g = layout === 'az-el' ? regularGrid({ thetaStepDeg: 30, phiStepDeg: 45, phiConvention: '-180-180' }) : small;
          const isPair = layout === 'pol-pair' || layout === 'pol-column' || layout === 'wide-pair';
          // A matrix row holds one value per direction, so its repeated pole samples must agree.
          if (layout === 'matrix') for (let i = 0; i < n; i++) if (g.thetaDeg[i] % 180 === 0) total[i] = total[g.thetaDeg[i] === 0 ? 0 : n - 1];
          await roundTrip(`prop${run++}_b2.${delimiter === ',' ? 'csv' : 'txt'}`, [beam],
            { layout, delimiter, decimalComma: comma && delimiter !== ',', lineEnding, beamColumn: false },
            isPair ? pairSum : printed, 1e-9, g);
        },
      ),
      { numRuns: 30, seed: 20261201 },
    );
  });
});
