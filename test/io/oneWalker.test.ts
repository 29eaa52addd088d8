/**
 * One file walker (src/io/findExportFiles.ts): `inspect` and `analyze` see the same files, in the
 * same order, on a folder built to trip a walker up: hidden files and folders, non-export files,
 * export extensions in any case, nested folders, a link to a folder inside the input (taken once),
 * a link cycle, links out of the input and a broken link (skipped), and a pipe named like an export.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inspectInput } from '../../src/io/inspectInput.js';
import { discoverInputs } from '../../src/batch/discover.js';
import { runAnalyze } from '../../src/batch/runAnalyze.js';

let sandbox: string;
let input: string;

/** A constant 10 dBm beam on a 30° grid (enough for a unit to be analyzed). */
function exportText(unit: string, beam: string): string {
  const out = ['unit,beam,theta_deg,phi_deg,eirp_dbm'];
  for (let t = 0; t <= 180; t += 30) for (let f = 0; f < 360; f += 30) out.push(`${unit},${beam},${t},${f},10`);
  return out.join('\n') + '\n';
}

beforeAll(() => {
  sandbox = mkdtempSync(path.join(tmpdir(), 'spherecov-walker-'));
  input = path.join(sandbox, 'in');
  const outside = path.join(sandbox, 'elsewhere');
  for (const d of ['U-01/sub/deep', 'U-02', '.hidden', 'U-01/.cache', outside]) mkdirSync(path.resolve(input, d), { recursive: true });
  const files: Record<string, string> = {
    'U-01/beam1.csv': exportText('U-01', '1'),
    'U-01/beam2.CSV': exportText('U-01', '2'),
    'U-01/sub/deep/beam3.tsv': exportText('U-01', '3').replaceAll(',', '\t'),
    'U-01/notes.md': '# not an export\n',
    'U-01/.cache/beam9.csv': exportText('U-01', '9'),
    'U-01/.beam8.csv': exportText('U-01', '8'),
    '.hidden/beam7.csv': exportText('U-07', '7'),
    'U-02/beam1.txt': exportText('U-02', '1'),
    'U-02/readme.txt': 'not an export, but named like one: both commands report it\n',
    'top.csv': exportText('U-03', '1'),
    'data.json': '{}\n',
  };
  for (const [f, text] of Object.entries(files)) writeFileSync(path.join(input, f), text);
  writeFileSync(path.join(outside, 'secret.csv'), exportText('U-SECRET', '1'));
  symlinkSync(path.join(input, 'U-02'), path.join(input, 'U-02-again'));
  symlinkSync(input, path.join(input, 'U-01', 'sub', 'loop'));
  symlinkSync(path.join(outside, 'secret.csv'), path.join(input, 'secret.csv'));
  symlinkSync(outside, path.join(input, 'elsewhere'));
  symlinkSync(path.join(input, 'gone.csv'), path.join(input, 'broken.csv'));
  symlinkSync(path.join(input, '.hidden', 'beam7.csv'), path.join(input, 'seven.csv'));
  execFileSync('mkfifo', [path.join(input, 'stream.csv')]);
});

afterAll(() => rmSync(sandbox, { recursive: true, force: true }));

describe('inspect and analyze walk the input alike', () => {
  it('find the same export files, skipped links and unreadable entries', async () => {
    const seen = await inspectInput(input);
    const discovered = await discoverInputs(input);
    const rel = discovered.files.map((f) => path.relative(input, f).split(path.sep).join('/'));
    // Hand-derived from the rules in findExportFiles: hidden entries out, extensions in any case,
    // U-02-again is U-02 again (taken once), the loop ends, links out and broken links skipped,
    // a link inside the input to a hidden file is followed (the link's own name is not hidden).
    expect(rel).toEqual(['U-01/beam1.csv', 'U-01/beam2.CSV', 'U-01/sub/deep/beam3.tsv', 'U-02/beam1.txt', 'U-02/readme.txt', 'seven.csv', 'top.csv']);
    expect(seen.files.map((f) => f.file)).toEqual(rel);
    expect(seen.skippedLinks).toEqual(['broken.csv', 'elsewhere', 'secret.csv']);
    expect(discovered.skippedLinks).toEqual(seen.skippedLinks);
    expect(discovered.problems.map((p) => p.file)).toEqual(['stream.csv']);
    expect(seen.errors.filter((e) => e.file === 'stream.csv')).toEqual(discovered.problems);
  });

  it('analyze reads exactly the files inspect lists', async () => {
    const seen = await inspectInput(input);
    const out = path.join(sandbox, 'out');
    const { results } = await runAnalyze({ input, outDir: out, pdf: false, jobs: 1, percentilesPct: [50] });
    const read = new Set([
      ...results.units.flatMap((u) => u.sources.map((s) => s.path)),
      ...results.unitsNotAnalyzed.flatMap((u) => u.files),
    ]);
    expect([...read].sort()).toEqual(seen.files.map((f) => f.file).sort());
    expect(results.settings.skippedLinks).toEqual(seen.skippedLinks);
    expect(results.units.map((u) => u.unit)).toEqual(['U-01', 'U-03', 'U-07']);
  });

  it('one file as the input is itself, with its folder as the root', async () => {
    const f = path.join(input, 'top.csv');
    expect((await inspectInput(f)).files.map((x) => x.file)).toEqual(['top.csv']);
    expect((await discoverInputs(f)).files).toEqual([f]);
  });
});
