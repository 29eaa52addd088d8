/**
 * Issue 20: an input folder prepared by someone else, a full disk, a shared output folder.
 * Each case of the table, end-to-end through the built CLI: a clear located error or a
 * correct result, no hang, nothing read or written outside what the user named, exit 2 for
 * input/output problems (never 3), the lock and temporary files gone, the manifest truthful.
 *
 * A full disk and a refused permission are injected (SPHERECOV_TEST_FAULTS, src/batch/faults.ts:
 * the file-system call fails with the errno the OS would give), because CI runs as root (which
 * ignores permissions) and may not mount a small tmpfs. Where the real condition can be made
 * (a FIFO, a path longer than PATH_MAX, a permission when not root) it is used as well.
 */
import { cpSync, existsSync, mkdirSync, readdirSync, readFileSync, symlinkSync, writeFileSync, chmodSync } from 'node:fs';
import { execFileSync, spawnSync } from 'node:child_process';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';
import { BIN, DATE, finalFiles, LOCK, MANIFEST, runSync, TEMP_MARK, tmp } from './cliHarness.js';
import type { ResultsFile } from '../../src/types.js';
import pngjs from 'pngjs';

const { PNG } = pngjs;

const PASS = path.join(ROOT, 'fixtures', 'cli', 'pass');
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

beforeAll(() => ensureBuilt(), 180_000);

/** A copy of the two-unit passing fixture, with an optional job file. */
function input(job?: string): string {
  const dir = path.join(tmp('hin'), 'in');
  cpSync(PASS, dir, { recursive: true });
  if (job !== undefined) writeFileSync(path.join(dir, 'spherecov.yaml'), job);
  return dir;
}

function analyze(inDir: string, out: string, extra: string[] = [], env: NodeJS.ProcessEnv = {}, cwd?: string) {
  return runSync([BIN, 'analyze', inDir, '--out', out, '--creation-date', DATE, '--quiet', ...extra], { ...process.env, ...env }, cwd);
}

function mkfifo(p: string): void {
  execFileSync('mkfifo', [p]);
}

/** No lock and no temporary file left in `out` (when it exists). */
function expectClean(out: string): void {
  if (!existsSync(out)) return;
  expect(readdirSync(out).filter((f) => f.startsWith(TEMP_MARK) || f.startsWith(LOCK))).toEqual([]);
}

function expectUserError(r: { code: number | null; stderr: string }, re: RegExp): void {
  expect(r.code, r.stderr).toBe(2);
  expect(r.stderr).toMatch(re);
  expect(r.stderr).not.toMatch(/internal error|^\s+at /m);
}

