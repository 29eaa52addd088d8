#!/usr/bin/env node
// `npm run bench [-- --quick] [-- --peer] [-- --reps N]`: the speed and memory benchmark (issue 7).
// Generates (and caches) its data, measures every stage as whole child processes (wall time and
// peak RSS) in rotating order against the read-and-count floor, and prints one table. It is a
// report: the exit code is 0 even when a target is missed (2 only for a usage error).
import { spawnSync } from 'node:child_process';
import { cpus, loadavg } from 'node:os';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseArgs, USAGE, wants } from './lib/args.mjs';
import { buildFolder, dataPlan, longExport, outDir, pickGenerator } from './lib/data.mjs';
import { comparePeer, renderComparison } from './lib/compare.mjs';
import { alternate, envWithout, runMeasured } from './lib/proc.mjs';
import { cliAvailable, findExport, repoDir } from './lib/resolve.mjs';
import { median, pairedRatio } from './lib/stats.mjs';
import { renderTable, row } from './lib/table.mjs';

const bench = (f) => join(repoDir, 'bench', f);
const PEER = '/work/shared/bench/peer.py';
/** Set in this environment, it makes every Node process and worker thread read a certificate bundle as it starts. */
const CA_TAX = process.env.NODE_EXTRA_CA_CERTS ? 'NODE_EXTRA_CA_CERTS' : null;
const MIB = 1024;
const log = (s) => process.stderr.write(`[bench] ${s}\n`);

let o;
try {
  o = parseArgs(process.argv.slice(2));
} catch (e) {
  process.stderr.write(`${e.message}\n`);
  process.exit(2);
}
if (o.help) {
  process.stdout.write(`${USAGE}\n`);
  process.exit(0);
}

const rows = [];
const raw = { options: o, startedAt: new Date().toISOString(), loadStart: loadavg()[0] };
const runsDir = join(outDir, 'runs');
mkdirSync(runsDir, { recursive: true });

// ---- build (others' half-finished files may make tsc report errors; dist is used as it is) ----
if (o.build) {
  log('building (tsc -p tsconfig.json) …');
  const r = spawnSync(process.execPath, [join(repoDir, 'node_modules/typescript/bin/tsc'), '-p', 'tsconfig.json'], { cwd: repoDir, encoding: 'utf8' });
  if (r.status !== 0) {
    const n = (r.stdout.match(/error TS/g) ?? []).length;
    log(`build reported ${n} type error(s) (work in progress elsewhere?); using dist/ as emitted`);
    raw.buildErrors = n;
  }
  // The CLI runs from dist/bundle when it is current (src/cli/bundleStamp.ts), as after npm install.
  log('bundling (scripts/bundle.mjs) …');
  const b = spawnSync(process.execPath, [join(repoDir, 'scripts/bundle.mjs')], { cwd: repoDir, encoding: 'utf8' });
  if (b.status !== 0) {
    log(`bundle step failed; the CLI runs from dist/cli\n${b.stderr}`);
    raw.bundleFailed = true;
  }
}

// ---- what exists ----
const cliProbe = cliAvailable();
const have = {
  cli: cliProbe.ok,
  read: !!(await findExport('readExportFile')).fn,
  measure: !!(await findExport('computeMetrics')).fn,
  pdf: !!(await findExport('renderUnitPdf')).fn,
};
raw.available = have;
log(`available: ${Object.entries(have).map(([k, v]) => `${k} ${v ? 'yes' : 'no'}`).join(', ')}`);
const NO_CLI = `not available yet (${cliProbe.why})`;

// ---- data ----
const generator = pickGenerator();
const plan = dataPlan(o.quick);
const long = await longExport(plan.long, generator, log);
const long4x = wants(o, 'growth') ? await longExport(plan.long4x, generator, log) : null;
const build = wants(o, 'build') || wants(o, 'pdf') ? await buildFolder(plan.build, generator, log) : null;
raw.data = { generator, long, long4x, build, plan };

