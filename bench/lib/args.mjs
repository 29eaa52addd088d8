// Command-line options of `npm run bench -- [options]`.
export const USAGE = `usage: npm run bench -- [--quick] [--peer] [--reps N] [--no-build] [--only a,b] [--keep]
  --quick     smaller files and one repetition (a smoke run; targets are then indicative only)
  --peer      also run the pandas peer (/work/shared/bench/peer.py) alternately with spherecov
  --reps N    repetitions of every timed process (default 3; 1 with --quick)
  --no-build  do not run the TypeScript build first (use dist/ as it is)
  --only L    run only these stages: floor,read,measure,cli,growth,build,pdf,build100,peer
  --keep      keep analyze outputs under bench/out/runs/ (default: deleted after each run)`;

const STAGES = ['floor', 'read', 'measure', 'cli', 'growth', 'build', 'pdf', 'build100', 'peer'];

/** Parse argv (without node and script) into options; throws Error with a usage message. */
export function parseArgs(argv) {
  const o = { quick: false, peer: false, reps: null, build: true, only: null, keep: false, help: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const [flag, inline] = a.includes('=') ? [a.slice(0, a.indexOf('=')), a.slice(a.indexOf('=') + 1)] : [a, null];
    const value = () => {
      const v = inline ?? argv[++i];
      if (v === undefined) throw new Error(`${flag}: expected a value\n${USAGE}`);
      return v;
    };
    if (flag === '--quick') o.quick = true;
    else if (flag === '--peer') o.peer = true;
    else if (flag === '--no-build') o.build = false;
    else if (flag === '--keep') o.keep = true;
    else if (flag === '--help' || flag === '-h') o.help = true;
    else if (flag === '--reps') {
      const v = value();
      const n = Number(v);
      if (!Number.isInteger(n) || n < 1) throw new Error(`--reps: found '${v}', expected a whole number >= 1`);
      o.reps = n;
    } else if (flag === '--only') {
      const list = value().split(',').map((s) => s.trim()).filter(Boolean);
      for (const s of list) if (!STAGES.includes(s)) throw new Error(`--only: found '${s}', expected one of ${STAGES.join(', ')}`);
      o.only = list;
    } else throw new Error(`unknown option '${a}'\n${USAGE}`);
  }
  if (o.reps === null) o.reps = o.quick ? 1 : 3;
  if (o.peer && o.only && !o.only.includes('peer')) o.only.push('peer');
  return o;
}

/** Is `stage` selected? */
export function wants(o, stage) {
  if (stage === 'peer' && !o.peer) return false;
  return o.only === null || o.only.includes(stage);
}
