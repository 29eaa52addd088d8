/**
 * The README stays true: its options table is the one the CLI declares, its Quick start
 * commands are the ones that work, and the demo it promises runs and shows the failing unit.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { ensureBuilt, ROOT } from './buildOnce.js';
import { renderOptionsTable } from '../../src/cli/options.js';

const README = readFileSync(path.join(ROOT, 'README.md'), 'utf8');
const cli = (...args: string[]) => spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), ...args], { cwd: ROOT, encoding: 'utf8' });

beforeAll(() => ensureBuilt(), 180_000);

describe('README', () => {
  it('carries the options table generated from the CLI declarations', () => {
    expect(README).toContain(renderOptionsTable().trim());
  });

  it('has the two Quick start commands, and the scripts they name exist', () => {
    const quick = README.slice(README.indexOf('## Quick start'), README.indexOf('## ', README.indexOf('## Quick start') + 3));
    expect(quick).toContain('npm install && npm run demo');
    expect(quick).toContain('npm test');
    const pkg = JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { scripts: Record<string, string> };
    for (const s of ['demo', 'test', 'bench', 'soak', 'demo:regen', 'docs:options']) expect(pkg.scripts[s], s).toBeTruthy();
  });

  it('documents commands that work: limits, limits <profile>, inspect', () => {
    const list = cli('limits');
    expect(list.status).toBe(0);
    expect(list.stdout).toContain('3gpp-fr2-pc3-n257');
    const one = cli('limits', '3gpp-fr2-pc3-n257');
    expect(one.status).toBe(0);
    expect(one.stdout).toContain('22.4');
    const ins = cli('inspect', 'fixtures/demo/RV28-P1-004');
    expect(ins.status).toBe(0);
    expect(ins.stdout).toContain('decimal comma');
  });

  it('npm run demo analyzes the demo build and shows which unit fails', () => {
    const r = spawnSync(process.execPath, [path.join(ROOT, 'scripts', 'run-demo.mjs')], { cwd: ROOT, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^RV28-P1-004\s+28\.000 GHz\s+FAIL\s/m);
    // The closing line names every file written.
    expect(r.stdout).toMatch(/^Wrote results\.json, summary\.csv, build-stats\.csv, summary\.pdf, RV28-P1-001_28GHz\.pdf, .* in reports\/demo\/$/m);
    // …and the README quotes that line as the demo prints it.
    const wrote = (/^Wrote .*$/m.exec(r.stdout) as RegExpExecArray)[0];
    expect(README).toContain(`    ${wrote}\n`);
    // The README shows the same table: header and every unit's verdict.
    const rows = r.stdout.split('\n').filter((l) => /^(unit\s|RV28-)/.test(l));
    expect(rows.length).toBeGreaterThan(6);
    for (const row of rows) expect(README.split('\n').some((l) => l.trim().split(/\s{2,}/).slice(0, 3).join('|') === row.split(/\s{2,}/).slice(0, 3).join('|')), row).toBe(true);
  }, 120_000);
});
