import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { dirname } from 'node:path';
import { once } from 'node:events';
import { exportLines } from './exportLines.js';
import type { ExportOptions, ExportTable } from './exportTypes.js';

/**
 * One export file as a string (small files, tests).
 * Cost: O(file size) memory.
 * @example
 * formatExport(table, { layout: 'long' }).split('\n')[0]; // 'theta_deg,phi_deg,beam,eirp_dbm'
 */
export function formatExport(table: ExportTable, opts: ExportOptions): string {
  let s = '';
  for (const line of exportLines(table, opts)) s += line;
  return s;
}

/**
 * Streams one export file to disk (parent folders created), writing in chunks of about
 * 64 KiB and waiting for the stream to drain, so memory stays flat for large exports.
 * Cost: O(file size) time, O(1) memory.
 * Boundary rule: on an error the partial file is removed.
 * @throws Error from the file system or from exportLines (unprintable values).
 * @example
 * await writeExport('/tmp/x/beam_0.csv', table, { layout: 'long' });
 */
export async function writeExport(path: string, table: ExportTable, opts: ExportOptions): Promise<void> {
  await mkdir(dirname(path), { recursive: true });
  const out = createWriteStream(path);
  try {
    let chunk = '';
    for (const line of exportLines(table, opts)) {
      chunk += line;
      if (chunk.length >= 65536) {
        if (!out.write(chunk)) await once(out, 'drain');
        chunk = '';
      }
    }
    out.end(chunk);
    await once(out, 'finish');
  } catch (err) {
    out.destroy();
    await rm(path, { force: true }); // no half-written export left behind
    throw err;
  }
}
