// UMAP rows of the "embed" suite (bench/suites/embed.ts calls benchUmap for every dataset): our
// UMAP beside umap-js 1.4.0 and druid.js 0.9.0 UMAP on the same data, with time, peak memory,
// trustworthiness (the suite's `quality`) and the neighbour graph's recall of the exact 15 nearest
// neighbours on a seeded sample of 1,000 windows.
//
// Peers run in a child process (`node --import tsx bench/embed-umap.ts --umap-peer <peer> <dataset> <n>`)
// killed at the time budget; druid.js UMAP builds N × N matrices (PEERS.md: 6 GB at 10k), so it is
// not run above 10,000 windows.
import { runChild } from './child';
import { fileURLToPath } from 'node:url';
import { UMAP as DruidUMAP } from '@saehrimnir/druidjs';
import { UMAP as UmapJs } from 'umap-js';
import { autoEpochs, Umap } from '../src/core/embed/umap/index';
import { sampleIndices } from '../src/core/metrics/sample';
import { exactKnnOfRows, type SampleKnn } from '../src/core/neighbors/recall';
import { seededRandom } from '../src/core/random';
import { blobsDataset, demoDataset, quality, recordRow, timeInProcess, type Dataset } from './embed-common';

const NEIGHBORS = 15;
const MIN_DIST = 0.1;
const RECALL_SAMPLE = 1000;
const RECALL_SEED = 1234;
const BUDGET_S = 300;
/** druid.js UMAP is O(N²) in memory: not run above this. */
const DRUID_MAX_N = 10_000;
const SMALL_N = 2000;

interface PeerResult { seconds: number; peakMiB: number; map: number[]; lists?: number[][] }

/** The seeded sample of rows and their exact 14 nearest other windows (15 counting the window itself). */
function exactSample(ds: Dataset): SampleKnn {
  const rows = sampleIndices(ds.n, RECALL_SAMPLE, seededRandom(RECALL_SEED));
  return exactKnnOfRows(ds.data, ds.n, ds.d, rows, NEIGHBORS - 1, 'euclidean');
}

/**
 * Recall of the exact 15-neighbourhood in UMAP's sense (n_neighbors = 15 counts the window itself):
 * |graph's neighbourhood ∩ ({i} ∪ exact 14 nearest others)| / 15, averaged over the sample.
 * `selfImplied`: the list leaves the window itself out (ours), so it is added; umap-js lists it.
 */
function recall15(exact: SampleKnn, list: (s: number) => ArrayLike<number>, selfImplied: boolean): number {
  const rows = exact.rows as ArrayLike<number>;
  let hits = 0;
  for (let s = 0; s < rows.length; s++) {
    const want = new Set<number>([rows[s]]);
    for (let t = 0; t < exact.k; t++) want.add(exact.indices[s * exact.k + t]);
    const got = new Set<number>(Array.from(list(s)).slice(0, selfImplied ? NEIGHBORS - 1 : NEIGHBORS));
    if (selfImplied) got.add(rows[s]);
    for (const j of got) if (want.has(j)) hits++;
  }
  return hits / (rows.length * NEIGHBORS);
}

/** Our UMAP on a dataset, then umap-js and (up to 10k) druid.js on the same data. */
export async function benchUmap(ds: Dataset, key: string): Promise<void> {
  const exact = exactSample(ds);
  const runs = ds.n <= SMALL_N ? 3 : 1;
  const base = { suite: 'embed' as const, method: 'UMAP', dataset: key, n: ds.n, d: ds.d };
  const m = await timeInProcess(async () => {
    const umap = new Umap(ds.data, ds.n, ds.d, { neighbors: NEIGHBORS, minDist: MIN_DIST, seed: 1 });
    await umap.init();
    while (umap.step());
    return { map: umap.coords(), knn: umap.knn! };
  }, runs);
  const knn = m.result.knn;
  const ours = recall15(exact, (s) => knn.indices.subarray(exact.rows![s] * knn.k, exact.rows![s] * knn.k + knn.k), true);
  recordRow({ ...base, impl: 'gleaner', seconds: m.seconds, peak_mib: m.peakMiB, trustworthiness: quality(ds, m.result.map), runs,
    note: `recall@15 ${ours.toFixed(3)} (NN-descent; ${RECALL_SAMPLE} sampled windows)` });

  for (const peer of ['umap-js', 'druid-umap'] as const) {
    const impl = peer === 'umap-js' ? 'umap-js 1.4.0' : 'druid.js 0.9.0';
    const row = { ...base, impl, runs: 1 };
    if (peer === 'druid-umap' && ds.n > DRUID_MAX_N) {
      recordRow({ ...row, seconds: null, peak_mib: null, trustworthiness: null, note: `skipped: N × N memory above ${DRUID_MAX_N} windows (6 GB at 10k, out of memory at 20k in PEERS.md)` });
      continue;
    }
    const graphOnly = peer === 'umap-js' && process.env.GLEANER_BENCH_UMAPJS === 'graph';
    const r = graphOnly ? { skipped: 'not run (GLEANER_BENCH_UMAPJS=graph)' } : await runUmapPeer(peer, key === 'blobs' ? 'blobs' : 'demo', ds.n);
    if ('skipped' in r) {
      recordRow({ ...row, seconds: null, peak_mib: null, trustworthiness: null, note: `skipped: ${r.skipped}` });
      // Where umap-js does not finish, its neighbour graph alone still gives the recall on the same data.
      if (peer === 'umap-js') await benchUmapJsGraph(exact, ds, key);
      continue;
    }
    const note = r.lists ? `recall@15 ${recall15(exact, (s) => r.lists![s], false).toFixed(3)}` : 'exact KD-tree neighbours';
    recordRow({ ...row, seconds: r.seconds, peak_mib: r.peakMiB, trustworthiness: quality(ds, Float64Array.from(r.map)), note });
  }
}

