import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { lazyPackage } from '../src/lazyPackage.js';
import { ensureBuilt, ROOT } from './cli/buildOnce.js';

describe('lazyPackage (issue 18: packages load when used)', () => {
  it('loads the package on the first call and returns the same module after', () => {
    const yaml = lazyPackage<typeof import('yaml')>('yaml');
    expect(yaml().parse('a: 1')).toEqual({ a: 1 });
    expect(yaml()).toBe(yaml());
  });

  it('uses a provided module instead of loading one (the browser bundle)', () => {
    const pkg = lazyPackage<{ answer: number }>('no-such-package-spherecov');
    pkg.provide({ answer: 42 });
    expect(pkg().answer).toBe(42);
  });

  it('says which package is missing', () => {
    expect(() => lazyPackage('no-such-package-spherecov')()).toThrow(/no-such-package-spherecov/);
  });

  it('the CLI starts without yaml, re2js, pngjs, pdfkit or d3-geo-voronoi and loads them when used', () => {
    ensureBuilt();
    // A module hook that prints every package the process loads (ES modules and require alike).
    const hooks = `data:text/javascript,${encodeURIComponent(
      "export async function load(u, c, n) { const m = /node_modules\\/((?:@[^/]+\\/)?[^/]+)\\//.exec(u); if (m) process.stderr.write('PKG ' + m[1] + '\\n'); return n(u, c); }",
    )}`;
    const preload = `data:text/javascript,${encodeURIComponent(`import { register } from 'node:module'; register(${JSON.stringify(hooks)});`)}`;
    // Packages loaded with require() (lazyPackage) are listed from the require cache at the end.
    const listRequired = `
      const { createRequire } = await import('node:module');
      for (const f of Object.keys(createRequire(import.meta.url).cache)) {
        const m = /node_modules\\/((?:@[^/]+\\/)?[^/]+)\\//.exec(f);
        if (m) process.stderr.write('PKG ' + m[1] + '\\n');
      }`;
    const run = (code: string): Set<string> => {
      const r = spawnSync(process.execPath, ['--import', preload, '--input-type=module', '-e', code + listRequired], { cwd: ROOT, encoding: 'utf8' });
      expect(r.status, r.stderr).toBe(0);
      return new Set([...r.stderr.matchAll(/^PKG (\S+)$/gm)].map((m) => m[1]));
    };
    // Both builds bin/spherecov.js may run: dist/cli as tsc wrote it and the bundle made from it.
    for (const main of [path.join(ROOT, 'dist', 'cli', 'main.js'), path.join(ROOT, 'dist', 'bundle', 'main.js')]) {
      const atStart = run(`await import(${JSON.stringify(main)});`);
      for (const p of ['yaml', 'zod', 're2js', 'pngjs', 'pdfkit', 'd3-geo-voronoi', 'd3-geo', 'papaparse']) expect(atStart.has(p), `${main}: ${p}`).toBe(false);
      // dist/cli imports commander from node_modules; the bundle carries it (scripts/bundle.mjs BUNDLED_PACKAGES).
      expect(atStart.has('commander'), main).toBe(main.includes(`${path.sep}cli${path.sep}`));
    }
    // …and on first use (a scattered grid's Voronoi weights, a limit profile).
    const used = run(`
      const { buildSphereGrid } = await import(${JSON.stringify(path.join(ROOT, 'dist', 'sphere', 'buildGrid.js'))});
      const { loadLimitSet } = await import(${JSON.stringify(path.join(ROOT, 'dist', 'limits', 'loadLimitSet.js'))});
      const n = 200, t = new Float64Array(n), p = new Float64Array(n);
      for (let i = 0; i < n; i++) { t[i] = Math.acos(1 - (2 * (i + 0.5)) / n) * 180 / Math.PI; p[i] = (i * 137.50776405) % 360; }
      const g = buildSphereGrid(t, p).grid;
      if (g.regular) throw new Error('expected a scattered grid');
      if (!loadLimitSet('3gpp-fr2-pc3-n257').limitSet) throw new Error('profile not loaded');
      const { readExportFile } = await import(${JSON.stringify(path.join(ROOT, 'dist', 'io', 'readExportFile.js'))});
      const r = await readExportFile(${JSON.stringify(path.join(ROOT, 'fixtures', 'cli', 'pass', 'U-01'))} + '/' + (await import('node:fs')).readdirSync(${JSON.stringify(path.join(ROOT, 'fixtures', 'cli', 'pass', 'U-01'))})[0], { inputRoot: ${JSON.stringify(ROOT)} });
      if (r.beams.length === 0) throw new Error('no beams read');
    `);
    for (const p of ['yaml', 'zod', 'd3-geo-voronoi', 'papaparse']) expect(used.has(p), p).toBe(true);
    // Planning a run that writes PDFs, without a job file, needs neither yaml nor zod: the report
    // defaults are a constant (src/report/settings.ts).
    const planned = run(`
      const { planAnalyze } = await import(${JSON.stringify(path.join(ROOT, 'dist', 'batch', 'analyzePlan.js'))});
      const plan = await planAnalyze({ input: ${JSON.stringify(path.join(ROOT, 'fixtures', 'cli', 'pass'))}, outDir: (await import('node:os')).tmpdir() + '/spherecov-lazy-plan', percentilesPct: [50], thresholds: [10], pdf: true, force: true });
      if (!plan.output.report || plan.output.report.title !== 'Spherical coverage report') throw new Error('no report settings planned');
    `);
    for (const p of ['yaml', 'zod']) expect(planned.has(p), `planning with PDFs: ${p}`).toBe(false);
    // The insight lane's worker (src/batch/insightWorker.ts) loads no package at all.
    const lane = run(`await import(${JSON.stringify(path.join(ROOT, 'dist', 'batch', 'insightWorker.js'))});`);
    expect([...lane]).toEqual([]);
  });
});
