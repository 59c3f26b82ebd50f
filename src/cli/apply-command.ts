import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, realpathSync, statSync } from 'node:fs';
import { basename, dirname, extname, isAbsolute, join, resolve, sep } from 'node:path';
import { applyFrozen, SplitSubjectError } from '../core/apply/frozen-recipe';
import { applyLabelsCsv } from '../core/apply/labels-csv';
import { clusterIdentity } from '../core/apply/cluster-name';
import { assignWindows, ModelError, studyModel, type StudyModel } from '../core/apply/study-model';
import { CAUTIONS } from '../core/cautions';
import { CancelledError, InputError } from '../core/errors';
import type { ParamSpec } from '../core/params';
import { subjectCodes } from '../core/recipe/subject-codes';
import { checkInputs } from '../core/study/check-inputs';
import { decodeStudy } from '../core/study/decode';
import type { Study, StudyRun } from '../core/study/study.types';
import { concatTables } from '../core/table/concat';
import { featureMatrix } from '../core/table/matrix';
import { findColumn, rowLine, type Table } from '../core/table/table';
import { OUT, PROGRESS, PROGRESS_SHORT } from './cli-flags';
import { commandUsage, parseCommand, value, type CommandSpec } from './parse-command';
import { progressReporter, type ProgressMode, type ProgressReporter } from './progress-bar';
import { readInputStep } from './read-input';
import { attachSubjects } from './recipe-options';
import { UsageError } from './usage-error';
import { commandFailure } from './command-failure';
import { VERSION } from './version';
import { writeFileAtomic } from './write-atomic';

const RUN_ID: ParamSpec<string> = { name: 'run', flag: 'run', meta: '<id>', kind: 'text', default: '', help: ['the run to apply (default: the study\'s active run)'] };
const STUDY_INPUT: ParamSpec<string> = {
  name: 'studyInput', flag: 'study-input', meta: '<file>', kind: 'text', default: '',
  help: ['the study\'s own windows table, instead of the path saved in the study'],
};

/** `gleaner apply`: its flags in usage order. */
export const APPLY: CommandSpec = {
  name: 'apply',
  named: true,
  flags: [
    { spec: OUT, help: ['folder for the labels and manifest.json (created if missing)'] },
    { spec: RUN_ID }, { spec: STUDY_INPUT }, { spec: PROGRESS, help: PROGRESS_SHORT },
  ],
};

export const APPLY_USAGE = `Usage: gleaner apply <study file> <input>... --out <dir> [options]

Labels windows the study never saw with the study's curated clusters. The study's recipe is frozen
on the study's own windows table (read from the path saved in the study, checked by its SHA-256):
means, deviations, medians, quantiles and the features it kept. Each input (CSV, TSV, Parquet,
Arrow, a partition file or a partitioned folder) goes through that recipe, and each window goes to
the curated cluster with the nearest centroid (docs/apply.md). Writes <dir>/<input name>.labels.csv
per input (window_id, subject, session, start, end, cluster, cluster_name, class_name, set_aside,
confidence) and <dir>/manifest.json (study and input SHA-256s, row counts, the clusters).

An input's labels depend only on the study and that input. Per-subject recipe steps use the
subject's windows in that input: keep each subject's windows whole in one partition.

Options:
${commandUsage(APPLY)}
  -h, --help         show this help

Exit codes: 0 done, 1 bad input (a changed study input, a partition that does not fit the study)
or failure, 2 bad command line, 130 cancelled (Ctrl-C).`;

export interface ApplyOptions {
  study: string;
  inputs: string[];
  out: string;
  run?: string;
  studyInput?: string;
  progress: ProgressMode;
}

/** Parses the arguments after `gleaner apply`; throws UsageError or OptionError. `null` means --help. */
export function parseApplyArgs(argv: readonly string[]): ApplyOptions | null {
  if (argv.includes('--help') || argv.includes('-h')) return null;
  const parsed = parseCommand(argv, APPLY);
  const { positionals, texts } = parsed;
  if (positionals.length < 2) throw new UsageError(positionals.length === 0 ? 'missing study: expected "apply <study file> <input>... --out <dir>"' : 'missing input: expected "apply <study file> <input>... --out <dir>"');
  const out = texts.get(OUT.flag);
  if (out === undefined) throw new UsageError('missing option --out <dir>');
  return { study: positionals[0], inputs: positionals.slice(1), out, run: texts.get(RUN_ID.flag), studyInput: texts.get(STUDY_INPUT.flag), progress: value(parsed, PROGRESS) };
}

