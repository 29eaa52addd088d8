/**
 * `--reference` must name something before any work starts: a unit of the build (a unit folder
 * or file-stem group), or a folder of one unit's exports outside the input. A value that is
 * neither is a usage error — unless some file of the build could name its unit in its own
 * content (a unit column, `# unit:` metadata, a job-file column mapping), in which case the name
 * can only be checked after reading and the run reports it then.
 */
import { openSync, readSync, closeSync, existsSync, statSync } from 'node:fs';
import path from 'node:path';
import type { JobSpec } from '../io/types.js';
import { sniffHead, HEAD_BYTES } from '../io/sniffHead.js';
import { parseHeaderCell } from '../io/headerCell.js';
import { roleOfName } from '../io/columnRoles.js';

/** True when the file's header or metadata could name a unit (so a unit may not be its group). */
function namesUnitInside(file: string): boolean {
  let fd = -1;
  try {
    fd = openSync(file, 'r');
    const buf = Buffer.alloc(HEAD_BYTES);
    const n = readSync(fd, buf, 0, HEAD_BYTES, 0);
    const head = sniffHead(file, buf.subarray(0, n), n < HEAD_BYTES);
    if (!('headerCells' in head)) return false;
    if (['unit', 'dut', 'serial'].some((k) => head.metadata[k]?.trim())) return true;
    return head.headerCells.some((c) => roleOfName(parseHeaderCell(c).base)?.role === 'unit');
  } catch {
    return false; // an unreadable file names nothing; the run reports it as an input error
  } finally {
    if (fd >= 0) closeSync(fd);
  }
}

/** unit: a unit of the build (its name); folder: a golden unit's own folder; after-reading: only the files can tell. */
export type ReferenceCheck = { kind: 'unit'; unit: string } | { kind: 'folder'; dir: string } | { kind: 'after-reading' };

/**
 * What a --reference value names.
 * @param groupKeys the build's unit groups (folder or file-stem identity)
 * @throws Error with a one-line message when the value names nothing
 */
export function checkReference(ref: string, input: string, groupKeys: Set<string>, files: string[], job: JobSpec | null): ReferenceCheck {
  // Unit names are compared in Unicode NFC, the form the build's units are grouped in.
  if (groupKeys.has(ref.normalize('NFC'))) return { kind: 'unit', unit: ref.normalize('NFC') };
  const candidate = path.resolve(ref);
  const rel = path.relative(input, candidate);
  const inside = rel === '' || (!rel.startsWith('..') && !path.isAbsolute(rel));
  if (existsSync(candidate)) {
    if (!statSync(candidate).isDirectory()) throw new Error(`--reference: '${ref}' is a file; give a unit of this build or a folder of one unit's exports`);
    if (!inside) return { kind: 'folder', dir: candidate };
    // A unit folder of the build given as a path: that unit.
    const first = rel.split(path.sep)[0];
    if (first && groupKeys.has(first)) return { kind: 'unit', unit: first };
  }
  const units = [...groupKeys].sort();
  const list = units.length > 8 ? `${units.slice(0, 8).join(', ')}, …` : units.join(', ');
  const looksLikePath = /[\\/]/.test(ref) || ref.startsWith('.');
  if (looksLikePath && !existsSync(candidate)) throw new Error(`--reference: the folder '${ref}' does not exist (units of this build: ${list})`);
  if (job?.columns?.unit || files.some(namesUnitInside)) return { kind: 'after-reading' };
  throw new Error(`--reference: '${ref}' is neither a unit of this build (${list}) nor a folder of one unit's exports`);
}