describe('files named by a job file: the trust boundary', () => {
  it('a limit set that is a password file or an environment dump: a located error quoting a short excerpt only', () => {
    for (const target of ['/etc/passwd', '/proc/self/environ']) {
      if (!existsSync(target)) continue;
      const r = analyze(input(`limits: ${target}\n`), tmp('o'), ['--no-pdf']);
      expectUserError(r, new RegExp(`the job file's limits: ${target}:1:1: \\(top level\\): found '.{1,61}', expected a mapping`));
      // The whole file is never echoed: one line of message, shorter than the file.
      expect(r.stderr.split('\n').filter(Boolean)).toHaveLength(1);
      expect(r.stderr.length).toBeLessThan(300);
    }
  });

  it('/dev/zero as the limit set: refused at once (a device), no unbounded read', () => {
    const r = analyze(input('limits: /dev/zero\n'), tmp('o'), ['--no-pdf']);
    expectUserError(r, /limits: \/dev\/zero: found a device, expected a regular file \(a limit set\)/);
  });

  it('a FIFO as the limit set, as the report logo, and as spherecov.yaml itself: an error, no hang', () => {
    const dir = input();
    mkfifo(path.join(dir, 'pipe.yaml'));
    let r = analyze(dir, tmp('o'), ['--no-pdf'], {}, undefined);
    // The FIFO in the input folder is not an export (.yaml), so the run itself is fine.
    expect(r.code).toBe(0);
    writeFileSync(path.join(dir, 'spherecov.yaml'), 'limits: pipe.yaml\n');
    r = analyze(dir, tmp('o'), ['--no-pdf']);
    expectUserError(r, /the job file's limits: pipe\.yaml: found a pipe \(FIFO\), expected a regular file \(a limit set\)/);
    writeFileSync(path.join(dir, 'spherecov.yaml'), 'report:\n  logo: pipe.yaml\n');
    r = analyze(dir, tmp('o'));
    expectUserError(r, /report\.logo: pipe\.yaml: found a pipe \(FIFO\), expected a regular file \(a logo\)/);
    const dir2 = input();
    mkfifo(path.join(dir2, 'spherecov.yaml'));
    r = analyze(dir2, tmp('o'), ['--no-pdf']);
    expectUserError(r, /spherecov\.yaml: found a pipe \(FIFO\), expected a regular file \(a job file\)/);
  });

  it('an oversized limit set: refused with the cap named', () => {
    const dir = input('limits: big.yaml\n');
    writeFileSync(path.join(dir, 'big.yaml'), `# ${'x'.repeat(1024 * 1024 + 10)}\n`);
    const r = analyze(dir, tmp('o'), ['--no-pdf']);
    expectUserError(r, /big\.yaml: found \d+ bytes, expected at most 1048576 bytes for a limit set/);
  });

  it('a relative limit-set path is relative to the job file: the same verdict from any working directory', () => {
    const dir = input('limits: my-limits.yaml\n');
    // A check every unit of the fixture fails (no unit has a 99 dBm peak), so the limit set is
    // visibly applied (exit 1) — or, before the fix, not found from the repository root.
    writeFileSync(path.join(dir, 'my-limits.yaml'), 'name: strict\nquantity: eirp\nchecks:\n  - kind: min-peak\n    limit: 99\n');
    const fromRoot = analyze(dir, tmp('o'), ['--no-pdf']);
    const fromInput = analyze(dir, tmp('o'), ['--no-pdf'], {}, dir);
    const fromTmp = analyze(dir, tmp('o'), ['--no-pdf'], {}, tmp('cwd'));
    for (const r of [fromRoot, fromInput, fromTmp]) {
      expect(r.stderr).toBe('');
      expect(r.code).toBe(1);
    }
  });

  it('a logo that is not PNG/JPEG is refused; a PNG one relative to the job file is embedded', () => {
    const dir = input('report:\n  logo: logo.png\n');
    writeFileSync(path.join(dir, 'logo.png'), 'not an image');
    expectUserError(analyze(dir, tmp('o')), /report\.logo: 'logo\.png' is neither a PNG nor a JPEG image/);
    // A damaged PNG (right signature, broken data) is refused before any PDF is drawn.
    const png = PNG.sync.write(Object.assign(new PNG({ width: 4, height: 4 }), { data: Buffer.alloc(64, 200) }));
    const broken = Buffer.from(png);
    broken.fill(0x55, 40, 60);
    writeFileSync(path.join(dir, 'logo.png'), broken);
    expectUserError(analyze(dir, tmp('o')), /report\.logo: 'logo\.png' is a damaged PNG image/);
    writeFileSync(path.join(dir, 'logo.png'), png);
    const out = tmp('o');
    const r = analyze(dir, out, [], {}, tmp('cwd'));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(readFileSync(path.join(out, 'U-01_28GHz.pdf')).includes('/Subtype /Image')).toBe(true);
  });

  it("the job file's reference may name only a unit of the build, never a folder outside the input", () => {
    for (const ref of ['/usr/share', '/']) {
      const r = analyze(input(`reference: ${ref}\n`), tmp('o'), ['--no-pdf']);
      expectUserError(r, /the job file's reference: '.+' is not a unit of this build; .* --reference <folder>/);
    }
    const ok = analyze(input('reference: U-01\n'), tmp('o'), ['--no-pdf']);
    expect(ok.stderr).toBe('');
    expect(ok.code).toBe(0);
  });

  it('a YAML alias bomb in a job file or a limit file: a clear error, exit 2', () => {
    const bomb = ['a: &a [x,x,x,x,x,x,x,x,x]', 'b: &b [*a,*a,*a,*a,*a,*a,*a,*a,*a]', 'c: &c [*b,*b,*b,*b,*b,*b,*b,*b,*b]',
      'd: &d [*c,*c,*c,*c,*c,*c,*c,*c,*c]', 'e: &e [*d,*d,*d,*d,*d,*d,*d,*d,*d]', 'f: [*e,*e,*e,*e,*e,*e,*e,*e,*e]', ''].join('\n');
    expectUserError(analyze(input(bomb), tmp('o'), ['--no-pdf']), /spherecov\.yaml: aliases: found more than 100 alias expansions/);
    const dir = input();
    const lim = path.join(tmp('lim'), 'bomb.yaml');
    writeFileSync(lim, bomb);
    expectUserError(analyze(dir, tmp('o'), ['--no-pdf', '--limits', lim]), /--limits: .*bomb\.yaml: aliases: found more than 100 alias expansions/);
  });
});

describe('inputs that are not files or folders', () => {
  it('a FIFO given as the input: exit 2 in plain words, no hang', () => {
    const p = path.join(tmp('fifo'), 'unit.csv');
    mkfifo(p);
    const out = tmp('o');
    expectUserError(analyze(p, out, ['--no-pdf']), /is a pipe \(FIFO\), not a file or a folder of exports; save it to a file first/);
    expectClean(out);
  });

  it('analyze <(cat f.csv): fails clearly (a pipe), exit 2', () => {
    const f = path.join(PASS, 'U-01', readdirSync(path.join(PASS, 'U-01'))[0]);
    const out = tmp('o');
    const r = spawnSync('bash', ['-c', `"${process.execPath}" "${BIN}" analyze <(cat "${f}") --out "${out}" --no-pdf --quiet`], { encoding: 'utf8', timeout: 120_000 });
    expect(r.status, r.stderr).toBe(2);
    expect(r.stderr).toMatch(/^spherecov: the input '\/dev\/fd\/\d+' is a pipe \(FIFO\)/);
  });

  it('a device given as the input: exit 2', () => {
    expectUserError(analyze('/dev/null', tmp('o'), ['--no-pdf']), /the input '\/dev\/null' is a device/);
  });

  it('a FIFO named like an export inside the input folder: reported, the rest analyzed', () => {
    const dir = input();
    mkfifo(path.join(dir, 'U-02', 'stuck_28GHz.csv'));
    const out = tmp('o');
    const r = analyze(dir, out, ['--no-pdf']);
    expectUserError(r, /U-02\/stuck_28GHz\.csv: a pipe \(FIFO\), not a regular file; not read/);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => u.unit)).toEqual(['U-01', 'U-02']);
    expectClean(out);
  });
});

