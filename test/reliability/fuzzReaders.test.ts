/**
 * Issue 8, property 1: fuzzing the readers. Thousands of generated exports (valid ones in random
 * dialects, and the same with random damage and wrong encodings) must never throw, and must end
 * either in normalized beams (that assemble into measurements without a thrown error) or in
 * errors naming the file and a line. Seeded; the counts are scaled up by `npm run soak`.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { readExportFile } from '../../src/io/readExportFile.js';
import { assembleMeasurements } from '../../src/io/assembleMeasurements.js';
import type { FileReadResult } from '../../src/io/types.js';
import { applyDamage, damage, encode, encoding, exportSpec, renderExport } from './exportGen.js';
import { recordFigure, SOAK } from './figures.js';

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-fuzz-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const VALID_RUNS = SOAK ? 20_000 : 1_000;
const DAMAGED_RUNS = SOAK ? 40_000 : 2_500;
let fileNo = 0;

/** The invariants every read must satisfy, damaged or not. */
function checkOutcome(name: string, r: FileReadResult): void {
  expect(r.file).toBe(name);
  if (r.errors.length > 0) {
    // A file with errors yields no beams (its unit fails, nothing half-read goes on).
    expect(r.beams).toEqual([]);
    for (const e of r.errors) {
      expect(e.file).toBe(name);
      expect(e.message.startsWith(`${name}:`)).toBe(true);
      expect(e.message).not.toMatch(/\n\s+at /); // no stack trace
    }
    // The first error points at a line (the "n more errors" summary is the only line-less kind).
    expect(r.errors[0].message).toMatch(new RegExp(`^${name.replace('.', '\\.')}:\\d+:\\d+: [^:]+: found .*, expected .+`, 's'));
    expect(r.errors[0].line).toBeGreaterThanOrEqual(1);
    return;
  }
  expect(r.beams.length).toBeGreaterThan(0);
  for (const b of r.beams) {
    expect(b.values.length).toBeGreaterThan(0);
    expect(b.thetaDeg.length).toBe(b.values.length);
    expect(b.phiDeg.length).toBe(b.values.length);
    for (let i = 0; i < b.values.length; i++) {
      if (!Number.isFinite(b.values[i]) || !(b.thetaDeg[i] >= 0 && b.thetaDeg[i] <= 180) || !(b.phiDeg[i] >= -180 && b.phiDeg[i] <= 360)) {
        throw new Error(`${name}: sample ${i} not normalized: θ ${b.thetaDeg[i]}, φ ${b.phiDeg[i]}, value ${b.values[i]}`);
      }
    }
  }
  // Assembly must not throw either; it gives measurements or errors naming a file.
  const asm = assembleMeasurements(r.beams, [{ path: r.file, sha256: r.sha256 }]);
  for (const e of asm.errors) expect(e.message.startsWith(`${name}`)).toBe(true);
  for (const m of asm.measurements) {
    const n = m.grid.thetaDeg.length;
    expect(n).toBeGreaterThan(0);
    for (const beam of m.beams) {
      expect(beam.values.length).toBe(n);
      expect(beam.values.every(Number.isFinite)).toBe(true);
    }
  }
  expect(asm.measurements.length + asm.errors.length).toBeGreaterThan(0);
}

async function readBytes(bytes: Buffer): Promise<{ name: string; r: FileReadResult }> {
  const name = `fz_${fileNo++}.csv`;
  const abs = path.join(dir, name);
  writeFileSync(abs, bytes);
  const r = await readExportFile(abs, { inputRoot: dir });
  rmSync(abs);
  return { name, r };
}

describe('reader fuzzing (fast-check, seeded)', () => {
  it(`valid exports in random dialects read back exactly (${VALID_RUNS} files)`, async () => {
    let n = 0;
    await fc.assert(
      fc.asyncProperty(exportSpec, async (spec) => {
        const { text, expected } = renderExport(spec);
        const { name, r } = await readBytes(encode(text, 'utf8', spec.bom));
        n++;
        expect(r.errors.map((e) => e.message)).toEqual([]);
        checkOutcome(name, r);
        expect(r.beams.length).toBe(expected.length);
        for (const [i, b] of r.beams.entries()) {
          expect(Array.from(b.values)).toEqual(expected[i].values);
          expect(Array.from(b.thetaDeg)).toEqual(expected[i].thetaDeg);
          expect(Array.from(b.phiDeg)).toEqual(expected[i].phiDeg);
        }
      }),
      { seed: 8_001, numRuns: VALID_RUNS },
    );
    recordFigure('fuzz.validFiles', n);
  }, 120_000);

  it(`damaged exports and wrong encodings: beams or located errors, never a throw (${DAMAGED_RUNS} files)`, async () => {
    let n = 0;
    let withErrors = 0;
    const kinds = new Map<string, number>();
    await fc.assert(
      fc.asyncProperty(exportSpec, fc.array(damage, { minLength: 1, maxLength: 3 }), encoding, async (spec, damages, enc) => {
        let { text } = renderExport(spec);
        for (const d of damages) {
          text = applyDamage(text, d, spec.delimiter);
          kinds.set(d.kind, (kinds.get(d.kind) ?? 0) + 1);
        }
        const { name, r } = await readBytes(encode(text, enc, spec.bom));
        n++;
        if (r.errors.length) withErrors++;
        checkOutcome(name, r);
        // The two parser paths agree on damaged input too (same errors, same numbers).
        const abs = path.join(dir, name);
        writeFileSync(abs, encode(text, enc, spec.bom));
        const g = await readExportFile(abs, { inputRoot: dir, parser: 'general' });
        rmSync(abs);
        expect(g.errors.map((e) => e.message)).toEqual(r.errors.map((e) => e.message));
        expect(g.beams.map((b) => Array.from(b.values))).toEqual(r.beams.map((b) => Array.from(b.values)));
      }),
      { seed: 8_002, numRuns: DAMAGED_RUNS },
    );
    recordFigure('fuzz.damagedFiles', n);
    recordFigure('fuzz.damagedWithErrors', withErrors);
    recordFigure('fuzz.damageKinds', Object.fromEntries(kinds));
    // The damage must actually bite: most damaged files are refused with a located error.
    expect(withErrors).toBeGreaterThan(n * 0.3);
  }, 240_000);
});