// ---- workloads ----
const floorRun = (file) => runMeasured('node', [bench('floor.mjs'), file]);
const stageRun = async (script, args) => {
  const r = await runMeasured('node', [bench(script), ...args], { cwd: repoDir });
  const line = r.stdout.trim().split('\n').reverse().find((l) => l.startsWith('{'));
  // A stage that died (no JSON line) keeps the head of its stderr in last-run.json (crashLog): a
  // native crash prints its reason first and a long stack after it.
  return { ...r, result: line ? JSON.parse(line) : { error: r.stderr.trim().split('\n').slice(0, 3).join(' | ') || `exit ${r.code ?? r.signal}`, crashLog: r.stderr.slice(0, 8000) } };
};
const ANALYZE_ARGS = ['--percentiles', '0,10,50,90,100', '--coverage-thresholds', '10,20,25'];
const cliRun = async (input, name, extra, unset = []) => {
  const out = join(runsDir, name);
  rmSync(out, { recursive: true, force: true });
  const r = await runMeasured('node', [join(repoDir, 'bin/spherecov.js'), 'analyze', input, '--out', out, ...ANALYZE_ARGS, ...extra], { cwd: repoDir, unset });
  const resultsPath = join(out, 'results.json');
  const ok = (r.code === 0 || r.code === 1) && existsSync(resultsPath);
  return { ...r, ok, out, resultsPath, why: ok ? '' : `exit ${r.code ?? r.signal}: ${r.stderr.trim().split('\n').slice(0, 2).join(' | ')}` };
};
const walls = (rs) => rs.map((r) => (r.ok === false ? NaN : r.wallS));
const rssMiB = (rs) => median(rs.map((r) => (r.ok === false || r.maxRssKiB === null ? NaN : r.maxRssKiB / MIB)));
const cpuS = (rs) => median(rs.map((r) => (r.ok === false || r.cpuS === null ? NaN : r.cpuS)));
const failure = (rs) => rs.find((r) => r.ok === false)?.why ?? '';
const keep = (r) => (o.keep ? null : rmSync(r.out, { recursive: true, force: true }));

log('warming the page cache (one untimed floor read per file) …');
for (const f of [long, long4x].filter(Boolean)) await floorRun(f.path);

const mb = long.bytes / 1e6;
const sizeNote = `${long.rows.toLocaleString('en-US')} rows, ${mb.toFixed(1)} MB`;

