// Suite "embed": our PCA, t-SNE and UMAP beside druid.js (PCA, TSNE exact, UMAP), tsne-js (exact)
// and umap-js on seeded Gaussian blobs (d = 50, 10 centres) at n = 2k, 10k, 20k, 50k, 100k
// (--quick: 2k, 10k) and on the demo windows (z-scored features). Prints time, peak memory and trustworthiness (k = 10, seeded sample of up to
// 5,000 windows) and appends JSON lines to bench-results/embed.jsonl.
//
// Peers run in a child process (`node --import tsx bench/suites/embed.ts --peer <name> ...`) so that
// one can be killed at the time budget or when it runs out of memory; a peer whose estimated time is
// past the budget is skipped and reported as skipped.
import { runChild } from '../child';
import { fileURLToPath } from 'node:url';
import { PCA as DruidPCA, TSNE as DruidTSNE } from '@saehrimnir/druidjs';
import TsneJs from 'tsne-js';
import { pca } from '../../src/core/embed/pca';
import { runTsne } from '../../src/core/embed/tsne';
import { TSNE_DEFAULTS } from '../../src/core/embed/tsne/options';
import { quietContext } from '../../src/core/job';
import { benchUmap } from '../embed-umap';
import { blobsDataset, CENTRES, D, demoDataset, K, quality, recordRow, RESULTS, rows, SAMPLE, SEED, timeInProcess, type Dataset } from '../embed-common';

/** A peer is skipped when its estimated (or actual) time passes this. */
const BUDGET_S = 300;
/** At or below this n every implementation of ours runs 3 times (median); above it once. */
const SMALL_N = 2000;
/** Gradient steps for every t-SNE here: ours by default (250 exaggerated + 500), and the peers alike. */
const ITERATIONS = TSNE_DEFAULTS.iterations;

/**
 * Runs a peer in a child process with a time budget. The child prints one JSON line
 * {seconds, peakMiB, map}; a child killed at the budget or dying (for example out of memory) gives
 * a skipped row with the reason.
 */
export function runPeerChild(peer: string, dataset: string, n: number): Promise<{ seconds: number; peakMiB: number; map: number[] } | { skipped: string }> {
  return runChild(fileURLToPath(import.meta.url), ['--peer', peer, dataset, String(n)], BUDGET_S);
}

function load(dataset: string, n: number): Dataset {
  return dataset === 'demo' ? demoDataset(n) : blobsDataset(n);
}

/** Our t-SNE on a dataset: one row. */
async function benchOurTsne(ds: Dataset, key: string): Promise<void> {
  const runs = ds.n <= SMALL_N ? 3 : 1;
  const m = await timeInProcess(() => runTsne(ds.data, ds.n, ds.d, { seed: 1 }, quietContext), runs);
  recordRow({ suite: 'embed', method: 't-SNE', impl: 'gleaner', dataset: key, n: ds.n, d: ds.d, seconds: m.seconds, peak_mib: m.peakMiB, trustworthiness: quality(ds, m.result), runs });
}

/**
 * The exact (O(n²) per iteration) t-SNE peers, each in a child process, skipped when the time
 * estimated from a measured run, growing as n² and with the iteration count, passes the budget:
 * - druid.js 0.9.0 TSNE: 41 s at n = 2,000 for 1,000 iterations (an earlier measurement, not this run);
 * - tsne-js 1.0.3 (ndarray-based): 251 s at n = 500, d = 50, 1,000 iterations, measured here
 *   (load average about 4, 2026-12-02).
 */
const EXACT_PEERS = {
  'druid-tsne': { impl: 'druid.js 0.9.0', seconds: 41, atN: 2000 },
  'tsne-js': { impl: 'tsne-js 1.0.3', seconds: 251, atN: 500 },
} as const;

