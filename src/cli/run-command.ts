import { existsSync, mkdirSync, readFileSync, realpathSync, statSync } from 'node:fs';
import { basename, dirname, isAbsolute, join, resolve } from 'node:path';
import type { AnalysisParams } from '../core/analysis.types';
import { analyze } from '../core/analyze';
import { CancelledError, InputError, OptionError } from '../core/errors';
import { studyExports, type StudyExportFile } from '../core/export/study-exports';
import type { JobContext } from '../core/job';
import { checkInputs } from '../core/study/check-inputs';
import { decodeStudy } from '../core/study/decode';
import type { Study } from '../core/study/study.types';
import { featureMatrix } from '../core/table/matrix';
import type { ParamSpec } from '../core/params';
import { OUT, PROGRESS, PROGRESS_SHORT } from './cli-flags';
import { commandUsage, parseCommand, value, type CommandSpec } from './parse-command';
import { progressReporter, type ProgressMode } from './progress-bar';
import { UsageError } from './usage-error';
import { commandFailure } from './command-failure';
import { readInputStep } from './read-input';
import { attachSubjects } from './recipe-options';
import { VERSION } from './version';
import { writeFileAtomic } from './write-atomic';
import { withSavedIdentities } from '../core/curation/carry-identities';
import { outputTime } from './source-date';

const RUN_ID: ParamSpec<string> = { name: 'run', flag: 'run', meta: '<id>', kind: 'text', default: '', help: ['only this run (default: every run)'] };
const INPUT: ParamSpec<string> = {
  name: 'input', flag: 'input', meta: '<file>', kind: 'text', default: '',
  help: ['read the input from here instead of the path saved in the study (one input)'],
};

/** `gleaner run`: its flags in usage order. */
export const RUN: CommandSpec = {
  name: 'run',
  named: true,
  flags: [
    { spec: OUT, help: ['folder for the exports (created if missing; never over an input file)'] },
    { spec: RUN_ID }, { spec: INPUT }, { spec: PROGRESS, help: PROGRESS_SHORT },
  ],
};

export const RUN_USAGE = `Usage: gleaner run <study file> --out <dir> [options]

Reproduces a saved study headless: reads each run's input file (checking its SHA-256 against the
study), re-runs the analysis with the saved parameters and seed, applies the recorded curation
(names, merges, splits, moves, set-aside clusters, classes) and writes the weak-label exports of
every run into <dir>/<run id>/: <input>-weak-labels.csv, <input>-provenance.json,
<input>-label-first.csv and, when the windows have start times, <input>-events.tsv and one EDF+
annotation file per subject (sub-<subject>_annotations.edf).

Options:
${commandUsage(RUN)}
  -h, --help         show this help

Exit codes: 0 done, 1 bad input (a changed input file, a damaged study) or failure, 2 bad command
line, 130 cancelled (Ctrl-C).`;

export interface RunCommandOptions {
  study: string;
  out: string;
  run?: string;
  input?: string;
  progress: ProgressMode;
}

/** Parses the arguments after `gleaner run`; throws UsageError or OptionError. `null` means --help. */
export function parseRunArgs(argv: readonly string[]): RunCommandOptions | null {
  if (argv.includes('--help') || argv.includes('-h')) return null;
  const parsed = parseCommand(argv, RUN);
  const { positionals, texts } = parsed;
  if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'missing study: expected "run <study file> --out <dir>"' : `expected one study file, got ${positionals.length}`);
  const out = texts.get(OUT.flag);
  if (out === undefined) throw new UsageError('missing option --out <dir>');
  return { study: positionals[0], out, run: texts.get(RUN_ID.flag), input: texts.get(INPUT.flag), progress: value(parsed, PROGRESS) };
}

/** Where an input of the study is now: --input, else its saved path (relative paths from the study's folder). */
function inputPath(study: Study, index: number, studyPath: string, override: string | undefined): string {
  if (override !== undefined) {
    if (study.inputs.length > 1) throw new UsageError(`--input works for a study with one input; this one has ${study.inputs.length}`);
    return override;
  }
  const saved = study.inputs[index].path || study.inputs[index].fileName;
  return isAbsolute(saved) ? saved : join(dirname(resolve(studyPath)), saved);
}

export interface RunOutcome {
  files: string[];
  /** Runs whose recomputed labels differ from the saved ones (their curation still applied). */
  differing: string[];
}

