import { existsSync, mkdirSync, realpathSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { AnalysisResult } from '../core/analysis.types';
import { OptionError } from '../core/errors';
import { categoricalColumn, composeByName } from '../core/composition/compose-by-name';
import { labelAgreement } from '../core/composition/label-agreement';
import { subjectComposition } from '../core/export/cluster-composition';
import { mapCsv } from '../core/export/map-csv';
import { runIdentities } from '../core/export/run-model';
import { columnWithRole } from '../core/export/window-columns';
import { featureMatrix } from '../core/table/matrix';
import { checkTable } from '../core/table/checks';
import { inferRolesTold } from '../core/table/roles';
import { readInputStep } from './read-input';
import type { JobClient, RunningJob } from '../worker/client';
import type { AnalyzeJob, Jobs } from '../worker/jobs';
import type { AnalyzeOptions } from './args';
import type { ProgressReporter } from './progress-bar';
import { buildSummary } from './summary';
import { UsageError } from './usage-error';
import { writeFileAtomic } from './write-atomic';
import { writeEventFiles } from './events-output';
import { windowTimes } from '../core/export/segments';
import { attachSubjects, recipeOption, useSubjectColumn } from './recipe-options';
import { keepRows } from '../core/recipe/keep-rows';
import { analyzeParams } from './pipeline-options';
import { runStability } from './stability-option';
import { runCliJob } from './cli-job';
import { missingNotices } from '../core/table/notices';
import { missingByFeature, recipeNotices } from '../core/recipe/notices';
import { checkRoleColumns, printNotices } from './table-options';
import { encodeStudy } from '../core/study/encode';
import { analyzeStudy } from './analyze-study';
import { outputTime } from './source-date';

export interface AnalyzeDeps {
  client: JobClient<Jobs>;
  progress: ProgressReporter;
  version: string;
  /** Called with each running job, so that Ctrl-C can cancel it. */
  onJob(job: RunningJob<unknown> | null): void;
}

export interface AnalyzeOutcome {
  files: string[];
  rows: number;
  result: AnalysisResult;
}

/** load → parse (worker) → feature matrix → analyze (worker) → windows.csv + summary.json + study.gleaner. */
export async function analyzeCommand(opts: AnalyzeOptions, deps: AnalyzeDeps): Promise<AnalyzeOutcome> {
  const outDir = resolve(opts.out);
  const outFiles = { windows: join(outDir, 'windows.csv'), summary: join(outDir, 'summary.json'), study: join(outDir, 'study.gleaner') };
  refuseToOverwriteInput(opts.input, outDir, Object.values(outFiles));

  const input = await readInputStep(opts.input, deps, opts.missing ? { missing: opts.missing } : undefined);
  const { fileName, sha256 } = input;
  const createdAt = outputTime(); // a malformed SOURCE_DATE_EPOCH stops before the long run
  let table = input.table;
  checkRoleColumns(table, opts.roles);
  const inferred = inferRolesTold(table, opts.roles);
  let roles = inferred.roles;
  const notices = [...inferred.notices, ...missingNotices(table, roles)];
  printNotices(notices, 'summary.json notices');
  for (const w of checkTable(table, roles)) process.stderr.write(`gleaner: warning: ${w.message}\n`);
  useSubjectColumn(table, roles, opts.subject);
  const recipe = recipeOption(opts);
  const matrix = featureMatrix(table, roles);
  attachSubjects(matrix, table, roles);
  for (const name of opts.compose ?? []) categoricalColumn(table, name); // fail before the long run
  if (opts.events) windowTimes(table, roles);
  if (opts.values.cutHeight === undefined && opts.values.k > matrix.n) {
    throw new OptionError('--k', opts.values.k, `at most the number of windows (${matrix.n})`);
  }
  if (opts.stability !== undefined && !matrix.subjectCodes) {
    throw new OptionError('--stability', opts.stability, 'a table with a subject column (resamples leave subjects out; name it with --subject)');
  }
  const params = analyzeParams(opts.values, matrix.n);
  const { n, d, featureNames } = matrix;
  if (recipe) params.recipe = recipe;
  const analyzePayload: AnalyzeJob = { matrix, params };
  const missing = missingByFeature(matrix); // before the matrix's buffer moves to the worker
  const result = await runCliJob(deps, 'analyze', analyzePayload, 'analysing', [matrix.data.buffer as ArrayBuffer]);
  const stability = opts.stability === undefined ? undefined
    : await runStability(deps, { table, roles, params, run: { labels: result.labels, windows: result.windows, cluster: result.cluster }, options: { resamples: opts.stability } });
  const told = recipeNotices(fileName, missing, result.recipe);
  printNotices(told, 'summary.json notices');
  notices.push(...told);
  const study = analyzeStudy({
    inputPath: resolve(opts.input), outDir, fileName, sha256, rows: table.nRows, roles, params, result, createdAt, version: deps.version,
  });
  // The recipe dropped windows: the outputs list the analysed windows only.
  if (result.windows) ({ table, roles } = keepRows(table, roles, result.windows));

  const identities = runIdentities(result, table, roles);
  const { clusters: composition, ...subjects } = subjectComposition(result.labels, result.cluster.k, columnWithRole(table, roles, 'subject'));
  const compositions = (opts.compose ?? []).map((name) => composeByName(table, result.labels, result.cluster.k, name));
  const label = columnWithRole(table, roles, 'label');
  const summary = buildSummary({
    input: { path: opts.input, fileName, sha256, rows: n, features: d, featureNames },
    roles,
    params,
    result,
    composition,
    identities,
    subjects,
    compositions,
    labelAgreement: label ? labelAgreement(result.labels, label) : null,
    ...(stability ? { stability } : {}),
    notices,
    version: deps.version,
  });
  mkdirSync(outDir, { recursive: true });
  writeFileAtomic(outFiles.windows, mapCsv({ table, roles, result, identities }));
  writeFileAtomic(outFiles.summary, `${JSON.stringify(summary, null, 2)}\n`);
  writeFileAtomic(outFiles.study, encodeStudy(study));
  const eventFiles = opts.events ? writeEventFiles(outDir, opts.input, table, roles, result, identities) : [];
  return { files: [outFiles.windows, outFiles.summary, outFiles.study, ...eventFiles], rows: n, result };
}

/** The outputs must never land on the input file (for example `--out .` next to windows.csv). */
function refuseToOverwriteInput(input: string, outDir: string, outputs: string[]): void {
  if (!existsSync(input)) return; // reading it reports the problem
  const inputReal = realpathSync(input);
  if (existsSync(outDir) && !statSync(outDir).isDirectory()) {
    throw new UsageError(`--out "${outDir}" is a file, not a folder`);
  }
  for (const out of outputs) {
    const real = existsSync(out) ? realpathSync(out) : out;
    if (real === inputReal) throw new UsageError(`refusing to write ${out}: it is the input file; choose another --out`);
  }
}
