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
