/**
 * Issue 8, properties 2 and 3: interrupted runs and two runs into one output folder.
 *
 * SIGKILL at seeded random points of a multi-unit batch (some timed, some right after the n-th
 * output file appears, so the writing stage is hit too): afterwards no file under a final name
 * is partial (each equals the reference run's file byte for byte, PDFs whole, JSON parses), and
 * a re-run completes with the reference results.json and no leftovers. SIGINT (SIGTERM) while
 * writing stops with exit 130 (143) and says how far it got (the analyzing-stage SIGINT case is in
 * test/cli/e2e.test.ts). Two concurrent runs: one refuses in plain words, the other's outputs
 * are intact.
 */
import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt } from '../cli/buildOnce.js';
import {
  analyzeArgs, DATE, expectNoPartialOutputs, finalFiles, LOCK, MANIFEST, multiUnitInput, pdfPages, prng, runAsync, runSync, TEMP_MARK, tmp,
} from './cliHarness.js';
import { recordFigure, SOAK } from './figures.js';

const UNITS = SOAK ? 12 : 4;
const KILLS = SOAK ? 40 : 5;

let input: string;
let ref: string;
let refMs: number;

beforeAll(() => {
  ensureBuilt();
  input = multiUnitInput(UNITS);
  ref = tmp('ref');
  const r = runSync(analyzeArgs(input, ref, ['--jobs', '2']));
  expect(r.stderr).toBe('');
  expect(r.code).toBe(0);
  refMs = r.ms;
}, 180_000);

/** Resolve once the child's stderr matches `re` (or it ends). */
function untilStderr(child: ChildProcess, re: RegExp): Promise<void> {
  return new Promise((resolve) => {
    let text = '';
    const check = (d: unknown) => {
      text += String(d);
      if (re.test(text)) {
        child.stderr!.off('data', check);
        resolve();
      }
    };
    child.stderr!.on('data', check);
    child.on('close', () => resolve());
  });
}

/** Wait until `n` final outputs exist in `out` (polling), or the child ends. */
async function afterFiles(out: string, n: number, ended: () => boolean): Promise<void> {
  while (!ended()) {
    try {
      if (finalFiles(out).length >= n) return;
    } catch {
      // the folder may not exist yet
    }
    await new Promise((r) => setTimeout(r, 3));
  }
}

describe('SIGKILL at random points', () => {
  it(`never leaves a partial output; a re-run gives the reference results (${KILLS} kills, ${UNITS} units)`, async () => {
    const rnd = prng(8_003);
    const out = tmp('kill');
    let killed = 0;
    let killedWhileWriting = 0;
    for (let k = 0; k < KILLS; k++) {
      const { child, done } = runAsync(analyzeArgs(input, out, ['--jobs', '2']));
      let ended = false;
      void done.then(() => (ended = true));
      if (rnd() < 0.5) {
        await new Promise((r) => setTimeout(r, (0.1 + 0.9 * rnd()) * refMs));
      } else {
        // Right after the n-th output file landed (n ≥ 1): the middle of the writing stage.
        await afterFiles(out, 1 + Math.floor(rnd() * (UNITS + 2)), () => ended);
        await new Promise((r) => setTimeout(r, rnd() * 30));
      }
      const writing = finalFiles(out).length > 0;
      child.kill('SIGKILL');
      const r = await done;
      if (r.signal === 'SIGKILL') {
        killed++;
        if (writing) killedWhileWriting++;
      } else {
        expect(r.code).toBe(0);
      }
      expectNoPartialOutputs(out, ref);
    }
    recordFigure('kill.killsSurvived', killed);
    recordFigure('kill.killedWhileWriting', killedWhileWriting);
    expect(killed).toBeGreaterThanOrEqual(Math.ceil(KILLS / 2));

    const again = runSync(analyzeArgs(input, out, ['--jobs', '2']));
    expect(again.stderr).toBe('');
    expect(again.code).toBe(0);
    expect(readFileSync(path.join(out, 'results.json'), 'utf8')).toBe(readFileSync(path.join(ref, 'results.json'), 'utf8'));
    expect(finalFiles(out)).toEqual(finalFiles(ref));
    expectNoPartialOutputs(out, ref);
    // Leftovers of the killed runs (temporary files, the dead run's lock) are gone.
    expect(readdirSync(out).filter((f) => f.startsWith(TEMP_MARK) || f === LOCK)).toEqual([]);
    for (const f of finalFiles(out).filter((x) => x.endsWith('.pdf'))) {
      expect(await pdfPages(readFileSync(path.join(out, f)))).toBeGreaterThan(0);
    }
  }, 300_000);
});

