import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadJobFile } from '../../src/io/jobFile.js';
import { wideCell } from '../../src/io/layouts/wideLayout.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import type { ReadContext } from '../../src/io/types.js';

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), 'wide-preamble-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

/** Write `text` as `name` and read it on both parser paths; both must agree. */
async function read(name: string, text: string, ctx: Partial<ReadContext> = {}) {
  const p = path.join(dir, name);
  await writeFile(p, text);
  const fast = await readExportFile(p, { inputRoot: dir, parser: 'fast', ...ctx });
  const general = await readExportFile(p, { inputRoot: dir, parser: 'general', ...ctx });
  expect(fast.errors).toEqual(general.errors);
  expect(fast.beams.map((b) => [b.beam, b.frequencyHz, Array.from(b.values)])).toEqual(general.beams.map((b) => [b.beam, b.frequencyHz, Array.from(b.values)]));
  return fast;
}

const GRID = ['0,0', '90,0', '90,90', '90,180', '90,270', '180,0'];

describe('wide layout headers', () => {
  it('reads beam, block frequency and value name in any order', () => {
    expect(wideCell('Beam 0 EIRP (dBm)')).toEqual({ beam: '0', frequencyHz: null, role: 'value', quantity: 'eirp', unit: 'dBm' });
    expect(wideCell('beam12_eis_lhcp_dbm')).toMatchObject({ beam: '12', role: 'valueTheta', quantity: 'eis', unit: 'dBm' });
    expect(wideCell('28 GHz Beam 3 EIRP cross (dBm)')).toMatchObject({ beam: '3', frequencyHz: 28e9, role: 'valuePhi' });
    expect(wideCell('Beam 3 Gain @ 39.5GHz [dBi]')).toMatchObject({ beam: '3', frequencyHz: 39.5e9, role: 'value', quantity: 'gain', unit: 'dBi' });
    expect(wideCell('B7 Rx Power (dBm)')).toMatchObject({ beam: '7', role: 'power' });
    expect(wideCell('beam')).toBeNull();
    expect(wideCell('eirp_dbm')).toBeNull();
    expect(wideCell('Beam 0 comment')).toBeNull();
  });
});

describe('wide layout files', () => {
  it('one column per beam, with a unit column, read per beam', async () => {
    const r = await read('wide_units.csv', ['unit,theta,phi,Beam 0 EIRP (dBm),Beam 1 EIRP (dBm)', ...GRID.map((g, i) => `U-${i < 3 ? 1 : 1},${g},${i},${10 + i}`)].join('\n'));
    expect(r.errors).toEqual([]);
    expect(r.info.layout).toBe('wide');
    expect(r.beams.map((b) => [b.unit, b.beam, Array.from(b.values)])).toEqual([
      ['U-1', '0', [0, 1, 2, 3, 4, 5]], ['U-1', '1', [10, 11, 12, 13, 14, 15]],
    ]);
    expect(r.beams[0].thetaDeg).toBe(r.beams[1].thetaDeg); // one copy of the angles for all beams
  });

  it('a polarization pair per beam is combined by power sum', async () => {
    const r = await read('wide_pair.csv', ['theta,phi,Beam 0 EIRP H (dBm),Beam 0 EIRP V (dBm)', ...GRID.map((g) => `${g},3,3`)].join('\n'));
    expect(r.errors).toEqual([]);
    // 10·log10(2·10^0.3) = 3 + 3.0103 (DESIGN.md "Polarization pair")
    for (const v of r.beams[0].values) expect(v).toBeCloseTo(3 + 10 * Math.log10(2), 12);
  });

  it('explains a half pair, a beam column beside per-beam columns, and mixed units', async () => {
    const half = await read('half.csv', ['theta,phi,Beam 0 EIRP co (dBm),Beam 1 EIRP co (dBm)', ...GRID.map((g) => `${g},1,2`)].join('\n'));
    expect(half.errors.map((e) => e.message)).toEqual([
      "half.csv:1:11: Beam 0 EIRP co (dBm): found 'Beam 0 EIRP co (dBm)', expected both polarizations (beam_0_eirp_co and _cross), or a pol column with a total value column",
    ]);
    const both = await read('both.csv', ['theta,phi,beam,Beam 0 EIRP (dBm)', ...GRID.map((g) => `${g},0,1`)].join('\n'));
    expect(both.errors[0].message).toBe("both.csv:1:11: beam: found 'beam', expected beam ids either in a beam column (long layout) or in the value headers ('Beam 0 EIRP (dBm)', wide layout), not both");
    const units = await read('units.csv', ['theta,phi,Beam 0 EIRP (dBm),Beam 1 EIRP (mW)', ...GRID.map((g) => `${g},0,1`)].join('\n'));
    expect(units.errors[0].message).toBe("units.csv:1:29: Beam 1 EIRP (mW): found 'Beam 1 EIRP (mW)', expected the unit of 'Beam 0 EIRP (dBm)' (dBm)");
  });

  it('a bad cell is located at its beam column', async () => {
    const r = await read('cell.csv', ['theta,phi,Beam 0 EIRP (dBm),Beam 1 EIRP (dBm)', '0,0,1,2', '90,0,1,x'].join('\n'));
    expect(r.errors.map((e) => e.message)).toEqual(["cell.csv:3:8: Beam 1 EIRP (dBm): found 'x', expected a number"]);
  });
});

