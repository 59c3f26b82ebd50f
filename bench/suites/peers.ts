// Suite "peers": this project beside Debian's scikit-learn (KMeans, TSNE Barnes–Hut with PCA start and
// the same iterations, PCA), fastcluster (linkage_vector, Ward) and pynndescent (kNN graph), run by
// /usr/bin/python3 (bench/peers.py) on the same seeded blobs written to a temporary file. A peer that
// is not installed is skipped with a printed line (CI does not need them). Prints, per task, time,
// ratio (ours / peer), and quality beside it: inertia (k-means, Ward cut), trustworthiness (t-SNE,
// PCA; k = 10 on a seeded sample of 5,000), recall@k against exact search (kNN). Appends JSON lines
// to bench-results/peers.jsonl. Median of GLEANER_BENCH_RUNS timed runs (default 3) after a warm-up.
// Full: k-means 100k × 50 (k = 10, 3 restarts), PCA 100k, Ward 20k, kNN 20k (k = 15), t-SNE 5k;
// --quick: 20k, 20k, 5k, 5k, 2k.
import { spawnSync } from 'node:child_process';
import { appendFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { cutTree, hierarchical } from '../../src/core/cluster/hierarchy';
import { kmeans } from '../../src/core/cluster/kmeans';
import { pca } from '../../src/core/embed/pca';
import { runTsne } from '../../src/core/embed/tsne';
import { TSNE_DEFAULTS } from '../../src/core/embed/tsne/options';
import { quietContext } from '../../src/core/job';
import { clusterMeans } from '../../src/core/metrics/cluster-means';
import { sampledTrustworthiness } from '../../src/core/metrics/trustworthiness';
import { approximateKnn } from '../../src/core/neighbors/nndescent';
import { exactKnnOfRows, neighbourRecall } from '../../src/core/neighbors/recall';
import type { Knn } from '../../src/core/neighbors/knn.types';
import { seededRandom } from '../../src/core/random';
import { gaussianBlobs, type Blobs } from '../blobs';
import { measure } from '../measure';

const PYTHON = '/usr/bin/python3';
const SCRIPT = fileURLToPath(new URL('../peers.py', import.meta.url));
const OUT = 'bench-results/peers.jsonl';
const D = 50;
const K = 10;
const SEED = 20240611;
const SPREAD = 0.25;
const KNN_K = 15;
const RUNS = Number(process.env.GLEANER_BENCH_RUNS ?? 3);
/** A peer run longer than this is stopped and reported as skipped. */
const BUDGET_S = 600;

interface Row {
  suite: 'peers';
  task: string;
  impl: string;
  n: number;
  d: number;
  seconds: number | null;
  peak_mib: number | null;
  quality: string;
  quality_value: number | null;
  runs: number;
  note?: string;
}

interface PeerResult { seconds: number; peak_mib: number; version: string; out: Buffer }

let scratch: string | null = null;
function scratchDir(): string {
  scratch ??= mkdtempSync(join(tmpdir(), 'gleaner-peers-'));
  return scratch;
}

/** Runs one peer task; null (with a printed line) when the peer is missing or fails. */
function runPeer(task: string, b: Blobs, params: (string | number)[]): PeerResult | { skipped: string } {
  if (!existsSync(PYTHON)) return { skipped: `${PYTHON} not found` };
  const dir = scratchDir();
  const input = join(dir, `in-${b.n}.f64`);
  if (!existsSync(input)) writeFileSync(input, new Uint8Array(b.data.buffer, b.data.byteOffset, b.data.byteLength));
  const output = join(dir, `out-${task}-${b.n}.bin`);
  const r = spawnSync(PYTHON, [SCRIPT, task, input, String(b.n), String(b.d), output, String(RUNS), ...params.map(String)],
    { encoding: 'utf8', timeout: BUDGET_S * 1000, maxBuffer: 1 << 24 });
  const last = r.stdout?.trim().split('\n').pop() ?? '';
  if (r.status === 3) return { skipped: `${JSON.parse(last).missing} not installed` };
  if (r.status !== 0) return { skipped: r.error ? String(r.error) : `exit ${r.status}: ${r.stderr.trim().split('\n').pop()}` };
  const parsed = JSON.parse(last) as Omit<PeerResult, 'out'>;
  return { ...parsed, out: readFileSync(output) };
}

/** Within-cluster sum of squares of a labelling (same formula for every implementation). */
function wcss(b: Blobs, labels: ArrayLike<number>): number {
  const { codes, means } = clusterMeans(b.data, b.n, b.d, labels);
  let s = 0;
  for (let i = 0; i < b.n; i++) for (let j = 0; j < b.d; j++) s += (b.data[i * b.d + j] - means[codes[i] * b.d + j]) ** 2;
  return s;
}

function trust(b: Blobs, low: Float32Array | Float64Array): number {
  return sampledTrustworthiness(b.data, b.n, b.d, low, 2, 10, { metric: 'euclidean', sample: 5000, random: seededRandom(7) });
}

const int32 = (buf: Buffer) => new Int32Array(buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength));
const float64 = (buf: Buffer) => new Float64Array(buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength));

/** Recall@k of a neighbour list (n × k) against exact search on 1,000 evenly spaced rows. */
function recall(b: Blobs, indices: Int32Array, k: number): number {
  const rows = Array.from({ length: Math.min(1000, b.n) }, (_, s) => Math.floor((s * b.n) / Math.min(1000, b.n)));
  const exact = exactKnnOfRows(b.data, b.n, b.d, rows, k, 'euclidean');
  const approx: Knn = { n: b.n, k, indices, distances: new Float64Array(indices.length) };
  return neighbourRecall(approx, { k, rows, indices: exact.indices });
}

