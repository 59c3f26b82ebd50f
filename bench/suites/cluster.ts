// Suite "cluster": k-means and hierarchical clustering, this project beside ml-kmeans 7.0.1,
// ml-hclust 4.0.0 and druid.js 0.9.0, on the same seeded blobs in one process. Prints a table and
// writes JSON lines to bench-results/cluster.jsonl ({suite, method, impl, n, d, seconds, peak_mib,
// inertia, ari}; impl "gleaner" for ours). Full: k-means at N = 2k, 10k, 50k, 100k; exact Ward to
// 20k; two-stage Ward at 50k and 100k. --quick: 2k and 10k.
// GLEANER_BENCH_ONLY=kmeans (or hierarchy) runs one half and keeps the other half's rows in the
// results file; GLEANER_KMEANS_SEED changes the k-means seeds only (the data stay the same).
// Our k-means runs with its default refinement (src/core/cluster/refine.ts), timed with the restarts.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { HierarchicalClustering as DruidHC, KMeans as DruidKMeans } from '@saehrimnir/druidjs';
import { agnes } from 'ml-hclust';
import { kmeans as mlKmeans } from 'ml-kmeans';
import { cutTree, hierarchical, twoStageHierarchy, windowLabels } from '../../src/core/cluster/hierarchy';
import { kmeans } from '../../src/core/cluster/kmeans';
import { adjustedRandIndex } from '../../src/core/metrics/ari';
import { clusterMeans } from '../../src/core/metrics/cluster-means';
import { seededRandom } from '../../src/core/random';
import { gaussianBlobs } from '../blobs';
import { measure } from '../measure';

const D = 50;
const K = 10;
const SEED = 20240611;
const SPREAD = 0.25;
const OUT = 'bench-results/cluster.jsonl';
/** k-means++ starts per implementation (best inertia kept; druid.js offers one start). */
const RESTARTS = 3;
const ONLY = process.env.GLEANER_BENCH_ONLY;
if (ONLY !== undefined && ONLY !== 'kmeans' && ONLY !== 'hierarchy') throw new Error(`GLEANER_BENCH_ONLY: expected kmeans or hierarchy, got ${ONLY}`);
const KM_SEED = Number(process.env.GLEANER_KMEANS_SEED ?? SEED);
if (!Number.isInteger(KM_SEED)) throw new Error(`GLEANER_KMEANS_SEED: expected an integer, got ${process.env.GLEANER_KMEANS_SEED}`);

interface Row {
  suite: 'cluster';
  method: string;
  impl: string;
  n: number;
  d: number;
  seconds: number;
  peak_mib: number;
  inertia: number;
  ari: number;
}

/** Within-cluster sum of squares of a labelling (same formula for every implementation). */
function wcss(data: Float64Array, n: number, d: number, labels: ArrayLike<number>): number {
  const { codes, means } = clusterMeans(data, n, d, labels);
  let s = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) s += (data[i * d + j] - means[codes[i] * d + j]) ** 2;
  return s;
}

function rowsOf(data: Float64Array, n: number, d: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(data.subarray(i * d, i * d + d)));
}

/** Labels from a list of index lists. */
function fromGroups(groups: number[][], n: number): Int32Array {
  const out = new Int32Array(n);
  groups.forEach((g, c) => g.forEach((i) => { out[i] = c; }));
  return out;
}

/** druid.js cuts only by distance: search the distance that leaves K clusters (outside timing). */
function druidCut(hc: InstanceType<typeof DruidHC>, n: number): Int32Array {
  let lo = 0;
  let hi = (hc as unknown as { root: { dist: number } }).root.dist;
  for (let t = 0; t < 60; t++) {
    const mid = (lo + hi) / 2;
    const c = hc.get_clusters(mid, 'distance').length;
    if (c > K) lo = mid; else hi = mid;
  }
  return fromGroups(hc.get_clusters(hi, 'distance'), n);
}

async function kmeansRows(n: number, out: Row[]): Promise<void> {
  const b = gaussianBlobs(n, D, K, SEED + n, SPREAD);
  const push = (impl: string, ms: number, peak: number, labels: ArrayLike<number>) =>
    out.push({ suite: 'cluster', method: 'kmeans', impl, n, d: D, seconds: ms / 1000, peak_mib: peak, inertia: wcss(b.data, n, D, labels), ari: adjustedRandIndex(labels, b.truth) });
  const ours = await measure(() => kmeans(b.data, n, D, { k: K, restarts: RESTARTS, maxIterations: 300, tol: 1e-4, random: seededRandom(KM_SEED) }));
  push('gleaner', ours.ms, ours.peakMiB, ours.result.labels);
  const points = rowsOf(b.data, n, D);
  const ml = await measure(() => {
    let best: { labels: number[]; inertia: number } | null = null;
    for (let r = 0; r < RESTARTS; r++) {
      const res = mlKmeans(points, K, { initialization: 'kmeans++', seed: KM_SEED + r, maxIterations: 300 });
      const inertia = wcss(b.data, n, D, res.clusters);
      if (!best || inertia < best.inertia) best = { labels: res.clusters, inertia };
    }
    return best as { labels: number[]; inertia: number };
  });
  push('ml-kmeans 7.0.1', ml.ms, ml.peakMiB, ml.result.labels);
  if (n <= 10_000) {
    const dr = await measure(() => new DruidKMeans(points, { K, seed: KM_SEED } as never), 1);
    push('druid.js 0.9.0', dr.ms, dr.peakMiB, dr.result.get_cluster_list() as number[]);
  }
}

