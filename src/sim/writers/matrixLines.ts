import type { ExportOptions, ExportTable } from './exportTypes.js';
import { valueUnitSuffix, type NumberFormat } from './numberFormat.js';

/**
 * The matrix layout of one beam: header `theta_deg,<φ₁>,<φ₂>,…`, then one row per θ starting
 * with the θ value; the quantity goes in a `# quantity: eirp dBm` metadata line (CONTRACT.md
 * "Matrix layout").
 * Boundary rule: a pole written once in the sample grid fills its whole row (one direction);
 * any other missing (θ, φ) cell is an error, since the layout has no way to say "not measured".
 * Cost: O(samples).
 * @throws Error when the table holds more or less than one beam or the grid is not a full
 * θ × φ product.
 * @example
 * matrixLines(table, { layout: 'matrix' }, fmt); // '# quantity: eirp dBm\n', 'theta_deg,0,5,…\n', …
 */
export function* matrixLines(table: ExportTable, opts: ExportOptions, fmt: NumberFormat): Generator<string> {
  if (table.beams.length !== 1) throw new Error(`writer: matrix layout holds one beam, got ${table.beams.length}`);
  const beam = table.beams[0];
  const nl = opts.lineEnding ?? '\n';
  const sep = opts.delimiter ?? ',';
  const { thetaDeg, phiDeg } = table.grid;
  const rows = [...new Set(thetaDeg)].sort((a, b) => a - b);
  const cols = [...new Set(Array.from(phiDeg).filter((_, i) => thetaDeg[i] !== 0 && thetaDeg[i] !== 180))].sort((a, b) => a - b);
  const cell = new Map<string, number>();
  const pole = new Map<number, number>();
  for (let i = 0; i < thetaDeg.length; i++) {
    cell.set(`${thetaDeg[i]}|${phiDeg[i]}`, i);
    if (thetaDeg[i] === 0 || thetaDeg[i] === 180) pole.set(thetaDeg[i], i);
  }
  const unitName = valueUnitSuffix(opts) === 'dbi' ? 'dBi' : valueUnitSuffix(opts) === 'mw' ? 'mW' : 'dBm';
  yield `# quantity: ${opts.quantity ?? 'eirp'} ${unitName}${nl}`;
  yield ['theta_deg', ...cols.map((c) => fmt.angle(c))].join(sep) + nl;
  for (const t of rows) {
    const out = [fmt.angle(t)];
    for (const c of cols) {
      const i = cell.get(`${t}|${c}`) ?? pole.get(t);
      if (i === undefined) throw new Error(`writer: matrix layout needs every (θ, φ) cell; θ ${t}, φ ${c} is missing`);
      out.push(fmt.value(beam.valuesDb[i], beam, i));
    }
    yield out.join(sep) + nl;
  }
}