describe('folders that cannot be read', () => {
  it('an unreadable subfolder (injected EACCES): exit 2 naming it, the other units analyzed and written', () => {
    const out = tmp('o');
    const r = analyze(input(), out, ['--no-pdf'], { SPHERECOV_TEST_FAULTS: 'EACCES:folder:U-02' });
    expectUserError(r, /^spherecov: U-02: cannot read this folder: permission denied \[EACCES\]; its exports were not analyzed$/m);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => u.unit)).toEqual(['U-01']);
    expect(res.errors.map((e) => e.file)).toEqual(['U-02']);
    expectClean(out);
  });

  it.skipIf(isRoot)('an unreadable subfolder (real chmod 000; skipped as root, which ignores permissions)', () => {
    const dir = input();
    chmodSync(path.join(dir, 'U-02'), 0o000);
    try {
      const out = tmp('o');
      expectUserError(analyze(dir, out, ['--no-pdf']), /U-02: cannot read this folder: permission denied \[EACCES\]/);
      expect(existsSync(path.join(out, 'results.json'))).toBe(true);
    } finally {
      chmodSync(path.join(dir, 'U-02'), 0o755);
    }
  });

  it('a path longer than the operating system allows: exit 2 naming the problem, the rest analyzed', () => {
    const dir = input();
    // Nest folders until the absolute path passes PATH_MAX (4096 on Linux); mkdir works step by
    // step through a relative path from the previous level.
    let rel = path.join(dir, 'U-01');
    const seg = 'n'.repeat(200);
    let depth = 0;
    while (rel.length < 4300) {
      execFileSync('mkdir', [seg], { cwd: rel.length < 3800 ? rel : undefined, stdio: 'ignore' });
      rel = path.join(rel, seg);
      depth++;
      if (rel.length >= 3800) break;
    }
    // The last levels through a shell `cd` chain, since the path itself is too long to name.
    execFileSync('bash', ['-c', `cd "${rel}" && for i in 1 2 3 4; do mkdir ${seg} && cd ${seg}; done && printf 'theta,phi,eirp_dbm\\n0,0,1\\n' > deep.csv`]);
    expect(depth).toBeGreaterThan(10);
    const out = tmp('o');
    const r = analyze(dir, out, ['--no-pdf']);
    expectUserError(r, /the path is longer than the operating system allows \[ENAMETOOLONG\]/);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => u.unit)).toEqual(['U-01', 'U-02']);
    expectClean(out);
  });
});

