/**
 * Discovery: the export files under the input, in a deterministic order.
 */
import { readdir, realpath, stat } from 'node:fs/promises';
import path from 'node:path';
import { existsSync } from 'node:fs';
import { pathIdentity } from '../io/pathIdentity.js';
import type { JobSpec } from '../io/types.js';
import type { InputError } from '../types.js';
import { fsReason, isFsError } from '../io/fsProblem.js';
import { injectFaultSync } from './faults.js';

const EXPORT_EXT = new Set(['.csv', '.tsv', '.txt']);
const JOB_FILES = new Set(['spherecov.yaml', 'spherecov.yml', 'spherecov.json']);

export interface Discovery {
  /** Absolute input root (the folder, or the folder holding the one input file). */
  root: string;
  /** Absolute paths of the export files, sorted by their path relative to root (code-point order). */
  files: string[];
  /** Symbolic links skipped because they point outside the input folder (relative paths). */
  skippedLinks: string[];
  /** The job file in the input folder (spherecov.yaml, .yml or .json, first found), or null. */
  jobFile: string | null;
  /**
   * Entries that could not be read (a subfolder without read permission, a path longer than the
   * system allows, a pipe or device named like an export): input errors of the run (exit 2);
   * everything else is still analyzed.
   */
  problems: InputError[];
}

/** The input itself is neither a regular file nor a folder (a pipe, a device, a socket). */
export class NotFileOrFolderError extends Error {
  override name = 'NotFileOrFolderError';
}

function entryKind(st: { isFIFO(): boolean; isCharacterDevice(): boolean; isBlockDevice(): boolean; isSocket(): boolean }): string {
  if (st.isFIFO()) return 'a pipe (FIFO)';
  if (st.isCharacterDevice() || st.isBlockDevice()) return 'a device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

/** The job file of an input folder: spherecov.yaml, then .yml, then .json (CONTRACT order). */
export function jobFileIn(dir: string): string | null {
  for (const n of ['spherecov.yaml', 'spherecov.yml', 'spherecov.json']) {
    const p = path.join(dir, n);
    if (existsSync(p)) return p;
  }
  return null;
}

/** Code-point comparison: the same order on every platform and locale. */
export function byCodePoint(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

function inside(root: string, p: string): boolean {
  const rel = path.relative(root, p);
  return rel === '' || (!rel.startsWith('..') && !path.isAbsolute(rel));
}

/**
 * Find the export files: `.csv`, `.tsv`, `.txt` (any case), recursively; the job file
 * (`spherecov.yaml|yml|json`) and hidden entries (a leading dot) are not exports. Symbolic links
 * are followed only when their target lies inside the input folder (a link out of it could make
 * a run read, and report on, unrelated data); each real folder and file is taken once (link cycles, and no beam counted twice).
 * `exclude` holds absolute folders not to enter (the output folder under `--force`).
 * @throws Error when the input does not exist.
 */
export async function discoverInputs(input: string, exclude: string[] = []): Promise<Discovery> {
  const abs = path.resolve(input);
  const st = await stat(abs);
  if (st.isFile()) return { root: path.dirname(abs), files: [abs], skippedLinks: [], jobFile: jobFileIn(path.dirname(abs)), problems: [] };
  if (!st.isDirectory()) {
    // A pipe (`analyze <(cat f.csv)`) or a device can be read only once, as a stream, and may
    // never end; the readers need a file they can measure and read again.
    throw new NotFileOrFolderError(`the input '${input}' is ${entryKind(st)}, not a file or a folder of exports; save it to a file first (for example: cat … > unit.csv) and analyze that`);
  }
  const realRoot = await realpath(abs);
  const realExclude = await Promise.all(exclude.map((e) => realpath(e).catch(() => path.resolve(e))));
  const files: string[] = [];
  const skippedLinks: string[] = [];
  const seenDirs = new Set<string>();
  const seenFiles = new Set<string>();
  const problems: InputError[] = [];
  const problem = (p: string, what: string): void => {
    const file = toPosix(path.relative(abs, p)) || path.basename(p);
    problems.push({ file, message: `${file}: ${what}` });
  };

  async function walk(dirAbs: string, dirReal: string): Promise<void> {
    if (seenDirs.has(dirReal) || realExclude.some((e) => inside(e, dirReal))) return;
    seenDirs.add(dirReal);
    let entries;
    try {
      injectFaultSync(`folder:${toPosix(path.relative(abs, dirAbs))}`, 'scandir', dirAbs);
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
      let isDir = ent.isDirectory();
      let isFile = ent.isFile();
      let real = path.join(dirReal, ent.name);
      if (ent.isSymbolicLink()) {
        try {
          real = await realpath(p);
        } catch {
          skippedLinks.push(path.relative(abs, p));
          continue;
        }
        if (!inside(realRoot, real)) {
          skippedLinks.push(path.relative(abs, p));
          continue;
        }
        const t = await stat(real);
        isDir = t.isDirectory();
        isFile = t.isFile();
        if (!isDir && !isFile && EXPORT_EXT.has(path.extname(ent.name).toLowerCase())) {
          problem(p, `${entryKind(t)}, not a regular file; not read`);
          continue;
        }
      } else if (!isDir && !isFile && EXPORT_EXT.has(path.extname(ent.name).toLowerCase())) {
        problem(p, `${ent.isFIFO() ? 'a pipe (FIFO)' : ent.isSocket() ? 'a socket' : 'a device'}, not a regular file; not read`);
        continue;
      }
      if (isDir) await walk(p, real);
      else if (isFile && EXPORT_EXT.has(path.extname(ent.name).toLowerCase()) && !JOB_FILES.has(ent.name.toLowerCase())) {
        if (seenFiles.has(real)) continue;
        seenFiles.add(real);
        files.push(p);
      }
    }
  }

  await walk(abs, realRoot);
  files.sort((a, b) => byCodePoint(toPosix(path.relative(abs, a)), toPosix(path.relative(abs, b))));
  problems.sort((a, b) => byCodePoint(a.file, b.file));
  return { root: abs, files, skippedLinks, jobFile: jobFileIn(abs), problems };
}

export function toPosix(p: string): string {
  return p.split(path.sep).join('/');
}


/**
 * Group files into work items by the unit their path names (the readers' path identity:
 * first subfolder, else the file stem without beam and frequency tokens, else the folder's
 * name; job-file identity patterns apply). This only splits the work across workers; the
 * readers decide the real unit identity (a unit column wins), and the batch merges groups that
 * turn out to share a unit.
 */
export function groupKey(relPosix: string, job?: JobSpec, rootName?: string): string {
  // NFC: folders named alike in two Unicode forms are one unit's group.
  return pathIdentity(relPosix, job, rootName).unit.normalize('NFC');
}
