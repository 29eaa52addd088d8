// Benchmark data: generated once, cached in bench/out/data/ under a name that spells out the
// parameters (a `.json` sidecar is written after the data, so a half-written file is never reused).
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generate } from '../gen.mjs';

const benchDir = join(dirname(fileURLToPath(import.meta.url)), '..');
export const outDir = join(benchDir, 'out');
export const dataDir = join(outDir, 'data');
const GEN_PY = '/work/shared/bench/gen.py';

/** The data sets of a full run and of a --quick smoke run. */
export function dataPlan(quick) {
  return quick
    ? { long: { beams: 16, step: 2, seed: 1 }, long4x: { beams: 64, step: 2, seed: 1 }, build: { units: 4, beams: 16, step: 5 }, build100: { units: 12, beams: 16, step: 5 } }
    : { long: { beams: 64, step: 1, seed: 1 }, long4x: { beams: 256, step: 1, seed: 1 }, build: { units: 20, beams: 16, step: 5 }, build100: { units: 100, beams: 16, step: 5 } };
}

/** Which generator is usable here: gen.py with numpy (the reference shape) or the Node port. */
export function pickGenerator() {
  if (existsSync(GEN_PY) && existsSync('/usr/bin/python3')) {
    const r = spawnSync('/usr/bin/python3', ['-c', 'import numpy'], { stdio: 'ignore' });
    if (r.status === 0) return 'gen.py';
  }
  return 'gen.mjs';
}

async function writeOne(path, p, generator) {
  const tmp = `${path}.part`;
  if (generator === 'gen.py') {
    const r = spawnSync('/usr/bin/python3', [GEN_PY, tmp, '--beams', String(p.beams), '--step', String(p.step), '--seed', String(p.seed)], { stdio: ['ignore', 'ignore', 'pipe'] });
    if (r.status !== 0) throw new Error(`gen.py failed: ${r.stderr}`);
  } else {
    await generate(tmp, p);
  }
  renameSync(tmp, path);
}

function cached(path, key) {
  try {
    return JSON.stringify(JSON.parse(readFileSync(`${path}.json`, 'utf8')).key) === JSON.stringify(key) && existsSync(path);
  } catch {
    return false;
  }
}

/** One long-layout export; resolves to { path, bytes, rows, generated: boolean }. */
export async function longExport(p, generator, log) {
  mkdirSync(dataDir, { recursive: true });
  const name = `long-b${p.beams}-s${p.step}-seed${p.seed}-${generator.replace('.', '')}.csv`;
  const path = join(dataDir, name);
  const key = { ...p, generator };
  const rows = p.beams * (Math.round(180 / p.step) + 1) * Math.round(360 / p.step);
  let generated = false;
  if (!cached(path, key)) {
    log(`generating ${name} (${rows.toLocaleString('en-US')} rows) with ${generator} …`);
    await writeOne(path, p, generator);
    writeFileSync(`${path}.json`, JSON.stringify({ key, rows }));
    generated = true;
  }
  return { path, bytes: statSync(path).size, rows, generated };
}

/** A build: one folder per unit (unit-01 …), one export each, seed = unit number. */
export async function buildFolder(p, generator, log) {
  const name = `build-u${p.units}-b${p.beams}-s${p.step}-${generator.replace('.', '')}`;
  const root = join(dataDir, name);
  const key = { ...p, generator };
  if (!cached(root, key)) {
    log(`generating ${name} (${p.units} units × ${p.beams} beams on a ${p.step}° grid) with ${generator} …`);
    rmSync(root, { recursive: true, force: true });
    for (let u = 1; u <= p.units; u++) {
      const dir = join(root, `unit-${String(u).padStart(2, '0')}`);
      mkdirSync(dir, { recursive: true });
      await writeOne(join(dir, 'pattern.csv'), { beams: p.beams, step: p.step, seed: u }, generator);
    }
    writeFileSync(`${root}.json`, JSON.stringify({ key }));
  }
  return { path: root, firstUnit: join(root, 'unit-01'), units: p.units };
}
