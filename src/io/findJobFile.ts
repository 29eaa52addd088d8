/**
 * Where an input folder's job file is. Kept apart from the job-file parser (jobFile.ts, which
 * loads the YAML library) so that discovery can look for the file without loading the parser.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';

/** Job-file names looked for in an input folder, in this order (CONTRACT.md). */
export const JOB_FILE_NAMES = ['spherecov.yaml', 'spherecov.yml', 'spherecov.json'];

/** The job file of an input folder, or null. */
export function findJobFile(inputDir: string): string | null {
  for (const name of JOB_FILE_NAMES) {
    const p = path.join(inputDir, name);
    if (existsSync(p)) return p;
  }
  return null;
}
