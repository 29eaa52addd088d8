import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, mkdirSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { MANIFEST_NAME, OutputWriter, outputDirProblem } from '../../src/batch/outputDir.js';
import { acquireLock, LOCK_MAX_AGE_MS, LOCK_NAME, LockBusyError, processStartTicks } from '../../src/batch/lock.js';
import { hostname } from 'node:os';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'spherecov-outdir-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('OutputWriter', () => {
  it('writes atomically and leaves no temporary file', async () => {
    const w = await OutputWriter.open(dir, 'r1');
    await w.write('a.txt', 'hello');
    await w.finish();
    expect(readFileSync(path.join(dir, 'a.txt'), 'utf8')).toBe('hello');
    expect(readdirSync(dir).sort()).toEqual([MANIFEST_NAME, 'a.txt']);
  });

  it('a re-run removes the stale outputs it wrote before, and nothing else', async () => {
    writeFileSync(path.join(dir, 'notes.txt'), 'mine');
    const w1 = await OutputWriter.open(dir, 'r1');
    await w1.write('U-01.pdf', 'x');
    await w1.write('U-02.pdf', 'y');
    await w1.finish();
    const w2 = await OutputWriter.open(dir, 'r2');
    await w2.write('U-01.pdf', 'x2');
    expect(await w2.finish()).toEqual(['U-02.pdf']);
    expect(readdirSync(dir).sort()).toEqual([MANIFEST_NAME, 'U-01.pdf', 'notes.txt']);
    const m = JSON.parse(readFileSync(path.join(dir, MANIFEST_NAME), 'utf8'));
    // The hash is the SHA-256 of the bytes 'x2' (node:crypto, the FIPS 180-4 digest).
    expect(m).toEqual({ tool: 'spherecov', complete: true, files: ['U-01.pdf'], sha256: { 'U-01.pdf': [createHash('sha256').update('x2').digest('hex')] } });
  });

  it('never deletes a file a foreign manifest lists, nor one of ours that someone has changed since', async () => {
    writeFileSync(path.join(dir, 'precious.txt'), 'not ours');
    writeFileSync(path.join(dir, MANIFEST_NAME), JSON.stringify({ tool: 'spherecov', complete: true, files: ['precious.txt'] }));
    const w1 = await OutputWriter.open(dir);
    await w1.write('U-09.pdf', 'ours');
    expect(await w1.finish()).toEqual([]);
    expect(readFileSync(path.join(dir, 'precious.txt'), 'utf8')).toBe('not ours');
    writeFileSync(path.join(dir, 'U-09.pdf'), 'edited by hand');
    const w2 = await OutputWriter.open(dir);
    await w2.write('results.json', '{}');
    expect(await w2.finish()).toEqual([]);
    expect(readFileSync(path.join(dir, 'U-09.pdf'), 'utf8')).toBe('edited by hand');
  });

  it('creates temporary files exclusively under random names: a planted link is never followed', async () => {
    const victim = path.join(dir, '..', `${path.basename(dir)}-victim.txt`);
    writeFileSync(victim, 'keep');
    const w = await OutputWriter.open(dir, 'r1');
    // Even a link planted at the exact temporary name (here guessable because the test fixed the
    // run id) makes the write fail with EEXIST instead of writing through it.
    symlinkSync(victim, path.join(dir, '.spherecov-tmp-r1-0-.spherecov-manifest.json'));
    await expect(w.write('a.txt', 'x')).rejects.toMatchObject({ code: 'EEXIST' });
    expect(readFileSync(victim, 'utf8')).toBe('keep');
    rmSync(victim);
  });

  it('records a name in the manifest before writing it, so a killed run is cleaned up by the next', async () => {
    const w1 = await OutputWriter.open(dir, 'r1');
    await w1.write('orphan.pdf', 'x'); // no finish(): the run was killed
    const w2 = await OutputWriter.open(dir, 'r2');
    await w2.write('results.json', '{}');
    await w2.finish();
    expect(existsSync(path.join(dir, 'orphan.pdf'))).toBe(false);
  });

  it('spools bytes and commits them under their final name; sweeps temporary files of a killed run', async () => {
    writeFileSync(path.join(dir, '.spherecov-tmp-dead-0-U-01.pdf'), 'half');
    const w = await OutputWriter.open(dir, 'r1');
    expect(existsSync(path.join(dir, '.spherecov-tmp-dead-0-U-01.pdf'))).toBe(false);
    const tmp = await w.spool(new Uint8Array([37, 80, 68, 70]));
    expect(path.basename(tmp).startsWith('.spherecov-tmp-r1')).toBe(true);
    await w.commit(tmp, 'U-01.pdf');
    await w.finish();
    expect(readFileSync(path.join(dir, 'U-01.pdf'), 'utf8')).toBe('%PDF');
    expect(readdirSync(dir).sort()).toEqual([MANIFEST_NAME, 'U-01.pdf']);
  });

  it('removes this run\'s temporary files after an interrupt', async () => {
    const w = await OutputWriter.open(dir, 'r1');
    await w.spool(new Uint8Array([1]));
    await w.removeTemps();
    expect(readdirSync(dir)).toEqual([]);
  });

  it('refuses names with folders', async () => {
    const w = await OutputWriter.open(dir, 'r1');
    await expect(w.write('../x.txt', 'no')).rejects.toThrow(/not a plain file name/);
    await expect(w.write('a/b.txt', 'no')).rejects.toThrow(/not a plain file name/);
  });

  it('ignores manifest entries that point outside the folder', async () => {
    writeFileSync(path.join(dir, MANIFEST_NAME), JSON.stringify({ files: ['../victim.txt'] }));
    const w = await OutputWriter.open(dir, 'r1');
    expect(await w.finish()).toEqual([]);
  });
});

