/**
 * The published typings and the library call work from a clean consumer project: a temporary
 * project holding only this folder's tsconfig (strict, skipLibCheck false), package.json and a
 * program, with spherecov installed (a link to this package, whose own dependencies resolve as
 * an install would) and @types/node. tsc must compile it without an error, and node must run it.
 * The README's "Use it from code" example is compiled and run the same way.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';

const HERE = path.join(ROOT, 'test', 'consumer');
const TSC = path.join(ROOT, 'node_modules', 'typescript', 'bin', 'tsc');
const dirs: string[] = [];
beforeAll(() => ensureBuilt(), 180_000);
afterAll(() => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

/** A fresh consumer project with `program` as its only source file. */
function project(program: string): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-consumer-'));
  dirs.push(dir);
  copyFileSync(path.join(HERE, 'tsconfig.json'), path.join(dir, 'tsconfig.json'));
  copyFileSync(path.join(HERE, 'package.json'), path.join(dir, 'package.json'));
  writeFileSync(path.join(dir, 'main.ts'), program);
  mkdirSync(path.join(dir, 'node_modules', '@types'), { recursive: true });
  symlinkSync(ROOT, path.join(dir, 'node_modules', 'spherecov'), 'dir');
  symlinkSync(path.join(ROOT, 'node_modules', '@types', 'node'), path.join(dir, 'node_modules', '@types', 'node'), 'dir');
  return dir;
}

function compile(dir: string): { status: number | null; output: string } {
  const r = spawnSync(process.execPath, [TSC, '-p', dir], { cwd: dir, encoding: 'utf8' });
  return { status: r.status, output: `${r.stdout}${r.stderr}` };
}

describe('a clean consumer project', () => {
  it("compiles against the typings (strict, skipLibCheck false) and runs, with the README's \"Use it from code\" example", () => {
    const dir = project(`${readFileSync(path.join(HERE, 'consumer.ts'), 'utf8')}\nconsole.log(JSON.stringify(await run()));\n`);
    const readme = readFileSync(path.join(ROOT, 'README.md'), 'utf8');
    const section = readme.slice(readme.indexOf('## Use it from code'));
    writeFileSync(path.join(dir, 'readme.ts'), /```ts\n([\s\S]*?)```/.exec(section)![1]);
    const c = compile(dir);
    expect(c.output).toBe('');
    expect(c.status).toBe(0);
    const got = JSON.parse(execFileSync(process.execPath, [path.join(dir, 'out', 'main.js')], { cwd: dir, encoding: 'utf8' })) as { verdict: string; bytes: number };
    expect(['pass', 'fail']).toContain(got.verdict);
    expect(got.bytes).toBeGreaterThan(10_000);
    const out = execFileSync(process.execPath, [path.join(dir, 'out', 'readme.js')], { cwd: dir, encoding: 'utf8' });
    expect(out).toMatch(/^verdict: (pass|fail)$/m);
    expect(out).toMatch(/^50 %: -?\d+\.\d+ dBm$/m);
    expect(readFileSync(path.join(dir, 'EX-1_28GHz.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
  }, 180_000);

  it('a type error in the consumer is reported (the check can fail)', () => {
    const dir = project("import { analyzeBeams } from 'spherecov';\nanalyzeBeams({ directions: { thetaDeg: [0] }, beams: [] });\n");
    const c = compile(dir);
    expect(c.status).not.toBe(0);
    expect(c.output).toMatch(/main\.ts.*error TS/);
  }, 180_000);
});
