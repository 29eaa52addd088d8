/**
 * Planning rules shared by the layouts: quantity resolution, value units, the job file's
 * column mapping, the angle columns. One place each, so every layout reads a header alike.
 */
import type { InputError, Quantity, ValueUnit, Warning } from '../../types.js';
import { warning } from '../../warnings.js';
import { isQuantity, quantityUnit, resolveQuantity } from '../../quantity.js';
import { roleOfName } from '../columnRoles.js';
import { parseHeaderCell, type HeaderCell } from '../headerCell.js';
import { inputError } from '../inputError.js';
import type { ColumnRole, JobSpec } from '../types.js';
import type { PlanContext, PlanResult } from './layoutTypes.js';

export const VALUE_ROLES: ColumnRole[] = ['value', 'valueTheta', 'valuePhi', 'power'];
export const FREQ_FACTORS: Record<string, number> = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 };

export function fail(errors: InputError[], warnings: Warning[] = []): PlanResult {
  return { planned: null, warnings, errors };
}

/** Quantity and unit named by a `# quantity: eirp dBm` metadata line. */
export function metadataQuantity(meta: Record<string, string>): { quantity?: Quantity; unit?: string } {
  const text = meta.quantity?.trim().toLowerCase();
  if (!text) return {};
  const [q, u] = text.split(/[\s,]+/);
  const quantity = isQuantity(q) ? q : undefined;
  const unit = u ? parseHeaderCell(`x [${u}]`).unit ?? undefined : undefined;
  return { quantity, unit };
}

/** Unit assumed for values whose header, job file and metadata name none (received power is in dBm). */
export function assumedValueUnit(quantity: Quantity, power: boolean): string {
  return power ? 'dBm' : quantityUnit(quantity);
}

/** Check the written unit against the quantity; gives the stored unit or an error text. */
export function checkValueUnit(
  quantity: Quantity,
  power: boolean,
  unit: string,
): { fileUnit: 'dBm' | 'dBi' | 'mW' | 'W'; valueUnit: ValueUnit } | string {
  if (quantity === 'gain' && !power) {
    if (unit === 'dBi' || unit === 'dB') return { fileUnit: 'dBi', valueUnit: 'dBi' };
    return 'dBi for gain';
  }
  if (unit === 'dBm' || unit === 'mW' || unit === 'W') return { fileUnit: unit, valueUnit: 'dBm' };
  return `dBm, mW or W for ${power ? 'power' : quantity}`;
}

/**
 * The file's quantity in the one resolution order of src/quantity.ts (option > job > columns >
 * metadata > assumed eirp, with a warning). Columns and metadata that disagree, with neither
 * option nor job deciding, are an input error at the metadata line.
 */
export function quantityOfFile(
  ctx: PlanContext,
  fromColumns: Quantity | undefined,
  columnName: string | undefined,
  warnings: Warning[],
): Quantity | InputError {
  const meta = metadataQuantity(ctx.metadata);
  const r = resolveQuantity({ option: ctx.quantityOverride, job: ctx.job?.quantity, columns: fromColumns, metadata: meta.quantity });
  if (r.from === 'columns' && meta.quantity && meta.quantity !== fromColumns) {
    const line = ctx.metadataLines.quantity ?? 1;
    return inputError(ctx.file, line, 1, 'quantity', meta.quantity, `'${fromColumns}' to agree with column '${columnName}'`);
  }
  if (r.from === 'assumed') warnings.push(warning('quantity-assumed', `no quantity named; assumed eirp (dBm)`, { file: ctx.file }));
  return r.quantity;
}

/** Header cells with their roles by name, after the job file's `columns:` mapping. */
export interface HeaderRoles {
  parsed: HeaderCell[];
  roles: (ColumnRole | null)[];
  quantities: (Quantity | undefined)[];
}

/** Index of the header cell a job-file mapping names (case-insensitive, spaces trimmed), or −1. */
export function mappedIndex(cells: string[], name: string): number {
  return cells.findIndex((c) => c.trim().toLowerCase() === name.trim().toLowerCase());
}

/**
 * Roles of the header cells: by name (columnRoles), then the job file's `columns:` mapping
 * (role → header name) moves a role onto the named column. A mapping naming no column is an
 * error that says which way round the mapping goes.
 */
export function headerRoles(cells: string[], ctx: PlanContext): HeaderRoles | InputError[] {
  const parsed = cells.map(parseHeaderCell);
  const roles: (ColumnRole | null)[] = parsed.map((p) => roleOfName(p.base)?.role ?? null);
  const quantities: (Quantity | undefined)[] = parsed.map((p) => roleOfName(p.base)?.quantity);
  const errors: InputError[] = [];
  for (const [role, name] of Object.entries(ctx.job?.columns ?? {}) as [ColumnRole, string][]) {
    const idx = mappedIndex(cells, name);
    if (idx < 0) {
      errors.push(inputError(ctx.file, ctx.headerLine, 1, 'header', ctx.headerText, mappingExpected(role, name, cells)));
      continue;
    }
    for (let i = 0; i < roles.length; i++) if (roles[i] === role) roles[i] = null;
    roles[idx] = role;
    if (VALUE_ROLES.includes(role)) quantities[idx] = roleOfName(parsed[idx].base)?.quantity;
  }
  return errors.length ? errors : { parsed, roles, quantities };
}

/** Role keys of the job file, for messages (columns.<key>: <header name>). */
const ROLE_KEY_OF: Record<ColumnRole, string> = {
  theta: 'theta', phi: 'phi', azimuth: 'azimuth', elevation: 'elevation', value: 'value', valueTheta: 'value_theta',
  valuePhi: 'value_phi', power: 'power', pol: 'pol', unit: 'unit', beam: 'beam', frequency: 'frequency',
};

/** "expected" text of a mapping that names no header cell; spots a mapping written the wrong way round. */
function mappingExpected(role: ColumnRole, name: string, cells: string[]): string {
  const key = ROLE_KEY_OF[role];
  const base = `a column '${name}' (columns.${key} in the job file)`;
  const flipped = Object.entries(ROLE_KEY_OF).find(([, k]) => k === name.trim().toLowerCase());
  const headerLikeKey = cells.find((c) => c.trim().toLowerCase() === key);
  if (flipped || headerLikeKey) {
    return `${base}; the mapping goes role: header name, e.g. 'columns: { ${flipped ? flipped[1] : key}: ${headerLikeKey ? headerLikeKey.trim() : '<header name>'} }'`;
  }
  return base;
}

/** The two angle columns: θ and φ, or elevation and azimuth (in that order), or null. */
export function angleColumns(roles: (ColumnRole | null)[]): { convention: 'theta-phi' | 'az-el'; a1: number; a2: number } | null {
  const find = (role: ColumnRole): number => roles.indexOf(role);
  if (find('theta') >= 0 && find('phi') >= 0) return { convention: 'theta-phi', a1: find('theta'), a2: find('phi') };
  if (find('azimuth') >= 0 && find('elevation') >= 0) return { convention: 'az-el', a1: find('elevation'), a2: find('azimuth') };
  return null;
}

/** Roles of the cells by name and job mapping (no errors; for header detection). */
export function rolesForDetection(cells: string[], job?: JobSpec): (ColumnRole | null)[] {
  const roles = cells.map((c) => roleOfName(parseHeaderCell(c).base)?.role ?? null);
  for (const [role, name] of Object.entries(job?.columns ?? {}) as [ColumnRole, string][]) {
    const idx = mappedIndex(cells, name);
    if (idx >= 0) roles[idx] = role;
  }
  return roles;
}