// ---- floor, reading, whole CLI on the long export (rotating order, paired) ----
let cliOnLong = null;
if (wants(o, 'floor') || wants(o, 'read') || wants(o, 'cli')) {
  const w = { floor: () => floorRun(long.path) };
  if (wants(o, 'read') && have.read) w.read = () => stageRun('stage-read.mjs', [long.path]);
  if (wants(o, 'cli') && have.cli) {
    w.cli = () => cliRun(long.path, 'long', ['--no-pdf']);
    // As a user runs it by default: the unit PDF, the build summary and viewer.html as well.
    w.cliPdf = () => cliRun(long.path, 'long-pdf', []);
  }
  log(`floor${w.read ? ' / read' : ''}${w.cli ? ' / cli' : ''} on ${sizeNote}: ${o.reps} rep(s) …`);
  const res = await alternate(o.reps, w);
  raw.long = res;
  const floorWall = median(walls(res.floor));
  const floorCounted = JSON.parse(res.floor[0].stdout || '{}');
  rows.push(row('floor', `read + count newlines, wall (${sizeNote})`, floorWall, { unit: 's' }));
  rows.push(row('floor', 'read + count newlines, throughput', mb / floorWall, { unit: 'MB/s', digits: 1 }));
  rows.push(row('floor', 'read + count newlines, peak RSS', rssMiB(res.floor), { unit: 'MiB', digits: 1 }));
  if (floorCounted.newlines !== long.rows + 1) log(`note: floor counted ${floorCounted.newlines} newlines, expected ${long.rows + 1}`);

  if (wants(o, 'read')) {
    if (!w.read) rows.push(row('read', 'readExportFile', null, { note: 'not available yet (dist/io readExportFile missing)' }));
    else {
      const rr = res.read.map((r) => r.result);
      const bad = rr.find((r) => r.error || r.readS === undefined);
      if (bad) rows.push(row('read', 'readExportFile', null, { note: `failed: ${bad.error}` }));
      else {
        const readS = median(rr.map((r) => r.readS));
        rows.push(row('read', 'readExportFile, in-process', readS, { unit: 's' }));
        rows.push(row('read', 'throughput', mb / readS, { unit: 'MB/s', digits: 1 }));
        rows.push(row('read', 'rows/s', rr[0].rows / readS, { digits: 0 }));
        if (rr[0].rows !== long.rows || rr[0].errors) rows.push(row('read', 'rows read (expected ' + long.rows + ')', rr[0].rows, { digits: 0, note: `${rr[0].errors} error(s): ${rr[0].firstError ?? ''}` }));
        if (rr[0].assembleS !== undefined) rows.push(row('read', 'assembleMeasurements (grid, merge)', median(rr.map((r) => r.assembleS)), { unit: 's' }));
        rows.push(row('read', 'whole process, wall / floor', pairedRatio(walls(res.read), walls(res.floor)), { digits: 2 }));
        rows.push(row('read', 'whole process, peak RSS', rssMiB(res.read), { unit: 'MiB', digits: 1 }));
        raw.readS = readS;
      }
    }
  }
  if (wants(o, 'cli')) {
    if (!w.cli) rows.push(row('cli', 'analyze <file> --no-pdf', null, { note: NO_CLI }));
    else if (failure(res.cli)) rows.push(row('cli', 'analyze <file> --no-pdf', null, { note: `failed: ${failure(res.cli)}` }));
    else {
      cliOnLong = res.cli;
      rows.push(row('cli', 'analyze <file> --no-pdf, wall', median(walls(res.cli)), { unit: 's' }));
      rows.push(row('cli', 'analyze --no-pdf / floor (paired)', pairedRatio(walls(res.cli), walls(res.floor)), { target: { op: '<=', limit: 4 }, digits: 2 }));
      rows.push(row('cli', 'peak RSS', rssMiB(res.cli), { target: { op: '<=', limit: 150 }, unit: 'MiB', digits: 1 }));
      rows.push(row('cli', 'CPU time (user + system)', cpuS(res.cli), { unit: 's' }));
      res.cli.slice(0, -1).forEach(keep);
      if (failure(res.cliPdf)) rows.push(row('cli', 'analyze <file> with PDFs and viewer.html', null, { note: `failed: ${failure(res.cliPdf)}` }));
      else {
        rows.push(row('cli', 'analyze <file> with PDFs and viewer.html (the default), wall', median(walls(res.cliPdf)), { unit: 's' }));
        rows.push(row('cli', 'with PDFs and viewer.html / --no-pdf (paired)', pairedRatio(walls(res.cliPdf), walls(res.cli)), { digits: 2 }));
        rows.push(row('cli', 'with PDFs and viewer.html, peak RSS', rssMiB(res.cliPdf), { unit: 'MiB', digits: 1 }));
        res.cliPdf.forEach(keep);
      }
    }
  }
  if (wants(o, 'cli') && have.read && have.measure) {
    log('cli breakdown: one unit phase by phase, in-process …');
    const u = (await stageRun('stage-unit.mjs', [long.path])).result;
    raw.unitPhases = u;
    if (u.error) rows.push(row('phases', 'one unit, in-process', null, { note: `failed: ${u.error}` }));
    else {
      const phases = [
        ['readS', 'readExportFile'],
        ['assembleS', 'assembleMeasurements'],
        ['metricsS', 'computeMetrics'],
        ['removalS', 'beamRemoval (analysis)'],
        ['holesS', 'findHoles (analysis)'],
        ['subsetS', `greedySubset (analysis, ${u.subsetSteps ?? '?'} beams picked)`],
      ].filter(([k]) => u[k] !== undefined);
      const total = phases.reduce((acc, [k]) => acc + u[k], 0);
      for (const [k, label] of phases) rows.push(row('phases', `${label}, share ${((100 * u[k]) / total).toFixed(0)} %`, u[k], { unit: 's' }));
    }
  }
}

