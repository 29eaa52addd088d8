/**
 * Discovery for `spherecov analyze`: the export files under the input (the one walker,
 * src/io/findExportFiles.ts, which `spherecov inspect` uses too) and the input folder's job file.
 */
import { pathIdentity } from '../io/pathIdentity.js';
import type { JobSpec } from '../io/types.js';
import { findExportFiles, type ExportFiles } from '../io/findExportFiles.js';
import { findJobFile } from '../io/findJobFile.js';
import { injectFaultSync } from './faults.js';

export { byCodePoint, toPosix, NotFileOrFolderError } from '../io/findExportFiles.js';

export interface Discovery extends ExportFiles {
  /** The job file in the input folder (spherecov.yaml, .yml or .json, first found), or null. */
  jobFile: string | null;
}

/**
 * The export files (see findExportFiles: hidden entries skipped, links followed only inside the
 * input, unreadable entries as problems) and the job file of the input's folder.
 * `exclude` holds absolute folders not to enter (the output folder under `--force`).
 * @throws Error when the input does not exist; NotFileOrFolderError for a pipe or device.
 */
export async function discoverInputs(input: string, exclude: string[] = []): Promise<Discovery> {
  const found = await findExportFiles(input, {
    exclude,
    beforeListing: (rel, abs) => injectFaultSync(`folder:${rel}`, 'scandir', abs),
  });
  return { ...found, jobFile: findJobFile(found.root) };
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
