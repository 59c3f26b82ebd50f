import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { DEFAULT_ANALYSIS_PARAMS } from '../core/analysis.types';
import { sweepK, type SweepRow } from '../core/cluster/sweep';
import { CancelledError, InputError, OptionError } from '../core/errors';
import type { JobContext } from '../core/job';
import { baselineRecipe } from '../core/recipe/baseline';
import { parseCsv } from '../core/table/csv';
import { featureMatrix } from '../core/table/matrix';
import { inferRoles } from '../core/table/roles';
import { UsageError } from './args';
import { PROGRESS_MODES, progressReporter, type ProgressMode } from './progress-bar';

export const SWEEP_USAGE = `Usage: gleaner sweep <windows.csv> [--k-min 2] [--k-max 12] [options]

Scales the features (z-score, missing values to the mean), runs k-means for every k from --k-min
to --k-max and prints one row per k: inertia (within-cluster sum of squares, for the elbow),
mean silhouette (on a seeded sample), Calinski–Harabasz and Davies–Bouldin.

Options:
  --k-min <k>        smallest k, an integer >= 2 (default 2)
  --k-max <k>        largest k, an integer >= --k-min and below the number of windows (default 12)
  --seed <n>         seed for every random step (default ${DEFAULT_ANALYSIS_PARAMS.seed})
  --restarts <n>     k-means restarts per k, best inertia kept (default ${DEFAULT_ANALYSIS_PARAMS.restarts})
  --silhouette-sample <n>  windows in the silhouette sample (default ${DEFAULT_ANALYSIS_PARAMS.silhouetteSample})
  --json             print JSON instead of the table
  --progress <mode>  auto, bar, lines or none (default auto)
  -h, --help         show this help

Exit codes: 0 done, 1 bad input or failure, 2 bad command line, 130 cancelled (Ctrl-C).`;

export interface SweepCommandOptions {
  input: string;
  kMin: number;
  kMax: number;
  seed: number;
  restarts: number;
  silhouetteSample: number;
  json: boolean;
  progress: ProgressMode;
}

const VALUE_FLAGS = ['k-min', 'k-max', 'seed', 'restarts', 'silhouette-sample', 'progress'] as const;
type ValueFlag = (typeof VALUE_FLAGS)[number];

function integer(name: string, text: string | undefined, fallback: number, min: number, max = Number.MAX_SAFE_INTEGER): number {
  if (text === undefined) return fallback;
  const value = /^[+]?\d+$/.test(text) ? Number(text) : NaN;
  if (!Number.isSafeInteger(value) || value < min || value > max) {
    throw new UsageError(`invalid --${name} "${text}": expected an integer from ${min}${max < Number.MAX_SAFE_INTEGER ? ` to ${max}` : ' up'}`);
  }
  return value;
}

/** Parses the arguments after `gleaner sweep`; throws UsageError. `null` means --help. */
export function parseSweepArgs(argv: readonly string[]): SweepCommandOptions | null {
  if (argv.includes('--help') || argv.includes('-h')) return null;
  const values: Partial<Record<ValueFlag, string>> = {};
  const positionals: string[] = [];
  let json = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (!arg.startsWith('-') || arg === '-') { positionals.push(arg); continue; }
    if (arg === '--json') { json = true; continue; }
    const eq = arg.indexOf('=');
    const name = (eq >= 0 ? arg.slice(0, eq) : arg).replace(/^--/, '');
    if (!arg.startsWith('--') || !(VALUE_FLAGS as readonly string[]).includes(name)) {
      throw new UsageError(`unknown option "${eq >= 0 ? arg.slice(0, eq) : arg}" for sweep`);
    }
    const flag = name as ValueFlag;
    if (values[flag] !== undefined) throw new UsageError(`option --${flag} given twice`);
    let value: string | undefined;
    if (eq >= 0) value = arg.slice(eq + 1);
    else if (i + 1 < argv.length && !argv[i + 1].startsWith('--')) value = argv[++i];
    if (value === undefined || value === '') throw new UsageError(`option --${flag} needs a value`);
    values[flag] = value;
  }
  if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'missing input: expected "sweep <windows.csv>"' : `expected one input file, got ${positionals.length}`);
  const kMin = integer('k-min', values['k-min'], 2, 2);
  const kMax = integer('k-max', values['k-max'], Math.max(12, kMin), kMin);
  const progress = values.progress ?? 'auto';
  if (!(PROGRESS_MODES as readonly string[]).includes(progress)) {
    throw new UsageError(`invalid --progress "${progress}": expected one of ${PROGRESS_MODES.join(', ')}`);
  }
  return {
    input: positionals[0], kMin, kMax, json, progress: progress as ProgressMode,
    seed: integer('seed', values.seed, DEFAULT_ANALYSIS_PARAMS.seed, 0, 0xffffffff),
    restarts: integer('restarts', values.restarts, DEFAULT_ANALYSIS_PARAMS.restarts, 1),
    silhouetteSample: integer('silhouette-sample', values['silhouette-sample'], DEFAULT_ANALYSIS_PARAMS.silhouetteSample, 2),
  };
}

