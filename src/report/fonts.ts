import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

/**
 * pdfkit, loaded with `require` rather than `import`: it is a CommonJS bundle, and importing it
 * from an ES module makes Node scan its 200 kB source for export names first (cjs-module-lexer),
 * about 60 ms of CPU in every thread that writes PDFs (main thread and each worker; measured
 * 2026-12-02, `import('pdfkit')` 217–258 ms against `require('pdfkit')` 160–174 ms of CPU).
 * pdfDoc.ts takes it from here, so the report modules load one pdfkit.
 */
export const PDFDocument = require('pdfkit') as typeof import('pdfkit');

let cache: { regular: Buffer; bold: Buffer } | null = null;

/**
 * DejaVu Sans regular and bold (open licence, from the dejavu-fonts-ttf package), embedded in every
 * PDF so θ, φ, Ω, σ, ≥ and π render. Read once per process; resolved through the module
 * resolver so it works from src/ and dist/.
 */
export function reportFonts(): { regular: Buffer; bold: Buffer } {
  cache ??= {
    regular: readFileSync(require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf')),
    bold: readFileSync(require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf')),
  };
  return cache;
}

/** The part of fontkit's API used here (fontkit is pdfkit's own dependency, not ours). */
interface Fontkit {
  create(buffer: Uint8Array, postscriptName?: string): unknown;
  registerFormat(format: unknown): void;
}

const TAG = 'spherecov-shared-font:';
let sources: { regular: Uint8Array; bold: Uint8Array } | null = null;
/** Why the shared-font hook fell back to the plain bytes (null while it works). */
let sharedFontProblem: string | null = null;

/*
 * This file is the only place that touches pdfkit's private parts: fontkit reached through
 * pdfkit's own `require` (fontkit's public registerFormat, but on pdfkit's instance) and the
 * document's private `_font.layoutCache`. Both fall back silently at run time (reports stay
 * correct, only slower), so `pdfkitHookProblems` below says what broke, and
 * test/report/pdfkitHooks.test.ts fails with that text when a pdfkit upgrade changes them.
 */
const PDFKIT_PIN = '0.17.2';

/**
 * What to pass to `doc.registerFont` for the report fonts: a short tag that pdfkit's font
 * factory hands to fontkit, which resolves it to a font parsed once per thread, or the TTF bytes
 * when that hook is unavailable.
 *
 * Why: pdfkit parses a registered TTF again for every document (`fontkit.create`), and the
 * tables it then decodes lazily (cmap, hmtx, GSUB/GPOS for kerning, glyphs) cost about a quarter
 * of a unit report. A fontkit font is read-only for pdfkit (each document makes its own subset
 * and layout cache from it), so one parse can serve every document; the embedded subsets are
 * byte-identical either way (test/report/unitReport.test.ts).
 * Mechanism: fontkit's public `registerFormat`, on the fontkit instance that pdfkit itself
 * requires; a format whose probe accepts only our tags and whose constructor returns the parsed
 * font. Checked once with a throwaway document; on any failure the plain bytes are used.
 */
export function reportFontSources(): { regular: Uint8Array; bold: Uint8Array } {
  if (sources) return sources;
  const fonts = reportFonts();
  sources = fonts;
  try {
    const fontkit = createRequire(require.resolve('pdfkit'))('fontkit') as Fontkit;
    const parsed = new Map<string, unknown>([
      [`${TAG}regular`, fontkit.create(fonts.regular)],
      [`${TAG}bold`, fontkit.create(fonts.bold)],
    ]);
    const text = (b: Uint8Array) => (b.length <= 64 ? Buffer.from(b.buffer, b.byteOffset, b.byteLength).toString('latin1') : '');
    class SharedFont {
      static probe(buffer: Uint8Array): boolean {
        return parsed.has(text(buffer));
      }
      constructor(stream: { buffer: Uint8Array }) {
        // A constructor that returns an object yields that object: the font parsed above.
        return parsed.get(text(stream.buffer)) as SharedFont;
      }
    }
    fontkit.registerFormat(SharedFont);
    const tagged = { regular: Buffer.from(`${TAG}regular`, 'latin1'), bold: Buffer.from(`${TAG}bold`, 'latin1') };
    const probe = new PDFDocument({ autoFirstPage: false });
    probe.registerFont('R', tagged.regular);
    probe.registerFont('B', tagged.bold);
    probe.font('R').font('B');
    sources = tagged;
  } catch (e) {
    sharedFontProblem = e instanceof Error ? e.message : String(e);
    sources = fonts;
  }
  return sources;
}

/** The document's current font object (pdfkit private `_font`), undefined when absent. */
function currentFont(doc: PDFKit.PDFDocument): { layoutCache?: unknown } | undefined {
  return (doc as unknown as { _font?: { layoutCache?: unknown } })._font;
}

/** pdfkit's per-document word layout cache (EmbeddedFont.layoutCache), shared per font and thread. */
const layoutCaches = new Map<string, Record<string, unknown>>();
let docsOnCaches = 0;

/**
 * Select each report font once on a new document and let it use a word-layout cache shared with
 * the earlier documents of this thread (only when the fonts are the shared parsed ones, so every
 * cached run has the same font and scale). pdfkit caches the glyph run of every word it lays out
 * (GSUB/GPOS shaping, the costly part of setting text) per document and copies a run before
 * changing it, so a run is as valid in the next document as in this one. Uses pdfkit's
 * EmbeddedFont.layoutCache field when present; otherwise nothing changes. Renewed every 500
 * documents so the cache stays small (it holds words, labels and numbers).
 */
export function shareLayoutCaches(doc: PDFKit.PDFDocument, names: string[]): void {
  if (sources === null || sources === cache) return;
  if (++docsOnCaches > 500) {
    layoutCaches.clear();
    docsOnCaches = 1;
  }
  for (const name of names) {
    doc.font(name);
    const font = currentFont(doc);
    if (!font || typeof font.layoutCache !== 'object' || font.layoutCache === null) continue;
    let shared = layoutCaches.get(name);
    if (!shared) layoutCaches.set(name, (shared = font.layoutCache as Record<string, unknown>));
    font.layoutCache = shared;
  }
}

/**
 * What no longer works of the private pdfkit hooks above, in words (empty: all work, as with the
 * pinned pdfkit). Checks: the installed pdfkit is the version the hooks were written against;
 * fontkit is reachable through pdfkit with `create` and `registerFormat`; the shared-font format
 * was accepted (reportFontSources returns the short tags, not the TTF bytes); a document's current
 * font has an object `layoutCache`, and two documents end up sharing one after
 * shareLayoutCaches. Cost: parses the fonts once (if not yet) and opens two empty documents.
 */
export function pdfkitHookProblems(): string[] {
  const problems: string[] = [];
  const here = 'src/report/fonts.ts';
  const version = (createRequire(require.resolve('pdfkit'))('../package.json') as { version?: string }).version;
  if (version !== PDFKIT_PIN) {
    problems.push(`pdfkit is ${version}, the private hooks in ${here} were written against ${PDFKIT_PIN}: re-check them (the other lines of this list) and move PDFKIT_PIN`);
  }
  let fontkit: Partial<Fontkit> | null = null;
  try {
    fontkit = createRequire(require.resolve('pdfkit'))('fontkit') as Partial<Fontkit>;
  } catch (e) {
    problems.push(`pdfkit no longer resolves its own 'fontkit' (${e instanceof Error ? e.message : String(e)}): ${here} cannot share parsed fonts`);
  }
  if (fontkit && (typeof fontkit.create !== 'function' || typeof fontkit.registerFormat !== 'function')) {
    problems.push(`pdfkit's fontkit has no create/registerFormat functions any more: ${here} cannot share parsed fonts`);
  }
  const s = reportFontSources();
  if (s === cache) problems.push(`the shared-font hook fell back to the TTF bytes (${sharedFontProblem ?? 'no error recorded'}): every report parses the fonts again`);
  const docs = [0, 1].map(() => {
    const doc = new PDFDocument({ autoFirstPage: false });
    doc.registerFont('R', s.regular);
    shareLayoutCaches(doc, ['R']);
    return currentFont(doc);
  });
  if (!docs[0] || typeof docs[0].layoutCache !== 'object' || docs[0].layoutCache === null) {
    problems.push(`pdfkit's current font (doc._font) has no object layoutCache any more: ${here} cannot share word layouts`);
  } else if (s !== cache && docs[0].layoutCache !== docs[1]?.layoutCache) {
    problems.push(`two documents do not share the word-layout cache after shareLayoutCaches: ${here}`);
  }
  return problems;
}
