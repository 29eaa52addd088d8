/**
 * File-system failures in the user's words. Every error node:fs can throw while spherecov reads
 * an input or writes an output (a full disk, a refused permission, a path longer than the system
 * allows, a folder or a pipe where a file was expected) is an input or output problem of the
 * run, reported as such (exit 2), never as an internal error.
 */

const WORDS: Record<string, string> = {
  ENOSPC: 'the disk is full (no space left on the device)',
  EDQUOT: 'the disk quota is exhausted',
  EACCES: 'permission denied',
  EPERM: 'the operation is not permitted',
  EROFS: 'the file system is read-only',
  ENAMETOOLONG: 'the path is longer than the operating system allows',
  EISDIR: 'it is a folder, not a file',
  ENOTDIR: 'a part of the path is not a folder',
  ENOENT: 'no such file or folder',
  ELOOP: 'too many levels of symbolic links',
  EMFILE: 'too many open files',
  ENFILE: 'too many open files in the system',
  EIO: 'input/output error (a failing disk or a lost network share)',
  EBUSY: 'the file is busy',
  EEXIST: 'a file of that name appeared meanwhile',
  EAGAIN: 'it would block (a pipe or device with nothing to read)',
  ENXIO: 'no such device or address',
  EINVAL: 'the operating system refused the request as invalid',
  EFBIG: 'the file is too large for the file system',
  ETXTBSY: 'the file is busy',
  ESTALE: 'the network file handle is stale',
};

/** True for an error thrown by a file-system call (it has a string errno `code` like ENOSPC). */
export function isFsError(e: unknown): e is NodeJS.ErrnoException {
  return e instanceof Error && typeof (e as NodeJS.ErrnoException).code === 'string' && /^E[A-Z0-9]+$/.test((e as NodeJS.ErrnoException).code as string);
}

/**
 * The plain-words reason of a file-system error, with its code for searching:
 * "the disk is full (no space left on the device) [ENOSPC]". Unknown codes keep Node's text.
 * @example fsReason(Object.assign(new Error('x'), { code: 'EACCES' })) === 'permission denied [EACCES]'
 */
export function fsReason(e: NodeJS.ErrnoException): string {
  const code = e.code ?? '';
  const words = WORDS[code];
  if (words) return `${words} [${code}]`;
  // Node's own message starts with the code ("EXDEV: cross-device link not permitted, rename …").
  const m = /^[A-Z0-9]+: ([^,]+)/.exec(e.message);
  return `${m ? m[1] : e.message} [${code}]`;
}