describe('a full disk while writing', () => {
  for (const where of ['spool', 'summary.pdf', 'results.json', 'manifest']) {
    it(`ENOSPC at ${where}: exit 2 in plain words, lock and temporaries removed, no results.json, manifest not complete`, () => {
      const out = tmp('o');
      const r = analyze(input(), out, [], { SPHERECOV_TEST_FAULTS: `ENOSPC:${where}` });
      expectUserError(r, /could not write to the output folder '.+'.*: the disk is full \(no space left on the device\) \[ENOSPC\]; .*temporary files were removed/);
      expectClean(out);
      expect(existsSync(path.join(out, 'results.json'))).toBe(false);
      if (existsSync(path.join(out, MANIFEST))) expect(JSON.parse(readFileSync(path.join(out, MANIFEST), 'utf8')).complete).toBe(false);
      // The next run (disk freed) takes the lock and completes.
      const again = analyze(input(), out, []);
      expect(again.stderr).toBe('');
      expect(again.code).toBe(0);
      expect(JSON.parse(readFileSync(path.join(out, MANIFEST), 'utf8')).complete).toBe(true);
    }, 120_000);
  }
});

describe('a shared output folder', () => {
  it('a foreign manifest listing precious.txt: the file is kept', () => {
    const out = tmp('o');
    writeFileSync(path.join(out, 'precious.txt'), 'not spherecov\'s');
    writeFileSync(path.join(out, MANIFEST), JSON.stringify({ tool: 'spherecov', complete: true, files: ['precious.txt'] }));
    const r = analyze(input(), out, ['--no-pdf']);
    expect(r.code).toBe(0);
    expect(readFileSync(path.join(out, 'precious.txt'), 'utf8')).toBe('not spherecov\'s');
  });

  it('a symbolic link planted as the lock: its target outside --out is neither read as a lock nor written', () => {
    const out = tmp('o');
    const victim = path.join(tmp('victim'), 'victim.txt');
    writeFileSync(victim, 'keep me');
    symlinkSync(victim, path.join(out, LOCK));
    const r = analyze(input(), out, ['--no-pdf']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(readFileSync(victim, 'utf8')).toBe('keep me');
    expectClean(out);
    expect(finalFiles(out)).toContain('results.json');
  });
});

describe('identity patterns that cannot hang', () => {
  it("'^(a+)+$' against a 40-character folder name completes (RE2: linear time; a backtracking engine needs 2^40 steps)", () => {
    const dir = path.join(tmp('re'), 'in');
    cpSync(path.join(PASS, 'U-01'), path.join(dir, `${'a'.repeat(40)}b`), { recursive: true });
    writeFileSync(path.join(dir, 'spherecov.yaml'), "identity:\n  unit: '^(a+)+$'\n");
    const out = tmp('o');
    const r = analyze(dir, out, ['--no-pdf']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    // The pattern does not match (the name ends in b): the path rule names the unit.
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => u.unit)).toEqual([`${'a'.repeat(40)}b`]);
  });

  it('a pattern RE2 refuses (a back-reference) is a job-file error with its key path and position', () => {
    const r = analyze(input("identity:\n  unit: '(PX)-\\1'\n"), tmp('o'), ['--no-pdf']);
    expectUserError(r, /spherecov\.yaml:2:9: identity\.unit: found '\(PX\)-\\1', expected a regular expression the linear-time RE2 engine accepts .*invalid escape sequence/);
  });
});

