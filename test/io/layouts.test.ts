import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers/expectClose.js';
import { FIXTURES, readAll } from './readHelpers.js';

const IO = path.join(FIXTURES, 'io');
const VARIANTS = [
  'long_semicolon_comma_bom_crlf.csv',
  'long_tab_reordered.tsv',
  'long_quoted.csv',
  'long_azel_rad.csv',
  'long_pol_pair.csv',
  'long_pol_column.csv',
  'long_mw.csv',
  'matrix',
  'calibrated',
  'wide.csv',
  'wide_pair_co_cross.csv',
  'wide_frequency_block.tsv',
  'preamble.csv',
  'long_pair_co_cross.csv',
  'long_pair_h_v.csv',
  'long_pair_lhcp_rhcp.csv',
  'long_pair_etheta_ephi.csv',
  'long_pol_column_h_v.csv',
  'calibrated_rx',
];
/** Data rows of each variant: 84 directions × 2 beams in the long layout. */
const ROWS: Record<string, number> = {
  'long_pol_column.csv': 336, 'long_pol_column_h_v.csv': 336, matrix: 14, 'wide.csv': 84, 'wide_pair_co_cross.csv': 84, 'wide_frequency_block.tsv': 84,
};

describe('every layout and convention reads into the same measurement as the long layout', async () => {
  const ref = await readAll(path.join(IO, 'long.csv'));
  it('reference reads cleanly', () => {
    expect(ref.errors).toEqual([]);
    expect(ref.files[0].errors).toEqual([]);
    expect(ref.measurements).toHaveLength(1);
    const m = ref.measurements[0];
    expect([m.unit, m.frequencyHz, m.quantity, m.valueUnit]).toEqual(['DUT-A', 28e9, 'eirp', 'dBm']);
    expect(m.beams.map((b) => b.id)).toEqual(['0', '1']);
    // 7 θ rows × 12 φ columns, the two pole rows merged into one point each: 5·12 + 2
    expect(m.grid.thetaDeg.length).toBe(62);
  });
  for (const v of VARIANTS) {
    it(v, async () => {
      const got = await readAll(path.join(IO, v));
      expect(got.files.flatMap((f) => f.errors)).toEqual([]);
      expect(got.errors).toEqual([]);
      // A θ/φ pair also gives its θ and φ components as measurements of their own (tagged).
      const pairLayout = /pair|pol_column/.test(v);
      expect(got.measurements.map((m) => m.polarization)).toEqual(pairLayout ? [undefined, 'theta', 'phi'] : [undefined]);
      expect(got.files.map((f) => f.info.parser)).toEqual(got.files.map(() => (v === 'long_quoted.csv' ? 'general' : 'fast')));
      expect(got.files.reduce((n, f) => n + f.info.rows, 0)).toBe(ROWS[v] ?? 168);
      const [a, b] = [got.measurements[0], ref.measurements[0]];
      expect([a.unit, a.frequencyHz, a.quantity, a.valueUnit]).toEqual([b.unit, b.frequencyHz, b.quantity, b.valueUnit]);
      expect(a.beams.map((x) => x.id)).toEqual(b.beams.map((x) => x.id));
      expect(a.grid.thetaDeg.length).toBe(b.grid.thetaDeg.length);
      for (let i = 0; i < b.grid.thetaDeg.length; i++) {
        // radians → degrees and back is exact to ~1e-13°; the grid builder rounds to 1e-5°
        expectClose(a.grid.thetaDeg[i], b.grid.thetaDeg[i], 1e-9, `${v} θ of point ${i}`);
        expectClose(a.grid.phiDeg[i], b.grid.phiDeg[i], 1e-9, `${v} φ of point ${i}`);
        expectClose(a.grid.weightSr[i], b.grid.weightSr[i], 1e-12, `${v} weight of point ${i}`);
      }
      for (let k = 0; k < b.beams.length; k++) {
        for (let i = 0; i < b.beams[k].values.length; i++) {
          // power sums, mW ↔ dBm and the calibration offset are exact to ~1e-13 dB at 17 written digits
          expectClose(a.beams[k].values[i], b.beams[k].values[i], 1e-9, `${v} beam ${k} point ${i}`);
        }
      }
    });
  }
});
