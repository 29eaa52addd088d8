import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';

const require = createRequire(import.meta.url);

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
  } catch {
    sources = fonts;
  }
  return sources;
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
    const font = (doc as unknown as { _font?: { layoutCache?: unknown } })._font;
    if (!font || typeof font.layoutCache !== 'object' || font.layoutCache === null) continue;
    let shared = layoutCaches.get(name);
    if (!shared) layoutCaches.set(name, (shared = font.layoutCache as Record<string, unknown>));
    font.layoutCache = shared;
  }
}
