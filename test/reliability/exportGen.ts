/**
 * Generated chamber exports for the reliability suite: valid files in random dialects (long,
 * matrix and wide layouts, with or without a free-text preamble) and random damage applied to them. All randomness comes from fast-check
 * (seeded by the caller), so a failure prints a replayable counterexample.
 */
import fc from 'fast-check';

export interface ExportSpec {
  layout: 'long' | 'matrix' | 'wide';
  /** Free-text lines (a title, `Operator: …`, a blank line) before everything else. */
  preamble: boolean;
  delimiter: ',' | ';' | '\t';
  decimalComma: boolean;
  crlf: boolean;
  bom: boolean;
  quoteCells: boolean;
  metadata: boolean;
  azEl: boolean;
  extraColumn: boolean;
  beams: number;
  thetaStepDeg: number;
  phiStepDeg: number;
  /** Values in hundredths of a dB, cycled over the samples. */
  centi: number[];
  trailingNewline: boolean;
}

export const exportSpec: fc.Arbitrary<ExportSpec> = fc.record({
  layout: fc.constantFrom('long' as const, 'long' as const, 'matrix' as const, 'wide' as const),
  preamble: fc.boolean(),
  delimiter: fc.constantFrom(',' as const, ';' as const, '\t' as const),
  decimalComma: fc.boolean(),
  crlf: fc.boolean(),
  bom: fc.boolean(),
  quoteCells: fc.boolean(),
  metadata: fc.boolean(),
  azEl: fc.boolean(),
  extraColumn: fc.boolean(),
  beams: fc.integer({ min: 1, max: 3 }),
  thetaStepDeg: fc.constantFrom(30, 45, 60, 90),
  phiStepDeg: fc.constantFrom(30, 45, 60, 90, 120),
  centi: fc.array(fc.integer({ min: -6000, max: 6000 }), { minLength: 3, maxLength: 12 }),
  trailingNewline: fc.boolean(),
});

export interface Rendered {
  text: string;
  /** Samples per beam (what a correct reader must return for the undamaged file). */
  expected: { thetaDeg: number[]; phiDeg: number[]; values: number[] }[];
}

/** Render a spec as export text (before encoding). */
export function renderExport(s: ExportSpec): Rendered {
  const dc = s.decimalComma && s.delimiter !== ',';
  const num = (x: number) => (dc ? String(x).replace('.', ',') : String(x));
  const q = (t: string) => (s.quoteCells && s.layout !== 'matrix' ? `"${t}"` : t);
  const nl = s.crlf ? '\r\n' : '\n';
  const thetas: number[] = [];
  for (let t = 0; t <= 180; t += s.thetaStepDeg) thetas.push(t);
  const phis: number[] = [];
  for (let p = 0; p < 360; p += s.phiStepDeg) phis.push(p);
  let k = 0;
  const nextValue = () => s.centi[k++ % s.centi.length] / 100;
  const lines: string[] = [];
  if (s.preamble) lines.push('Pattern export of an invented range', 'Operator: fuzz', '');
  if (s.metadata) lines.push('# unit: FZ-01', '# frequency: 28 GHz');
  const expected: Rendered['expected'] = [];
  if (s.layout === 'matrix') {
    lines.push('# quantity: eirp dBm');
    lines.push([s.azEl ? 'el\\az' : 'theta\\phi', ...phis.map(num)].join(s.delimiter));
    const e = { thetaDeg: [] as number[], phiDeg: [] as number[], values: [] as number[] };
    for (const t of thetas) {
      const row = [num(s.azEl ? 90 - t : t)];
      for (const p of phis) {
        const v = nextValue();
        row.push(num(v));
        e.thetaDeg.push(t);
        e.phiDeg.push(p);
        e.values.push(v);
      }
      lines.push(row.join(s.delimiter));
    }
    expected.push(e);
  } else if (s.layout === 'wide') {
    const beamCols = Array.from({ length: s.beams }, (_, b) => `Beam ${b} EIRP (dBm)`);
    const header = [s.azEl ? 'el_deg' : 'theta_deg', s.azEl ? 'az_deg' : 'phi_deg', ...beamCols, ...(s.extraColumn ? ['chamber_temp'] : [])];
    lines.push(header.map(q).join(s.delimiter));
    for (let b = 0; b < s.beams; b++) expected.push({ thetaDeg: [], phiDeg: [], values: [] });
    for (const t of thetas) {
      for (const p of phis) {
        const vals = expected.map((e) => {
          const v = nextValue();
          e.thetaDeg.push(t);
          e.phiDeg.push(p);
          e.values.push(v);
          return num(v);
        });
        lines.push([num(s.azEl ? 90 - t : t), num(p), ...vals, ...(s.extraColumn ? [num(21.5)] : [])].join(s.delimiter));
      }
    }
  } else {
    const header = [s.azEl ? 'el_deg' : 'theta_deg', s.azEl ? 'az_deg' : 'phi_deg', 'beam', 'eirp_dbm', ...(s.extraColumn ? ['chamber_temp'] : [])];
    lines.push(header.map(q).join(s.delimiter));
    for (let b = 0; b < s.beams; b++) {
      const e = { thetaDeg: [] as number[], phiDeg: [] as number[], values: [] as number[] };
      for (const t of thetas) {
        for (const p of phis) {
          const v = nextValue();
          lines.push([num(s.azEl ? 90 - t : t), num(p), q(String(b)), num(v), ...(s.extraColumn ? [num(21.5)] : [])].join(s.delimiter));
          e.thetaDeg.push(t);
          e.phiDeg.push(p);
          e.values.push(v);
        }
      }
      expected.push(e);
    }
  }
  return { text: lines.join(nl) + (s.trailingNewline ? nl : ''), expected };
}

