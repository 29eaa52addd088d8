import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { calibrationOffsetDb } from '../../src/io/calibrationOffset.js';
import { formatInspect, inspectInput } from '../../src/io/inspectInput.js';
import { loadJobFile } from '../../src/io/jobFile.js';
import { pathIdentity } from '../../src/io/pathIdentity.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import { expectClose } from '../helpers/expectClose.js';
import { FIXTURES } from './readHelpers.js';

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-job-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('identity from the path (CONTRACT.md "Input folder")', () => {
  it.each([
    ['PX-01/PX-01_beam_5_28GHz.csv', 'PX-01', '5', 28e9, 'folder'],
    ['PX-02_beam-12_26.5GHz.csv', 'PX-02', '12', 26.5e9, 'file-name'],
    ['lot3_b7.csv', 'lot3', '7', null, 'file-name'],
    ['unitA.csv', 'unitA', 'unitA', null, 'file-name'],
    ['U9/sweep/beam3.csv', 'U9', '3', null, 'folder'],
    ['X_tx.csv', 'X', 'X_tx', null, 'file-name'],
    ['X/X_tx.csv', 'X', 'X_tx', null, 'folder'],
    ['PX-3_beam_2_RX_28GHz.csv', 'PX-3', '2', 28e9, 'file-name'],
    ['tx_power_PX-3.csv', 'power_PX-3', 'tx_power_PX-3', null, 'file-name'],
  ])('%s', (rel, unit, beam, f, src) => {
    const id = pathIdentity(rel);
    expect([id.unit, id.beam, id.frequencyHz, id.sources.unit]).toEqual([unit, beam, f, src]);
  });
  it('a stem that is only beam and frequency tokens takes the unit from the folder analyzed', () => {
    // `spherecov analyze PX-07/` on one unit's folder: its files are beam_<N>_28GHz.csv
    const id = pathIdentity('beam_3_28GHz.csv', undefined, 'PX-07');
    expect([id.unit, id.beam, id.frequencyHz, id.sources.unit]).toEqual(['PX-07', '3', 28e9, 'folder']);
    expect(pathIdentity('PX-02_beam_3.csv', undefined, 'lab').unit).toBe('PX-02'); // a stem that names the unit wins
  });
  it('a unit analyzed from a single file gets the name it has in its folder (tx/rx tokens are not part of it)', () => {
    // `analyze build/` sees build/X/X_tx.csv (unit from the folder); `analyze build/X/X_tx.csv` sees X_tx.csv alone
    expect(pathIdentity('X/X_tx.csv', undefined, 'build').unit).toBe(pathIdentity('X_tx.csv', undefined, 'X').unit);
    expect([pathIdentity('X_tx.csv').link, pathIdentity('X_Rx_beam1.csv').link, pathIdentity('Xtx.csv').link]).toEqual(['tx', 'rx', null]);
  });
  it('job-file patterns override the path rules', () => {
    const id = pathIdentity('run7/SN-0042__cw17__f27p9.csv', {
      source: 'x', identity: { unit: '(SN-\\d+)', beam: 'cw(\\d+)', frequencyGhz: 'f(\\d+)p' },
    });
    expect([id.unit, id.beam, id.frequencyHz, id.sources.unit]).toEqual(['SN-0042', '17', 27e9, 'job']);
  });
});

describe('calibration offset (piecewise-linear interpolation, Eq. C1)', () => {
  const table = [{ frequencyHz: 24e9, offsetDb: 30 }, { frequencyHz: 26e9, offsetDb: 31 }, { frequencyHz: 30e9, offsetDb: 35 }];
  it('interpolates linearly and returns table points exactly', () => {
    // hand computation: 30 + (31 − 30)·(25 − 24)/(26 − 24) = 30.5; 31 + 4·(28 − 26)/4 = 33
    expectClose(calibrationOffsetDb(table, 25e9)!, 30.5, 1e-12, 'midpoint of the first segment');
    expectClose(calibrationOffsetDb(table, 28e9)!, 33, 1e-12, 'midpoint of the second segment');
    expect(calibrationOffsetDb(table, 26e9)).toBe(31);
  });
  it('refuses to extrapolate', () => {
    expect(calibrationOffsetDb(table, 23.9e9)).toBeNull();
    expect(calibrationOffsetDb(table, 30.1e9)).toBeNull();
  });
});

