import { INPUT_PARAMS, PARAMS, STABILITY_PARAMS, type ImputeChoice, type RunValues, type ScaleChoice } from '../core/params';
import { OUT, PROGRESS } from './cli-flags';
import { commandUsage, parseCommand, value, type CommandSpec } from './parse-command';
import { pipelineValues } from './pipeline-options';
import { naOption, roleOption, TABLE_FLAGS } from './table-options';
import type { RoleOverrides } from '../core/table/roles.types';
import type { ProgressMode } from './progress-bar';
import { UsageError } from './usage-error';

export { UsageError };
export { IMPUTE_CHOICES, SCALE_CHOICES, type ImputeChoice, type ScaleChoice } from '../core/params';

export interface AnalyzeOptions {
  input: string;
  out: string;
  /** The run parameters as given (defaults for the flags left out). */
  values: RunValues;
  /** Flags given, by name: a default run's parameters list nothing it did not ask for. */
  given: ReadonlySet<string>;
  progress: ProgressMode;
  /** Categorical columns (besides the subject) whose mix per cluster goes into summary.json. */
  compose?: string[];
  /** Scaling (--scale); with --impute, builds the recipe when no --recipe file is given. */
  scale?: ScaleChoice;
  /** Missing-value handling (--impute). */
  impute?: ImputeChoice;
  /** Column to use as the subject (--subject), overriding the inferred one. */
  subject?: string;
  /** Path of a recipe JSON file (--recipe). */
  recipe?: string;
  /** Also write events.tsv and EDF+ annotation files (--events). */
  events?: boolean;
  /** Resamples of the stability assessment across subjects (--stability). */
  stability?: number;
  /** Cells read as missing (--na); the default list when absent. */
  missing?: string[];
  /** Column roles set on the command line (--role column=role). */
  roles?: RoleOverrides;
}

export type Command =
  | { command: 'help' }
  | { command: 'version' }
  | ({ command: 'analyze' } & AnalyzeOptions);

const P = PARAMS;
const I = INPUT_PARAMS;

/** `gleaner analyze`: its flags in the order the usage lists them. */
export const ANALYZE: CommandSpec = {
  name: 'analyze',
  named: false,
  flags: [
    ...[OUT, P.k, P.seed, P.restarts, I.compose, PROGRESS, I.scale, I.impute, I.subject].map((spec) => ({ spec })),
    ...TABLE_FLAGS,
    ...[I.recipe, I.events,
      P.embed, P.perplexity, P.iterations, P.neighbors, P.minDist, P.metric, P.sampleAbove, P.cluster, P.cutHeight, P.minClusterSize, P.minSamples, P.space,
      STABILITY_PARAMS.stability,
    ].map((spec) => ({ spec })),
  ],
};

export const USAGE = `Usage: gleaner analyze <windows.csv> --out <dir> [options]
       gleaner sweep <windows.csv> --k-min 2 --k-max 12 [--json]   (metrics per k; gleaner sweep --help)
       gleaner run <study file> --out <dir>   (reproduce a saved study; gleaner run --help)
       gleaner apply <study file> <input>... --out <dir>   (label new windows with a study; gleaner apply --help)
       gleaner inspect <file>   (JSON summary of a windows table or a raw EDF/CSV signal file)

Loads a featurized windows table, scales the features, makes a map of them (PCA, t-SNE or UMAP)
and clusters them (k-means, a tree or HDBSCAN). Writes <dir>/windows.csv (id, subject, start, end, x, y, cluster, confidence),
<dir>/summary.json (input hash, recipe, algorithms, seed, metrics, subject mix per cluster) and
<dir>/study.gleaner (the run as a study the app opens; its time is SOURCE_DATE_EPOCH when set).

Options:
${commandUsage(ANALYZE)}
  -h, --help         show this help
  -V, --version      show the version

Exit codes: 0 done, 1 bad input or failure, 2 bad command line, 130 cancelled (Ctrl-C).`;

/** Parses the arguments after `gleaner`; throws UsageError or OptionError with a one-line message. */
export function parseArgs(argv: readonly string[]): Command {
  if (argv.length === 0) throw new UsageError('missing command: expected "analyze <windows.csv> --out <dir>"');
  if (argv.includes('--help') || argv.includes('-h')) return { command: 'help' };
  if (argv.includes('--version') || argv.includes('-V')) return { command: 'version' };
  const [command, ...rest] = argv;
  if (command !== 'analyze') throw new UsageError(`unknown command "${command}": expected "analyze"`);

  const parsed = parseCommand(rest, ANALYZE);
  const { positionals, texts } = parsed;
  if (positionals.length === 0) throw new UsageError('missing input: expected "analyze <windows.csv>"');
  if (positionals.length > 1) throw new UsageError(`expected one input file, got ${positionals.length}: ${positionals.join(' ')}`);
  const out = texts.get(OUT.flag);
  if (out === undefined) throw new UsageError('missing option --out <dir>');
  const k = value(parsed, P.k);
  const seed = value(parsed, P.seed);
  const restarts = value(parsed, P.restarts);
  const progress = value(parsed, PROGRESS);
  const opts: Omit<AnalyzeOptions, 'values'> = { input: positionals[0], out, given: new Set(texts.keys()), progress };
  if (texts.has(I.compose.flag)) opts.compose = value(parsed, I.compose);
  if (texts.has(I.recipe.flag)) {
    const clash = [I.scale, I.impute].find((s) => texts.has(s.flag))?.flag;
    if (clash) throw new UsageError(`--recipe and --${clash} cannot be combined: put the ${clash} step in the recipe file`);
    opts.recipe = texts.get(I.recipe.flag);
  }
  if (texts.has(I.scale.flag)) opts.scale = value(parsed, I.scale);
  if (texts.has(I.impute.flag)) opts.impute = value(parsed, I.impute);
  if (texts.has(I.subject.flag)) opts.subject = texts.get(I.subject.flag);
  if (texts.has(I.events.flag)) opts.events = true;
  if (texts.has(STABILITY_PARAMS.stability.flag)) opts.stability = value(parsed, STABILITY_PARAMS.stability);
  const missing = naOption(parsed);
  if (missing) opts.missing = missing;
  const roles = roleOption(parsed);
  if (roles) opts.roles = roles;
  return { command: 'analyze', ...opts, values: { ...pipelineValues(parsed), k, seed, restarts } };
}
