/**
 * Issue 8, property 1 (time): reading is linear in the file's size, also for the damage shapes
 * that could make a tokenizer quadratic (one enormous line, an unterminated quote, every row bad).
 * Not a speed target (those live in `npm run bench`): only the ratio of the read time of an 8×
 * larger file to the 1× file, minimum of several repeats, against a loose bound (a quadratic
 * reader gives about 64×, a linear one about 8×).
 * Robust on a loaded CI machine: the time is this process's CPU time (user + system), not wall
 * time, and a ratio over the bound is measured again (up to ATTEMPTS times): a quadratic reader
 * is over the bound every time, while a transient stall of a linear one is not repeated.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readExportFile } from '../../src/io/readExportFile.js';
import { recordFigure } from './figures.js';

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-linear-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const BASE_ROWS = 30_000;
const FACTOR = 8;
const BOUND = 28;
const ATTEMPTS = 3;

type Shape = (rows: number) => string;

const row = (i: number) => `${(i % 37) * 5 % 181},${(i * 7) % 360},${i % 4},${((i * 13) % 4000) / 100}`;
const shapes: Record<string, Shape> = {
  'plain rows (fast path)': (n) => ['theta_deg,phi_deg,beam,eirp_dbm', ...Array.from({ length: n }, (_, i) => row(i))].join('\n') + '\n',
  'quoted rows (general path)': (n) => ['"theta_deg","phi_deg","beam","eirp_dbm"', ...Array.from({ length: n }, (_, i) => row(i).replace(/,(\d+),/, ',"$1",'))].join('\n') + '\n',
  'every row bad': (n) => ['theta_deg,phi_deg,beam,eirp_dbm', ...Array.from({ length: n }, (_, i) => `${i % 180},x${i},0,NaN`)].join('\n') + '\n',
  'one enormous line': (n) => 'theta_deg,phi_deg,beam,eirp_dbm\n' + '1,'.repeat(n * 6),
  'unterminated quote': (n) => ['theta_deg,phi_deg,beam,eirp_dbm', '0,0,"0,1', ...Array.from({ length: n }, (_, i) => row(i))].join('\n') + '\n',
  'huge numbers and 1e999': (n) => ['theta_deg,phi_deg,beam,eirp_dbm', ...Array.from({ length: n }, (_, i) => `0,${i % 360},0,${i % 2 ? '1e999' : '9'.repeat(30)}`)].join('\n') + '\n',
};

async function readMs(file: string, repeats: number): Promise<number> {
  let best = Infinity;
  for (let k = 0; k < repeats; k++) {
    const t0 = process.cpuUsage();
    const r = await readExportFile(file, { inputRoot: dir });
    const used = process.cpuUsage(t0);
    const ms = (used.user + used.system) / 1e3;
    expect(r.file).toBe(path.basename(file));
    best = Math.min(best, ms);
  }
  return best;
}

describe('read time grows linearly with the file size', () => {
  for (const [name, shape] of Object.entries(shapes)) {
    it(name, async () => {
      const small = path.join(dir, `small-${name.replace(/\W+/g, '_')}.csv`);
      const big = path.join(dir, `big-${name.replace(/\W+/g, '_')}.csv`);
      writeFileSync(small, shape(BASE_ROWS));
      writeFileSync(big, shape(BASE_ROWS * FACTOR));
      await readMs(small, 1); // warm up the JIT on this shape
      let ratio = Infinity, tSmall = NaN, tBig = NaN;
      for (let attempt = 0; attempt < ATTEMPTS && !(ratio < BOUND); attempt++) {
        tSmall = await readMs(small, 5);
        tBig = await readMs(big, 3);
        // Floor the small time at 2 ms so timer granularity cannot inflate the ratio.
        ratio = Math.min(ratio, tBig / Math.max(tSmall, 2));
      }
      recordFigure(`linear.${name}`, { smallMs: +tSmall.toFixed(2), bigMs: +tBig.toFixed(2), ratio: +ratio.toFixed(2) });
      expect(ratio).toBeLessThan(BOUND);
    });
  }
});
