import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readExportFile } from '../../src/io/readExportFile.js';

// The long sink's short path for plain rows (θ/φ in degrees, a dB value, continuing the last
// beam) must agree with the full row check bit for bit, also where JSON cannot see it (−0).
const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-plain-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const bits = (a: Float64Array): string[] => Array.from(a, (x) => (Object.is(x, -0) ? '-0' : String(x)));

describe('plain rows on the fast path (issue 18)', () => {
  it('θ = −0 reads as +0 and a value of −0 stays −0, as on the general path', async () => {
    const f = path.join(dir, 'zeros.csv');
    const beam0 = Array.from({ length: 6 }, (_v, i) => `-0,${i * 60},0,${i % 2 ? '-0' : '1.5'}`);
    const beam1 = Array.from({ length: 6 }, (_v, i) => `-0.0,${i * 60},1,-0.0`);
    writeFileSync(f, `theta,phi,beam,eirp_dbm\n${[...beam0, ...beam1].join('\n')}\n`);
    const fast = await readExportFile(f, { inputRoot: dir, parser: 'fast' });
    const general = await readExportFile(f, { inputRoot: dir, parser: 'general' });
    expect(fast.info.parser).toBe('fast');
    expect(fast.beams.map((b) => [bits(b.thetaDeg), bits(b.phiDeg), bits(b.values)])).toEqual(general.beams.map((b) => [bits(b.thetaDeg), bits(b.phiDeg), bits(b.values)]));
    expect(bits(fast.beams[0].thetaDeg)).toEqual(['0', '0', '0', '0', '0', '0']);
    expect(bits(fast.beams[0].values)).toEqual(['1.5', '-0', '1.5', '-0', '1.5', '-0']);
  });

  it('angles and levels at and beyond the ranges give the same errors as the full check', async () => {
    const f = path.join(dir, 'edges.csv');
    const ok = ['0,0,0,-500', '180,360,0,500', '90,-180,0,0'];
    const bad = ['180.0000001,0,0,1', '0,360.5,0,1', '0,0,0,500.01', '-0.1,0,0,1'];
    writeFileSync(f, `theta,phi,beam,eirp_dbm\n${[...ok, ...bad].join('\n')}\n`);
    const fast = await readExportFile(f, { inputRoot: dir, parser: 'fast' });
    const general = await readExportFile(f, { inputRoot: dir, parser: 'general' });
    expect(fast.errors.map((e) => e.message)).toEqual(general.errors.map((e) => e.message));
    expect(fast.errors.map((e) => `${e.line}:${e.column}`)).toEqual(['5:1', '6:3', '7:7', '8:1']);
  });
});