/** One kind of damage; positions are fractions of the file so they shrink well. */
export type Damage =
  | { kind: 'truncate'; at: number }
  | { kind: 'strayQuote'; at: number }
  | { kind: 'binary'; at: number; bytes: number[] }
  | { kind: 'cell'; at: number; text: string }
  | { kind: 'duplicateHeaderLine'; at: number }
  | { kind: 'duplicateHeaderCell' }
  | { kind: 'hugeLine'; at: number; char: string }
  | { kind: 'hugeCell'; at: number }
  | { kind: 'deleteLine'; at: number }
  | { kind: 'emptyLines'; at: number }
  | { kind: 'foreignDelimiter'; at: number };

const frac = fc.double({ min: 0, max: 1, noNaN: true });

export const BAD_CELLS = ['1e999', '-1e999', 'NaN', 'nan', 'Infinity', '-inf', '', ' ', '1'.repeat(400), '9'.repeat(25), '0x1F', '--5', '1.2.3', '1,2,3', '1e', '+', '.', '١٢', '1_000', '"', '""', '12 dBm'];

export const damage: fc.Arbitrary<Damage> = fc.oneof(
  fc.record({ kind: fc.constant('truncate' as const), at: frac }),
  fc.record({ kind: fc.constant('strayQuote' as const), at: frac }),
  fc.record({ kind: fc.constant('binary' as const), at: frac, bytes: fc.array(fc.integer({ min: 0, max: 255 }), { minLength: 1, maxLength: 8 }) }),
  fc.record({ kind: fc.constant('cell' as const), at: frac, text: fc.constantFrom(...BAD_CELLS) }),
  fc.record({ kind: fc.constant('duplicateHeaderLine' as const), at: frac }),
  fc.record({ kind: fc.constant('duplicateHeaderCell' as const) }),
  fc.record({ kind: fc.constant('hugeLine' as const), at: frac, char: fc.constantFrom('x', '7', ',', '"', ';', ' ') }),
  fc.record({ kind: fc.constant('hugeCell' as const), at: frac }),
  fc.record({ kind: fc.constant('deleteLine' as const), at: frac }),
  fc.record({ kind: fc.constant('emptyLines' as const), at: frac }),
  fc.record({ kind: fc.constant('foreignDelimiter' as const), at: frac }),
);

export type Encoding = 'utf8' | 'utf16le' | 'utf16le-bom' | 'utf16be-bom' | 'latin1';
export const encoding: fc.Arbitrary<Encoding> = fc.constantFrom('utf8', 'utf8', 'utf8', 'utf8', 'utf16le', 'utf16le-bom', 'utf16be-bom', 'latin1');

