import { describe, it, expect } from 'vitest';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { exportLines, formatExport, regularGrid, writeExport } from '../../src/sim/index.js';
import type { ExportTable } from '../../src/sim/index.js';

const grid = regularGrid({ thetaStepDeg: 90, phiStepDeg: 90, polesOnce: true }); // 6 directions
const table: ExportTable = {
  grid,
  beams: [
    { id: '0', valuesDb: Float64Array.of(1, 2.345, -3.3, 4, 5, 6.006), thetaDb: Float64Array.of(0, 0, 0, 0, 0, 0), phiDb: Float64Array.of(-1, -1, -1, -1, -1, -1) },
    { id: '7', valuesDb: Float64Array.of(-1, -2, -3, -4, -5, -6) },
  ],
};

describe('export writers', () => {
  it('long layout: header, beam column, θ-then-φ rows, 2 decimals', () => {
    const lines = formatExport(table, { layout: 'long' }).trimEnd().split('\n');
    expect(lines[0]).toBe('theta_deg,phi_deg,beam,eirp_dbm');
    expect(lines.slice(1, 4)).toEqual(['0,0,0,1.00', '90,0,0,2.35', '90,90,0,-3.30']);
    expect(lines.length).toBe(1 + 12);
    expect(lines[12]).toBe('180,0,7,-6.00');
  });

  it('unit and frequency columns, metadata lines, CRLF', () => {
    const s = formatExport({ grid, beams: [table.beams[1]] }, {
      layout: 'long', unit: 'X-1', frequencyHz: 28.5e9, metadata: { note: 'hello' }, lineEnding: '\r\n',
    });
    expect(s.split('\r\n').slice(0, 3)).toEqual(['# note: hello', 'unit,frequency_ghz,theta_deg,phi_deg,eirp_dbm', 'X-1,28.5,0,0,-1.00']);
  });

  it('polarization pair, pol column, az/el, decimal comma, mW and EIS names', () => {
    const one = { grid, beams: [table.beams[0]] };
    expect(formatExport(one, { layout: 'pol-pair' }).split('\n').slice(0, 2)).toEqual(['theta_deg,phi_deg,eirp_theta_dbm,eirp_phi_dbm', '0,0,0.00,-1.00']);
    expect(formatExport(one, { layout: 'pol-column' }).split('\n').slice(0, 3)).toEqual(['theta_deg,phi_deg,pol,eirp_dbm', '0,0,theta,0.00', '0,0,phi,-1.00']);
    // el = 90 − θ; az = φ in [−180, 180): φ 270 → az −90, φ 180 → az −180.
    const azel = formatExport(one, { layout: 'az-el' }).split('\n');
    expect(azel.slice(0, 2)).toEqual(['azimuth_deg,elevation_deg,eirp_dbm', '0,90,1.00']);
    expect(azel.slice(3, 6)).toEqual(['90,0,-3.30', '-180,0,4.00', '-90,0,5.00']);
    expect(formatExport(one, { layout: 'long', delimiter: ';', decimalComma: true }).split('\n')[2]).toBe('90;0;2,35');
    expect(formatExport(one, { layout: 'long', linearMw: true }).split('\n').slice(0, 2)).toEqual(['theta_deg,phi_deg,eirp_mw', '0,0,1.25893']);
    expect(formatExport(one, { layout: 'long', quantity: 'eis' }).split('\n')[0]).toBe('theta_deg,phi_deg,eis_dbm');
    expect(formatExport(one, { layout: 'long', quantity: 'gain' }).split('\n')[0]).toBe('theta_deg,phi_deg,gain_dbi');
  });

  it('matrix layout: quantity line, φ columns, a pole written once fills its row', () => {
    const lines = formatExport({ grid, beams: [table.beams[0]] }, { layout: 'matrix' }).trimEnd().split('\n');
    expect(lines).toEqual([
      '# quantity: eirp dBm',
      'theta_deg,0,90,180,270',
      '0,1.00,1.00,1.00,1.00',
      '90,2.35,-3.30,4.00,5.00',
      '180,6.01,6.01,6.01,6.01',
    ]);
    expect(() => formatExport(table, { layout: 'matrix' })).toThrow(/one beam/);
  });

  it('refuses what it cannot print faithfully', () => {
    const bad = { grid, beams: [{ id: 'x', valuesDb: Float64Array.of(-Infinity, 0, 0, 0, 0, 0) }] };
    expect(() => formatExport(bad, { layout: 'long' })).toThrow(/beam x sample 0/);
    expect(() => formatExport(table, { layout: 'pol-pair' })).toThrow(/no polarization components/);
    expect(() => formatExport(table, { layout: 'long', decimalComma: true })).toThrow(/decimal comma/);
    expect(() => formatExport(table, { layout: 'long', quantity: 'gain', linearMw: true })).toThrow(/mW/);
  });

  it('a streamed file equals the string form (chunks larger than 64 KiB)', async () => {
    const big = regularGrid({ thetaStepDeg: 1, phiStepDeg: 1 });
    const vals = Float64Array.from(big.thetaDeg, (t, i) => Math.sin(t) * 10 + big.phiDeg[i] / 100);
    const t: ExportTable = { grid: big, beams: [{ id: '3', valuesDb: vals }] };
    const dir = await mkdtemp(join(tmpdir(), 'sim-writer-'));
    try {
      await writeExport(join(dir, 'sub', 'beam_3.csv'), t, { layout: 'long' });
      const text = await readFile(join(dir, 'sub', 'beam_3.csv'), 'utf8');
      expect(text).toBe(formatExport(t, { layout: 'long' }));
      expect(text.length).toBeGreaterThan(65536 * 4);
      expect([...exportLines(t, { layout: 'long' })].length).toBe(1 + 65160);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});

describe('writeExport on an unprintable value', () => {
  it('throws and leaves no partial file', async () => {
    const { stat } = await import('node:fs/promises');
    const dir = await mkdtemp(join(tmpdir(), 'sim-writer-'));
    try {
      const big = regularGrid({ thetaStepDeg: 1, phiStepDeg: 1 });
      const vals = new Float64Array(big.thetaDeg.length);
      vals[vals.length - 1] = NaN; // after several 64 KiB chunks have been written
      const path = join(dir, 'bad.csv');
      await expect(writeExport(path, { grid: big, beams: [{ id: '1', valuesDb: vals }] }, { layout: 'long' })).rejects.toThrow(/cannot be printed/);
      await expect(stat(path)).rejects.toThrow(/ENOENT/);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