/** The metrics table, one row per k, fixed-width columns. */
export function formatSweepTable(rows: SweepRow[]): string {
  const head = ['k', 'inertia', 'silhouette', 'calinski_harabasz', 'davies_bouldin'];
  const fmt = (v: number, digits: number) => (Number.isFinite(v) ? v.toFixed(digits) : 'NaN');
  const body = rows.map((r) => [String(r.k), fmt(r.inertia, 2), fmt(r.silhouette, 4), fmt(r.calinskiHarabasz, 2), fmt(r.daviesBouldin, 4)]);
  const widths = head.map((h, j) => Math.max(h.length, ...body.map((b) => b[j].length)));
  return [head, ...body].map((cells) => cells.map((c, j) => c.padStart(widths[j])).join('  ')).join('\n');
}

/** Runs `gleaner sweep ...` in this process (checkpoints yield to the event loop so Ctrl-C cancels). */
export async function runSweep(argv: readonly string[]): Promise<number> {
  let cancelled = false;
  const onSigint = () => {
    if (cancelled) process.exit(130);
    cancelled = true;
  };
  try {
    const opts = parseSweepArgs(argv);
    if (!opts) { process.stdout.write(`${SWEEP_USAGE}\n`); return 0; }
    process.on('SIGINT', onSigint);
    const fileName = basename(opts.input);
    const table = parseCsv(new Uint8Array(readFileSync(opts.input)), fileName);
    const matrix = featureMatrix(table, inferRoles(table));
    if (opts.kMax >= matrix.n) throw new OptionError('--k-max', opts.kMax, `below the number of windows (${matrix.n})`);
    const { data } = baselineRecipe(matrix);
    const bar = progressReporter(process.stderr, opts.progress);
    const ctx: JobContext = {
      progress: (stage, f) => bar.update(`sweep: ${stage}`, f),
      checkpoint: () => new Promise((resolve, reject) => setImmediate(() => (cancelled ? reject(new CancelledError()) : resolve()))),
    };
    const rows = await sweepK(data, matrix.n, matrix.d, opts, ctx).finally(() => bar.finish());
    if (opts.json) {
      const out = {
        input: opts.input, windows: matrix.n, features: matrix.d, recipe: 'zscore + mean fill', method: 'kmeans', init: 'k-means++',
        seed: opts.seed, restarts: opts.restarts, silhouetteSample: Math.min(opts.silhouetteSample, matrix.n), rows,
      };
      process.stdout.write(`${JSON.stringify(out, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)}\n`);
    } else {
      process.stdout.write(`${formatSweepTable(rows)}\n`);
    }
    return 0;
  } catch (err) {
    return sweepFailure(err);
  } finally {
    process.off('SIGINT', onSigint);
  }
}

function sweepFailure(err: unknown): number {
  const message = (err instanceof Error ? err.message : String(err)).replace(/\s*\n\s*/g, ' ');
  if (err instanceof UsageError || err instanceof OptionError) {
    process.stderr.write(`gleaner: ${message} (see gleaner sweep --help)\n`);
    return 2;
  }
  if (err instanceof CancelledError) { process.stderr.write('gleaner: cancelled\n'); return 130; }
  if (err instanceof InputError) { process.stderr.write(`gleaner: ${message}\n`); return 1; }
  const sys = err as { code?: unknown; path?: unknown };
  if (typeof sys.code === 'string' && typeof sys.path === 'string') {
    process.stderr.write(`gleaner: cannot open ${sys.path}: ${sys.code === 'ENOENT' ? 'no such file or folder' : sys.code}\n`);
    return 1;
  }
  process.stderr.write(`gleaner: error: ${message}\n`);
  return 1;
}
