/**
 * viewer.html: one self-contained page beside the PDFs (no server, no network; opens from a
 * shared drive or an e-mail attachment). It holds the build's numbers (src/viewer/viewerData.ts,
 * packed by viewerPack.ts) and the page script, which is bundled here at analyze time with esbuild
 * from the same compiled modules the CLI runs (src/coverage, src/limits, src/analysis, the
 * report's projection and colour maps) plus three.js: the page recomputes with the tool's code,
 * not with a second implementation.
 */
import { existsSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ResultsFile, SphereGrid, TotalScanPattern, UnitResult } from '../types.js';
import type { LimitSet } from '../limits/limitSet.js';
import type { ViewerBuild, ViewerUnit } from '../viewer/viewerData.js';
import { CAUTION } from './caution.js';
import { packReferencePattern } from './viewerPack.js';
import { VIEWER_CSS } from './viewerCss.js';

let bundled: Promise<string> | null = null;

interface BundleStamp { inputs: { path: string; size: number; mtimeMs: number }[] }

/** The cached bundle when every input file is unchanged since it was made, else null. */
function freshCache(bundlePath: string, stampPath: string, root: string): string | null {
  try {
    const stamp = JSON.parse(readFileSync(stampPath, 'utf8')) as BundleStamp;
    for (const i of stamp.inputs) {
      const st = statSync(path.resolve(root, i.path));
      if (st.size !== i.size || st.mtimeMs !== i.mtimeMs) return null;
    }
    return readFileSync(bundlePath, 'utf8');
  } catch {
    return null;
  }
}

/**
 * The page script as one minified IIFE (built once per process). Running from dist/, the bundle
 * is kept beside the compiled entry with the size and time of every input file, and reused while
 * none of them changed (esbuild is the analyze run's largest memory user); any change to the
 * compiled modules or three.js rebuilds it, so the page always runs the CLI's current code.
 */
export function viewerScript(): Promise<string> {
  bundled ??= (async () => {
    const js = fileURLToPath(new URL('../viewer/main.js', import.meta.url));
    const fromDist = existsSync(js);
    const entry = fromDist ? js : js.replace(/\.js$/, '.ts'); // from sources under vitest
    const root = path.resolve(path.dirname(entry), '..', '..');
    const bundlePath = path.join(path.dirname(entry), 'page.bundle.js');
    const stampPath = path.join(path.dirname(entry), 'page.bundle.json');
    if (fromDist) {
      const cached = freshCache(bundlePath, stampPath, root);
      if (cached !== null) return cached;
    }
    const { build } = await import('esbuild');
    const out = await build({
      entryPoints: [entry], bundle: true, minify: true, write: false, format: 'iife', platform: 'browser',
      target: 'es2022', legalComments: 'none', logLevel: 'silent', charset: 'utf8', metafile: true, absWorkingDir: root,
    });
    const text = out.outputFiles[0].text;
    if (fromDist) {
      try {
        const inputs = Object.keys(out.metafile.inputs).map((p) => {
          const st = statSync(path.resolve(root, p));
          return { path: p, size: st.size, mtimeMs: st.mtimeMs };
        });
        const tmp = `${bundlePath}.${process.pid}.tmp`;
        writeFileSync(tmp, text);
        renameSync(tmp, bundlePath);
        writeFileSync(`${stampPath}.${process.pid}.tmp`, JSON.stringify({ inputs } satisfies BundleStamp));
        renameSync(`${stampPath}.${process.pid}.tmp`, stampPath);
      } catch {
        // A read-only install: no cache, the next run bundles again.
      }
    }
    return text;
  })();
  bundled.catch(() => { bundled = null; });
  return bundled;
}

/** JSON that is safe inside a <script> element (no `</script>`, no `<!--`, no U+2028/9). */
export function scriptSafeJson(value: unknown): string {
  const json = JSON.stringify(value);
  // The packed arrays are most of the text and never need escaping: copy only when something does.
  if (!/[<\u2028\u2029]/.test(json)) return json;
  return json
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

const escapeHtml = (s: string): string =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);

export interface ViewerInput {
  results: ResultsFile;
  /** The packed units, in results.units order (null where a unit was not packed). */
  packed: (ViewerUnit | null)[];
  limitSet: LimitSet | null;
  removalLevelPct: number;
  holeThreshold: number | null;
  colorMap: 'lumen' | 'grey';
  mapCenterPhiDeg: number;
  /** A golden unit measured elsewhere: its patterns (grid + TSP) per frequency. */
  golden?: { grid: SphereGrid; tsp: TotalScanPattern; result: UnitResult }[];
}

/** The page data of a run. */
export function viewerBuild(input: ViewerInput): ViewerBuild {
  const { results } = input;
  const s = results.settings as { input?: string; percentilesPct?: number[]; coverageThresholds?: number[]; relativeDb?: number[]; reference?: string | null };
  const units: ViewerUnit[] = [];
  results.units.forEach((r, i) => {
    const p = input.packed[i];
    // The final results.json entry (cross-unit extras are added after the workers finish).
    if (p) units.push({ ...p, result: { ...r, tsp: { ...r.tsp, curve: [] } } });
  });
  return {
    schemaVersion: 1,
    tool: results.tool,
    generatedAt: results.generatedAt,
    input: s.input ?? '',
    percentilesPct: s.percentilesPct ?? [],
    thresholds: s.coverageThresholds ?? [],
    relativeDb: s.relativeDb ?? [],
    limitSet: input.limitSet,
    removalLevelPct: input.removalLevelPct,
    holeThreshold: input.holeThreshold,
    reference: s.reference ?? null,
    colorMap: input.colorMap,
    mapCenterPhiDeg: input.mapCenterPhiDeg,
    units,
    referenceUnits: (input.golden ?? []).map((g) => packReferencePattern(g.grid, g.tsp, g.result, `reference@${g.result.frequencyHz ?? '-'}`)),
  };
}

/** The whole page as UTF-8 text. */
export async function renderViewerHtml(input: ViewerInput): Promise<Uint8Array> {
  const data = viewerBuild(input);
  const script = (await viewerScript()).replace(/<\/(script)/gi, '<\\/$1').replace(/<!--/g, '<\\!--');
  const title = `spherecov viewer: ${data.input || 'build'}`;
  // Content-Security-Policy: nothing may be fetched; only this page's inline script and styles run.
  const csp = "default-src 'none'; script-src 'unsafe-inline'; style-src 'unsafe-inline'; img-src data: blob:";
  const head = `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${csp}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="spherecov ${escapeHtml(data.tool.version)}">
<title>${escapeHtml(title)}</title>
<style>${VIEWER_CSS}</style>
</head>
<body>
<noscript><p>This page needs JavaScript to show the build (it runs offline, nothing is fetched).</p></noscript>
<div id="app" aria-live="polite"></div>
<footer class="cautions" id="cautions"><p>${escapeHtml(CAUTION)}</p>
<p>Limit values come from the limit set named above; verify every value taken from a standard against its current release. spherecov never claims certification.</p></footer>
<script type="application/json" id="spherecov-data">`;
  // Encoded part by part: the data (plain ASCII, megabytes) never joins the page script's
  // non-ASCII text in one string, which would double its size in memory.
  return Buffer.concat([
    Buffer.from(head, 'utf8'),
    Buffer.from(scriptSafeJson(data), 'utf8'),
    Buffer.from(`</script>\n<script>${script}</script>\n</body>\n</html>\n`, 'utf8'),
  ]);
}