// ---- measuring: computeMetrics on 64 beams × the 1° grid ----
if (wants(o, 'measure')) {
  if (!have.measure) rows.push(row('measure', 'computeMetrics', null, { note: 'not available yet (dist/coverage computeMetrics missing)' }));
  else {
    log('measure: computeMetrics …');
    const r = (await stageRun('stage-measure.mjs', [long.path, String(Math.max(5, o.reps))])).result;
    raw.measure = r;
    if (r.error) rows.push(row('measure', 'computeMetrics', null, { note: `${r.unavailable ? '' : 'failed: '}${r.error}` }));
    else {
      rows.push(row('measure', `computeMetrics, ${r.beams} beams × ${r.points.toLocaleString('en-US')} points (${r.source})`, r.computeS, { unit: 's', digits: 4 }));
      rows.push(row('measure', 'points/s (beams × points / s)', r.pointsPerS, { digits: 0 }));
      if (raw.readS) rows.push(row('measure', "computeMetrics / readExportFile (our reading of 'a small fraction')", r.computeS / raw.readS, { target: { op: '<=', limit: 0.25 }, digits: 3 }));
    }
  }
}

// ---- memory growth: a 4× longer file ----
if (wants(o, 'growth')) {
  const note4 = `${long4x.rows.toLocaleString('en-US')} rows, ${(long4x.bytes / 1e6).toFixed(1)} MB`;
  if (!have.cli) rows.push(row('growth', '4× longer file, peak RSS ratio', null, { note: NO_CLI }));
  else {
    log(`growth: floor / cli on the 4× file (${note4}): ${o.reps} rep(s) …`);
    const res = await alternate(o.reps, { floor: () => floorRun(long4x.path), cli: () => cliRun(long4x.path, 'long4x', ['--no-pdf']) });
    raw.long4x = res;
    if (failure(res.cli)) rows.push(row('growth', '4× longer file', null, { note: `failed: ${failure(res.cli)}` }));
    else {
      rows.push(row('growth', `analyze 4× file --no-pdf, wall (${note4})`, median(walls(res.cli)), { unit: 's' }));
      rows.push(row('growth', '4× file: wall / floor (paired)', pairedRatio(walls(res.cli), walls(res.floor)), { digits: 2 }));
      rows.push(row('growth', '4× file: peak RSS', rssMiB(res.cli), { unit: 'MiB', digits: 1 }));
      if (cliOnLong) rows.push(row('growth', 'peak RSS, 4× file / 1× file', rssMiB(res.cli) / rssMiB(cliOnLong), { target: { op: '<=', limit: 2 }, digits: 2 }));
      else rows.push(row('growth', 'peak RSS, 4× file / 1× file', null, { note: 'needs the cli stage on the 1× file' }));
      res.cli.forEach(keep);
    }
  }
}

