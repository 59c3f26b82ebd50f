import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { sweepK, type SweepRow } from '../core/cluster/sweep';
import { CancelledError, InputError, OptionError } from '../core/errors';
import type { JobContext } from '../core/job';
import { baselineRecipe } from '../core/recipe/baseline';
import { parseCsv } from '../core/table/csv';
import { featureMatrix } from '../core/table/matrix';
import { inferRolesTold } from '../core/table/roles';
import { PARAMS, type ParamSpec } from '../core/params';
import { JSON_FLAG, PROGRESS, PROGRESS_SHORT } from './cli-flags';
import { commandUsage, parseCommand, value, type CommandSpec } from './parse-command';
import { progressReporter, type ProgressMode } from './progress-bar';
import { UsageError } from './usage-error';
import { missingNotices } from '../core/table/notices';
import { missingByFeature, recipeNotices } from '../core/recipe/notices';
import type { RoleOverrides } from '../core/table/roles.types';
import { checkRoleColumns, naOption, printNotices, roleOption, TABLE_FLAGS } from './table-options';

/** The range of k a sweep covers (common practice for a first look: 2 to 12 clusters). */
export const K_MIN: ParamSpec<number> = {
  name: 'kMin', flag: 'k-min', meta: '<k>', kind: 'integer', min: 2, default: 2, help: ['smallest k, an integer >= 2 (default {default})'],
};
export const K_MAX: ParamSpec<number> = {
  name: 'kMax', flag: 'k-max', meta: '<k>', kind: 'integer', min: 2, default: 12,
  help: ['largest k, an integer >= --k-min and below the number of windows (default {default})'],
};

/** `gleaner sweep`: its flags in usage order. */
export const SWEEP: CommandSpec = {
  name: 'sweep',
  named: true,
  flags: [
    { spec: K_MIN }, { spec: K_MAX },
    { spec: PARAMS.seed, help: ['seed for every random step (default {default})'] },
    { spec: PARAMS.restarts, help: ['k-means restarts per k, best inertia kept (default {default})'] },
    { spec: PARAMS.silhouetteSample }, { spec: JSON_FLAG }, { spec: PROGRESS, help: PROGRESS_SHORT }, ...TABLE_FLAGS,
  ],
};

export const SWEEP_USAGE = `Usage: gleaner sweep <windows.csv> [--k-min 2] [--k-max 12] [options]

Scales the features (z-score, missing values to the mean), runs k-means for every k from --k-min
to --k-max and prints one row per k: inertia (within-cluster sum of squares, for the elbow),
mean silhouette (on a seeded sample), Calinski–Harabasz and Davies–Bouldin.

Options:
${commandUsage(SWEEP)}
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
  /** Cells read as missing (--na); the default list when absent. */
  missing?: string[];
  /** Column roles set on the command line (--role column=role). */
  roles?: RoleOverrides;
}

/** Parses the arguments after `gleaner sweep`; throws UsageError or OptionError. `null` means --help. */
export function parseSweepArgs(argv: readonly string[]): SweepCommandOptions | null {
  if (argv.includes('--help') || argv.includes('-h')) return null;
  const parsed = parseCommand(argv, SWEEP);
  const { positionals } = parsed;
  if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'missing input: expected "sweep <windows.csv>"' : `expected one input file, got ${positionals.length}`);
  const kMin = value(parsed, K_MIN);
  const kMax = value(parsed, K_MAX, Math.max(K_MAX.default, kMin));
  if (kMax < kMin) throw new OptionError(`--${K_MAX.flag}`, parsed.texts.get(K_MAX.flag), `an integer >= --k-min (${kMin})`);
  const progress = value(parsed, PROGRESS);
  return {
    input: positionals[0], kMin, kMax, json: value(parsed, JSON_FLAG), progress,
    seed: value(parsed, PARAMS.seed),
    restarts: value(parsed, PARAMS.restarts),
    silhouetteSample: value(parsed, PARAMS.silhouetteSample),
    ...(parsed.texts.has('na') ? { missing: naOption(parsed) } : {}),
    ...(parsed.lists.has('role') ? { roles: roleOption(parsed) } : {}),
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
    const table = parseCsv(new Uint8Array(readFileSync(opts.input)), fileName, opts.missing ? { missing: opts.missing } : {});
    checkRoleColumns(table, opts.roles);
    const { roles, notices } = inferRolesTold(table, opts.roles);
    printNotices([...notices, ...missingNotices(table, roles)]);
    const matrix = featureMatrix(table, roles);
    if (opts.kMax >= matrix.n) throw new OptionError('--k-max', opts.kMax, `below the number of windows (${matrix.n})`);
    const { data, recipe } = baselineRecipe(matrix);
    printNotices(recipeNotices(fileName, missingByFeature(matrix), recipe));
    const bar = progressReporter(process.stderr, opts.progress);
    const ctx: JobContext = {
      progress: (stage, f, detail) => bar.update(`sweep: ${stage}`, f, detail),
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