/** 100 000-character lines, the size the issue names. */
export const HUGE_LINE = 100_000;

function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
  return starts;
}

/** Apply one damage to the text (binary damage is kept as \u0000-\u00ff chars, encoded later as bytes). */
export function applyDamage(text: string, d: Damage, delimiter: string): string {
  const pos = (f: number) => Math.min(text.length, Math.floor(f * text.length));
  const starts = lineStarts(text);
  const lineAt = (f: number) => Math.min(starts.length - 1, Math.floor(f * starts.length));
  const header = () => {
    const i = starts.findIndex((s) => text[s] !== '#');
    return i < 0 ? 0 : i;
  };
  const lineText = (i: number) => text.slice(starts[i], i + 1 < starts.length ? starts[i + 1] : text.length);
  switch (d.kind) {
    case 'truncate':
      return text.slice(0, pos(d.at));
    case 'strayQuote':
      return text.slice(0, pos(d.at)) + '"' + text.slice(pos(d.at));
    case 'binary':
      return text.slice(0, pos(d.at)) + String.fromCharCode(...d.bytes) + text.slice(pos(d.at));
    case 'cell': {
      // Replace the numeric field after the n-th delimiter at or after the position.
      const p = text.indexOf(delimiter, pos(d.at));
      if (p < 0) return text + delimiter + d.text;
      let e = p + 1;
      while (e < text.length && text[e] !== delimiter && text[e] !== '\n' && text[e] !== '\r') e++;
      return text.slice(0, p + 1) + d.text + text.slice(e);
    }
    case 'duplicateHeaderLine': {
      const h = lineText(header());
      const at = starts[lineAt(d.at)];
      return text.slice(0, at) + (h.endsWith('\n') ? h : h + '\n') + text.slice(at);
    }
    case 'duplicateHeaderCell': {
      const h = header();
      const line = lineText(h);
      const first = line.split(delimiter)[0].replace(/\r?\n$/, '');
      return text.slice(0, starts[h]) + first + delimiter + line + text.slice(starts[h] + line.length);
    }
    case 'hugeLine': {
      const at = starts[lineAt(d.at)];
      return text.slice(0, at) + d.char.repeat(HUGE_LINE) + '\n' + text.slice(at);
    }
    case 'hugeCell': {
      const p = text.indexOf(delimiter, pos(d.at));
      if (p < 0) return text + '5'.repeat(HUGE_LINE);
      return text.slice(0, p + 1) + '5'.repeat(HUGE_LINE) + text.slice(p + 1);
    }
    case 'deleteLine': {
      const i = lineAt(d.at);
      return text.slice(0, starts[i]) + text.slice(starts[i] + lineText(i).length);
    }
    case 'emptyLines': {
      const at = starts[lineAt(d.at)];
      return text.slice(0, at) + '\n\n \n' + text.slice(at);
    }
    case 'foreignDelimiter': {
      const i = lineAt(d.at);
      const other = delimiter === ',' ? ';' : ',';
      const l = lineText(i);
      return text.slice(0, starts[i]) + l.split(delimiter).join(other) + text.slice(starts[i] + l.length);
    }
  }
}

/** Encode text as bytes; characters 0x80–0xff that came from binary damage stay single bytes in latin1. */
export function encode(text: string, enc: Encoding, bom: boolean): Buffer {
  switch (enc) {
    case 'utf8':
      return Buffer.concat([bom ? Buffer.from([0xef, 0xbb, 0xbf]) : Buffer.alloc(0), Buffer.from(text, 'utf8')]);
    case 'latin1':
      // A Latin-1 file with an accented name in it, the usual wrong-encoding case.
      return Buffer.from(text.replace('FZ-01', 'FZ-Müller'), 'latin1');
    case 'utf16le':
      return Buffer.from(text, 'utf16le');
    case 'utf16le-bom':
      return Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
    case 'utf16be-bom': {
      const le = Buffer.from(text, 'utf16le');
      return Buffer.concat([Buffer.from([0xfe, 0xff]), le.swap16()]);
    }
  }
}
