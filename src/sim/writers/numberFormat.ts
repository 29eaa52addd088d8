import type { ExportBeam, ExportOptions } from './exportTypes.js';

export interface NumberFormat {
  angle(x: number): string;
  value(db: number, beam: ExportBeam, i: number): string;
}

/** Number printing shared by all layouts (decimal comma, mW, decimals). */
export function numberFormat(opts: ExportOptions): NumberFormat {
  const comma = opts.decimalComma ?? false;
  if (comma && (opts.delimiter ?? ',') === ',') throw new Error('writer: a decimal comma needs a ";" or tab delimiter');
  if (opts.linearMw && opts.quantity === 'gain') throw new Error('writer: gain cannot be written in mW');
  const decimals = opts.decimals ?? 2;
  const dot = (s: string): string => (comma ? s.replace('.', ',') : s);
  return {
    angle: (x) => dot(String(Math.round(x * 1e9) / 1e9 + 0)),
    value: (db, beam, i) => {
      if (!Number.isFinite(db)) {
        throw new Error(`writer: beam ${beam.id} sample ${i}: value ${db} cannot be printed (apply a noise floor first)`);
      }
      return dot(opts.linearMw ? (10 ** (db / 10)).toPrecision(6) : db.toFixed(decimals));
    },
  };
}

/** Column-name suffix of the value's unit: dbm, dbi or mw. */
export function valueUnitSuffix(opts: ExportOptions): string {
  if (opts.linearMw) return 'mw';
  return (opts.quantity ?? 'eirp') === 'gain' ? 'dbi' : 'dbm';
}
