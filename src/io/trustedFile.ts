/**
 * The trust boundary for files that a job file or an option names (a limit set, a report logo,
 * the job file itself). Input folders are prepared by other people (exports copied from a
 * chamber PC, a colleague's build folder) and their job file is loaded automatically, so what
 * such a file names is checked before a byte is read:
 *
 * - a relative path is relative to the file that names it (the job file's folder), never to the
 *   working directory, so the verdict does not depend on where the command runs;
 * - only a regular file is read: a folder, a FIFO (which would block the open or the read
 *   forever), a device (/dev/zero never ends) or a socket is refused. The file is opened with
 *   O_NONBLOCK, so opening a FIFO cannot hang, and checked with fstat on the open descriptor,
 *   so it cannot be swapped between the check and the read;
 * - at most a size cap per kind is read (pseudo-files such as /proc/self/environ report size 0,
 *   so the cap is enforced on the bytes actually read, not only on the reported size);
 * - an error quotes a short excerpt at most (clipText), never the file's content.
 */
import { closeSync, constants, fstatSync, openSync, readSync } from 'node:fs';
import path from 'node:path';
import { fsReason, isFsError } from './fsProblem.js';

/** What a named file is for; each has its own size cap. */
export type TrustedKind = 'job file' | 'limit set' | 'logo';

/** Largest accepted size per kind, bytes. Generous for real files, small enough to read at once. */
export const SIZE_CAP_BYTES: Record<TrustedKind, number> = {
  'job file': 1024 * 1024,
  'limit set': 1024 * 1024,
  logo: 4 * 1024 * 1024,
};

/** A named file that may not be read; the message says which file, why, and what to do. */
export class TrustedFileError extends Error {
  override name = 'TrustedFileError';
}

/**
 * The absolute path a file reference means: absolute as given, or relative to `baseDir` (the
 * folder of the job file that names it; the working directory for a command-line option).
 * @example resolveNamed('limits/n257.yaml', '/data/build-B') === '/data/build-B/limits/n257.yaml'
 */
export function resolveNamed(ref: string, baseDir: string): string {
  return path.isAbsolute(ref) ? path.normalize(ref) : path.resolve(baseDir, ref);
}

function kindOfStat(st: { isDirectory(): boolean; isFIFO(): boolean; isCharacterDevice(): boolean; isBlockDevice(): boolean; isSocket(): boolean }): string {
  if (st.isDirectory()) return 'a folder';
  if (st.isFIFO()) return 'a pipe (FIFO)';
  if (st.isCharacterDevice() || st.isBlockDevice()) return 'a device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

/**
 * Read a named file as bytes across the trust boundary.
 * Cost: one open, one fstat, reads up to the kind's cap + 1 byte.
 * @param shown how to name the file in messages (what the user wrote)
 * @throws TrustedFileError when it is missing, unreadable, not a regular file, or over the cap
 */
export function readTrustedBytes(file: string, kind: TrustedKind, shown: string = file): Buffer {
  const cap = SIZE_CAP_BYTES[kind];
  let fd: number;
  try {
    // O_NONBLOCK: opening a FIFO with no writer returns at once instead of waiting for one.
    fd = openSync(file, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (e) {
    throw new TrustedFileError(`${shown}: cannot open the ${kind}: ${isFsError(e) ? fsReason(e) : String(e)}`);
  }
  try {
    const st = fstatSync(fd);
    if (!st.isFile()) throw new TrustedFileError(`${shown}: found ${kindOfStat(st)}, expected a regular file (a ${kind})`);
    if (st.size > cap) throw new TrustedFileError(`${shown}: found ${st.size} bytes, expected at most ${cap} bytes for a ${kind}`);
    const chunks: Buffer[] = [];
    let total = 0;
    for (;;) {
      const buf = Buffer.alloc(Math.min(64 * 1024, cap + 1 - total));
      const n = readSync(fd, buf, 0, buf.length, null);
      if (n === 0) break;
      chunks.push(buf.subarray(0, n));
      total += n;
      if (total > cap) throw new TrustedFileError(`${shown}: found more than ${cap} bytes, expected at most ${cap} bytes for a ${kind}`);
    }
    return Buffer.concat(chunks, total);
  } catch (e) {
    if (e instanceof TrustedFileError) throw e;
    throw new TrustedFileError(`${shown}: cannot read the ${kind}: ${isFsError(e) ? fsReason(e) : String(e)}`);
  } finally {
    closeSync(fd);
  }
}

/**
 * Read a named text file (UTF-8) across the trust boundary; see readTrustedBytes.
 * @throws TrustedFileError as readTrustedBytes
 */
export function readTrustedText(file: string, kind: TrustedKind, shown: string = file): string {
  return readTrustedBytes(file, kind, shown).toString('utf8');
}
