import { lazySchema, zod } from './zod.js';
import type { ReportSections, ReportSettings } from '../report/reportTypes.js';
import { num, oneOf, whole } from './fields.js';
import { camelizeKeys } from './naming.js';

/** The report's sections, in file spelling (each `true` to draw it, `false` to leave it out). */
const SECTION_KEYS = ['checks', 'input_files', 'cdf', 'beam_cdfs', 'tsp_map', 'best_beam_map', 'coverage', 'beams', 'quality',
  'holes', 'reference', 'frequency_trend'] as const;

const onOff = () => zod().boolean({ error: 'true or false' }).optional();

/**
 * Report settings: templates/report/default.yaml and a job file's `report:` block (every key
 * optional there: it overrides the defaults key by key, `sections` section by section).
 */
export const reportSettingsSchema = lazySchema(() => zod().strictObject({
  title: zod().string({ error: 'a text' }).optional(),
  organisation: zod().string({ error: 'a text' }).optional(),
  logo: zod().string({ error: 'a file path or null' }).nullable().optional()
    .describe('PNG or JPEG drawn top right of the first page; relative to the job file'),
  page_size: oneOf(['A4', 'Letter'], 'A4 or Letter').optional(),
  color_map: oneOf(['lumen', 'grey'], 'lumen or grey').optional(),
  map_center_phi_deg: num('a number of degrees').optional().describe('Central meridian of the maps (φ at the map centre), degrees'),
  map_width_px: whole('an integer from 100 to 4000', 100, 4000).optional().describe('Raster width of each sphere map, pixels'),
  creation_date: zod().string({ error: 'an ISO 8601 date or null' })
    .refine((s) => !Number.isNaN(Date.parse(s)), { error: 'an ISO 8601 date or null' }).nullable().optional(),
  sections: zod().strictObject(Object.fromEntries(SECTION_KEYS.map((k) => [k, onOff()])) as Record<(typeof SECTION_KEYS)[number], ReturnType<typeof onOff>>,
    { error: 'a mapping of report sections to true or false' }).optional(),
}, { error: 'a mapping of report settings' })
  .transform((r) => camelizeKeys<Partial<Omit<ReportSettings, 'sections'>> & { sections?: Partial<ReportSections> }>(r)));