/** The output file of an input: its name without the extension, then ".labels.csv". */
export function labelsFileName(input: string): string {
  const name = basename(resolve(input));
  const ext = extname(name);
  return `${ext && ext !== name ? name.slice(0, -ext.length) : name}.labels.csv`;
}

export interface ApplyInputRecord {
  file: string;
  sha256: string;
  rows: number;
  labelled: number;
  /** Windows a drop step of the recipe left out (no label). */
  dropped: number;
  output: string;
  outputSha256: string;
}

export interface ApplyOutcome {
  files: string[];
  inputs: ApplyInputRecord[];
  model: StudyModel;
}

/** Applies the study's run to every input and writes the labels and the manifest. */
export async function applyStudy(opts: ApplyOptions, deps: { cancelled(): boolean }): Promise<ApplyOutcome> {
  const studyName = basename(opts.study);
  const studyBytes = new Uint8Array(readFileSync(opts.study));
  const study = decodeStudy(studyBytes, studyName);
  const run = pickRun(study, studyName, opts.run);
  const outDir = resolve(opts.out);
  if (existsSync(outDir) && !statSync(outDir).isDirectory()) throw new UsageError(`--out "${outDir}" is a file, not a folder`);
  const names = opts.inputs.map(labelsFileName);
  names.forEach((name, i) => {
    const j = names.indexOf(name);
    if (j !== i) throw new UsageError(`inputs ${opts.inputs[j]} and ${opts.inputs[i]} would both write ${name}: apply them with different --out folders`);
  });
  const inputReal = new Set(opts.inputs.filter((p) => existsSync(p)).map((p) => realpathSync(p)));
  const bar = progressReporter(process.stderr, opts.progress);
  const model = await learnModel(study, studyName, run, opts, bar);

  mkdirSync(outDir, { recursive: true });
  const records: ApplyInputRecord[] = [];
  const files: string[] = [];
  for (const [t, path] of opts.inputs.entries()) {
    if (deps.cancelled()) throw new CancelledError();
    const read = await readInputStep(path, { progress: bar, onJob: () => {} }, { precision: 'float64' });
    const csv = labelTable(withPartitionColumns(read.table, path, run), run, model, studyName);
    const outPath = join(outDir, names[t]);
    if (existsSync(outPath) && inputReal.has(realpathSync(outPath))) throw new UsageError(`refusing to write ${outPath}: it is an input file; choose another --out`);
    writeFileAtomic(outPath, csv.text);
    files.push(outPath);
    records.push({
      file: read.fileName, sha256: read.sha256, rows: read.table.nRows, labelled: csv.labelled, dropped: read.table.nRows - csv.labelled,
      output: names[t], outputSha256: createHash('sha256').update(csv.text).digest('hex'),
    });
  }
  const manifest = {
    command: 'gleaner apply',
    version: VERSION,
    study: {
      file: studyName,
      sha256: createHash('sha256').update(studyBytes).digest('hex'),
      run: run.id,
      input: study.inputs[run.input],
    },
    assignment: !run.result.tree
      ? 'the curated cluster with the nearest centroid (Euclidean, after the study\'s frozen recipe); confidence 1 - d1/d2 (docs/apply.md)'
      : 'the curated cluster of the nearest centroid of its parts in the run\'s tree cut finer (Euclidean, after the study\'s frozen recipe); confidence 1 - d1/d2 over the curated clusters\' centroids (docs/apply.md)',
    clusters: model.clusters.map((g) => {
      const note = model.notes[g];
      const id = clusterIdentity(g, note);
      return { cluster: id.number, name: id.name, className: note.className, setAside: note.setAside };
    }),
    inputs: records,
    cautions: CAUTIONS,
  };
  const manifestPath = join(outDir, 'manifest.json');
  writeFileAtomic(manifestPath, `${JSON.stringify(manifest, null, 2)}\n`);
  files.push(manifestPath);
  return { files, inputs: records, model };
}

