import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { discoverInputs, groupKey } from '../../src/batch/discover.js';

let root: string;
let outside: string;

beforeAll(() => {
  root = mkdtempSync(path.join(tmpdir(), 'spherecov-disc-'));
  outside = mkdtempSync(path.join(tmpdir(), 'spherecov-out-'));
  const input = path.join(root, 'in');
  mkdirSync(path.join(input, 'B', 'deep'), { recursive: true });
  mkdirSync(path.join(input, 'A'));
  mkdirSync(path.join(input, '.hidden'));
  for (const f of ['B/deep/x.CSV', 'B/a.tsv', 'A/z.txt', 'A/readme.md', 'top.csv', 'spherecov.yaml', 'spherecov.json', '.hidden/h.csv']) {
    writeFileSync(path.join(input, f), 'theta_deg,phi_deg,eirp_dbm\n');
  }
  writeFileSync(path.join(outside, 'secret.csv'), 'x\n');
  symlinkSync(path.join(outside, 'secret.csv'), path.join(input, 'link-out.csv'));
  symlinkSync(path.join(input, 'A'), path.join(input, 'C'));
  symlinkSync(input, path.join(input, 'A', 'loop'));
  mkdirSync(path.join(input, '.store'));
  writeFileSync(path.join(input, '.store', 's.csv'), 'x\n');
  symlinkSync(path.join(input, '.store'), path.join(input, 'E'));
});

afterAll(() => {
  rmSync(root, { recursive: true, force: true });
  rmSync(outside, { recursive: true, force: true });
});

describe('discoverInputs', () => {
  it('finds exports recursively, in code-point order, without job files, hidden entries or links leaving the input', async () => {
    const input = path.join(root, 'in');
    const d = await discoverInputs(input);
    const rel = d.files.map((f) => path.relative(input, f));
    // C is a link to A (same real folder, taken once); E links to a hidden folder inside the input.
    expect(rel).toEqual(['A/z.txt', 'B/a.tsv', 'B/deep/x.CSV', 'E/s.csv', 'top.csv']);
    expect(d.skippedLinks).toEqual(['link-out.csv']);
  });

  it('excludes a folder (the output folder under --force)', async () => {
    const input = path.join(root, 'in');
    const d = await discoverInputs(input, [path.join(input, 'B')]);
    expect(d.files.map((f) => path.relative(input, f))).toEqual(['A/z.txt', 'E/s.csv', 'top.csv']);
  });

  it('takes one file as the input', async () => {
    const f = path.join(root, 'in', 'top.csv');
    const d = await discoverInputs(f);
    expect(d.files).toEqual([f]);
    expect(d.root).toBe(path.dirname(f));
  });
});

describe('groupKey (work split, CONTRACT.md identity rules for paths)', () => {
  it.each([
    ['PX-01/beam3.csv', 'PX-01'],
    ['PX-01/sub/beam3.csv', 'PX-01'],
    ['PX-02_beam_3_28GHz.csv', 'PX-02'],
    ['PX-02-b12.csv', 'PX-02'],
    ['beam4.csv', 'beam4'],
  ])('%s → %s', (rel, key) => {
    expect(groupKey(rel)).toBe(key);
  });
});