/** Reproduces the study's runs and writes their exports; `now` gives the provenance time. */
export async function runStudy(opts: RunCommandOptions, deps: { progress: ProgressMode; now(): string; cancelled(): boolean; warn(line: string): void }): Promise<RunOutcome> {
  const studyName = basename(opts.study);
  const study = decodeStudy(new Uint8Array(readFileSync(opts.study)), studyName);
  const runs = opts.run === undefined ? study.runs.map((_, i) => i) : [study.runs.findIndex((r) => r.id === opts.run)];
  if (runs[0] === -1) throw new UsageError(`no run "${opts.run}" in ${studyName} (runs: ${study.runs.map((r) => r.id).join(', ') || 'none'})`);
  if (runs.length === 0) throw new InputError({ file: studyName, expected: 'at least one run to reproduce', found: 'none' });
  const outDir = resolve(opts.out);
  if (existsSync(outDir) && !statSync(outDir).isDirectory()) throw new UsageError(`--out "${outDir}" is a file, not a folder`);
  const bar = progressReporter(process.stderr, deps.progress);
  const written: string[] = [];
  const differing: string[] = [];
  const inputs = new Map<number, { table: Awaited<ReturnType<typeof readInputStep>>['table']; real: string }>();
  for (const r of runs) {
    const run = study.runs[r];
    let input = inputs.get(run.input);
    if (!input) {
      const path = inputPath(study, run.input, opts.study, opts.input);
      const read = await readInputStep(path, { progress: bar, onJob: () => {} });
      const [check] = checkInputs({ inputs: [study.inputs[run.input]] }, [read.sha256]);
      if (check.status !== 'same') throw new InputError({ file: read.fileName, expected: `the input saved in ${studyName} (SHA-256 ${check.expected})`, found: `SHA-256 ${check.found}: the file changed since the study was saved` });
      input = { table: read.table, real: realpathSync(path) };
      inputs.set(run.input, input);
    }
    const matrix = featureMatrix(input.table, run.roles);
    attachSubjects(matrix, input.table, run.roles);
    const ctx: JobContext = {
      progress: (stage, f, detail) => bar.update(`${run.id}: ${stage}`, f, detail),
      checkpoint: () => new Promise((res, rej) => setImmediate(() => (deps.cancelled() ? rej(new CancelledError()) : res()))),
    };
    // A tree cut again is numbered by lowest leaf; the saved run numbers its clusters as the app kept them.
    const result = withSavedIdentities(run.result, await analyze(matrix, run.params as unknown as AnalysisParams, ctx).finally(() => bar.finish()));
    if (!sameLabels(result.labels, run.result.labels)) {
      differing.push(run.id);
      deps.warn(`run ${run.id}: the recomputed clusters differ from the saved ones; the exports use the recomputed ones`);
    }
    const redone: Study = { ...study, runs: study.runs.map((x, i) => (i === r ? { ...x, result } : x)) };
    const files = exportsWithEvents(redone, r, input.table, deps);
    const dir = join(outDir, run.id);
    mkdirSync(dir, { recursive: true });
    for (const f of files) {
      const path = join(dir, f.name);
      if (existsSync(path) && realpathSync(path) === input.real) throw new UsageError(`refusing to write ${path}: it is the input file; choose another --out`);
      writeFileAtomic(path, f.data);
      written.push(path);
    }
  }
  return { files: written, differing };
}

function exportsWithEvents(study: Study, run: number, table: Parameters<typeof studyExports>[0]['table'], deps: { now(): string; warn(line: string): void }): StudyExportFile[] {
  const args = { study, run, table, appVersion: VERSION, createdAt: deps.now() };
  try {
    return studyExports({ ...args, events: true });
  } catch (err) {
    if (!(err instanceof OptionError) || !/events/.test(err.message)) throw err;
    deps.warn(`run ${study.runs[run].id}: no events written (${err.message})`);
    return studyExports(args);
  }
}

function sameLabels(a: Int32Array, b: Int32Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** `gleaner run ...`: exit code 0 done, 1 input or failure, 2 usage, 130 cancelled. */
export async function runRunCommand(argv: readonly string[]): Promise<number> {
  let cancelled = false;
  const onSigint = () => {
    if (cancelled) process.exit(130);
    cancelled = true;
  };
  try {
    const opts = parseRunArgs(argv);
    if (!opts) { process.stdout.write(`${RUN_USAGE}\n`); return 0; }
    process.on('SIGINT', onSigint);
    const outcome = await runStudy(opts, {
      progress: opts.progress,
      now: () => outputTime(),
      cancelled: () => cancelled,
      warn: (line) => process.stderr.write(`gleaner: warning: ${line}\n`),
    });
    process.stdout.write(`gleaner: reproduced ${opts.study}; wrote ${outcome.files.length} files under ${resolve(opts.out)}\n`);
    return 0;
  } catch (err) {
    return commandFailure(err, 'run');
  } finally {
    process.off('SIGINT', onSigint);
  }
}

