import { DEFAULT_ANALYSIS_PARAMS } from '../core/analysis.types';
import { PIPELINE_FLAGS, PIPELINE_USAGE, pipelineOptions, type PipelineFlag, type PipelineOptions } from './pipeline-options';
import { PROGRESS_MODES, type ProgressMode } from './progress-bar';

/** A mistake on the command line: the CLI prints the message and exits with code 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

export interface AnalyzeOptions extends PipelineOptions {
  input: string;
  out: string;
  k: number;
  seed: number;
  restarts: number;
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
}

export const SCALE_CHOICES = ['zscore', 'robust', 'subject-zscore', 'minmax', 'none'] as const;
export type ScaleChoice = (typeof SCALE_CHOICES)[number];
export const IMPUTE_CHOICES = ['mean', 'median', 'subject-median', 'drop'] as const;
export type ImputeChoice = (typeof IMPUTE_CHOICES)[number];

export type Command =
  | { command: 'help' }
  | { command: 'version' }
  | ({ command: 'analyze' } & AnalyzeOptions);

export const USAGE = `Usage: gleaner analyze <windows.csv> --out <dir> [options]
       gleaner sweep <windows.csv> --k-min 2 --k-max 12 [--json]   (metrics per k; gleaner sweep --help)
       gleaner run <study file> --out <dir>   (reproduce a saved study; gleaner run --help)
       gleaner inspect <file>   (JSON summary of a windows table or a raw EDF/CSV signal file)

Loads a featurized windows table, scales the features, makes a map of them (PCA, t-SNE or UMAP)
and clusters them (k-means or a tree). Writes <dir>/windows.csv (id, subject, start, end, x, y, cluster, confidence) and
<dir>/summary.json (input hash, recipe, algorithms, seed, metrics, subject mix per cluster).

Options:
  --out <dir>        folder for the outputs (created if missing; never the input's own file)
  --k <k>            number of clusters, an integer >= 2 (default ${DEFAULT_ANALYSIS_PARAMS.k})
  --seed <n>         seed for every random step, an integer >= 0 (default ${DEFAULT_ANALYSIS_PARAMS.seed})
  --restarts <n>     k-means restarts, an integer >= 1 (default ${DEFAULT_ANALYSIS_PARAMS.restarts})
  --compose <cols>   also report the mix of these categorical columns (comma-separated, e.g.
                     device,site) per cluster in summary.json, as is done for the subject
  --progress <mode>  auto (a bar on a terminal, else nothing), bar, lines (plain lines for
                     batch logs) or none (default auto)
  --scale <how>      zscore (default), robust (median/IQR), subject-zscore (within each
                     subject), minmax or none
  --impute <how>     missing values: mean (default), median, subject-median (each subject's
                     own median) or drop (leave out windows with any missing value)
  --subject <column> the column naming each window's subject (default: inferred)
  --recipe <file>    a recipe JSON file {"version": 1, "steps": [...]} instead of --scale and
                     --impute; the recipe used is written into summary.json
  --events           also write <dir>/events.tsv (BIDS-style segments of consecutive windows
                     of one cluster per subject) and sub-<subject>_annotations.edf (EDF+)
${PIPELINE_USAGE}
  -h, --help         show this help
  -V, --version      show the version

Exit codes: 0 done, 1 bad input or failure, 2 bad command line, 130 cancelled (Ctrl-C).`;

type ValueFlag = 'out' | 'k' | 'seed' | 'restarts' | 'progress' | 'compose' | 'scale' | 'impute' | 'subject' | 'recipe' | PipelineFlag;
const VALUE_FLAGS: readonly ValueFlag[] = ['out', 'k', 'seed', 'restarts', 'progress', 'compose', 'scale', 'impute', 'subject', 'recipe', ...PIPELINE_FLAGS];

/** Parses the arguments after `gleaner`; throws UsageError with a one-line message. */
export function parseArgs(argv: readonly string[]): Command {
  if (argv.length === 0) throw new UsageError('missing command: expected "analyze <windows.csv> --out <dir>"');
  if (argv.includes('--help') || argv.includes('-h')) return { command: 'help' };
  if (argv.includes('--version') || argv.includes('-V')) return { command: 'version' };
  const [command, ...rest] = argv;
  if (command !== 'analyze') throw new UsageError(`unknown command "${command}": expected "analyze"`);

  const values: Partial<Record<ValueFlag, string>> = {};
  const positionals: string[] = [];
  let events = false;
  for (let i = 0; i < rest.length; i++) {
    const arg = rest[i];
    if (arg === '--events') { events = true; continue; }
    if (!arg.startsWith('-') || arg === '-') {
      positionals.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = (eq >= 0 ? arg.slice(0, eq) : arg).replace(/^--?/, '');
    if (!arg.startsWith('--') || !(VALUE_FLAGS as readonly string[]).includes(name)) {
      throw new UsageError(`unknown option "${eq >= 0 ? arg.slice(0, eq) : arg}"`);
    }
    const flag = name as ValueFlag;
    if (values[flag] !== undefined) throw new UsageError(`option --${flag} given twice`);
    let value: string | undefined;
    if (eq >= 0) value = arg.slice(eq + 1);
    else if (i + 1 < rest.length && !rest[i + 1].startsWith('--')) value = rest[++i];
    if (value === undefined || value === '') throw new UsageError(`option --${flag} needs a value`);
    values[flag] = value;
  }

  if (positionals.length === 0) throw new UsageError('missing input: expected "analyze <windows.csv>"');
  if (positionals.length > 1) throw new UsageError(`expected one input file, got ${positionals.length}: ${positionals.join(' ')}`);
  if (values.out === undefined) throw new UsageError('missing option --out <dir>');
  return {
    command: 'analyze',
    input: positionals[0],
    out: values.out,
    k: integerOption('k', values.k, DEFAULT_ANALYSIS_PARAMS.k, 2),
    seed: integerOption('seed', values.seed, DEFAULT_ANALYSIS_PARAMS.seed, 0),
    restarts: integerOption('restarts', values.restarts, DEFAULT_ANALYSIS_PARAMS.restarts, 1),
    progress: progressOption(values.progress),
    ...(values.compose !== undefined ? { compose: composeOption(values.compose) } : {}),
    ...recipeOptions(values),
    ...pipelineOptions(values),
    ...(events ? { events: true } : {}),
  };
}

function recipeOptions(values: Partial<Record<ValueFlag, string>>): Pick<AnalyzeOptions, 'scale' | 'impute' | 'subject' | 'recipe'> {
  const out: Pick<AnalyzeOptions, 'scale' | 'impute' | 'subject' | 'recipe'> = {};
  if (values.recipe !== undefined) {
    const clash = values.scale !== undefined ? 'scale' : values.impute !== undefined ? 'impute' : undefined;
    if (clash) throw new UsageError(`--recipe and --${clash} cannot be combined: put the ${clash} step in the recipe file`);
    out.recipe = values.recipe;
  }
  if (values.scale !== undefined) out.scale = choice('scale', values.scale, SCALE_CHOICES);
  if (values.impute !== undefined) out.impute = choice('impute', values.impute, IMPUTE_CHOICES);
  if (values.subject !== undefined) out.subject = values.subject;
  return out;
}

function choice<T extends string>(name: string, text: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(text)) throw new UsageError(`invalid --${name} "${text}": expected one of ${allowed.join(', ')}`);
  return text as T;
}

function composeOption(text: string): string[] {
  const names = text.split(',').map((s) => s.trim());
  if (names.some((s) => s === '')) throw new UsageError(`invalid --compose "${text}": expected column names separated by commas`);
  return [...new Set(names)];
}

function integerOption(name: string, text: string | undefined, fallback: number, min: number): number {
  if (text === undefined) return fallback;
  const value = /^[+]?\d+$/.test(text) ? Number(text) : NaN;
  if (!Number.isSafeInteger(value) || value < min || (name === 'seed' && value > 0xffffffff)) {
    const range = name === 'seed' ? 'an integer from 0 to 4294967295' : `an integer >= ${min}`;
    throw new UsageError(`invalid --${name} "${text}": expected ${range}`);
  }
  return value;
}

function progressOption(text: string | undefined): ProgressMode {
  if (text === undefined) return 'auto';
  if (!(PROGRESS_MODES as readonly string[]).includes(text)) {
    throw new UsageError(`invalid --progress "${text}": expected one of ${PROGRESS_MODES.join(', ')}`);
  }
  return text as ProgressMode;
}
