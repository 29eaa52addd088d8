import path from 'node:path';
import { gridSummary } from '../sphere/gridSummary.js';
import type { InputError, Quantity, Warning } from '../types.js';
import { assembleMeasurements } from './assembleMeasurements.js';
import { findExportFiles, NotFileOrFolderError, toPosix, type ExportFiles } from './findExportFiles.js';
import { findJobFile } from './findJobFile.js';
import { loadJobFile } from './jobFile.js';
import { fsReason, isFsError } from './fsProblem.js';
import { readExportFile } from './readExportFile.js';
import { nfcIdentity } from './nfcIdentity.js';
import { decimalSeparatorSeen, type DecimalSeparatorSeen } from './decimalSeparator.js';
import type { InspectReport, JobSpec, RawBeam } from './types.js';

export interface InspectOptions {
  /** Explicit job file; default: spherecov.yaml/.yml/.json in the input folder. */
  job?: string;
  quantity?: Quantity;
}

/**
 * The export files of the input, found by the walker analyze uses (so inspect shows the files
 * analyze would read); an input that does not exist, is a pipe or cannot be listed becomes the
 * report's error and null.
 */
async function findFiles(input: string, report: InspectReport): Promise<ExportFiles | null> {
  try {
    return await findExportFiles(input);
  } catch (e) {
    if (e instanceof NotFileOrFolderError) report.errors.push({ file: input, message: e.message });
    else if (isFsError(e)) report.errors.push({ file: input, message: e.code === 'ENOENT' ? `${input}: not found, expected a file or folder of exports` : `${input}: cannot read it: ${fsReason(e)}` });
    else throw e;
    return null;
  }
}

/**
 * How spherecov understands a file or folder, before anyone trusts a number: per file the
 * layout, dialect, column roles, units, angle convention, identities; per unit and frequency
 * the grid; all warnings and errors. Never throws for bad input.
 */
export async function inspectInput(input: string, opts: InspectOptions = {}): Promise<InspectReport> {
  const report: InspectReport = { input, job: { path: null, errors: [], notices: [] }, files: [], skippedLinks: [], measurements: [], errors: [], warnings: [] };
  const found = await findFiles(input, report);
  if (!found) return report;
  report.skippedLinks = found.skippedLinks.map(toPosix);
  report.errors.push(...found.problems);
  const root = found.root;
  const jobPath = opts.job ? path.resolve(opts.job) : findJobFile(root);
  let job: JobSpec | undefined;
  if (jobPath) {
    const loaded = loadJobFile(jobPath);
    report.job = { path: jobPath, errors: loaded.errors, notices: loaded.notices };
    report.errors.push(...loaded.errors);
    job = loaded.job ?? undefined;
  }
  const beams: RawBeam[] = [];
  for (const f of found.files) {
    const r = await readExportFile(f, { inputRoot: root, job, quantityOverride: opts.quantity });
    nfcIdentity(r.beams); // units and beams named as analyze groups them
    const decimalSeparator = r.info.layout && r.info.delimiter ? decimalSeparatorSeen(f, r.info.delimiter, r.info.header?.line ?? 1) : null;
    report.files.push({
      ...r.info, decimalSeparator, file: r.file, sha256: r.sha256,
      units: [...new Set(r.beams.map((b) => b.unit))], beams: [...new Set(r.beams.map((b) => b.beam))],
      frequenciesHz: [...new Set(r.beams.map((b) => b.frequencyHz))], errors: r.errors, warnings: r.warnings,
    });
    report.errors.push(...r.errors);
    report.warnings.push(...r.warnings);
    beams.push(...r.beams);
  }
  const sources = report.files.map((f) => ({ path: f.file, sha256: f.sha256 }));
  const asm = assembleMeasurements(beams, sources, { consumeRaw: true, mergeRule: job?.mergeRule });
  report.errors.push(...asm.errors);
  report.warnings.push(...asm.warnings);
  for (const m of asm.measurements) {
    const files = m.sources.map((s) => s.path);
    report.measurements.push({
      unit: m.unit, frequencyHz: m.frequencyHz, quantity: m.quantity, valueUnit: m.valueUnit,
      beams: m.beams.map((b) => b.id), files, grid: gridSummary(m), warnings: m.warnings,
      ...(m.polarization ? { polarization: m.polarization } : {}),
    });
  }
  return report;
}

const n4 = (x: number): string => String(Number(x.toFixed(4)));
const ghz = (f: number | null): string => (f === null ? 'none' : `${n4(f / 1e9)} GHz`);

/** Errors and warnings of a file (showFile false: they are listed under the file already) or of a unit. */
function listErrors(out: string[], errors: InputError[], warnings: Warning[], indent: string, showFile = false): void {
  for (const e of errors) out.push(`${indent}error: ${e.message}`);
  for (const w of warnings) {
    const where = showFile && w.file ? `${w.file}${w.line ? `:${w.line}` : ''}: ` : '';
    out.push(`${indent}warning [${w.code}]: ${where}${w.message}`);
  }
}