async function hierarchyRows(n: number, out: Row[]): Promise<void> {
  const b = gaussianBlobs(n, D, K, SEED + n, SPREAD);
  const push = (method: string, impl: string, ms: number, peak: number, labels: ArrayLike<number>) =>
    out.push({ suite: 'cluster', method, impl, n, d: D, seconds: ms / 1000, peak_mib: peak, inertia: wcss(b.data, n, D, labels), ari: adjustedRandIndex(labels, b.truth) });
  const runs = n <= 2_000 ? 3 : 1;
  if (n <= 20_000) {
    const ours = await measure(() => hierarchical(b.data, n, D, { linkage: 'ward' }), runs);
    push('ward', 'gleaner', ours.ms, ours.peakMiB, cutTree(ours.result, { k: K }));
    if (n <= 10_000) {
      for (const linkage of ['average', 'single'] as const) {
        const r = await measure(() => hierarchical(b.data, n, D, { linkage }), runs);
        push(linkage, 'gleaner', r.ms, r.peakMiB, cutTree(r.result, { k: K }));
      }
    }
  } else {
    const two = await measure(() => twoStageHierarchy(b.data, n, D, { linkage: 'ward', seed: SEED }), 1);
    push('ward (two-stage, 1,000 micro-clusters)', 'gleaner', two.ms, two.peakMiB, windowLabels(cutTree(two.result.tree, { k: K }), two.result.assignment));
  }
  if (n <= 2_000) {
    // ml-hclust's 'ward' is not Ward's criterion; 'ward2' is (PEERS.md).
    const points = rowsOf(b.data, n, D);
    const ml = await measure(() => agnes(points, { method: 'ward2' }), 1);
    const groups = ml.result.group(K).children.map((c) => c.indices());
    push('ward', 'ml-hclust 4.0.0 (ward2)', ml.ms, ml.peakMiB, fromGroups(groups, n));
    const dr = await measure(() => new DruidHC(points, { linkage: 'ward' } as never), 1);
    push('ward', 'druid.js 0.9.0', dr.ms, dr.peakMiB, druidCut(dr.result, n));
  }
}

function print(rows: Row[]): void {
  const head = ['method', 'n', 'implementation', 'seconds', 'peak MiB', 'inertia', 'ARI', 'time vs gleaner'];
  const ours = new Map(rows.filter((r) => r.impl === 'gleaner').map((r) => [`${r.method.split(' ')[0]}|${r.n}`, r.seconds]));
  const body = rows.map((r) => {
    const base = ours.get(`${r.method.split(' ')[0]}|${r.n}`);
    return [r.method, String(r.n), r.impl, r.seconds.toFixed(3), r.peak_mib.toFixed(1), r.inertia.toFixed(0), r.ari.toFixed(4),
      r.impl === 'gleaner' || base === undefined ? '' : `${(r.seconds / base).toFixed(1)}×`];
  });
  const widths = head.map((h, j) => Math.max(h.length, ...body.map((c) => c[j].length)));
  const line = (cells: string[]) => `| ${cells.map((c, j) => c.padEnd(widths[j])).join(' | ')} |`;
  console.log(line(head));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const c of body) console.log(line(c));
}

export async function run(quick: boolean): Promise<void> {
  const kmSizes = quick ? [2_000, 10_000] : [2_000, 10_000, 50_000, 100_000];
  const hcSizes = quick ? [2_000, 10_000] : [2_000, 10_000, 20_000, 50_000, 100_000];
  console.log(`Gaussian blobs, d = ${D}, k = ${K}, spread ${SPREAD}, seed ${SEED}, k-means seed ${KM_SEED}; Node ${process.version}${quick ? ' (quick)' : ''}${ONLY ? ` (${ONLY} only)` : ''}`);
  const rows: Row[] = [];
  if (ONLY !== 'hierarchy') for (const n of kmSizes) await kmeansRows(n, rows);
  if (ONLY !== 'kmeans') for (const n of hcSizes) await hierarchyRows(n, rows);
  print(rows);
  console.log('seconds: median of 3 runs (1 run for hierarchies above 2k and for druid.js / ml-hclust), after one untimed warm-up.');
  console.log(`k-means: ${RESTARTS} k-means++ starts each, best inertia kept (druid.js: one start), iteration cap 300; inertia = within-cluster SS of the returned labels.`);
  console.log('gleaner k-means times include its refinement of the kept run (Lloyd to a fixed point, split–merge rounds, single-window transfers).');
  console.log('hierarchies are cut at k = 10; ARI against the planted blobs.');
  mkdirSync('bench-results', { recursive: true });
  // With one half run, keep the other half's rows from the previous results.
  const kept = ONLY && existsSync(OUT)
    ? readFileSync(OUT, 'utf8').split('\n').filter((l) => l.trim()).map((l) => JSON.parse(l) as Row)
      .filter((r) => (r.method === 'kmeans') !== (ONLY === 'kmeans'))
    : [];
  const all = ONLY === 'hierarchy' ? [...kept, ...rows] : [...rows, ...kept];
  writeFileSync(OUT, all.map((r) => JSON.stringify(r)).join('\n') + '\n');
  console.log(`wrote ${OUT}`);
}