describe('leftovers of a killed run', () => {
  it('a re-run removes the temporary files a SIGKILLed run left (they never carry a final name)', () => {
    const out = tmp('left');
    // What a run killed inside writeFile leaves: a half-written temporary beside the outputs.
    const left = `${TEMP_MARK}4242-kzq1-3-R-01_28GHz.pdf`;
    writeFileSync(path.join(out, left), '%PDF-1.3\n(half');
    writeFileSync(path.join(out, LOCK), JSON.stringify({ pid: 2 ** 22 + 4242 }) + '\n');
    const r = runSync(analyzeArgs(input, out, ['--jobs', '2']));
    expect(r.code).toBe(0);
    expect(readdirSync(out).filter((f) => f.startsWith(TEMP_MARK) || f === LOCK)).toEqual([]);
    expectNoPartialOutputs(out, ref);
  }, 120_000);
});

describe('SIGINT and SIGTERM while writing', () => {
  // The run is held just before summary.csv (after the unit PDFs were replaced) by the test
  // fault hook (src/batch/faults.ts), and the signal is sent only once the run says it is
  // there: the signal lands in the writing stage on every run, however loaded the machine.
  for (const [sig, code, words] of [['SIGINT', 130, 'interrupted'], ['SIGTERM', 143, 'stopped by SIGTERM']] as const) {
    it(`${sig}: exit ${code}, says how many files were replaced, no temporary files, lock released, nothing partial`, async () => {
      const out = tmp('int');
      const { child, done } = runAsync(analyzeArgs(input, out, ['--jobs', '2']), { ...process.env, SPHERECOV_TEST_FAULTS: 'pause:summary.csv' });
      await untilStderr(child, /test pause before summary\.csv/);
      child.kill(sig);
      const r = await done;
      expect(r.signal).toBeNull();
      expect(r.code).toBe(code);
      expect(r.stderr).toMatch(new RegExp(`${words} while writing: [1-9]\\d* file\\(s\\) replaced .*; run again to complete`));
      expect(r.stderr).not.toMatch(/^\s+at /m);
      expect(readdirSync(out).filter((f) => f.startsWith(TEMP_MARK) || f === LOCK)).toEqual([]);
      expect(finalFiles(out)).not.toContain('results.json');
      expectNoPartialOutputs(out, ref);
      const manifest = JSON.parse(readFileSync(path.join(out, MANIFEST), 'utf8')) as { complete: boolean };
      expect(manifest.complete).toBe(false);
    }, 120_000);
  }
});

describe('two runs into the same output folder', () => {
  for (const stale of [false, true]) {
    it(`the second refuses in plain words and the first's outputs are intact${stale ? ' (a dead run left a stale lock)' : ''}`, async () => {
      const out = tmp('two');
      if (stale) writeFileSync(path.join(out, LOCK), JSON.stringify({ pid: 2 ** 22 + 12_345, startedAt: DATE }) + '\n');
      const a = runAsync(analyzeArgs(input, out, ['--jobs', '1']));
      const b = runAsync(analyzeArgs(input, out, ['--jobs', '1']));
      const [ra, rb] = await Promise.all([a.done, b.done]);
      const codes = [ra.code, rb.code].sort();
      expect(codes).toEqual([0, 2]);
      const loser = ra.code === 2 ? ra : rb;
      expect(loser.stderr).toMatch(/^spherecov: another spherecov run \(pid \d+\) is writing to '.+'; wait for it to finish, or choose another --out\n$/);
      expect(readFileSync(path.join(out, 'results.json'), 'utf8')).toBe(readFileSync(path.join(ref, 'results.json'), 'utf8'));
      expect(finalFiles(out)).toEqual(finalFiles(ref));
      expectNoPartialOutputs(out, ref);
      expect(readdirSync(out).filter((f) => f.startsWith(TEMP_MARK) || f === LOCK)).toEqual([]);
      rmSync(out, { recursive: true, force: true });
    }, 120_000);
  }
});
