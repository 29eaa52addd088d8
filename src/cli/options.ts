/**
 * Every command-line option, declared once as data. The same list drives commander (flags and
 * parsing), `--help` and the README options table (`npm run docs:options`).
 */
import { QUANTITIES } from '../quantity.js';
import { DEFAULT_PERCENTILES_PCT } from '../batch/options.js';

export type CommandName = 'analyze' | 'inspect' | 'limits';

export interface OptionSpec {
  /** Long flag without dashes, e.g. `coverage-thresholds`. */
  name: string;
  /** Optional one-letter alias. */
  short?: string;
  /** Placeholder of the value; absent for a switch. */
  value?: string;
  /** Allowed values, when the value is one of a fixed set. */
  choices?: string[];
  description: string;
  /** Default shown in help and the table (the batch applies it; commander keeps undefined). */
  defaultText?: string;
  commands: CommandName[];
  /** A switch whose `--no-` form is the documented flag (`--no-pdf`). */
  negated?: boolean;
  /** Required option. */
  required?: boolean;
}

export const OPTIONS: OptionSpec[] = [
  { name: 'out', short: 'o', value: 'dir', required: true, commands: ['analyze'],
    description: 'Folder for results.json, summary.csv, build-stats.csv, the PDFs and viewer.html (created if missing).' },
  { name: 'percentiles', value: 'list', commands: ['analyze'],
    description: 'CDF percentile levels in %, comma separated, added to those the limit set needs.',
    defaultText: DEFAULT_PERCENTILES_PCT.join(',') },
  { name: 'coverage-thresholds', value: 'list', commands: ['analyze'],
    description: 'Absolute thresholds for coverage efficiency in the value\'s unit (dBm, dBi); may be negative.',
    defaultText: 'those of the limit set' },
  { name: 'relative-db', value: 'list', commands: ['analyze'],
    description: 'Coverage-efficiency thresholds in dB below the total scan pattern peak.',
    defaultText: 'none' },
  { name: 'limits', short: 'l', value: 'file|profile', commands: ['analyze'],
    description: 'Limit set: a YAML/JSON file or a shipped profile name (see `spherecov limits`).',
    defaultText: 'none (verdict "none")' },
  { name: 'quantity', value: 'name', choices: [...QUANTITIES], commands: ['analyze', 'inspect'],
    description: 'What the values are; overrides detection from headers and metadata.' },
  { name: 'eis-polarizations', value: 'view', choices: ['each', 'combined'], commands: ['analyze'],
    description: 'EIS θ/φ pairs: judge each polarization on its own (a check passes only when both pass), or the combined-sensitivity view 1/EIS = 1/EISθ + 1/EISφ. EIS is never power-summed.',
    defaultText: 'each' },
  { name: 'pdf', negated: true, commands: ['analyze'],
    description: 'Skip the PDF reports and viewer.html (JSON and CSV only, for speed).' },
  { name: 'core-only', commands: ['analyze'],
    description: 'Only the metrics and checks: skip the optional analysis (coverage holes, beam removal, smallest beam subset), for speed.' },
  { name: 'viewer', negated: true, commands: ['analyze'],
    description: 'Skip viewer.html, the interactive page of the build (one self-contained file, works offline); --no-pdf skips it too.' },
  { name: 'jobs', short: 'j', value: 'n', commands: ['analyze'],
    description: "Units analyzed in parallel (main thread + worker threads), or 'auto': up to the number of cores, workers started only when the work left outweighs their start-up.", defaultText: 'auto' },
  { name: 'job', value: 'file', commands: ['analyze', 'inspect'],
    description: 'Job file with column mapping and settings.', defaultText: 'spherecov.yaml|yml|json in the input folder' },
  { name: 'reference', value: 'unit|folder', commands: ['analyze'],
    description: 'Golden unit to compare every unit against: a unit of this build, or a folder of one unit\'s exports (per-direction difference maps in the PDFs, metric deltas in results.json).' },
  { name: 'page-size', value: 'size', choices: ['a4', 'letter'], commands: ['analyze'],
    description: 'Paper size of the PDF reports.', defaultText: 'a4' },
  { name: 'creation-date', value: 'iso', commands: ['analyze'],
    description: 'Fixed timestamp (ISO 8601) for results.json and PDFs, for reproducible outputs.',
    defaultText: 'now' },
  { name: 'json', commands: ['analyze', 'inspect'],
    description: 'Write results.json to stdout instead of the verdict table (analyze), or the report as JSON (inspect).' },
  { name: 'quiet', short: 'q', commands: ['analyze'],
    description: 'No verdict table on stdout and no progress line on stderr (input errors are still printed on stderr).' },
  { name: 'fail-on', value: 'list', commands: ['analyze'],
    description: 'CI gate: also end with exit code 1 when a unit is `not-judged` (no limits, or a check not evaluable), measured on a `partial-sphere`, or has `warnings` (comma list).',
    defaultText: 'only a failed limit gives 1' },
  { name: 'force', commands: ['analyze'],
    description: 'Allow an output folder inside the input folder.' },
];

/** Options of one command, in declaration order. */
export function optionsFor(command: CommandName): OptionSpec[] {
  return OPTIONS.filter((o) => o.commands.includes(command));
}

/** The flag text as the user types it, e.g. `-l, --limits <file|profile>` or `--no-pdf`. */
export function flagText(o: OptionSpec): string {
  const long = o.negated ? `--no-${o.name}` : `--${o.name}`;
  const withValue = o.value ? `${long} <${o.value}>` : long;
  return o.short ? `-${o.short}, ${withValue}` : withValue;
}

/** Markdown table of every option (README "Options" section). */
export function renderOptionsTable(): string {
  const esc = (s: string) => s.replace(/\|/g, '\\|');
  const lines = ['| option | commands | what it does | default |', '|---|---|---|---|'];
  for (const o of OPTIONS) {
    const choices = o.choices ? ` One of ${o.choices.map((c) => `\`${c}\``).join(', ')}.` : '';
    const req = o.required ? ' Required.' : '';
    lines.push(
      `| \`${esc(flagText(o))}\` | ${o.commands.join(', ')} | ${esc(o.description + choices + req)} | ${esc(o.defaultText ?? '')} |`,
    );
  }
  return lines.join('\n') + '\n';
}

/**
 * Join a value that starts with a dash to its option (`--coverage-thresholds -88,-85` becomes
 * `--coverage-thresholds=-88,-85`) so a negative number is never mistaken for an option flag.
 * Only tokens after a value-taking option, and only when they look like a number or a number list.
 */
export function joinNegativeValues(argv: string[]): string[] {
  const byLong = new Map<string, OptionSpec>();
  const byShort = new Map<string, OptionSpec>();
  for (const o of OPTIONS) {
    if (!o.value) continue;
    byLong.set(`--${o.name}`, o);
    if (o.short) byShort.set(`-${o.short}`, o);
  }
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--') {
      out.push(...argv.slice(i));
      break;
    }
    const next = argv[i + 1];
    if ((byLong.has(a) || byShort.has(a)) && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(byLong.has(a) ? `${a}=${next}` : `${a}${next}`);
      i++;
    } else out.push(a);
  }
  return out;
}