describe('job file', () => {
  it('accepts every key and passes the other stages\' keys through', () => {
    const p = path.join(dir, 'spherecov.yaml');
    writeFileSync(p, [
      'columns: { theta: "Pos Theta", phi: "Pos Phi", value: "Level" }',
      'identity: { unit: "(SN-\\\\d+)" }',
      'quantity: eis', 'value_unit: dBm', 'angles: { convention: theta-phi, unit: deg }', 'frequency_unit: GHz',
      'calibration:', '  table:', '    - { frequency_mhz: 28000, offset_db: 1.5 }', '    - { frequency_ghz: 27, offset_db: 1 }',
      'limits: fr2-example', 'checks: [{ kind: min-peak, limit: 20 }]', 'percentiles: [50, 90]', 'coverage_thresholds: [-88, -85]',
      'report: { title: Bench }', 'reference: SN-0001', '',
    ].join('\n'));
    const { job, errors } = loadJobFile(p);
    expect(errors).toEqual([]);
    expect(job).toEqual({
      source: p, columns: { theta: 'Pos Theta', phi: 'Pos Phi', value: 'Level' }, identity: { unit: '(SN-\\d+)' }, quantity: 'eis',
      valueUnit: 'dBm', angles: { convention: 'theta-phi', unit: 'deg' }, frequencyUnit: 'GHz',
      calibration: { table: [{ frequencyHz: 27e9, offsetDb: 1 }, { frequencyHz: 28e9, offsetDb: 1.5 }] },
      limits: 'fr2-example', checks: [{ kind: 'min-peak', limit: 20 }], percentiles: [50, 90], coverageThresholds: [-88, -85],
      report: { title: 'Bench' }, reference: 'SN-0001',
    });
  });
  it('JSON job files and syntax errors', () => {
    const p = path.join(dir, 'spherecov.json');
    writeFileSync(p, '{"quantity": "gain", "percentiles": [5]}');
    expect(loadJobFile(p).job).toMatchObject({ quantity: 'gain', percentiles: [5] });
    writeFileSync(p, '{"quantity": "gain",\n "percentiles": [5}');
    const bad = loadJobFile(p);
    expect(bad.job).toBeNull();
    expect(bad.errors[0].message).toMatch(/^spherecov\.json:2:\d+: syntax: found '.*', expected valid JSON/);
  });
  it('test_info keeps every value as written, in the order written; a nested value or a non-snake_case key is a located error', () => {
    const p = path.join(dir, 'spherecov.yaml');
    writeFileSync(p, [
      'test_info:', '  operator: B. Sample', '  chamber: 007', '  date_measured: 2026-11-30', '  rev: 1.50', '  lid: yes',
      '  dut_description: "module: P1"', '  blank:', '  notes: |', '    line one', '    line two', '',
    ].join('\n'));
    const { job, errors } = loadJobFile(p);
    expect(errors).toEqual([]);
    // YAML would read 007 as 7, 1.50 as 1.5 and yes as a text: the plain scalars keep their source text.
    expect(job?.testInfo).toEqual({
      operator: 'B. Sample', chamber: '007', date_measured: '2026-11-30', rev: '1.50', lid: 'yes', dut_description: 'module: P1', blank: '',
      notes: 'line one\nline two\n',
    });
    expect(Object.keys(job!.testInfo!)).toEqual(['operator', 'chamber', 'date_measured', 'rev', 'lid', 'dut_description', 'blank', 'notes']);
    writeFileSync(p, ['test_info:', '  chamber: [a, b]', '  Operator: X', ''].join('\n'));
    expect(loadJobFile(p).errors.map((e) => e.message)).toEqual([
      'spherecov.yaml:2:12: test_info.chamber: found a list, expected a text (one line, or a YAML block with |)',
      "spherecov.yaml:3:3: test_info.Operator: found 'Operator', expected a key in snake_case, e.g. chamber, operator, date_measured, notes, dut_description",
    ]);
    writeFileSync(p, 'test_info: CATR-2\n');
    expect(loadJobFile(p).errors[0].message).toBe("spherecov.yaml:1:12: test_info: found 'CATR-2', expected a mapping of keys to values");
  });
  it('mapped columns read a file detection alone cannot', async () => {
    const p = path.join(dir, 'spherecov.yaml');
    writeFileSync(p, 'columns: { theta: "Pos Theta", phi: "Pos Phi", value: "Level", beam: "CW" }\nquantity: eis\n');
    const job = loadJobFile(p).job!;
    const f = path.join(dir, 'SN-7.csv');
    writeFileSync(f, 'Pos Theta,Pos Phi,CW,Level\n0,0,a,-90.5\n90,0,a,-88\n90,120,a,-87\n90,240,a,-86\n180,0,a,-80\n');
    const r = await readExportFile(f, { inputRoot: dir, job });
    expect(r.errors).toEqual([]);
    expect(r.beams.map((b) => [b.unit, b.beam, b.quantity, b.valueUnit, Array.from(b.values)])).toEqual([['SN-7', 'a', 'eis', 'dBm', [-90.5, -88, -87, -86, -80]]]);
  });
});

describe('inspect', () => {
  it('reports how a folder was understood, as text and as a JSON-able object', async () => {
    const r = await inspectInput(path.join(FIXTURES, 'io', 'calibrated'));
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
    expect(r.errors).toEqual([]);
    expect(r.files[0]).toMatchObject({ file: 'power.csv', layout: 'long', delimiter: ',', parser: 'fast', calibrated: true, rows: 168, units: ['DUT-A'] });
    expect(r.measurements[0].grid).toMatchObject({ kind: 'regular', points: 62, thetaStepDeg: 30, phiStepDeg: 30, fullSphere: true });
    // full sphere: the weights sum to 4π
    expectClose(r.measurements[0].grid.solidAngleSr, 4 * Math.PI, 1e-9, 'regular full grid covers 4π');
    const text = formatInspect(r);
    expect(text).toContain('file power.csv');
    expect(text).toContain('layout: long; delimiter: comma; decimal point; LF; parser: fast');
    expect(text).toContain('calibrated from received power');
    expect(text).toMatch(/power_dbm\s+power \[dBm\]/);
    expect(text).toContain('unit DUT-A at 28 GHz: eirp (dBm), 2 beams from 1 file(s)');
    expect(text).toContain('grid: regular, 62 points; θ 0–180° step 30°; φ 0–330° step 30°');
    expect(text).toContain('warning [calibration-applied]: received power + 31.000 dB at 28 GHz');
  });
});
