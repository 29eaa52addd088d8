import { quantityLabel } from '../../quantity.js';
import type { ExportBeam, ExportOptions, ExportTable } from './exportTypes.js';
import { valueUnitSuffix, type NumberFormat } from './numberFormat.js';


/**
 * The wide layout: one row per direction, one value column per beam, `Beam <id> EIRP (dBm)`
 * (layout 'wide'), or two polarization columns per beam, `Beam <id> EIRP theta (dBm)` and
 * `… phi (dBm)` with the names of `pairNames` (layout 'wide-pair'); with `frequencyBlocks`, one
 * column block per frequency whose headers start with the frequency (`28 GHz Beam 0 EIRP (dBm)`).
 * Boundary rule: every beam of every block must be sampled on the table's grid (one row per
 * direction holds them all).
 * Cost: O(beams · samples) strings.
 * @throws Error when a beam lacks polarization components for 'wide-pair' or a value is not finite.
 * @example
 * [...wideLines(table, { layout: 'wide' }, fmt)][0]; // 'theta_deg,phi_deg,Beam 0 EIRP (dBm),Beam 7 EIRP (dBm)\n'
 */
export function* wideLines(table: ExportTable, opts: ExportOptions, fmt: NumberFormat): Generator<string> {
  const nl = opts.lineEnding ?? '\n';
  const sep = opts.delimiter ?? ',';
  const label = quantityLabel(opts.quantity ?? 'eirp');
  const vu = valueUnitSuffix(opts);
  const unit = vu === 'dbi' ? 'dBi' : vu === 'mw' ? 'mW' : 'dBm';
  const [pa, pb] = opts.pairNames ?? ['theta', 'phi'];
  const pair = opts.layout === 'wide-pair';
  const blocks = opts.frequencyBlocks ?? [{ frequencyHz: null, beams: table.beams }];
  const head: string[] = [];
  const lead: string[] = [];
  if (opts.unit !== undefined) {
    head.push('unit');
    lead.push(opts.unit);
  }
  if (opts.frequencyHz !== undefined && !opts.frequencyBlocks) {
    head.push('frequency_ghz');
    lead.push(fmt.angle(opts.frequencyHz / 1e9));
  }
  head.push('theta_deg', 'phi_deg');
  for (const block of blocks) {
    const f = block.frequencyHz === null ? '' : `${fmt.angle(block.frequencyHz / 1e9)} GHz `;
    for (const b of block.beams) {
      if (pair) head.push(`${f}Beam ${b.id} ${label} ${pa} (${unit})`, `${f}Beam ${b.id} ${label} ${pb} (${unit})`);
      else head.push(`${f}Beam ${b.id} ${label} (${unit})`);
    }
  }
  yield head.join(sep) + nl;
  const { thetaDeg, phiDeg } = table.grid;
  for (let i = 0; i < thetaDeg.length; i++) {
    const cells = [...lead, fmt.angle(thetaDeg[i]), fmt.angle(phiDeg[i])];
    for (const block of blocks) {
      for (const b of block.beams) {
        if (pair) {
          const [t, p] = components(b);
          cells.push(fmt.value(t[i], b, i), fmt.value(p[i], b, i));
        } else cells.push(fmt.value(b.valuesDb[i], b, i));
      }
    }
    yield cells.join(sep) + nl;
  }
}

function components(beam: ExportBeam): [Float64Array, Float64Array] {
  if (!beam.thetaDb || !beam.phiDb) throw new Error(`writer: beam ${beam.id} has no polarization components`);
  return [beam.thetaDb, beam.phiDb];
}
