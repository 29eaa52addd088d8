import { TOOL_VERSION } from '../batch/version.js';
import type { UnitAnalysis } from './analyzeBeams.js';

export interface UnitReportOptions {
  /** Report settings over the defaults (templates/report/default.yaml): title, organisation, pageSize, sections, … */
  settings?: import('../report/settings.js').ReportSettingsOverrides;
  /** Timestamp printed in the report (ISO 8601); default now. Fix it for reproducible PDFs. */
  generatedAt?: string;
}

/**
 * The unit report PDF of an analyzed unit (analyzeBeams), the same document `spherecov analyze`
 * writes as `<unit>_<frequency>.pdf`: verdict and checks first, CDF, equal-area maps, coverage
 * curve, beams, holes, data quality, and the cautions (engineering data, not a conformance or
 * RF-exposure assessment).
 * Cost: one PDF render (tens of milliseconds for a 1° grid).
 * @throws ReportSettingsError when a setting has the wrong type.
 * @example
 * const pdf = await unitReportPdf(analyzeBeams(input)); // Uint8Array, starts with '%PDF-'
 */
export async function unitReportPdf(analysis: UnitAnalysis, opts: UnitReportOptions = {}): Promise<Uint8Array> {
  // The report modules (pdfkit, fonts) load only when a PDF is asked for.
  const [{ renderUnitPdf }, { cdfCurve }, { loadReportSettings }] = await Promise.all([
    import('../report/unitReport.js'),
    import('../report/cdfCurve.js'),
    import('../report/settings.js'),
  ]);
  const { result, measurement, tsp } = analysis;
  const buf = await renderUnitPdf(
    {
      result, measurement, tsp, generatedAt: opts.generatedAt ?? new Date().toISOString(), toolVersion: TOOL_VERSION,
      tspCdf: cdfCurve(tsp.values, measurement.grid.weightSr, measurement.quantity),
    },
    loadReportSettings(opts.settings ?? {}),
  );
  return new Uint8Array(buf.buffer, buf.byteOffset, buf.byteLength);
}