async function benchExactTsne(peer: keyof typeof EXACT_PEERS, ds: Dataset, key: string): Promise<void> {
  const { impl, seconds, atN } = EXACT_PEERS[peer];
  const estimate = seconds * (ds.n / atN) ** 2 * (ITERATIONS / 1000);
  const base = { suite: 'embed' as const, method: 't-SNE', impl, dataset: key, n: ds.n, d: ds.d, runs: 1 };
  // GLEANER_BENCH_FORCE=druid-tsne,tsne-js runs those peers whatever the estimate (still killed at the budget).
  const forced = (process.env.GLEANER_BENCH_FORCE ?? '').split(',').includes(peer);
  if (estimate > BUDGET_S && !forced) {
    recordRow({ ...base, seconds: null, peak_mib: null, trustworthiness: null, note: `skipped: estimated ${estimate.toFixed(0)} s > ${BUDGET_S} s budget (O(n²) from ${seconds} s at n = ${atN})` });
    return;
  }
  const r = await runPeerChild(peer, key === 'blobs' ? 'blobs' : 'demo', ds.n);
  if ('skipped' in r) {
    recordRow({ ...base, seconds: null, peak_mib: null, trustworthiness: null, note: `skipped: ${r.skipped}` });
    return;
  }
  recordRow({ ...base, seconds: r.seconds, peak_mib: r.peakMiB, trustworthiness: quality(ds, Float64Array.from(r.map)) });
}

/** Our PCA (2-D) and druid.js PCA on the same input, in this process: two rows. */
async function benchPca(ds: Dataset, key: string): Promise<void> {
  const runs = 3;
  const ours = await timeInProcess(async () => pca(ds.data, ds.n, ds.d, 2).scores, runs);
  recordRow({ suite: 'embed', method: 'PCA', impl: 'gleaner', dataset: key, n: ds.n, d: ds.d, seconds: ours.seconds, peak_mib: ours.peakMiB, trustworthiness: quality(ds, ours.result), runs });
  const input = Array.from({ length: ds.n }, (_, i) => ds.data.subarray(i * ds.d, i * ds.d + ds.d));
  const druid = await timeInProcess(async () => {
    const y = DruidPCA.transform(input, { d: 2 }) as unknown as ArrayLike<number>[];
    const flat = new Float64Array(2 * ds.n);
    for (let i = 0; i < ds.n; i++) { flat[2 * i] = y[i][0]; flat[2 * i + 1] = y[i][1]; }
    return flat;
  }, runs);
  recordRow({ suite: 'embed', method: 'PCA', impl: 'druid.js 0.9.0', dataset: key, n: ds.n, d: ds.d, seconds: druid.seconds, peak_mib: druid.peakMiB, trustworthiness: quality(ds, druid.result), runs });
}

/** A peer's t-SNE of the dataset's rows, flattened (n × 2). */
function peerTsne(peer: string, ds: Dataset): number[] {
  const input = Array.from({ length: ds.n }, (_, i) => ds.data.subarray(i * ds.d, i * ds.d + ds.d));
  let y: ArrayLike<number>[];
  if (peer === 'druid-tsne') {
    // Same perplexity and iterations as ours; druid's own learning rate (epsilon 10) and seed.
    y = new DruidTSNE(input, { perplexity: 30, d: 2, seed: 1 }).transform(ITERATIONS) as unknown as ArrayLike<number>[];
  } else if (peer === 'tsne-js') {
    // Same perplexity and iterations as ours; tsne-js's documented defaults otherwise.
    const model = new TsneJs({ dim: 2, perplexity: 30, earlyExaggeration: 4, learningRate: 100, nIter: ITERATIONS, metric: 'euclidean' });
    model.init({ data: input.map((r) => Array.from(r)), type: 'dense' });
    model.run();
    y = model.getOutput() as ArrayLike<number>[];
  } else throw new Error(`unknown peer ${peer}`);
  const flat = new Array<number>(2 * ds.n);
  for (let i = 0; i < ds.n; i++) { flat[2 * i] = y[i][0]; flat[2 * i + 1] = y[i][1]; }
  return flat;
}

/** Child-process side of a peer run: prints {seconds, peakMiB, map}. */
async function peerChild(peer: string, dataset: string, n: number): Promise<void> {
  const ds = load(dataset, n);
  const m = await timeInProcess(async () => peerTsne(peer, ds), 1);
  // Exit only once the (possibly large) line is flushed: an early exit truncates piped stdout.
  await new Promise<void>((resolve) => process.stdout.write(`${JSON.stringify({ seconds: m.seconds, peakMiB: m.peakMiB, map: m.result })}\n`, () => resolve()));
}