// ---- a build of units: the default --jobs ('auto') vs --jobs 1, and what the PDFs add ----
if (wants(o, 'build') || wants(o, 'pdf')) {
  const n = build.units;
  const bnote = `${n} units × ${plan.build.beams} beams, ${plan.build.step}° grid`;
  if (!have.cli) rows.push(row('build', `default --jobs / --jobs 1 (${bnote})`, null, { note: NO_CLI }));
  else {
    log(`build: ${bnote}, default --jobs and --jobs 1, with and without PDFs: ${o.reps} rep(s) …`);
    const res = await alternate(o.reps, {
      j1: () => cliRun(build.path, 'build-j1', ['--jobs', '1']),
      auto: () => cliRun(build.path, 'build-auto', []),
      j1nopdf: () => cliRun(build.path, 'build-j1-nopdf', ['--jobs', '1', '--no-pdf']),
      autonopdf: () => cliRun(build.path, 'build-auto-nopdf', ['--no-pdf']),
    });
    raw.build = res;
    const why = failure(res.j1) || failure(res.auto) || failure(res.j1nopdf) || failure(res.autonopdf);
    if (why) rows.push(row('build', `default --jobs / --jobs 1 (${bnote})`, null, { note: `failed: ${why}` }));
    else {
      rows.push(row('build', `--jobs 1 with PDFs, wall (${bnote})`, median(walls(res.j1)), { unit: 's' }));
      rows.push(row('build', 'without PDFs: default --jobs / --jobs 1 (paired)', pairedRatio(walls(res.autonopdf), walls(res.j1nopdf)), { target: { op: '<=', limit: 1.0 }, digits: 2 }));
      rows.push(row('build', 'with PDFs: default --jobs / --jobs 1 (paired)', pairedRatio(walls(res.auto), walls(res.j1)), { target: { op: '<=', limit: o.quick ? 1.0 : 0.7 }, digits: 2 }));
      rows.push(row('build', 'default --jobs with PDFs, peak RSS', rssMiB(res.auto), { unit: 'MiB', digits: 1 }));
      rows.push(row('build', '--jobs 1, CPU time', cpuS(res.j1), { unit: 's' }));
      rows.push(row('build', 'default --jobs, CPU time', cpuS(res.auto), { unit: 's' }));
      rows.push(row('build', 'default --jobs, CPU / wall (cores kept busy)', pairedRatio(res.auto.map((r) => r.cpuS), walls(res.auto)), { digits: 2 }));
      // What the machine itself allows: the same --jobs 1 run twice side by side as separate
      // processes (no shared start-up, no threads), against twice its wall alone. 0.5 = two full
      // cores; a --jobs 2 ratio cannot beat this on this machine.
      const side = [];
      for (let i = 0; i < o.reps; i++) {
        const t = process.hrtime.bigint();
        const pair = await Promise.all([cliRun(build.path, 'build-side-a', ['--jobs', '1']), cliRun(build.path, 'build-side-b', ['--jobs', '1'])]);
        side.push(Number(process.hrtime.bigint() - t) / 1e9 / (2 * res.j1[i].wallS));
        pair.forEach(keep);
      }
      raw.ceiling = median(side);
      rows.push(row('build', 'machine ceiling: 2 × --jobs 1 side by side / 2 × alone (bounds --jobs 2)', raw.ceiling, { digits: 2 }));
      const added = [];
      for (let i = 0; i < o.reps; i++) added.push((res.j1[i].wallS - res.j1nopdf[i].wallS) / n);
      rows.push(row('pdf', 'PDF time added per unit (CLI --jobs 1, with vs --no-pdf, incl. build PDF share)', median(added), { target: { op: '<=', limit: 0.3 }, unit: 's' }));
      for (const k of ['j1', 'auto', 'j1nopdf', 'autonopdf']) res[k].forEach(keep);
    }
  }
  if (wants(o, 'pdf')) {
    if (!have.cli || !have.pdf || !have.read) rows.push(row('pdf', 'renderUnitPdf, in-process', null, { note: `not available yet (${[!have.cli && 'cli', !have.pdf && 'renderUnitPdf', !have.read && 'readers'].filter(Boolean).join(', ')} missing)` }));
    else {
      log('pdf: renderUnitPdf in-process on unit-01 …');
      const one = await cliRun(build.firstUnit, 'unit-01', ['--no-pdf']);
      if (!one.ok) rows.push(row('pdf', 'renderUnitPdf, in-process', null, { note: `failed: ${one.why}` }));
      else {
        const r = (await stageRun('stage-pdf.mjs', [build.firstUnit, one.resultsPath, String(Math.max(3, o.reps))])).result;
        raw.pdf = r;
        if (r.error) rows.push(row('pdf', 'renderUnitPdf, in-process', null, { note: `failed: ${r.error}` }));
        else {
          rows.push(row('pdf', `renderUnitPdf, ${r.beams} beams × ${r.points} points, first call (fonts)`, r.firstS, { unit: 's' }));
          rows.push(row('pdf', 'renderUnitPdf, steady state (median)', r.pdfS, { target: { op: '<=', limit: 0.3 }, unit: 's' }));
        }
        keep(one);
      }
      // What a worker thread costs before it is as fast as the warm main thread (pool.ts
      // WORKER_START_MS, which --jobs auto weighs against the work left).
      log('pdf: worker start-up, with and without PDFs …');
      for (const mode of ['pdf', 'plain']) {
        const w = (await stageRun('stage-worker-start.mjs', [build.path, mode])).result;
        raw[`workerStart_${mode}`] = w;
        const label = `worker start-up CPU ${mode === 'pdf' ? 'with' : 'without'} PDFs (first ${w.tasks ?? '?'} tasks in a worker − the same warm, in-process; pool.ts WORKER_START_MS)`;
        rows.push(w.error ? row('pdf', label, null, { note: `failed: ${w.error}` }) : row('pdf', label, w.startS, { unit: 's' }));
      }
    }
  }
}

