/**
 * Spawning the built CLI (bin/spherecov.js → dist/) for the reliability tests, building a
 * multi-unit input from the fixture beams by hard links, and checking an output folder for
 * partial files against a reference run.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { expect } from 'vitest';
import { ROOT } from '../cli/buildOnce.js';

export const BIN = path.join(ROOT, 'bin', 'spherecov.js');
export const DATE = '2025-04-01T08:00:00Z';
export const TEMP_MARK = '.spherecov-tmp-';
export const LOCK = '.spherecov.lock';
export const MANIFEST = '.spherecov-manifest.json';

export function tmp(tag: string): string {
  return mkdtempSync(path.join(tmpdir(), `spherecov-rel-${tag}-`));
}

/** A build of `units` units (folders R-01…), beams hard-linked from fixtures/cli/pass (U-01, U-02 alternately). */
export function multiUnitInput(units: number): string {
  const input = tmp('in');
  for (let k = 0; k < units; k++) {
    const src = path.join(ROOT, 'fixtures', 'cli', 'pass', k % 2 ? 'U-02' : 'U-01');
    const d = path.join(input, `R-${String(k + 1).padStart(2, '0')}`);
    mkdirSync(d);
    for (const f of readdirSync(src)) linkSync(path.join(src, f), path.join(d, f.replace(/^U-0\d_/, '')));
  }
  return input;
}

export function analyzeArgs(input: string, out: string, extra: string[] = []): string[] {
  return [BIN, 'analyze', input, '--out', out, '--creation-date', DATE, '--quiet', ...extra];
}

export function runSync(args: string[], env: NodeJS.ProcessEnv = process.env, cwd: string = ROOT): { code: number | null; stdout: string; stderr: string; ms: number } {
  const t0 = Date.now();
  // A generous timeout only so that a regression to a hang fails the test instead of the suite.
  const r = spawnSync(process.execPath, args, { cwd, env, encoding: 'utf8', timeout: 120_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr, ms: Date.now() - t0 };
}

export interface Spawned {
  child: ChildProcess;
  done: Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }>;
}

export function runAsync(args: string[], env: NodeJS.ProcessEnv = process.env): Spawned {
  const child = spawn(process.execPath, args, { cwd: ROOT, env });
  let stderr = '';
  child.stderr!.on('data', (d) => (stderr += String(d)));
  child.stdout!.resume();
  const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }>((resolve) =>
    child.on('close', (code, signal) => resolve({ code, signal, stderr })),
  );
  return { child, done };
}

/** Final-named output files (no temp, lock or manifest). */
export function finalFiles(out: string): string[] {
  return readdirSync(out).filter((f) => !f.startsWith(TEMP_MARK) && f !== LOCK && f !== MANIFEST).sort();
}

/** A PDF is whole: header, and the %%EOF trailer at its end. */
export function pdfLooksWhole(bytes: Buffer): boolean {
  return bytes.subarray(0, 5).toString('latin1') === '%PDF-' && bytes.subarray(-32).toString('latin1').trimEnd().endsWith('%%EOF');
}

/**
 * No partial file under a final name: every final-named file is byte-identical to the
 * reference run's file of that name (outputs are deterministic with --creation-date), every
 * PDF is whole, every JSON parses. Returns the number of final files seen.
 */
export function expectNoPartialOutputs(out: string, ref: string): number {
  const files = finalFiles(out);
  for (const f of files) {
    const bytes = readFileSync(path.join(out, f));
    if (f.endsWith('.pdf')) expect(pdfLooksWhole(bytes), `${f} is a whole PDF`).toBe(true);
    if (f.endsWith('.json')) expect(() => JSON.parse(bytes.toString('utf8')), `${f} parses`).not.toThrow();
    expect(existsSync(path.join(ref, f)), `${f} is an output the reference run also writes`).toBe(true);
    expect(bytes.equals(readFileSync(path.join(ref, f))), `${f} equals the reference run's file`).toBe(true);
  }
  if (existsSync(path.join(out, MANIFEST))) {
    expect(() => JSON.parse(readFileSync(path.join(out, MANIFEST), 'utf8'))).not.toThrow();
  }
  return files.length;
}

/** Load a PDF with pdfjs (legacy build) and return its page count: a real parse, not a header check. */
export async function pdfPages(bytes: Buffer): Promise<number> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const doc = await pdfjs.getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
  const n = doc.numPages;
  await doc.destroy();
  return n;
}

/** Deterministic uniform numbers for kill points (mulberry32). */
export function prng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
