/**
 * The command line: parses options (declared once in options.ts) and calls the library.
 * Never calls process.exit: the exit code goes to process.exitCode so pending writes finish.
 */
import { Command, CommanderError, Option } from 'commander';
import { optionsFor, flagText, joinNegativeValues, type CommandName, type OptionSpec } from './options.js';
import { UsageError, parseFailOn, parseIsoDate, parseJobs, parseNumberList, parsePercentiles } from './parse.js';
import { EXIT_INTERNAL, EXIT_INTERRUPTED } from './exitCode.js';
import { runAnalyze } from '../batch/runAnalyze.js';
import { InterruptedError, RunError } from '../batch/errors.js';
import type { AnalyzeOptions, BatchIo } from '../batch/options.js';
import type { Quantity } from '../types.js';
import { TOOL_VERSION } from '../batch/version.js';
import { runInspect, runLimits } from './commands.js';
import { LEVEL_RANGE, RELATIVE_DB_RANGE, type SaneRange } from '../io/saneRange.js';
import { exitCodeForSignal, interruptSignal, receivedSignal } from './signals.js';

const EXAMPLES = `
Examples:
  $ spherecov analyze exports/build-B --out reports/build-B
  $ spherecov analyze exports/build-B --out reports/build-B --limits 3gpp-fr2-pc3-n257 --jobs 2
  $ spherecov analyze exports/rx --out reports/rx --quantity eis --coverage-thresholds -88,-85
  $ spherecov analyze exports/build-B --out /tmp/quick --no-pdf --json > results.json
  $ spherecov analyze exports/build-B --out ci-out --limits my-limits.yaml --fail-on not-judged,partial-sphere
  $ spherecov inspect exports/build-B/PX-01
  $ spherecov limits
  $ spherecov limits 3gpp-fr2-pc3-n257

Exit codes: 0 all units analyzed and none failed a limit; 1 a unit failed a limit (or met a
--fail-on condition); 2 usage error or an input could not be read (the rest is still analyzed
and written; also a full disk or an unreadable file); 3 internal error; 130 interrupted
(143 for SIGTERM).`;

function defaultIo(): BatchIo {
  return {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    stderrIsTTY: Boolean(process.stderr.isTTY),
  };
}

function addOptions(cmd: Command, name: CommandName): void {
  for (const spec of optionsFor(name)) cmd.addOption(toOption(spec));
}

function toOption(spec: OptionSpec): Option {
  const desc = spec.defaultText ? `${spec.description} (default: ${spec.defaultText})` : spec.description;
  const opt = new Option(flagText(spec), desc);
  if (spec.choices) opt.choices(spec.choices);
  return opt;
}

/** Commander's option bag → AnalyzeOptions, with every value checked. */
export function toAnalyzeOptions(input: string, o: Record<string, unknown>, io: BatchIo): AnalyzeOptions {
  const str = (k: string) => (typeof o[k] === 'string' ? (o[k] as string) : undefined);
  const list = (k: string, option: string, range: SaneRange) => (str(k) !== undefined ? parseNumberList(str(k) as string, option, range) : undefined);
  const out = str('out');
  if (!out) throw new UsageError("missing --out <dir>: name the folder for the results");
  return {
    input,
    outDir: out,
    percentilesPct: str('percentiles') !== undefined ? parsePercentiles(str('percentiles') as string) : undefined,
    thresholds: list('coverageThresholds', 'coverage-thresholds', LEVEL_RANGE),
    relativeDb: list('relativeDb', 'relative-db', RELATIVE_DB_RANGE),
    limits: str('limits'),
    quantity: str('quantity') as Quantity | undefined,
    eisPolarizations: str('eisPolarizations') as 'each' | 'combined' | undefined,
    pdf: o.pdf !== false,
    coreOnly: o.coreOnly === true,
    viewer: o.viewer === false ? false : undefined,
    jobs: str('jobs') !== undefined ? parseJobs(str('jobs') as string) : undefined,
    json: o.json === true,
    quiet: o.quiet === true,
    failOn: str('failOn') !== undefined ? parseFailOn(str('failOn') as string) : undefined,
    force: o.force === true,
    jobFile: str('job'),
    reference: str('reference'),
    pageSize: (str('pageSize') as 'a4' | 'letter' | undefined) ?? 'a4',
    creationDate: str('creationDate') !== undefined ? parseIsoDate(str('creationDate') as string) : undefined,
    io,
  };
}

