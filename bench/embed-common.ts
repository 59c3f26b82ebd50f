// What the "embed" suite's t-SNE/PCA rows (bench/suites/embed.ts) and its UMAP rows (bench/embed-umap.ts)
// share: the datasets, the quality measure, in-process timing and the result file.
import { appendFileSync, mkdirSync, readFileSync } from 'node:fs';
import { sampledTrustworthiness } from '../src/core/metrics/trustworthiness';
import { seededRandom } from '../src/core/random';
import { baselineRecipe } from '../src/core/recipe/baseline';
import { parseCsv } from '../src/core/table/csv';
import { featureMatrix } from '../src/core/table/matrix';
import { inferRoles } from '../src/core/table/roles';
import { gaussianBlobs } from './blobs';
import { PeakSampler } from './peak';

export const D = 50;
export const CENTRES = 10;
export const SEED = 20240601;
export const K = 10;
export const SAMPLE = 5000;
export const RESULTS = 'bench-results/embed.jsonl';

export interface Dataset {
  name: string;
  data: Float64Array;
  n: number;
  d: number;
}

/** One result line; `seconds` and friends are null for a skipped peer. */
export interface EmbedRow {
  suite: 'embed';
  method: string;
  impl: string;
  dataset: string;
  n: number;
  d: number;
  seconds: number | null;
  peak_mib: number | null;
  trustworthiness: number | null;
  runs: number;
  note?: string;
}

export const rows: EmbedRow[] = [];

/** Records a row: kept for the table and appended to bench-results/embed.jsonl. */
export function recordRow(row: EmbedRow): void {
  rows.push(row);
  mkdirSync('bench-results', { recursive: true });
  appendFileSync(RESULTS, `${JSON.stringify(row)}\n`);
}

/** Trustworthiness(k = 10) of a map on a seeded sample of up to 5,000 windows (same sample for every impl). */
export function quality(ds: Dataset, map: Float32Array | Float64Array): number {
  return sampledTrustworthiness(ds.data, ds.n, ds.d, map, 2, K, { sample: SAMPLE, random: seededRandom(SEED) });
}

/**
 * Times `fn` in this process: median of `runs` runs (no warm-up run when runs = 1) and the largest
 * rise of the RSS above its level at the start of a run, sampled every 1 ms from a worker thread.
 */
export async function timeInProcess<T>(fn: () => Promise<T>, runs: number): Promise<{ seconds: number; peakMiB: number; result: T }> {
  const sampler = new PeakSampler();
  await sampler.ready();
  const times: number[] = [];
  let peak = 0;
  let result: T | undefined;
  try {
    for (let r = 0; r < runs; r++) {
      const base = sampler.reset();
      const t0 = performance.now();
      result = await fn();
      times.push((performance.now() - t0) / 1000);
      peak = Math.max(peak, sampler.peakMiB() - base);
    }
  } finally {
    await sampler.stop();
  }
  times.sort((a, b) => a - b);
  return { seconds: times[Math.floor(times.length / 2)], peakMiB: peak, result: result as T };
}

export function blobsDataset(n: number): Dataset {
  const b = gaussianBlobs(n, D, CENTRES, SEED + n);
  return { name: 'blobs', data: b.data, n, d: D };
}

/**
 * The demo windows' feature columns, z-scored with missing values filled (the baseline recipe);
 * only the first `limit` windows (file order) when given.
 */
export function demoDataset(limit = Infinity): Dataset {
  const table = parseCsv(new Uint8Array(readFileSync('demo-data/windows.csv')), 'windows.csv');
  const matrix = featureMatrix(table, inferRoles(table));
  const n = Math.min(matrix.n, limit);
  return { name: 'demo windows', data: baselineRecipe(matrix).data.slice(0, n * matrix.d), n, d: matrix.d };
}