function pickRun(study: Study, studyName: string, id: string | undefined): StudyRun {
  if (id !== undefined) {
    const run = study.runs.find((r) => r.id === id);
    if (!run) throw new UsageError(`no run "${id}" in ${studyName} (runs: ${study.runs.map((r) => r.id).join(', ') || 'none'})`);
    return run;
  }
  const run = study.runs[study.activeRun] ?? (study.runs.length === 1 ? study.runs[0] : undefined);
  if (!run) throw new InputError({ file: studyName, expected: study.runs.length === 0 ? 'a run to apply' : 'an active run (or name one with --run)', found: `${study.runs.length} runs, none active` });
  return run;
}

/** Reads the study's own input (hash-checked) and learns the frozen recipe and centroids. */
async function learnModel(study: Study, studyName: string, run: StudyRun, opts: ApplyOptions, bar: ProgressReporter): Promise<StudyModel> {
  const saved = study.inputs[run.input];
  // As `gleaner run` finds it: --study-input, else the saved path (a relative one from the study's folder).
  const savedPath = saved.path || saved.fileName;
  const path = opts.studyInput ?? (isAbsolute(savedPath) ? savedPath : join(dirname(resolve(opts.study)), savedPath));
  if (!existsSync(path)) {
    throw new InputError({ file: studyName, expected: `its input ${saved.fileName} at ${path} (the recipe is frozen on it; name it with --study-input)`, found: 'no such file' });
  }
  const read = await readInputStep(path, { progress: bar, onJob: () => {} });
  const [check] = checkInputs({ inputs: [saved] }, [read.sha256]);
  if (check.status !== 'same') {
    throw new InputError({ file: read.fileName, expected: `the input saved in ${studyName} (SHA-256 ${check.expected}; this file's is ${check.found})`, found: 'a changed file' });
  }
  const matrix = featureMatrix(read.table, run.roles);
  attachSubjects(matrix, read.table, run.roles);
  try {
    return studyModel(run, matrix);
  } catch (err) {
    if (err instanceof ModelError) throw new InputError({ file: studyName, expected: err.expected, found: err.found });
    throw err;
  }
}

/** One input through the frozen recipe and the assignment, as CSV text. */
function labelTable(table: Table, run: StudyRun, model: StudyModel, studyName: string): { text: string; labelled: number } {
  const features = model.frozen.inputFeatures;
  checkSchema(table, run, features, studyName);
  const n = table.nRows;
  const d = features.length;
  const data = new Float64Array(n * d);
  features.forEach((name, j) => {
    const column = findColumn(table, name)!;
    if (column.kind === 'numeric') {
      for (let i = 0; i < n; i++) data[i * d + j] = column.values[i];
      return;
    }
    // A text column holding no value at all is an all-missing feature; any text is refused, naming
    // the first cell that is not a number (or, when every cell reads as one, the column's type).
    const text = (c: number) => column.dictionary[c];
    const bad = column.codes.findIndex((c) => c >= 0 && !/^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/.test(text(c)));
    if (bad >= 0) throw new InputError({ file: table.fileName, row: rowLine(table, bad), column: name, expected: `a number (a feature of ${studyName})`, found: text(column.codes[bad]) });
    if (column.codes.some((c) => c >= 0)) throw new InputError({ file: table.fileName, column: name, expected: `a numeric column (a feature of ${studyName})`, found: 'numbers stored as text' });
    for (let i = 0; i < n; i++) data[i * d + j] = NaN;
  });
  const subjectRole = run.roles.find((r) => r.role === 'subject');
  const subjectColumn = subjectRole ? findColumn(table, subjectRole.name) : undefined;
  const subjects = subjectColumn ? subjectCodes(subjectColumn) : undefined;
  let out;
  try {
    out = applyFrozen(model.frozen, data, n, subjects?.codes);
  } catch (err) {
    if (err instanceof SplitSubjectError) {
      const who = err.subject < 0 ? 'windows without a subject' : `subject ${subjects!.names[err.subject]}`;
      throw new InputError({
        file: table.fileName, column: subjectRole!.name,
        expected: `at least ${err.needed} windows of each subject for recipe step ${err.step} (${err.stepType}): keep each subject's windows whole in one partition`,
        found: `${who}: ${err.windows} window${err.windows === 1 ? '' : 's'}`,
      });
    }
    if (err instanceof Error && /needs the subject/.test(err.message)) {
      throw new InputError({ file: table.fileName, expected: `a subject column${subjectRole ? ` "${subjectRole.name}"` : ''} (${err.message})`, found: 'none' });
    }
    throw err;
  }
  for (let i = 0; i < out.data.length; i++) {
    if (out.data[i] === out.data[i]) continue;
    const row = out.windows[Math.floor(i / out.d)];
    throw new InputError({ file: table.fileName, row: rowLine(table, row), column: model.frozen.outputFeatures[i % out.d], expected: 'a value: the study\'s recipe does not fill missing values (add an impute step to it)', found: 'a missing value' });
  }
  const { labels, confidence } = assignWindows(model, out.data, out.n);
  return { text: applyLabelsCsv({ table, roles: run.roles, model, rows: out.windows, labels, confidence }), labelled: out.n };
}

