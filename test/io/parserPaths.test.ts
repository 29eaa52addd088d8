import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { findExportFiles } from '../../src/io/findExportFiles.js';
import { loadJobFile } from '../../src/io/jobFile.js';
import { findJobFile } from '../../src/io/findJobFile.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import { FIXTURES } from './readHelpers.js';

/** Everything but the parser name must be identical, values bit for bit. */
function comparable(r: Awaited<ReturnType<typeof readExportFile>>) {
  return {
    ...r,
    info: { ...r.info, parser: null },
    beams: r.beams.map((b) => ({ ...b, thetaDeg: Array.from(b.thetaDeg), phiDeg: Array.from(b.phiDeg), values: Array.from(b.values) })),
  };
}

const files = [...(await findExportFiles(path.join(FIXTURES, 'io'))).files, ...(await findExportFiles(path.join(FIXTURES, 'bad'))).files];

describe('fast and general parser paths give identical results on every fixture', () => {
  it('finds the fixtures', () => expect(files.length).toBeGreaterThan(25));
  for (const f of files) {
    it(path.relative(FIXTURES, f), async () => {
      const root = path.dirname(f);
      const jp = findJobFile(root);
      const job = jp ? loadJobFile(jp).job ?? undefined : undefined;
      const fast = await readExportFile(f, { inputRoot: root, job, parser: 'fast' });
      const general = await readExportFile(f, { inputRoot: root, job, parser: 'general' });
      expect(comparable(fast)).toEqual(comparable(general));
      // tiny chunks: nearly every line is cut by a chunk boundary and stitched
      for (const chunkBytes of [7, 64]) {
        const small = await readExportFile(f, { inputRoot: root, job, parser: 'fast', chunkBytes });
        expect(comparable(small)).toEqual(comparable(general));
      }
      for (let k = 0; k < fast.beams.length; k++) {
        for (let i = 0; i < fast.beams[k].values.length; i++) {
          expect(Object.is(fast.beams[k].values[i], general.beams[k].values[i])).toBe(true);
        }
      }
    });
  }
});
