/**
 * Output folder: safety check, atomic writes, manifest of what we wrote, stale-output cleanup.
 */
import { lstat, mkdir, readFile, rename, rm, writeFile, readdir, realpath } from 'node:fs/promises';
import { createHash, randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { injectFault } from './faults.js';

export const MANIFEST_NAME = '.spherecov-manifest.json';
export const TEMP_MARK = '.spherecov-tmp-';

/** The resolved path with symlinks followed as far as the path exists (a new out dir does not). */
async function realOrResolved(p: string): Promise<string> {
  let cur = path.resolve(p);
  const rest: string[] = [];
  for (;;) {
    try {
      return path.join(await realpath(cur), ...rest);
    } catch {
      const parent = path.dirname(cur);
      if (parent === cur) return path.resolve(p);
      rest.unshift(path.basename(cur));
      cur = parent;
    }
  }
}

/**
 * Refuse an output folder equal to or inside the input folder (a re-run would read its own
 * outputs), unless forced. Returns a plain-words problem, or null when the folder is fine.
 */
export async function outputDirProblem(inputPath: string, outDir: string, force: boolean): Promise<string | null> {
  if (force) return null;
  const input = await realOrResolved(inputPath);
  const out = await realOrResolved(outDir);
  const rel = path.relative(input, out);
  if (rel === '' || (!rel.startsWith('..') && !path.isAbsolute(rel))) {
    return `the output folder '${outDir}' is the input folder or inside it; choose another --out or add --force`;
  }
  return null;
}

interface Manifest {
  tool: 'spherecov';
  complete: boolean;
  files: string[];
  /**
   * SHA-256 (hex) of each file's content as this tool wrote it (up to two per name: the one on
   * disk and the one being written). A file is only ever deleted when its content still has one
   * of these hashes: a manifest that someone else wrote, or a file that someone replaced, never
   * makes the tool delete a file it did not write.
   */
  sha256: Record<string, string[]>;
}

/** Where a writer reports test pauses and what stops them (see faults.ts); both optional. */
export interface WriterContext {
  signal?: AbortSignal;
  stderr?: (t: string) => void;
}

/** A random run id for temporary names (not guessable, so nobody can plant a link there first). */
export function randomRunId(): string {
  return `${process.pid}-${randomBytes(8).toString('hex')}`;
}

function sha256(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

/** SHA-256 of a regular file's content, or null when it is missing, not a regular file, or unreadable. */
async function fileHash(file: string): Promise<string | null> {
  try {
    const st = await lstat(file);
    if (!st.isFile()) return null;
    return sha256(await readFile(file));
  } catch {
    return null;
  }
}

/**
 * Writes every output through a temporary file in the output folder and a rename, so a file
 * under its final name is always complete. Temporary files have random names and are created
 * exclusively (O_CREAT|O_EXCL: a link planted under that name makes the write fail instead of
 * being followed). Tracks the names and content hashes in a manifest so that a re-run can remove
 * the outputs of the previous run that it does not produce again (only files we wrote, with the
 * content we wrote).
 */
export class OutputWriter {
  private readonly previous: Map<string, string[]>;
  private readonly known: Map<string, string[]>;
  private readonly written = new Set<string>();
  private readonly temps = new Set<string>();
  private seq = 0;

  private constructor(
    readonly dir: string,
    private readonly runId: string,
    previous: Map<string, string[]>,
    private readonly ctx: WriterContext,
  ) {
    this.previous = previous;
    this.known = new Map([...previous].map(([k, v]) => [k, [...v]]));
  }

  /**
   * Open (create) the output folder and read the previous run's manifest. Call with the lock
   * held: temporary files left by an earlier run (killed before it could clean up) are removed.
   */
  static async open(dir: string, runId: string = randomRunId(), ctx: WriterContext = {}): Promise<OutputWriter> {
    await mkdir(dir, { recursive: true });
    for (const f of await readdir(dir)) {
      if (f.startsWith(TEMP_MARK)) await rm(path.join(dir, f), { force: true });
    }
    const previous = new Map<string, string[]>();
    try {
      const text = await readFile(path.join(dir, MANIFEST_NAME), 'utf8');
      const m = JSON.parse(text) as Partial<Manifest>;
      const hashes = m.sha256 && typeof m.sha256 === 'object' ? m.sha256 : {};
      if (Array.isArray(m.files)) {
        for (const f of m.files) {
          if (typeof f !== 'string' || !isPlainName(f)) continue;
          const hs = (hashes as Record<string, unknown>)[f];
          // A name without a recorded hash (a manifest of an older version, or not ours) is
          // remembered but never deleted: nothing proves the file is ours.
          previous.set(f, Array.isArray(hs) ? hs.filter((h): h is string => typeof h === 'string' && /^[0-9a-f]{64}$/.test(h)) : []);
        }
      }
    } catch {
      previous.clear();
    }
    return new OutputWriter(dir, runId, previous, ctx);
  }

  /** Files written so far in this run, sorted. */
  get files(): string[] {
    return [...this.written].sort();
  }

  /** Atomically write `name` (a plain file name, no folders) with `data`. */
  async write(name: string, data: string | Uint8Array): Promise<void> {
    if (!isPlainName(name)) throw new Error(`refusing to write '${name}': not a plain file name`);
    await this.fault(name, 'open');
    // Record the name and the hash before the file exists, so a killed run's outputs are still
    // recognised (and cleaned up) by the next run.
    await this.remember(name, sha256(data));
    await this.atomic(name, data);
    this.written.add(name);
    this.keepOnly(name, sha256(data));
  }

  /**
   * Park finished bytes in a temporary file now (so they need not stay in memory) and give
   * them their final name later with `commit`. The spool file is removed on interrupt.
   */
  async spool(data: Uint8Array): Promise<string> {
    const tmp = this.tempName('spool');
    this.temps.add(tmp);
    await this.fault('spool', 'open');
    await writeFile(tmp, data, { flag: 'wx' });
    this.spoolHash.set(tmp, sha256(data));
    return tmp;
  }

  private readonly spoolHash = new Map<string, string>();

  /** Give a spooled file its final name (a rename: atomic), recording it like `write`. */
  async commit(spooled: string, name: string): Promise<void> {
    if (!isPlainName(name)) throw new Error(`refusing to write '${name}': not a plain file name`);
    await this.fault(name, 'rename');
    const hash = this.spoolHash.get(spooled) ?? (await fileHash(spooled)) ?? '';
    await this.remember(name, hash);
    await rename(spooled, path.join(this.dir, name));
    this.temps.delete(spooled);
    this.spoolHash.delete(spooled);
    this.written.add(name);
    this.keepOnly(name, hash);
  }

  /** Remove a previous output (only one this tool wrote, with the content it wrote). */
  async discard(name: string): Promise<void> {
    if (isPlainName(name) && (await this.ownedNow(name, this.previous))) await rm(path.join(this.dir, name), { force: true });
  }

  /** Remove the previous run's outputs that this run did not write, and record the final manifest. */
  async finish(): Promise<string[]> {
    const stale = [...this.known.keys()].filter((f) => !this.written.has(f)).sort();
    const removed: string[] = [];
    for (const f of stale) {
      if (await this.ownedNow(f, this.known)) {
        await rm(path.join(this.dir, f), { force: true });
        removed.push(f);
      }
    }
    const final = new Map([...this.known].filter(([f]) => this.written.has(f)));
    await this.saveManifest(final, true);
    return removed;
  }

  /** Remove this run's temporary files (after an interrupt or a failure). Safe to call twice. */
  async removeTemps(): Promise<void> {
    for (const t of this.temps) await rm(t, { force: true });
    this.temps.clear();
    for (const f of await readdir(this.dir).catch(() => [] as string[])) {
      if (f.includes(TEMP_MARK + this.runId)) await rm(path.join(this.dir, f), { force: true });
    }
  }

  /** True when `name` was written by a previous run (listed in its manifest). */
  hadPrevious(name: string): boolean {
    return this.previous.has(name);
  }

  /** Is the file `name` on disk (a regular file) one whose content hash `table` records? */
  private async ownedNow(name: string, table: Map<string, string[]>): Promise<boolean> {
    const hashes = table.get(name) ?? [];
    if (hashes.length === 0) return false;
    const h = await fileHash(path.join(this.dir, name));
    return h !== null && hashes.includes(h);
  }

  /** Add `hash` to the hashes recorded for `name` and save the (incomplete) manifest. */
  private async remember(name: string, hash: string): Promise<void> {
    const hs = this.known.get(name) ?? [];
    if (hs.includes(hash) && this.known.has(name)) return;
    // Keep the hash of what is on disk now (the previous run's) and the new one.
    this.known.set(name, [...hs.slice(-1), hash]);
    await this.saveManifest(this.known, false);
  }

  /** After `name` got its new content, only that content's hash is ours on disk. */
  private keepOnly(name: string, hash: string): void {
    this.known.set(name, [hash]);
  }

  private tempName(tag: string): string {
    return path.join(this.dir, `${TEMP_MARK}${this.runId}-${this.seq++}-${tag}`);
  }

  private async fault(where: string, syscall: string): Promise<void> {
    await injectFault(where, syscall, path.join(this.dir, where), this.ctx.signal, this.ctx.stderr ?? (() => undefined));
  }

  private async saveManifest(table: Map<string, string[]>, complete: boolean): Promise<void> {
    const files = [...table.keys()].sort();
    const m: Manifest = { tool: 'spherecov', complete, files, sha256: Object.fromEntries(files.map((f) => [f, table.get(f) as string[]])) };
    await this.fault('manifest', 'open');
    await this.atomic(MANIFEST_NAME, JSON.stringify(m, null, 2) + '\n');
  }

  private async atomic(name: string, data: string | Uint8Array): Promise<void> {
    const tmp = this.tempName(name);
    this.temps.add(tmp);
    try {
      await writeFile(tmp, data, { flag: 'wx' });
      await rename(tmp, path.join(this.dir, name));
    } finally {
      this.temps.delete(tmp);
      if (existsSync(tmp)) await rm(tmp, { force: true });
    }
  }
}

/** A file name without any folder part, not hidden-by-dots trickery like `..`. */
function isPlainName(name: string): boolean {
  return name !== '' && name !== '.' && name !== '..' && !/[\\/\0]/.test(name);
}
