/**
 * The one file walker: which files under an input are chamber exports. `spherecov analyze`
 * (src/batch/discover.ts) and `spherecov inspect` (inspectInput.ts) both call it, so the two
 * commands always see the same files in the same order.
 */
import { readdir, realpath, stat } from 'node:fs/promises';
import path from 'node:path';
import type { InputError } from '../types.js';
import { fsReason, isFsError } from './fsProblem.js';

const EXPORT_EXT = new Set(['.csv', '.tsv', '.txt']);

export interface ExportFiles {
  /** Absolute input root (the folder, or the folder holding the one input file). */
  root: string;
  /** Absolute paths of the export files, sorted by their path relative to root (code-point order). */
  files: string[];
  /** Symbolic links skipped: broken, or pointing outside the input folder (paths relative to root). */
  skippedLinks: string[];
  /**
   * Entries that could not be read (a subfolder without read permission, a path longer than the
   * system allows, a pipe or device named like an export): input errors of the run (exit 2);
   * everything else is still read.
   */
  problems: InputError[];
}

export interface FindOptions {
  /** Absolute folders not to enter (analyze's output folder under `--force`). */
  exclude?: string[];
  /** Called before each folder is listed (relative POSIX path, '' for the root): fault injection in tests. */
  beforeListing?: (relPosix: string, abs: string) => void;
}

/** The input itself is neither a regular file nor a folder (a pipe, a device, a socket). */
export class NotFileOrFolderError extends Error {
  override name = 'NotFileOrFolderError';
}

/** Code-point comparison: the same order on every platform and locale. */
export function byCodePoint(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** A path with '/' separators (results and messages are the same on every platform). */
export function toPosix(p: string): string {
  return p.split(path.sep).join('/');
}

function entryKind(st: { isFIFO(): boolean; isCharacterDevice(): boolean; isBlockDevice(): boolean; isSocket(): boolean }): string {
  if (st.isFIFO()) return 'a pipe (FIFO)';
  if (st.isCharacterDevice() || st.isBlockDevice()) return 'a device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

const isExportName = (name: string): boolean => EXPORT_EXT.has(path.extname(name).toLowerCase());

function inside(root: string, p: string): boolean {
  const rel = path.relative(root, p);
  return rel === '' || (!rel.startsWith('..') && !path.isAbsolute(rel));
}

/** What a directory entry is once links are resolved; 'skip' for entries that are not walked. */
type EntryKind = { kind: 'dir' | 'file'; real: string } | { kind: 'link-out' } | { kind: 'special'; what: string } | { kind: 'skip' };

/**
 * Resolve one directory entry. Symbolic links are followed only when their target lies inside the
 * input folder: a link out of it could make a run read, and report on, unrelated data.
 */
async function resolveEntry(ent: import('node:fs').Dirent, p: string, dirReal: string, realRoot: string): Promise<EntryKind> {
  if (!ent.isSymbolicLink()) {
    if (ent.isDirectory()) return { kind: 'dir', real: path.join(dirReal, ent.name) };
    if (ent.isFile()) return { kind: 'file', real: path.join(dirReal, ent.name) };
    const what = ent.isFIFO() ? 'a pipe (FIFO)' : ent.isSocket() ? 'a socket' : 'a device';
    return isExportName(ent.name) ? { kind: 'special', what } : { kind: 'skip' };
  }
  let real: string;
  try {
    real = await realpath(p);
  } catch {
    return { kind: 'link-out' }; // broken link
  }
  if (!inside(realRoot, real)) return { kind: 'link-out' };
  const t = await stat(real);
  if (t.isDirectory()) return { kind: 'dir', real };
  if (t.isFile()) return { kind: 'file', real };
  return isExportName(ent.name) ? { kind: 'special', what: entryKind(t) } : { kind: 'skip' };
}

/**
 * Find the export files under an input: `.csv`, `.tsv`, `.txt` (any case), recursively. Hidden
 * entries (a leading dot) are not walked; the job file (spherecov.yaml|yml|json) never has an
 * export's extension. Symbolic links are followed only inside the input folder, and each real
 * folder and file is taken once (link cycles end, and no beam is counted twice). Unreadable
 * entries become `problems`; the rest is still found. A file path gives itself.
 * Cost: one listing per folder, one realpath + stat per symbolic link.
 * @throws NotFileOrFolderError when the input is a pipe, device or socket; the file system's
 *   error when the input does not exist or cannot be listed at all.
 */
export async function findExportFiles(input: string, opts: FindOptions = {}): Promise<ExportFiles> {
  const abs = path.resolve(input);
  const st = await stat(abs);
  if (st.isFile()) return { root: path.dirname(abs), files: [abs], skippedLinks: [], problems: [] };
  if (!st.isDirectory()) {
    // A pipe (`analyze <(cat f.csv)`) or a device can be read only once, as a stream, and may
    // never end; the readers need a file they can measure and read again.
    throw new NotFileOrFolderError(`the input '${input}' is ${entryKind(st)}, not a file or a folder of exports; save it to a file first (for example: cat … > unit.csv) and analyze that`);
  }
  const realRoot = await realpath(abs);
  const realExclude = await Promise.all((opts.exclude ?? []).map((e) => realpath(e).catch(() => path.resolve(e))));
  const found: ExportFiles = { root: abs, files: [], skippedLinks: [], problems: [] };
  const seenDirs = new Set<string>();
  const seenFiles = new Set<string>();
  const problem = (p: string, what: string): void => {
    const file = toPosix(path.relative(abs, p)) || path.basename(p);
    found.problems.push({ file, message: `${file}: ${what}` });
  };

  async function walk(dirAbs: string, dirReal: string): Promise<void> {
    if (seenDirs.has(dirReal) || realExclude.some((e) => inside(e, dirReal))) return;
    seenDirs.add(dirReal);
    let entries;
    try {
      opts.beforeListing?.(toPosix(path.relative(abs, dirAbs)), dirAbs);
      entries = await readdir(dirAbs, { withFileTypes: true });
    } catch (e) {
      if (!isFsError(e)) throw e;
      problem(dirAbs, `cannot read this folder: ${fsReason(e)}; its exports were not analyzed`);
      return;
    }
    entries.sort((a, b) => byCodePoint(a.name, b.name));
    for (const ent of entries) {
      if (ent.name.startsWith('.')) continue;
      const p = path.join(dirAbs, ent.name);
      const r = await resolveEntry(ent, p, dirReal, realRoot);
      if (r.kind === 'link-out') found.skippedLinks.push(path.relative(abs, p));
      else if (r.kind === 'special') problem(p, `${r.what}, not a regular file; not read`);
      else if (r.kind === 'dir') await walk(p, r.real);
      else if (r.kind === 'file' && isExportName(ent.name) && !seenFiles.has(r.real)) {
        seenFiles.add(r.real);
        found.files.push(p);
      }
    }
  }

  await walk(abs, realRoot);
  found.files.sort((a, b) => byCodePoint(toPosix(path.relative(abs, a)), toPosix(path.relative(abs, b))));
  found.problems.sort((a, b) => byCodePoint(a.file, b.file));
  return found;
}