describe('outputDirProblem', () => {
  it('refuses the input folder and folders inside it unless forced', async () => {
    const input = path.join(dir, 'in');
    mkdirSync(input);
    expect(await outputDirProblem(input, input, false)).toMatch(/inside it/);
    expect(await outputDirProblem(input, path.join(input, 'out'), false)).toMatch(/--force/);
    expect(await outputDirProblem(input, path.join(input, 'out'), true)).toBeNull();
    expect(await outputDirProblem(input, path.join(dir, 'in-out'), false)).toBeNull();
  });
});

describe('lock', () => {
  it('refuses while the owner runs and takes over a stale lock', () => {
    const release = acquireLock(dir);
    // Same pid counts as stale only for another process; simulate a live other owner with pid 1.
    writeFileSync(path.join(dir, LOCK_NAME), JSON.stringify({ pid: 1 }));
    expect(() => acquireLock(dir)).toThrow(LockBusyError);
    writeFileSync(path.join(dir, LOCK_NAME), JSON.stringify({ pid: 2 ** 22 + 12345 }));
    const again = acquireLock(dir);
    again();
    expect(existsSync(path.join(dir, LOCK_NAME))).toBe(false);
    release();
  });

  it('judges a lock by more than its pid: a reused pid (other start time) and a day-old lock are taken over; another host waits', () => {
    const mine = processStartTicks(process.pid);
    const other = { pid: process.pid === 1 ? 2 : 1 };
    // pid 1 runs, but its recorded start time is not the one /proc reports: the pid was reused.
    if (mine !== null) {
      writeFileSync(path.join(dir, LOCK_NAME), JSON.stringify({ ...other, host: hostname(), procStart: 'not-that-process', startedAt: new Date().toISOString() }));
      acquireLock(dir)();
      // The same pid with its true start time is a live owner.
      writeFileSync(path.join(dir, LOCK_NAME), JSON.stringify({ ...other, host: hostname(), procStart: processStartTicks(other.pid), startedAt: new Date().toISOString() }));
      expect(() => acquireLock(dir)).toThrow(LockBusyError);
    }
    writeFileSync(path.join(dir, LOCK_NAME), JSON.stringify({ ...other, startedAt: new Date(Date.now() - LOCK_MAX_AGE_MS - 60_000).toISOString() }));
    acquireLock(dir)();
    writeFileSync(path.join(dir, LOCK_NAME), JSON.stringify({ pid: 2 ** 22 + 7, host: `not-${hostname()}`, startedAt: new Date().toISOString() }));
    expect(() => acquireLock(dir)).toThrow(LockBusyError);
    rmSync(path.join(dir, LOCK_NAME));
  });

  it('records pid, host, start time and process start in the lock it writes', () => {
    const release = acquireLock(dir);
    const info = JSON.parse(readFileSync(path.join(dir, LOCK_NAME), 'utf8'));
    expect(info.pid).toBe(process.pid);
    expect(info.host).toBe(hostname());
    expect(Number.isFinite(Date.parse(info.startedAt))).toBe(true);
    expect(info.procStart).toBe(processStartTicks(process.pid) ?? undefined);
    release();
  });
});
