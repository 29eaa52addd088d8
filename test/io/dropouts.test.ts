import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectClose } from '../helpers/expectClose.js';
import { FIXTURES, readAll } from './readHelpers.js';

const DIR = path.join(FIXTURES, 'io', 'dropouts');
let tmp = '';
beforeAll(async () => {
  tmp = await mkdtemp(path.join(tmpdir(), 'dropouts-'));
});
afterAll(async () => {
  await rm(tmp, { recursive: true, force: true });
});

/** long.csv without the rows of the directions the dropout fixtures lose: the equivalent long file. */
async function equivalentLong(): Promise<string> {
  const text = await readFile(path.join(FIXTURES, 'io', 'long.csv'), 'utf8');
  const kept = text.split('\n').filter((l) => !/^(60,90|120,300),/.test(l));
  const p = path.join(tmp, 'long_without.csv');
  await writeFile(p, kept.join('\n'));
  return p;
}

describe('dropout cells with the job-file policy', () => {
  for (const parser of ['fast', 'general'] as const) {
    it(`read into the same measurement as the long file without those directions (${parser} path)`, async () => {
      const ref = await readAll(await equivalentLong(), parser);
      expect(ref.errors).toEqual([]);
      const got = await readAll(DIR, parser);
      expect(got.files.flatMap((f) => f.errors)).toEqual([]);
      expect(got.errors).toEqual([]);
      expect(got.measurements.map((m) => m.unit)).toEqual(['DUT-A', 'DUT-B']);
      const b = ref.measurements[0];
      for (const a of got.measurements) {
        // 84 directions − 2 dropped; the poles merged: 5·12 + 2 − 2 = 60 points
        expect(a.grid.thetaDeg.length).toBe(60);
        expect(a.grid.thetaDeg.length).toBe(b.grid.thetaDeg.length);
        expectClose(a.grid.solidAngleSr, b.grid.solidAngleSr, 1e-12, 'same measured solid angle as the equivalent long file');
        for (let i = 0; i < b.grid.thetaDeg.length; i++) {
          expectClose(a.grid.thetaDeg[i], b.grid.thetaDeg[i], 1e-9, `θ ${i}`);
          expectClose(a.grid.weightSr[i], b.grid.weightSr[i], 1e-12, `weight ${i}`);
        }
        for (let k = 0; k < 2; k++) {
          for (let i = 0; i < b.beams[k].values.length; i++) expectClose(a.beams[k].values[i], b.beams[k].values[i], 1e-9, `${a.unit} beam ${k} point ${i}`);
        }
      }
      // Located warnings: the reader names each dropout cell; assembly names the direction it took out of every beam.
      const w = [...got.files.flatMap((f) => f.warnings), ...got.warnings].filter((x) => x.code === 'dropout-samples').map((x) => `${x.file}:${x.line ?? ''}: ${x.message}`);
      expect(w).toEqual([
        "long_dropouts.csv:31: 3 dropout cells (dropout_tokens in the job file) read as missing samples: line 31 'eirp_dbm' (θ 60°, φ 90°), line 115 'eirp_dbm' (θ 60°, φ 90°), line 146 'eirp_dbm' (θ 120°, φ 300°)",
        "wide_dropouts.csv:31: 3 dropout cells (dropout_tokens in the job file) read as missing samples: line 31 'Beam 0 EIRP (dBm)' (θ 60°, φ 90°), line 31 'Beam 1 EIRP (dBm)' (θ 60°, φ 90°), line 62 'Beam 1 EIRP (dBm)' (θ 120°, φ 300°)",
        "long_dropouts.csv:: unit 'DUT-A' (28 GHz): 1 direction without a sample in some beam (dropout cells) left out of every beam, so it is a missing grid point: θ 120°, φ 300°",
        "wide_dropouts.csv:: unit 'DUT-B' (28 GHz): 1 direction without a sample in some beam (dropout cells) left out of every beam, so it is a missing grid point: θ 120°, φ 300°",
      ]);
    });
  }

  it('without the policy the same files fail at the first dropout (strict default)', async () => {
    for (const name of ['long_dropouts.csv', 'wide_dropouts.csv']) {
      await writeFile(path.join(tmp, name), await readFile(path.join(DIR, name)));
    }
    const got = await readAll(tmp);
    const msgs = got.files.flatMap((f) => f.errors.map((e) => e.message));
    expect(msgs).toContain("long_dropouts.csv:31:9: eirp_dbm: found 'OVLD', expected a number");
    expect(msgs).toContain("wide_dropouts.csv:31:7: Beam 0 EIRP (dBm): found 'OVLD', expected a number");
  });

  it('an angle cell is never a dropout, and numbers cannot be listed', async () => {
    await writeFile(path.join(tmp, 'spherecov.yaml'), "dropout_tokens: [OVLD, '-999', 5]\n");
    const bad = await readAll(tmp);
    expect(bad.jobErrors.map((e) => e.message)).toEqual([
      "spherecov.yaml:1:24: dropout_tokens[1]: found '-999', expected a text that is not a number (numbers are read as values, never as dropouts)",
      "spherecov.yaml:1:32: dropout_tokens[2]: found '5', expected a text such as OVLD (numbers are read as values, never as dropouts)",
    ]);
    await writeFile(path.join(tmp, 'spherecov.yaml'), 'dropout_tokens: [OVLD]\n');
    await writeFile(path.join(tmp, 'long_dropouts.csv'), 'theta,phi,eirp\n0,0,1\nOVLD,0,2\n');
    const angle = await readAll(path.join(tmp, 'long_dropouts.csv'));
    expect(angle.files[0].errors.map((e) => e.message)).toEqual(["long_dropouts.csv:3:1: theta: found 'OVLD', expected a number"]);
  });
});