describe('Unicode names', () => {
  it('a unit name in NFC and NFD forms is one unit; the spellings as written are kept in results.json', () => {
    const nfc = 'Caf\u00e9-01';
    const nfd = 'Cafe\u0301-01';
    expect(nfc).not.toBe(nfd);
    expect(nfd.normalize('NFC')).toBe(nfc);
    const dir = path.join(tmp('nfc'), 'in');
    const src = path.join(PASS, 'U-01');
    const beams = readdirSync(src).sort();
    mkdirSync(path.join(dir, nfc), { recursive: true });
    mkdirSync(path.join(dir, nfd), { recursive: true });
    // Half of the unit's beams in each folder (the same unit copied from two chamber PCs).
    beams.forEach((f, i) => cpSync(path.join(src, f), path.join(dir, i % 2 ? nfd : nfc, f)));
    const out = tmp('o');
    const r = analyze(dir, out, ['--no-pdf']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => u.unit)).toEqual([nfc]);
    expect(res.units[0].beams).toHaveLength(beams.length);
    expect(res.units[0].unitAsWritten).toEqual([nfd, nfc].sort());
  });
});

describe('numbers out of any sane range', () => {
  /** One beam on a 15° grid, `pole` at θ = 0 and 10 dBm elsewhere. */
  function poleFile(dir: string, pole: string, header = 'theta_deg,phi_deg,eirp_dbm'): void {
    const rows = [header];
    for (let t = 0; t <= 180; t += 15) for (let p = 0; p < 360; p += 15) rows.push(`${t},${p},${t === 0 ? pole : '10'}`);
    mkdirSync(dir, { recursive: true });
    writeFileSync(path.join(dir, 'U-09_beam1_28GHz.csv'), rows.join('\n') + '\n');
  }

  it('1e308 dBm at a pole: a located input error naming file:line:column, no internal function', () => {
    for (const [pole, header] of [['1e308', 'theta_deg,phi_deg,eirp_dbm'], ['1e300', 'theta_deg,phi_deg,eirp_mw'], ['-1e308', 'theta_deg,phi_deg,eirp_dbm']]) {
      const dir = path.join(tmp('pole'), 'in');
      poleFile(dir, pole, header);
      const out = tmp('o');
      const r = analyze(dir, out, ['--no-pdf']);
      expect(r.code, r.stderr).toBe(2);
      // Line 2 is the first data row (θ = 0, φ = 0); column 7 is the value field.
      expect(r.stderr).toMatch(new RegExp(`U-09_beam1_28GHz\\.csv:2:\\d+: eirp_(dbm|mw): found '${pole.replace('-', '\\-')}', expected a number between -500 and 500`));
      expect(r.stderr).not.toMatch(/createMeasurement|internal error/);
    }
  });

  it('a limit of -1e308, a coverage threshold of 1e309 and a calibration offset of 1e300: located errors, exit 2', () => {
    const dir = input('limits: lim.yaml\n');
    writeFileSync(path.join(dir, 'lim.yaml'), 'name: x\nquantity: eirp\nchecks:\n  - kind: min-peak\n    limit: -1e308\n');
    expectUserError(analyze(dir, tmp('o'), ['--no-pdf']), /lim\.yaml:5:12: checks\[0\]\.limit: found '-1e\+308', expected a number between -500 and 500/);
    expectUserError(analyze(input('coverage_thresholds: [10, 1e309]\n'), tmp('o'), ['--no-pdf']), /spherecov\.yaml:1:\d+: coverage_thresholds\[1\]: found '.*', expected a (number|finite)/);
    expectUserError(analyze(input('coverage_thresholds: [10, -1e300]\n'), tmp('o'), ['--no-pdf']), /coverage_thresholds\[1\]: found '-1e\+300', expected a number between -500 and 500/);
    expectUserError(analyze(input('calibration:\n  table:\n    - frequency_ghz: 28\n      offset_db: 1e300\n'), tmp('o'), ['--no-pdf']),
      /spherecov\.yaml:4:18: calibration\.table\[0\]\.offset_db: found '1e\+300', expected a finite offset between -200 and 200 dB/);
    expectUserError(analyze(input(), tmp('o'), ['--no-pdf', '--coverage-thresholds', '-1e308']), /--coverage-thresholds: found '-1e308', expected a number between -500 and 500/);
  });
});
