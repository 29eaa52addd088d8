import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { readExportFile } from '../../src/io/readExportFile.js';

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-dialect-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Our own small generator: 2 beams on a 45° grid, values with up to 6 decimals. */
function samples(seedValues: number[]) {
  const rows: { theta: number; phi: number; beam: number; v: number }[] = [];
  let k = 0;
  for (const beam of [0, 1]) for (let theta = 0; theta <= 180; theta += 45) for (let phi = 0; phi < 360; phi += 45) {
    rows.push({ theta, phi, beam, v: seedValues[k++ % seedValues.length] });
  }
  return rows;
}

const dialect = fc.record({
  delimiter: fc.constantFrom(',', ';', '\t'),
  decimalComma: fc.boolean(),
  bom: fc.boolean(),
  crlf: fc.boolean(),
  order: fc.shuffledSubarray([0, 1, 2, 3, 4], { minLength: 5, maxLength: 5 }),
  extra: fc.boolean(),
  quoteNames: fc.boolean(),
  comment: fc.boolean(),
});

describe('CSV dialect choices never change the normalized result', () => {
  it('delimiter, decimal comma, BOM, CRLF, column order, extra columns, quotes, comments', async () => {
    let n = 0;
    await fc.assert(
      fc.asyncProperty(dialect, fc.array(fc.integer({ min: -9_000_000, max: 40_000_000 }), { minLength: 5, maxLength: 20 }), async (d, ints) => {
        const rows = samples(ints.map((i) => i / 1e6));
        const names = ['theta_deg', 'phi_deg', 'beam', 'eirp_dbm', 'dut'];
        const cols = [...d.order, ...(d.extra ? [5] : [])];
        const header = cols.map((c) => (c === 5 ? 'chamber_temp' : names[c])).map((h) => (d.quoteNames ? `"${h}"` : h));
        const dc = d.decimalComma && d.delimiter !== ',';
        const num = (x: number) => (dc ? String(x).replace('.', ',') : String(x));
        const cell = (r: (typeof rows)[number], c: number) => [num(r.theta), num(r.phi), String(r.beam), num(r.v), 'PX-9', '21,5'.replace(',', dc ? ',' : '.')][c];
        const nl = d.crlf ? '\r\n' : '\n';
        const lines = [...(d.comment ? ['# exported by an invented chamber'] : []), header.join(d.delimiter), ...rows.map((r) => cols.map((c) => cell(r, c)).join(d.delimiter))];
        const file = path.join(dir, `f${n++}.csv`);
        writeFileSync(file, (d.bom ? '\uFEFF' : '') + lines.join(nl) + nl);
        const got = await readExportFile(file, { inputRoot: dir });
        expect(got.errors).toEqual([]);
        expect(got.info.decimalComma).toBe(d.delimiter !== ',');
        expect(got.beams.map((b) => [b.unit, b.beam])).toEqual([['PX-9', '0'], ['PX-9', '1']]);
        for (const [bi, b] of got.beams.entries()) {
          const want = rows.filter((r) => r.beam === bi);
          expect(Array.from(b.thetaDeg)).toEqual(want.map((r) => r.theta));
          expect(Array.from(b.phiDeg)).toEqual(want.map((r) => r.phi));
          // the same decimal text gives the same double: equality, no tolerance
          expect(Array.from(b.values)).toEqual(want.map((r) => r.v));
        }
      }),
      { seed: 20240601, numRuns: 60 },
    );
  });
});
