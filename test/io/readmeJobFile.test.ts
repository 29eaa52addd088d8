import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadJobFile } from '../../src/io/jobFile.js';

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
      const { job, errors } = loadJobFile(p);
      expect(errors).toEqual([]);
      expect(job?.columns).toEqual({ theta: 'Pol Angle', phi: 'Turntable', value: 'Level' });
      expect(job?.headerLine).toBe(7);
      expect(job?.calibration?.table).toHaveLength(2);
      // Every top-level key the validator accepts appears in the example (both spellings of
      // coverage thresholds are accepted; the README shows the snake_case one).
      const bad = path.join(dir, 'bad.yaml');
      await writeFile(bad, 'nonsense_key: 1\n');
      const listed = /expected one of the keys (.+)$/.exec(loadJobFile(bad).errors[0].message)![1].split(', ');
      for (const k of listed.filter((k) => k !== 'coverageThresholds')) expect(yaml, k).toMatch(new RegExp(`^${k}:`, 'm'));
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
