/**
 * Output folder: safety check, atomic writes, manifest of what we wrote, stale-output cleanup.
 */
import { mkdir, readFile, rename, rm, writeFile, readdir, realpath } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import path from 'node:path';

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
}

/**
 * Writes every output through a temporary file in the output folder and a rename, so a file
 * under its final name is always complete. Tracks the names in a manifest so that a re-run can
 * remove the outputs of the previous run that it does not produce again (only files we wrote).
 */
export class OutputWriter {
  private readonly previous: Set<string>;
  private readonly known: Set<string>;
  private readonly written = new Set<string>();
  private readonly temps = new Set<string>();
  private seq = 0;

  private constructor(readonly dir: string, private readonly runId: string, previous: string[]) {
    this.previous = new Set(previous);
    this.known = new Set(previous);
  }

  /**
   * Open (create) the output folder and read the previous run's manifest. Call with the lock
   * held: temporary files left by an earlier run (killed before it could clean up) are removed.
   */
  static async open(dir: string, runId: string): Promise<OutputWriter> {
    await mkdir(dir, { recursive: true });
    for (const f of await readdir(dir)) {
      if (f.startsWith(TEMP_MARK)) await rm(path.join(dir, f), { force: true });
    }
    let previous: string[] = [];
    try {
      const m = JSON.parse(await readFile(path.join(dir, MANIFEST_NAME), 'utf8')) as Partial<Manifest>;
      if (Array.isArray(m.files)) previous = m.files.filter((f): f is string => typeof f === 'string' && isPlainName(f));
    } catch {
      previous = [];
    }
    return new OutputWriter(dir, runId, previous);
  }

  /** Files written so far in this run, sorted. */
  get files(): string[] {
    return [...this.written].sort();
  }

  /** Atomically write `name` (a plain file name, no folders) with `data`. */
  async write(name: string, data: string | Uint8Array): Promise<void> {
    if (!isPlainName(name)) throw new Error(`refusing to write '${name}': not a plain file name`);
    if (!this.known.has(name)) {
      // Record the name before the file exists, so a killed run's outputs are still cleaned up later.
      this.known.add(name);
      await this.saveManifest([...this.known], false);
    }
    await this.atomic(name, data);
    this.written.add(name);
  }

  /**
   * Park finished bytes in a temporary file now (so they need not stay in memory) and give
   * them their final name later with `commit`. The spool file is removed on interrupt.
   */
  async spool(data: Uint8Array): Promise<string> {
    const tmp = path.join(this.dir, `${TEMP_MARK}${this.runId}-${this.seq++}-spool`);
    this.temps.add(tmp);
    await writeFile(tmp, data);
    return tmp;
  }

  /** Give a spooled file its final name (a rename: atomic), recording it like `write`. */
  async commit(spooled: string, name: string): Promise<void> {
    if (!isPlainName(name)) throw new Error(`refusing to write '${name}': not a plain file name`);
    if (!this.known.has(name)) {
      this.known.add(name);
      await this.saveManifest([...this.known], false);
    }
    await rename(spooled, path.join(this.dir, name));
    this.temps.delete(spooled);
    this.written.add(name);
  }

  /** Remove a previous output (only one listed in the previous manifest: never a file we did not write). */
  async discard(name: string): Promise<void> {
    if (this.previous.has(name) && isPlainName(name)) await rm(path.join(this.dir, name), { force: true });
  }

  /** Remove the previous run's outputs that this run did not write, and record the final manifest. */
  async finish(): Promise<string[]> {
    const stale = [...this.known].filter((f) => !this.written.has(f)).sort();
    for (const f of stale) await rm(path.join(this.dir, f), { force: true });
    await this.saveManifest(this.files, true);
    return stale;
  }

  /** Remove this run's temporary files (after an interrupt). Synchronous-safe to call twice. */
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

  private async saveManifest(files: string[], complete: boolean): Promise<void> {
    const m: Manifest = { tool: 'spherecov', complete, files: [...files].sort() };
    await this.atomic(MANIFEST_NAME, JSON.stringify(m, null, 2) + '\n');
  }

  private async atomic(name: string, data: string | Uint8Array): Promise<void> {
    const tmp = path.join(this.dir, `${TEMP_MARK}${this.runId}-${this.seq++}-${name}`);
    this.temps.add(tmp);
    try {
      await writeFile(tmp, data);
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
