#!/usr/bin/env node
// Where does analyze spend its time? Runs the CLI under `node --cpu-prof` (one profile per thread,
// workers included) and prints self time by function and by source file, from the samples.
//
//   node bench/profile.mjs [--pdf] [FILE] [-- extra analyze options]   (default FILE: the 64-beam export;
//                                          without --pdf the run is --no-pdf)
//   node bench/profile.mjs --script bench/stage-read.mjs FILE  (profile one stage script instead)
import { spawnSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join, relative } from 'node:path';
import { outDir, dataDir } from './lib/data.mjs';
import { repoDir } from './lib/resolve.mjs';

/**
 * Self time per profile node from a .cpuprofile (samples[i] was on top of the stack for
 * timeDeltas[i + 1] µs, the interval up to the next sample). Returns rows
 * { fn, file, line, selfMs } aggregated by function, descending.
 */
export function selfTimes(profile) {
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const selfUs = new Map();
  const { samples, timeDeltas } = profile;
  for (let i = 0; i < samples.length; i++) {
    const dt = timeDeltas[i + 1] ?? 0;
    selfUs.set(samples[i], (selfUs.get(samples[i]) ?? 0) + dt);
  }
  const agg = new Map();
  for (const [id, us] of selfUs) {
    const cf = byId.get(id).callFrame;
    const file = cf.url ? cf.url.replace(`file://${repoDir}/`, '') : `(${cf.functionName || 'native'})`;
    const key = `${cf.functionName}|${file}|${cf.lineNumber}`;
    const e = agg.get(key) ?? { fn: cf.functionName || '(anonymous)', file, line: cf.lineNumber + 1, selfMs: 0 };
    e.selfMs += us / 1000;
    agg.set(key, e);
  }
  return [...agg.values()].sort((a, b) => b.selfMs - a.selfMs);
}

function report(name, profile, top = 20) {
  const rows = selfTimes(profile);
  const total = rows.reduce((s, r) => s + r.selfMs, 0);
  const lines = [`== ${name}: ${total.toFixed(0)} ms sampled`];
  lines.push('-- by function (self time)');
  for (const r of rows.slice(0, top)) lines.push(`${r.selfMs.toFixed(1).padStart(9)} ms ${((100 * r.selfMs) / total).toFixed(1).padStart(5)} %  ${r.fn}  ${r.file}:${r.line}`);
  const byFile = new Map();
  for (const r of rows) byFile.set(r.file, (byFile.get(r.file) ?? 0) + r.selfMs);
  lines.push('-- by file (self time)');
  for (const [f, ms] of [...byFile].sort((a, b) => b[1] - a[1]).slice(0, 12)) lines.push(`${ms.toFixed(1).padStart(9)} ms ${((100 * ms) / total).toFixed(1).padStart(5)} %  ${f}`);
  return lines.join('\n');
}

const argv = process.argv.slice(2);
const dd = argv.indexOf('--');
const extra = dd >= 0 ? argv.slice(dd + 1) : [];
const ownAll = dd >= 0 ? argv.slice(0, dd) : argv;
const withPdf = ownAll.includes('--pdf');
const own = ownAll.filter((a) => a !== '--pdf');
const profDir = join(outDir, 'prof');
rmSync(profDir, { recursive: true, force: true });
mkdirSync(profDir, { recursive: true });
let cmd;
if (own[0] === '--script') cmd = [own[1], ...own.slice(2)];
else {
  const file = own[0] ?? readdirSync(dataDir).map((f) => join(dataDir, f)).find((f) => /long-b64-s1-.*\.csv$/.test(f));
  if (!file) {
    process.stderr.write('no FILE given and no cached 64-beam export: run npm run bench first\n');
    process.exit(2);
  }
  cmd = [join(repoDir, 'bin/spherecov.js'), 'analyze', file, '--out', join(outDir, 'runs', 'profile'), ...(withPdf ? [] : ['--no-pdf']), ...extra];
}
const t0 = process.hrtime.bigint();
const r = spawnSync(process.execPath, ['--cpu-prof', '--cpu-prof-dir', profDir, '--cpu-prof-interval', '200', ...cmd], { cwd: repoDir, encoding: 'utf8' });
const wall = Number(process.hrtime.bigint() - t0) / 1e9;
process.stdout.write(`${relative(repoDir, cmd[0])} exit ${r.status}, wall ${wall.toFixed(2)} s under the profiler\n`);
if (r.status !== 0 && r.status !== 1) process.stdout.write(r.stderr.split('\n').slice(0, 5).join('\n') + '\n');
for (const f of readdirSync(profDir).filter((n) => n.endsWith('.cpuprofile')).sort()) {
  process.stdout.write(report(f, JSON.parse(readFileSync(join(profDir, f), 'utf8'))) + '\n');
}