/** umap-js's neighbour graph alone (initializeFit: NN-descent and the fuzzy set): its time and recall. */
async function benchUmapJsGraph(exact: SampleKnn, ds: Dataset, key: string): Promise<void> {
  const row = { suite: 'embed' as const, method: 'UMAP neighbour graph', dataset: key, n: ds.n, d: ds.d, impl: 'umap-js 1.4.0', runs: 1, trustworthiness: null };
  const r = await runUmapPeer('umap-js-graph', key === 'blobs' ? 'blobs' : 'demo', ds.n);
  if ('skipped' in r) recordRow({ ...row, seconds: null, peak_mib: null, note: `skipped: ${r.skipped}` });
  else recordRow({ ...row, seconds: r.seconds, peak_mib: r.peakMiB, note: `recall@15 ${recall15(exact, (s) => r.lists![s], false).toFixed(3)} (graph only)` });
}

function runUmapPeer(peer: string, dataset: string, n: number): Promise<PeerResult | { skipped: string }> {
  return runChild<PeerResult>(fileURLToPath(import.meta.url), ['--umap-peer', peer, dataset, String(n)], BUDGET_S, ['--max-old-space-size=16000']);
}

/** Child side: runs one peer; returns the line {seconds, peakMiB, map, lists?} to print. */
async function peerChild(peer: string, dataset: string, n: number): Promise<string> {
  const ds = dataset === 'demo' ? demoDataset(n) : blobsDataset(n);
  const rowsOf = () => Array.from({ length: ds.n }, (_, i) => Array.from(ds.data.subarray(i * ds.d, i * ds.d + ds.d)));
  const epochs = autoEpochs(ds.n);
  if (peer === 'umap-js') {
    const x = rowsOf();
    const m = await timeInProcess(async () => {
      // Same n_neighbors, min_dist and epoch count as ours; umap-js's own seeded stream.
      const u = new UmapJs({ nNeighbors: NEIGHBORS, minDist: MIN_DIST, nEpochs: epochs, random: seededRandom(1) });
      const y = u.fit(x);
      return { map: y.flat(), knn: (u as unknown as { knnIndices: number[][] }).knnIndices };
    }, 1);
    const rows = sampleIndices(ds.n, RECALL_SAMPLE, seededRandom(RECALL_SEED));
    const lists = Array.from(rows, (i) => m.result.knn[i]);
    return `${JSON.stringify({ seconds: m.seconds, peakMiB: m.peakMiB, map: m.result.map, lists })}\n`;
  } else if (peer === 'umap-js-graph') {
    const x = rowsOf();
    const m = await timeInProcess(async () => {
      const u = new UmapJs({ nNeighbors: NEIGHBORS, minDist: MIN_DIST, nEpochs: epochs, random: seededRandom(1) });
      u.initializeFit(x);
      return (u as unknown as { knnIndices: number[][] }).knnIndices;
    }, 1);
    const rows = sampleIndices(ds.n, RECALL_SAMPLE, seededRandom(RECALL_SEED));
    return `${JSON.stringify({ seconds: m.seconds, peakMiB: m.peakMiB, map: [], lists: Array.from(rows, (i) => m.result[i]) })}\n`;
  } else if (peer === 'druid-umap') {
    const x = Array.from({ length: ds.n }, (_, i) => ds.data.subarray(i * ds.d, i * ds.d + ds.d));
    const m = await timeInProcess(async () => {
      const y = new DruidUMAP(x, { n_neighbors: NEIGHBORS, min_dist: MIN_DIST, d: 2, seed: 1 }).transform(epochs) as unknown as ArrayLike<number>[];
      const flat = new Array<number>(2 * ds.n);
      for (let i = 0; i < ds.n; i++) { flat[2 * i] = y[i][0]; flat[2 * i + 1] = y[i][1]; }
      return flat;
    }, 1);
    return `${JSON.stringify({ seconds: m.seconds, peakMiB: m.peakMiB, map: m.result })}\n`;
  }
  throw new Error(`unknown UMAP peer ${peer}`);
}

const argv = process.argv;
const at = argv.indexOf('--umap-peer');
if (at >= 0 && argv[1] && fileURLToPath(import.meta.url) === argv[1]) {
  const line = await peerChild(argv[at + 1], argv[at + 2], Number(argv[at + 3]));
  // Exit only once the (long) line has drained into the pipe; an early exit truncates it.
  process.stdout.write(line, () => process.exit(0));
}