function headerHow(h: { chosen: string; preambleLines: number }): string {
  if (h.chosen === 'job') return ' (header_line in the job file)';
  if (h.chosen === 'detected') return ` (found below a ${h.preambleLines}-line preamble: the first row naming two angles and a value)`;
  return '';
}

/** The decimal separator found in the data rows, in words. */
function decimalText(d: DecimalSeparatorSeen | null | undefined): string {
  if (!d) return '';
  return d === 'comma' ? '; decimal comma' : d === 'point' ? '; decimal point' : d === 'both' ? '; decimal point and decimal comma both found' : '; no decimal fractions seen';
}

/** Plain-text rendering of an inspect report (stdout of `spherecov inspect`). */
export function formatInspect(r: InspectReport): string {
  const out: string[] = [`input: ${r.input}`, `job file: ${r.job.path ?? 'none'}`];
  for (const e of r.job.errors) out.push(`  error: ${e.message}`);
  for (const n of r.job.notices) out.push(`  notice: ${n.message}`);
  for (const l of r.skippedLinks) out.push(`skipped link: ${l} (broken, or pointing outside the input folder; not read)`);
  const delimName: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };
  for (const f of r.files) {
    out.push('', `file ${f.file}`);
    if (f.layout) {
      out.push(`  layout: ${f.layout}; delimiter: ${delimName[f.delimiter ?? ','] ?? 'n/a'}${decimalText(f.decimalSeparator)}; ${f.lineEnding ?? ''}${f.bom ? ', BOM' : ''}; parser: ${f.parser ?? 'n/a'}`);
      out.push(`  quantity: ${f.quantity} (${f.valueUnit}${f.fileValueUnit !== f.valueUnit ? `, written in ${f.fileValueUnit}` : ''})${f.calibrated ? ', calibrated from received power' : ''}`);
      out.push(`  angles: ${f.angleConvention} in ${f.angleUnit}`);
      if (f.header) out.push(`  header: line ${f.header.line}${headerHow(f.header)}`);
      out.push('  columns:');
      for (const c of f.columns) out.push(`    ${String(c.index + 1).padStart(3)}  ${c.name.padEnd(24)} ${c.role ?? 'ignored'}${c.beam !== undefined ? ` (beam ${c.beam})` : ''}${c.unit ? ` [${c.unit}]` : ''}`);
      if (f.matrixColumnsDeg) out.push(`  matrix columns: ${f.matrixColumnsDeg.join(', ')}`);
      out.push(`  rows: ${f.rows}`);
      out.push(`  identity: unit from ${f.identity.unit}, beam from ${f.identity.beam}, frequency from ${f.identity.frequency}`);
      out.push(`  units: ${f.units.join(', ') || '-'}; beams: ${f.beams.length} (${f.beams.slice(0, 12).join(', ')}${f.beams.length > 12 ? ', …' : ''}); frequencies: ${f.frequenciesHz.map(ghz).join(', ') || '-'}`);
      for (const [k, v] of Object.entries(f.metadata)) out.push(`  metadata ${k}: ${v}`);
    }
    listErrors(out, f.errors, f.warnings, '  ');
  }
  for (const m of r.measurements) {
    const g = m.grid;
    const pol = m.polarization ? `, ${m.polarization === 'theta' ? 'θ' : 'φ'} polarization component` : '';
    out.push('', `unit ${m.unit} at ${ghz(m.frequencyHz)}: ${m.quantity} (${m.valueUnit})${pol}, ${m.beams.length} beams from ${m.files.length} file(s)`);
    out.push(`  grid: ${g.kind}, ${g.points} points; θ ${n4(g.thetaRangeDeg[0])}–${n4(g.thetaRangeDeg[1])}° step ${g.thetaStepDeg === null ? 'varies' : `${n4(g.thetaStepDeg)}°`}; φ ${n4(g.phiRangeDeg[0])}–${n4(g.phiRangeDeg[1])}° step ${g.phiStepDeg === null ? 'varies' : `${n4(g.phiStepDeg)}°`}`);
    out.push(`  measured solid angle: ${g.solidAngleSr.toFixed(4)} sr (${((100 * g.solidAngleSr) / (4 * Math.PI)).toFixed(1)} % of 4π${g.fullSphere ? ', full sphere' : ''}); samples merged: ${g.duplicatesMerged}`);
    listErrors(out, [], m.warnings, '  ', true);
  }
  const nErr = r.errors.length;
  out.push('', `${r.files.length} file(s), ${r.measurements.length} unit/frequency measurement(s), ${nErr} error(s), ${r.warnings.length} warning(s)`);
  return `${out.join('\n')}\n`;
}