async function task(
  rows: Row[], name: string, b: Blobs, quality: string,
  ours: () => Promise<unknown>, oursQuality: (r: unknown) => number,
  peer: { task: string; params: (string | number)[]; quality: (out: Buffer) => number },
): Promise<void> {
  const m = await measure(ours, RUNS);
  rows.push({ suite: 'peers', task: name, impl: 'gleaner', n: b.n, d: b.d, seconds: m.ms / 1000, peak_mib: m.peakMiB, quality, quality_value: oursQuality(m.result), runs: RUNS });
  const p = runPeer(peer.task, b, peer.params);
  if ('skipped' in p) {
    console.log(`${name}: peer skipped (${p.skipped})`);
    rows.push({ suite: 'peers', task: name, impl: 'peer', n: b.n, d: b.d, seconds: null, peak_mib: null, quality, quality_value: null, runs: 0, note: `skipped: ${p.skipped}` });
    return;
  }
  rows.push({ suite: 'peers', task: name, impl: p.version, n: b.n, d: b.d, seconds: p.seconds, peak_mib: p.peak_mib, quality, quality_value: peer.quality(p.out), runs: RUNS });
}

function print(rows: Row[]): void {
  const head = ['task', 'n', 'implementation', 'seconds', 'peak MiB', 'quality', 'ours / peer'];
  const ours = new Map(rows.filter((r) => r.impl === 'gleaner').map((r) => [`${r.task}|${r.n}`, r.seconds]));
  const body = rows.map((r) => {
    const base = ours.get(`${r.task}|${r.n}`);
    const ratio = r.impl !== 'gleaner' && r.seconds && base ? `${(base / r.seconds).toFixed(2)}×` : '';
    return [r.task, String(r.n), r.impl, r.seconds === null ? 'skipped' : r.seconds.toFixed(3), r.peak_mib === null ? '' : r.peak_mib.toFixed(0),
      r.quality_value === null ? '' : `${r.quality} ${r.quality_value < 10 ? r.quality_value.toFixed(4) : r.quality_value.toFixed(0)}`, ratio];
  });
  const widths = head.map((h, j) => Math.max(h.length, ...body.map((c) => c[j].length)));
  const line = (cells: string[]) => `| ${cells.map((c, j) => c.padEnd(widths[j])).join(' | ')} |`;
  console.log(line(head));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const c of body) console.log(line(c));
}

export async function run(quick: boolean): Promise<void> {
  const size = (full: number, q: number) => (quick ? q : full);
  console.log(`peers: Gaussian blobs d = ${D}, ${K} centres, spread ${SPREAD}; median of ${RUNS} runs; Node ${process.version}; ` +
    `${cpus().length} cores, load ${loadavg().map((l) => l.toFixed(2)).join(' ')}${quick ? ' (quick)' : ''}`);
  const rows: Row[] = [];
  const blobs = (n: number) => gaussianBlobs(n, D, K, SEED + n, SPREAD);
  try {
    {
      const b = blobs(size(100_000, 20_000));
      await task(rows, 'kmeans k=10 ×3', b, 'inertia',
        () => kmeans(b.data, b.n, D, { k: K, restarts: 3, maxIterations: 300, tol: 1e-4, random: seededRandom(SEED) }),
        (r) => wcss(b, (r as { labels: Int32Array }).labels),
        { task: 'kmeans', params: [K, 3, 0], quality: (out) => wcss(b, int32(out)) });
      const pb = b;
      await task(rows, 'PCA 2', pb, 'trust', async () => pca(pb.data, pb.n, D, 2).scores, (r) => trust(pb, r as Float64Array),
        { task: 'pca', params: [2], quality: (out) => trust(pb, float64(out)) });
    }
    {
      const b = blobs(size(20_000, 5_000));
      await task(rows, 'Ward', b, 'inertia', () => hierarchical(b.data, b.n, D, { linkage: 'ward' }),
        (r) => wcss(b, cutTree(r as Awaited<ReturnType<typeof hierarchical>>, { k: K })),
        { task: 'ward', params: [K], quality: (out) => wcss(b, int32(out)) });
      await task(rows, `kNN k=${KNN_K}`, b, 'recall',
        () => approximateKnn(b.data, b.n, D, KNN_K, { metric: 'euclidean', random: seededRandom(1) }),
        (r) => recall(b, (r as Knn).indices, KNN_K),
        { task: 'knn', params: [KNN_K], quality: (out) => recall(b, int32(out), KNN_K) });
    }
    {
      const b = blobs(size(5_000, 2_000));
      await task(rows, 't-SNE', b, 'trust', () => runTsne(b.data, b.n, D, { seed: 1 }, quietContext), (r) => trust(b, r as Float32Array),
        { task: 'tsne', params: [TSNE_DEFAULTS.iterations, TSNE_DEFAULTS.perplexity], quality: (out) => trust(b, float64(out)) });
    }
  } finally {
    if (scratch) rmSync(scratch, { recursive: true, force: true });
  }
  print(rows);
  mkdirSync('bench-results', { recursive: true });
  const commit = spawnSync('git', ['rev-parse', '--short', 'HEAD'], { encoding: 'utf8' }).stdout?.trim() || null;
  const stamp = { commit, quick, load: loadavg()[0], cores: cpus().length };
  appendFileSync(OUT, rows.map((r) => JSON.stringify({ ...r, ...stamp })).join('\n') + '\n');
  console.log(`appended ${rows.length} rows to ${OUT}`);
}
