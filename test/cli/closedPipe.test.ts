import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtWithScratch, ROOT } from './buildOnce.js';

// A reader that closes our stdout early (`spherecov analyze --help | head -2`, a pager quit
// before the end): output stops, the run goes on (src/cli/signals.ts onClosedPipe).

const BIN = path.join(ROOT, 'bin', 'spherecov.js');
const scratch = builtWithScratch('spherecov-pipe-');

/** Run the CLI with its stdout pipe closed by the reader at once; exit code and stderr. */
function withClosedStdout(args: string[]): Promise<{ code: number | null; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout.destroy(); // the reader is gone before the first line is written
    let stderr = '';
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString('utf8')));
    child.on('close', (code) => resolve({ code, stderr }));
  });
}

describe('a closed stdout pipe', () => {
  it('--help: exit 0, no stack trace', async () => {
    const r = await withClosedStdout(['analyze', '--help']);
    expect(r.stderr).not.toMatch(/EPIPE|Error/);
    expect(r.code).toBe(0);
  });

  it('analyze: the run still writes its files and exits as with a reader', async () => {
    const args = (out: string) => ['analyze', path.join(ROOT, 'fixtures', 'cli', 'pass'), '--out', out, '--no-pdf'];
    const normal = spawnSync(process.execPath, [BIN, ...args(path.join(scratch(), 'a'))], { cwd: ROOT, encoding: 'utf8' });
    const r = await withClosedStdout(args(path.join(scratch(), 'b')));
    expect(r.stderr).not.toMatch(/EPIPE/);
    expect(r.code).toBe(normal.status);
    expect(existsSync(path.join(scratch(), 'b', 'results.json'))).toBe(true);
  }, 60_000);
});
