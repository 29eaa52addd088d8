/**
 * Reader bugs the fuzzing found, pinned as plain examples (each fails without its fix).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readExportFile } from '../../src/io/readExportFile.js';

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-regress-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('reader regressions found by fuzzing', () => {
  it('a Latin-1 byte above the header does not shift the fast path off the first data row', async () => {
    // 'ü' is one byte in Latin-1 but decodes to U+FFFD (three UTF-8 bytes): the data start must be
    // counted in the file's own bytes, not in re-encoded text.
    const text = '# unit: FZ-Müller\n# frequency: 28 GHz\ntheta_deg,phi_deg,beam,eirp_dbm\n0,0,0,1.5\n0,30,0,2.5\n';
    const file = path.join(dir, 'latin1.csv');
    writeFileSync(file, Buffer.from(text, 'latin1'));
    const fast = await readExportFile(file, { inputRoot: dir, parser: 'fast' });
    const general = await readExportFile(file, { inputRoot: dir, parser: 'general' });
    expect(fast.errors.map((e) => e.message)).toEqual(general.errors.map((e) => e.message));
    expect(fast.beams.map((b) => Array.from(b.values))).toEqual([[1.5, 2.5]]);
    expect(general.beams.map((b) => Array.from(b.values))).toEqual([[1.5, 2.5]]);
  });
});

describe('mixed line ends (found by npm run soak, seed 8002)', () => {
  it('bare LF lines inside a CRLF file count as lines on both paths', async () => {
    // Lines: 1 header, 2–3 rows, 4–5 empty, 6 a lone space, 7 a repeated header (LF-ended lines
    // pasted into a CRLF export). papaparse in CRLF mode joined 4–7 into one row reported at 6.
    const file = path.join(dir, 'mixed_eol.csv');
    writeFileSync(file, 'theta_deg,phi_deg,eirp_dbm\r\n0,0,1\r\n30,0,1\r\n\n\n \ntheta_deg,phi_deg,eirp_dbm\r\n60,0,1\r\n90,0,1');
    for (const parser of ['fast', 'general'] as const) {
      const r = await readExportFile(file, { inputRoot: dir, parser });
      expect(r.errors.map((e) => e.message), parser).toEqual(["mixed_eol.csv:7:1: theta_deg: found 'theta_deg', expected a number"]);
    }
  });
});

describe('a file with more samples than the tool supports', () => {
  it('is refused while streaming, with the line where the limit was passed (long and matrix layouts, both paths)', async () => {
    const long = path.join(dir, 'too_many.csv');
    writeFileSync(long, ['theta_deg,phi_deg,beam,eirp_dbm', ...Array.from({ length: 12 }, (_, i) => `${i * 10},0,0,1`)].join('\n') + '\n');
    for (const parser of ['fast', 'general'] as const) {
      const r = await readExportFile(long, { inputRoot: dir, parser, maxSamples: 10 });
      expect(r.errors.map((e) => e.message)).toEqual([
        'too_many.csv:12:1: data: found more than 10 samples, expected at most 10 samples (rows × value columns) in one file; split the export by beam or unit',
      ]);
      expect(r.beams).toEqual([]);
      expect((await readExportFile(long, { inputRoot: dir, parser, maxSamples: 12 })).errors).toEqual([]);
    }
    const matrix = path.join(dir, 'too_many_matrix.csv');
    writeFileSync(matrix, ['# quantity: eirp dBm', 'theta\\phi,0,90,180,270', '0,1,1,1,1', '90,1,1,1,1', '180,1,1,1,1'].join('\n') + '\n');
    const m = await readExportFile(matrix, { inputRoot: dir, maxSamples: 11 });
    expect(m.errors.map((e) => e.message)).toEqual([
      'too_many_matrix.csv:5:1: data: found more than 11 samples, expected at most 11 samples (rows × value columns) in one file; split the export by beam or unit',
    ]);
  });
});