function print(): void {
  const head = ['method', 'dataset', 'n', 'implementation', 'runs', 'seconds', 'peak MiB', 'trust.(k=10)', 'speed-up vs fastest peer', 'note'];
  const body = rows.map((r) => {
    const peers = rows.filter((p) => p.impl !== 'gleaner' && p.method === r.method && p.dataset === r.dataset && p.n === r.n && p.seconds !== null);
    const ok = peers.filter((p) => r.trustworthiness !== null && p.trustworthiness !== null && r.trustworthiness >= p.trustworthiness - 0.01);
    const fastest = ok.sort((a, b) => a.seconds! - b.seconds!)[0];
    const ratio = r.impl === 'gleaner' && fastest && r.seconds ? `${(fastest.seconds! / r.seconds).toFixed(1)}× (${fastest.impl})` : '';
    return [r.method, r.dataset, String(r.n), r.impl, String(r.runs), r.seconds?.toFixed(2) ?? '-', r.peak_mib?.toFixed(0) ?? '-', r.trustworthiness?.toFixed(4) ?? '-', ratio, r.note ?? ''];
  });
  const widths = head.map((h, j) => Math.max(h.length, ...body.map((b) => b[j].length)));
  const line = (cells: string[]) => `| ${cells.map((c, j) => c.padEnd(widths[j])).join(' | ')} |`;
  console.log(line(head));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const b of body) console.log(line(b));
}

export async function run(quick: boolean): Promise<void> {
  // --sizes=20000,100000 runs only those blob sizes; --tsne-only leaves out UMAP, PCA and the demo
  // windows; --pca-only and --umap-only run those rows alone (GLEANER_BENCH_UMAPJS=graph: umap-js's
  // neighbour graph only).
  const sizesFlag = process.argv.find((a) => a.startsWith('--sizes='));
  const tsneOnly = process.argv.includes('--tsne-only');
  const pcaOnly = process.argv.includes('--pca-only');
  const umapOnly = process.argv.includes('--umap-only');
  const sizes = sizesFlag ? sizesFlag.slice('--sizes='.length).split(',').map(Number)
    : quick ? [2_000, 10_000] : [2_000, 10_000, 20_000, 50_000, 100_000];
  console.log(`t-SNE: Gaussian blobs d = ${D}, ${CENTRES} centres, seed ${SEED}; demo windows z-scored; Node ${process.version}${quick ? ' (quick)' : ''}`);
  console.log(`ours: median of 3 runs at n <= ${SMALL_N}, 1 run above; peers: 1 run in a child process, ${BUDGET_S} s budget`);
  if (umapOnly) {
    for (const n of sizes) await benchUmap(blobsDataset(n), 'blobs');
    print();
    return;
  }
  if (pcaOnly) {
    await benchPca(demoDataset(quick ? 2_000 : Infinity), 'demo windows');
    for (const n of sizes) await benchPca(blobsDataset(n), 'blobs');
    print();
    return;
  }
  if (!tsneOnly) {
    const demo = demoDataset(quick ? 2_000 : Infinity); // --quick: the first 2,000 demo windows
    await benchPca(demo, 'demo windows');
    await benchOurTsne(demo, 'demo windows');
    await benchExactTsne('druid-tsne', demo, 'demo windows');
    await benchExactTsne('tsne-js', demo, 'demo windows');
    await benchUmap(demo, 'demo windows');
  }
  for (const n of sizes) {
    const ds = blobsDataset(n);
    if (!tsneOnly) await benchPca(ds, 'blobs');
    await benchOurTsne(ds, 'blobs');
    await benchExactTsne('druid-tsne', ds, 'blobs');
    await benchExactTsne('tsne-js', ds, 'blobs');
    if (!tsneOnly) await benchUmap(ds, 'blobs'); // UMAP rows: ours, umap-js, druid.js (bench/embed-umap.ts)
  }
  print();
  console.log(`trustworthiness: k = ${K} on a seeded sample of up to ${SAMPLE} windows, the same sample for every implementation.`);
  console.log('peak MiB: largest rise of the RSS during a run (the child process for peers). Timings on a shared machine are indicative only.');
  console.log(`rows appended to ${RESULTS}`);
}

const argv = process.argv;
const peerAt = argv.indexOf('--peer');
if (peerAt >= 0 && argv[1] && fileURLToPath(import.meta.url) === argv[1]) {
  await peerChild(argv[peerAt + 1], argv[peerAt + 2], Number(argv[peerAt + 3]));
  process.exit(0);
}
