import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadJobFile } from '../../src/io/jobFile.js';
import { jobFileSchema } from '../../src/config/jobFileSchema.js';
import { knownKeys } from '../../src/config/schemaWalk.js';

const README = readFileSync(path.resolve(__dirname, '../../README.md'), 'utf8');

describe("README's job-file example", () => {
  it('loads without errors and shows every key the job file accepts', async () => {
    const start = README.indexOf('Every key it accepts');
    const block = README.slice(README.indexOf('\n', start) + 1, README.indexOf('**Dropout cells.**'));
    const yaml = block.split('\n').map((l) => l.slice(7)).join('\n');
    const dir = await mkdtemp(path.join(tmpdir(), 'readme-job-'));
    try {
      const p = path.join(dir, 'spherecov.yaml');
      await writeFile(p, yaml);
      const { job, errors, notices } = loadJobFile(p);
      expect(errors).toEqual([]);
      expect(notices).toEqual([]); // the README writes every key in the one (snake_case) spelling
      expect(job?.columns).toEqual({ theta: 'Pol Angle', phi: 'Turntable', value: 'Level' });
      expect(job?.headerLine).toBe(7);
      expect(job?.calibration?.table).toHaveLength(2);
      // Every top-level key the schema accepts appears in the example.
      const listed = knownKeys(jobFileSchema(), {}) ?? [];
      expect(listed.length).toBeGreaterThan(10);
      for (const k of listed) expect(yaml, k).toMatch(new RegExp(`^${k}:`, 'm'));
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
