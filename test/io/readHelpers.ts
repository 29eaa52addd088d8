import path from 'node:path';
import { assembleMeasurements } from '../../src/io/assembleMeasurements.js';
import { findExportFiles } from '../../src/io/findExportFiles.js';
import { loadJobFile } from '../../src/io/jobFile.js';
import { findJobFile } from '../../src/io/findJobFile.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import type { FileReadResult, ReadContext } from '../../src/io/types.js';

export const FIXTURES = path.resolve(__dirname, '../../fixtures');

/** Read a file or folder the way the batch does: job file, every export, assemble. */
export async function readAll(input: string, parser: ReadContext['parser'] = 'auto') {
  const abs = path.resolve(input);
  const isFile = abs.match(/\.(csv|tsv|txt)$/i) !== null;
  const root = isFile ? path.dirname(abs) : abs;
  const jobPath = findJobFile(root);
  const loaded = jobPath ? loadJobFile(jobPath) : { job: null, errors: [] };
  const files: FileReadResult[] = [];
  for (const f of (await findExportFiles(abs)).files) files.push(await readExportFile(f, { inputRoot: root, job: loaded.job ?? undefined, parser }));
  const asm = assembleMeasurements(files.flatMap((f) => f.beams), files.map((f) => ({ path: f.file, sha256: f.sha256 })));
  return { files, jobErrors: loaded.errors, ...asm };
}