// ---- a long build: 100 units with PDFs, default --jobs vs --jobs 1 ----
if (wants(o, 'build100')) {
  const big = await buildFolder(plan.build100, generator, log);
  const note100 = `${big.units} units × ${plan.build100.beams} beams, ${plan.build100.step}° grid, with PDFs`;
  if (!have.cli) rows.push(row('build100', `default --jobs / --jobs 1 (${note100})`, null, { note: NO_CLI }));
  else {
    const reps = Math.min(o.reps, 2);
    log(`build100: ${note100}: ${reps} rep(s) …`);
    const res = await alternate(reps, {
      j1: () => cliRun(big.path, 'build100-j1', ['--jobs', '1']),
      auto: () => cliRun(big.path, 'build100-auto', []),
    });
    raw.build100 = res;
    const why = failure(res.j1) || failure(res.auto);
    if (why) rows.push(row('build100', `default --jobs / --jobs 1 (${note100})`, null, { note: `failed: ${why}` }));
    else {
      rows.push(row('build100', `--jobs 1, wall (${note100})`, median(walls(res.j1)), { unit: 's' }));
      rows.push(row('build100', 'default --jobs / --jobs 1 (paired)', pairedRatio(walls(res.auto), walls(res.j1)), { target: { op: '<=', limit: 0.65 }, digits: 2 }));
      rows.push(row('build100', '--jobs 1, CPU time', cpuS(res.j1), { unit: 's' }));
      rows.push(row('build100', 'default --jobs, CPU time', cpuS(res.auto), { unit: 's' }));
      // The same bound as the build stage's: a ratio below the machine ceiling is not possible.
      rows.push(raw.ceiling === undefined
        ? row('build100', 'machine ceiling (measured by the build stage)', null, { note: 'run the build stage too (--only build,build100) for this line' })
        : row('build100', 'machine ceiling (from the build stage; bounds the ratio above)', raw.ceiling, { digits: 2 }));
      for (const k of ['j1', 'auto']) res[k].forEach(keep);
    }
  }
}

// ---- the pandas peer, alternately with spherecov on the same file ----
let comparison = null;
// A full run without --peer still lists the issue's peer rows with their targets, as not run.
if (o.only === null && !o.peer) {
  rows.push(row('peer', 'analyze --no-pdf / peer (paired)', null, { target: { op: '<=', limit: 0.45 }, digits: 3, note: 'not run: add --peer' }));
  rows.push(row('peer', 'analyze --no-pdf --core-only (no holes, removal, subset) / peer (paired)', null, { target: { op: '<=', limit: 0.35 }, digits: 3, note: 'not run: add --peer' }));
}
if (wants(o, 'peer')) {
  const pyOk = existsSync(PEER) && spawnSync('/usr/bin/python3', ['-c', 'import pandas'], { stdio: 'ignore' }).status === 0;
  if (!pyOk) rows.push(row('peer', 'cli / pandas peer', null, { note: 'not available (/usr/bin/python3 with pandas, or peer.py, missing)' }));
  else if (!have.cli) rows.push(row('peer', 'cli / pandas peer', null, { note: NO_CLI }));
  else {
    log(`peer: pandas peer / cli on ${sizeNote}: ${o.reps} rep(s) …`);
    const res = await alternate(o.reps, {
      peer: async () => {
        const r = await runMeasured('python', [PEER, long.path]);
        return { ...r, ok: r.code === 0, why: r.code === 0 ? '' : r.stderr.trim().split('\n').pop() };
      },
      cli: () => cliRun(long.path, 'long-peer', ['--no-pdf']),
      core: () => cliRun(long.path, 'long-peer-core', ['--no-pdf', '--core-only']),
      // Node reads NODE_EXTRA_CA_CERTS's certificates as every process and worker thread starts
      // (this sandbox sets it: ~50 ms a process, ~15 ms a worker, measured): the same run without
      // it, as on a machine that does not set it (informative; the rows above keep it).
      ...(CA_TAX ? { cliBare: () => cliRun(long.path, 'long-peer-bare', ['--no-pdf'], [CA_TAX]) } : {}),
    });
    raw.peer = res;
    const why = failure(res.peer) || failure(res.cli) || failure(res.core);
    if (why) rows.push(row('peer', 'cli / pandas peer', null, { note: `failed: ${why}` }));
    else {
      const ratio = pairedRatio(walls(res.cli), walls(res.peer));
      rows.push(row('peer', 'pandas peer, wall', median(walls(res.peer)), { unit: 's' }));
      rows.push(row('peer', 'pandas peer, peak RSS', rssMiB(res.peer), { unit: 'MiB', digits: 1 }));
      rows.push(row('peer', 'analyze --no-pdf / peer (paired)', ratio, { target: { op: '<=', limit: 0.45 }, digits: 3 }));
      rows.push(row('peer', 'analyze --no-pdf --core-only (no holes, removal, subset) / peer (paired)', pairedRatio(walls(res.core), walls(res.peer)), { target: { op: '<=', limit: 0.35 }, digits: 3 }));
      if (res.cliBare && !failure(res.cliBare)) {
        rows.push(row('peer', `analyze --no-pdf / peer, ${CA_TAX} unset (informative: the environment's Node start-up cost removed)`, pairedRatio(walls(res.cliBare), walls(res.peer)), { digits: 3 }));
      }
      res.core.forEach(keep);
      const peerJson = JSON.parse(res.peer.at(-1).stdout);
      const results = JSON.parse(readFileSync(res.cli.at(-1).resultsPath, 'utf8'));
      const unit = results.units?.[0];
      if (!unit) rows.push(row('peer', 'cross-check', null, { note: 'results.json has no unit' }));
      else {
        const cmp = comparePeer(peerJson, unit);
        comparison = renderComparison(cmp, peerJson.points, unit.grid?.points);
        raw.comparison = cmp;
        const judged = cmp.filter((c) => c.agree !== null);
        rows.push(row('peer', `cross-check: quantities differing beyond tolerance (of ${judged.length})`, judged.filter((c) => !c.agree).length, { target: { op: '<=', limit: 0 }, digits: 0 }));
      }
      res.cli.forEach(keep);
    }
  }
}

