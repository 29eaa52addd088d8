import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { parseNumberText } from '../../src/io/numberText.js';
import { readExportFile } from '../../src/io/readExportFile.js';

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-num-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const numberText = fc
  .tuple(
    fc.constantFrom('', '-', '+'),
    fc.stringMatching(/^[0-9]{0,18}$/),
    fc.option(fc.stringMatching(/^[0-9]{0,18}$/)),
    fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '-', '+'), fc.integer({ min: 0, max: 330 }))),
  )
  .map(([s, i, f, e]) => `${s}${i}${f === null ? '' : `.${f}`}${e === null ? '' : `${e[0]}${e[1]}${e[2]}`}`);

describe('the byte-level number reader equals Number(text) (correct rounding, ECMA-262 StringToNumber)', () => {
  it('random decimal and exponent texts, fast vs general path and vs parseNumberText', async () => {
    let n = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(numberText, { minLength: 1, maxLength: 30 }), async (texts) => {
        const file = path.join(dir, `n${n++}.csv`);
        writeFileSync(file, `theta,phi,beam,eirp\n${texts.map((t, i) => `${i % 180},0,${i},${t}`).join('\n')}\n`);
        const fast = await readExportFile(file, { inputRoot: dir, parser: 'fast' });
        const general = await readExportFile(file, { inputRoot: dir, parser: 'general' });
        expect(fast.errors).toEqual(general.errors);
        const valid = texts.map((t) => parseNumberText(t, false)).filter((v) => typeof v === 'number');
        if (fast.errors.length === 0) {
          expect(fast.beams.map((b) => b.values[0])).toEqual(valid);
          for (const [k, b] of fast.beams.entries()) expect(Object.is(b.values[0], general.beams[k].values[0])).toBe(true);
          for (const [k, t] of texts.entries()) expect(Object.is(fast.beams[k].values[0], Number(t))).toBe(true);
        }
      }),
      { seed: 7, numRuns: 80 },
    );
  });
});