describe('free-text preamble', () => {
  const body = ['theta_deg,phi_deg,eirp_dbm', ...GRID.map((g, i) => `${g},${i}`)];

  it('finds the header below free text, keeps key: value lines as metadata', async () => {
    const r = await read('pre.csv', ['Antenna range report', 'DUT serial: SN-9', 'Operator: A. N. Other', '', '# note: kept', ...body].join('\n'));
    expect(r.errors).toEqual([]);
    expect(r.info.header).toEqual({ line: 6, chosen: 'detected', preambleLines: 3 });
    expect(r.info.metadata).toEqual({ note: 'kept', 'dut serial': 'SN-9', operator: 'A. N. Other' });
    expect(r.beams[0].firstLine).toBe(7);
  });

  it('a file whose first row is not a header keeps its located error', async () => {
    const r = await read('nohead.csv', ['Antenna range report', '1,2,3'].join('\n'));
    expect(r.errors.map((e) => e.message)).toEqual([
      "nohead.csv:1:1: header: found 'Antenna range report', expected theta and phi (or azimuth and elevation) columns for the long layout, or a matrix header 'theta,<phi values…>'; map columns in the job file (columns:) if the names differ",
    ]);
  });

  it('the job file header_line settles what detection cannot (a header with unknown names, mapped)', async () => {
    const jobPath = path.join(dir, 'spherecov.yaml');
    await writeFile(jobPath, 'header_line: 3\ncolumns: { theta: pol_angle, phi: az_angle, value: level }\n');
    const { job, errors } = loadJobFile(jobPath);
    expect(errors).toEqual([]);
    const r = await read('byline.csv', ['Result table', 'pol_angle = deg', 'pol_angle,az_angle,level', ...GRID.map((g, i) => `${g},${i}`)].join('\n'), { job: job! });
    expect(r.errors).toEqual([]);
    expect(r.info.header).toEqual({ line: 3, chosen: 'job', preambleLines: 2 });
    expect(r.info.metadata).toEqual({ pol_angle: 'deg' });
    const blank = await read('blank.csv', ['x', '', 'theta,phi,eirp'].join('\n'), { job: { source: jobPath, headerLine: 2 } });
    expect(blank.errors.map((e) => e.message)).toEqual(['blank.csv:2:1: header: found a blank line, expected the header row at this line (header_line in the job file)']);
  });

  it('a mapping written the wrong way round says which way it goes', async () => {
    const r = await read('flip.csv', ['Angle1,Angle2,Level', '0,0,1'].join('\n'), { job: { source: 'x', columns: { theta: 'theta' } } });
    expect(r.errors.map((e) => e.message)).toEqual([
      "flip.csv:1:1: header: found 'Angle1,Angle2,Level', expected a column 'theta' (columns.theta in the job file); the mapping goes role: header name, e.g. 'columns: { theta: <header name> }'",
    ]);
  });
});