// ---- report ----
raw.loadEnd = loadavg()[0];
// What the environment's NODE_EXTRA_CA_CERTS costs every Node process as it starts (time to the
// first line of JavaScript, with and without it; medians of 5).
if (CA_TAX) {
  const firstLine = (unset) => {
    const r = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(performance.now()))'], { env: envWithout(unset), encoding: 'utf8' });
    return Number(r.stdout);
  };
  const ms = (unset) => median(Array.from({ length: 5 }, () => firstLine(unset)));
  raw.caTax = { withMs: ms([]), withoutMs: ms([CA_TAX]) };
}
const busy = Math.max(raw.loadStart, raw.loadEnd) > cpus().length;
const header = [
  `spherecov benchmark — ${raw.startedAt}`,
  `node ${process.version}, ${cpus().length} cores (${cpus()[0]?.model ?? '?'}), ${o.reps} rep(s) per process, rotating order; medians`,
  `data: ${generator}; long export ${sizeNote}; peak RSS via process.resourceUsage().maxRSS / getrusage in the child`,
  `load average (1 min) at start ${raw.loadStart.toFixed(2)}, at end ${raw.loadEnd.toFixed(2)} on ${cpus().length} cores`,
  busy ? 'BUSY MACHINE: other processes competed for the cores during this run; wall times and the --jobs ratio are inflated — re-run on a quiet machine before trusting a miss' : '',
  raw.caTax ? `${CA_TAX} is set here: Node reaches its first line of JavaScript after ${raw.caTax.withMs.toFixed(0)} ms instead of ${raw.caTax.withoutMs.toFixed(0)} ms (every process; worker threads pay part of it too) — the spherecov rows include it, the peer does not pay it` : '',
  o.quick ? 'QUICK RUN: smaller files, one repetition — the targets are for the full-size files, so these statuses are indicative only' : '',
].filter(Boolean);
const text = `${header.join('\n')}\n\n${renderTable(rows)}\n${comparison ? `\n${comparison}\n` : ''}`;
process.stdout.write(text);
writeFileSync(join(outDir, 'last-run.txt'), text);
writeFileSync(join(outDir, 'last-run.json'), JSON.stringify({ ...raw, rows }, (k, v) => (k === 'stdout' || k === 'stderr' ? undefined : v), 1));
process.exitCode = 0;
