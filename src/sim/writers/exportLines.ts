import type { ExportBeam, ExportOptions, ExportTable } from './exportTypes.js';
import { matrixLines } from './matrixLines.js';
import { numberFormat, valueUnitSuffix } from './numberFormat.js';
import { wideLines } from './wideLines.js';

/**
 * The lines of one export file in the requested layout, generated lazily so large exports
 * can be streamed. Every line ends with the line ending.
 * Formula: az/el columns use el = 90° − θ and az = φ mapped to [−180, 180) (the inverse of
 * CONTRACT.md's θ = 90 − el, φ = az mod 360); mW values are 10^(dB/10).
 * Boundary rule: angles print with up to 9 decimals and no trailing zeros; dB values with
 * `decimals` decimals (toFixed, round half away from zero on the binary value).
 * Cost: O(beams · samples) strings.
 * @throws Error when a value to print is not finite, when a pol layout lacks components,
 * or when a decimal comma is asked for with a comma delimiter.
 * @example
 * [...exportLines(table, { layout: 'long' })][0]; // 'theta_deg,phi_deg,beam,eirp_dbm\n'
 */
export function* exportLines(table: ExportTable, opts: ExportOptions): Generator<string> {
  const fmt = numberFormat(opts);
  const nl = opts.lineEnding ?? '\n';
  for (const line of opts.preamble ?? []) yield `${line}${nl}`;
  for (const [k, v] of Object.entries(opts.metadata ?? {})) yield `# ${k}: ${v}${nl}`;
  if (opts.layout === 'matrix') {
    yield* matrixLines(table, opts, fmt);
    return;
  }
  if (opts.layout === 'wide' || opts.layout === 'wide-pair') {
    yield* wideLines(table, opts, fmt);
    return;
  }
  const [pa, pb] = opts.pairNames ?? ['theta', 'phi'];
  const sep = opts.delimiter ?? ',';
  const q = opts.quantity ?? 'eirp';
  const vu = valueUnitSuffix(opts);
  const withBeam = opts.beamColumn ?? table.beams.length > 1;
  const lead: string[] = [];
  const leadHead: string[] = [];
  if (opts.unit !== undefined) {
    leadHead.push('unit');
    lead.push(opts.unit);
  }
  if (opts.frequencyHz !== undefined) {
    leadHead.push('frequency_ghz');
    lead.push(fmt.angle(opts.frequencyHz / 1e9));
  }
  const angleHead = opts.layout === 'az-el' ? ['azimuth_deg', 'elevation_deg'] : ['theta_deg', 'phi_deg'];
  const valueHead =
    opts.layout === 'pol-pair' ? [`${q}_${pa}_${vu}`, `${q}_${pb}_${vu}`] : opts.layout === 'pol-column' ? ['pol', `${q}_${vu}`] : [`${q}_${vu}`];
  yield [...leadHead, ...angleHead, ...(withBeam ? ['beam'] : []), ...valueHead].join(sep) + nl;
  const { thetaDeg, phiDeg } = table.grid;
  for (const beam of table.beams) {
    for (let i = 0; i < thetaDeg.length; i++) {
      const angles =
        opts.layout === 'az-el'
          ? [fmt.angle((((phiDeg[i] + 180) % 360) + 360) % 360 - 180), fmt.angle(90 - thetaDeg[i])]
          : [fmt.angle(thetaDeg[i]), fmt.angle(phiDeg[i])];
      const cells = [...lead, ...angles, ...(withBeam ? [beam.id] : [])];
      if (opts.layout === 'pol-pair') {
        const [t, p] = components(beam);
        yield [...cells, fmt.value(t[i], beam, i), fmt.value(p[i], beam, i)].join(sep) + nl;
      } else if (opts.layout === 'pol-column') {
        const [t, p] = components(beam);
        yield [...cells, pa, fmt.value(t[i], beam, i)].join(sep) + nl;
        yield [...cells, pb, fmt.value(p[i], beam, i)].join(sep) + nl;
      } else {
        yield [...cells, fmt.value(beam.valuesDb[i], beam, i)].join(sep) + nl;
      }
    }
  }
}

function components(beam: ExportBeam): [Float64Array, Float64Array] {
  if (!beam.thetaDb || !beam.phiDb) throw new Error(`writer: beam ${beam.id} has no polarization components`);
  return [beam.thetaDb, beam.phiDb];
}