/**
 * A part file of a partitioned dataset (`.../subject=S01/part-0.parquet`) often lacks the columns
 * its folders name: those the study knows are added from the folder names (as a folder input gets
 * them), so the part's windows keep their subject.
 */
function withPartitionColumns(table: Table, path: string, run: StudyRun): Table {
  if (statSync(path).isDirectory()) return table;
  const known = new Set(run.roles.map((r) => r.name));
  const partition: Record<string, string> = {};
  for (const seg of resolve(path).split(sep).slice(0, -1)) {
    const eq = seg.indexOf('=');
    if (eq <= 0) continue;
    const key = decodeURIComponent(seg.slice(0, eq));
    if (known.has(key) && !findColumn(table, key)) partition[key] = decodeURIComponent(seg.slice(eq + 1));
  }
  return Object.keys(partition).length === 0 ? table : concatTables([{ table, partition }], table.fileName);
}

/** The input's columns must be the study's: every feature column, and no column the study does not know. */
function checkSchema(table: Table, run: StudyRun, features: string[], studyName: string): void {
  const known = new Set(run.roles.map((r) => r.name));
  const have = new Set(table.columns.map((c) => c.name));
  const missing = features.filter((f) => !have.has(f));
  const extra = table.columns.map((c) => c.name).filter((c) => !known.has(c));
  if (missing.length === 0 && extra.length === 0) return;
  const parts = [missing.length ? `missing ${missing.join(', ')}` : '', extra.length ? `not in the study ${extra.join(', ')}` : ''].filter(Boolean);
  throw new InputError({ file: table.fileName, expected: `the feature columns of ${studyName} (${features.length}): ${parts.join('; ')}` });
}

/** `gleaner apply ...`: exit code 0 done, 1 input or failure, 2 usage, 130 cancelled. */
export async function runApply(argv: readonly string[]): Promise<number> {
  let cancelled = false;
  const onSigint = () => {
    if (cancelled) process.exit(130);
    cancelled = true;
  };
  try {
    const opts = parseApplyArgs(argv);
    if (!opts) { process.stdout.write(`${APPLY_USAGE}\n`); return 0; }
    process.on('SIGINT', onSigint);
    const outcome = await applyStudy(opts, { cancelled: () => cancelled });
    const windows = outcome.inputs.reduce((s, r) => s + r.labelled, 0);
    process.stdout.write(`gleaner: labelled ${windows} windows of ${outcome.inputs.length} input${outcome.inputs.length === 1 ? '' : 's'} with run ${outcome.model.runId}; wrote ${outcome.files.length} files under ${resolve(opts.out)}\n`);
    return 0;
  } catch (err) {
    return commandFailure(err, 'apply');
  } finally {
    process.off('SIGINT', onSigint);
  }
}

