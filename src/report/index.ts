// Reports: PDF per unit and per build, their settings, and the equal-area map projection.
export { renderUnitPdf, contourThreshold } from './unitReport.js';
export { renderBuildPdf } from './buildReport.js';
export { unitMapThumbnail } from './thumbnail.js';
export { cdfCurve, type CdfCurve } from './cdfCurve.js';
export { loadReportSettings, ReportSettingsError, type ReportSettingsOverrides } from './settings.js';
export { hammerForward, hammerInverse, HAMMER_HALF_WIDTH, HAMMER_HALF_HEIGHT } from './hammerProjection.js';
export { unitKey, type BuildReportInput, type MapThumbnail, type ReportSettings, type ReportSections, type UnitReportInput } from './reportTypes.js';
export { CAUTION } from './caution.js';
