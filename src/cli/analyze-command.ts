import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, realpathSync, statSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams, type AnalysisResult } from '../core/analysis.types';
import { OptionError } from '../core/errors';
import { clusterComposition } from '../core/export/cluster-composition';
import { mapCsv } from '../core/export/map-csv';
import { columnWithRole } from '../core/export/window-columns';
import { featureMatrix } from '../core/table/matrix';
import type { JobClient, RunningJob } from '../worker/client';
import type { AnalyzeJob, ParseJob, ParseResult } from '../worker/jobs';
import type { AnalyzeOptions } from './args';
import type { ProgressReporter } from './progress-bar';
import { buildSummary } from './summary';
import { UsageError } from './args';
import { writeFileAtomic } from './write-atomic';

export interface AnalyzeDeps {
  client: JobClient;
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

/** load → parse (worker) → feature matrix → analyze (worker) → windows.csv + summary.json. */
export async function analyzeCommand(opts: AnalyzeOptions, deps: AnalyzeDeps): Promise<AnalyzeOutcome> {
  const outDir = resolve(opts.out);
  const outFiles = { windows: join(outDir, 'windows.csv'), summary: join(outDir, 'summary.json') };
  refuseToOverwriteInput(opts.input, outDir, Object.values(outFiles));

  const buf = readFileSync(opts.input);
  const sha256 = createHash('sha256').update(buf).digest('hex');
  const fileName = basename(opts.input);
  // Hand the worker a buffer of its own (file buffers may share a pooled ArrayBuffer).
  const bytes = new Uint8Array(buf);

  const parsePayload: ParseJob = { fileName, bytes };
  const { table, roles } = await runJob<ParseResult>(deps, 'parse', parsePayload, [bytes.buffer], 'reading');
  const matrix = featureMatrix(table, roles);
  if (opts.k > matrix.n) {
    throw new OptionError('--k', opts.k, `at most the number of windows (${matrix.n})`);
  }
  const params: AnalysisParams = { ...DEFAULT_ANALYSIS_PARAMS, k: opts.k, seed: opts.seed, restarts: opts.restarts };
  const { n, d, featureNames } = matrix;
  const analyzePayload: AnalyzeJob = { matrix, params };
  const result = await runJob<AnalysisResult>(deps, 'analyze', analyzePayload, [matrix.data.buffer as ArrayBuffer], 'analysing');

  const composition = clusterComposition(result.labels, result.cluster.k, columnWithRole(table, roles, 'subject'));
  const summary = buildSummary({
    input: { path: opts.input, fileName, sha256, rows: n, features: d, featureNames },
    roles,
    params,
    result,
    composition,
    version: deps.version,
  });
  mkdirSync(outDir, { recursive: true });
  writeFileAtomic(outFiles.windows, mapCsv({ table, roles, result }));
  writeFileAtomic(outFiles.summary, `${JSON.stringify(summary, null, 2)}\n`);
  return { files: [outFiles.windows, outFiles.summary], rows: n, result };
}

async function runJob<R>(deps: AnalyzeDeps, job: string, payload: unknown, transfer: ArrayBuffer[], label: string): Promise<R> {
  const running = deps.client.run<R>(job, payload, {
    transfer,
    onProgress: (p) => deps.progress.update(`${label}: ${p.stage}`, p.fraction),
  });
  deps.onJob(running as RunningJob<unknown>);
  try {
    return await running.result;
  } finally {
    deps.onJob(null);
    deps.progress.finish();
  }
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