/** Build the commander program; actions set `state.code`. */
function buildProgram(io: BatchIo, state: { code: number }): Command {
  const program = new Command('spherecov')
    .description('Spherical coverage of over-the-air beam measurements: total scan pattern, EIRP/EIS CDF, coverage efficiency, TRP, limits.')
    .version(TOOL_VERSION, '-V, --version')
    .showHelpAfterError('(run with --help for usage)')
    .exitOverride()
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr, outputError: (s, write) => write(s) })
    .addHelpText('after', EXAMPLES);

  const analyze = program
    .command('analyze')
    .description('Analyze every unit of a build folder (or one file) and write results.json, summary.csv and PDFs.')
    .argument('<input>', 'folder of exports (scanned recursively for .csv/.tsv/.txt) or one file');
  addOptions(analyze, 'analyze');
  analyze.addHelpText('after', EXAMPLES).action(async (input: string, o: Record<string, unknown>) => {
    const opts = { ...toAnalyzeOptions(input, o, io), signal: interruptSignal() };
    const { exitCode } = await runAnalyze(opts);
    state.code = exitCode;
  });

  const inspect = program
    .command('inspect')
    .description('Show what spherecov reads from a folder or file: layout, columns, units, beams, grid.')
    .argument('<path>', 'folder or file');
  addOptions(inspect, 'inspect');
  inspect.action(async (p: string, o: Record<string, unknown>) => {
    state.code = await runInspect(p, { json: o.json === true, quantity: o.quantity as Quantity | undefined, jobFile: o.job as string | undefined }, io);
  });

  program
    .command('limits')
    .description('List the shipped limit profiles, or print one (by name or file).')
    .argument('[name]', 'profile name or limit-set file')
    .action(async (name: string | undefined) => {
      state.code = await runLimits(name, io);
    });

  for (const c of program.commands) c.exitOverride().configureOutput({ writeOut: io.stdout, writeErr: io.stderr });
  return program;
}

/**
 * Run the CLI with `argv` (without node and script). Resolves when done; sets process.exitCode
 * and also returns the code (tests call it in-process).
 */
export async function main(argv: string[], io: BatchIo = defaultIo()): Promise<number> {
  const state = { code: 0 };
  const program = buildProgram(io, state);
  let finished = true;
  try {
    await program.parseAsync(joinNegativeValues(argv), { from: 'user' });
  } catch (e) {
    finished = false;
    state.code = codeForError(e, io);
  }
  const sig = receivedSignal();
  if (sig !== null && state.code !== exitCodeForSignal(sig)) {
    if (finished) {
      // The signal came after the work was done (or during a command that does not stop early):
      // say so, and still exit with the signal's code, as a shell expects of an interrupted program.
      io.stderr(`spherecov: ${sig === 'SIGTERM' ? 'stopped by SIGTERM' : 'interrupted'} after the command had finished; nothing was cut short\n`);
    }
    state.code = exitCodeForSignal(sig);
  }
  process.exitCode = state.code;
  return state.code;
}

function codeForError(e: unknown, io: BatchIo): number {
  if (e instanceof CommanderError) {
    // Asked-for help and --version are "errors" to exitOverride with exitCode 0; help shown
    // because no command was given, and every parse error, are usage errors.
    return e.exitCode === 0 ? 0 : 2;
  }
  if (e instanceof UsageError || e instanceof RunError) {
    io.stderr(`spherecov: ${e.message}\n`);
    return 2;
  }
  if (e instanceof InterruptedError) {
    io.stderr(`spherecov: ${e.message}\n`);
    const sig = receivedSignal();
    return sig ? exitCodeForSignal(sig) : EXIT_INTERRUPTED;
  }
  const msg = e instanceof Error ? e.message : String(e);
  io.stderr(`spherecov: internal error: ${msg}\nPlease report this with the command you ran.\n`);
  return EXIT_INTERNAL;
}
