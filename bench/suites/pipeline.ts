// Suite "pipeline": our z-score + PCA and k-means against druid.js PCA and ml-kmeans on seeded
// blobs (n = 10k and 100k; --quick: 2k and 10k).
import { PCA as DruidPCA } from '@saehrimnir/druidjs';
import { kmeans as mlKmeans } from 'ml-kmeans';
import { kmeans } from '../../src/core/cluster/kmeans';
import { squaredDistance } from '../../src/core/cluster/distance';
import { pca } from '../../src/core/embed/pca';
import { adjustedRandIndex } from '../../src/core/metrics/ari';
import { seededRandom } from '../../src/core/random';
import { zscoreInPlace } from '../../src/core/recipe/zscore';
import { gaussianBlobs, type Blobs } from '../blobs';
import { measure } from '../measure';

const D = 40;
const K = 8;
const RESTARTS = 3;
const MAX_ITER = 300;
const SEED = 20240601;
/** Blob centre spread: small enough that blobs overlap and ARI says something. */
const SPREAD = 0.2;

interface Row {
  task: string;
  n: number;
  who: string;
  ms: number;
  peakMiB: number;
  check: string;
}

function rowsOf(b: Blobs): number[][] {
  const out: number[][] = [];
  for (let i = 0; i < b.n; i++) out.push(Array.from(b.data.subarray(i * b.d, i * b.d + b.d)));
  return out;
}

function inertiaOf(data: Float64Array, n: number, d: number, labels: ArrayLike<number>, centres: number[][]): number {
  const flat = Float64Array.from(centres.flat());
  let s = 0;
  for (let i = 0; i < n; i++) s += squaredDistance(data, i * d, flat, labels[i] * d, d);
  return s;
}

/** |Pearson correlation| between column c of two row-major n × 2 score matrices (sign-free agreement). */
function absCorr(a: ArrayLike<number>, b: ArrayLike<number>, n: number, c: number): number {
  let sa = 0, sb = 0, saa = 0, sbb = 0, sab = 0;
  for (let i = 0; i < n; i++) {
    const x = a[i * 2 + c], y = b[i * 2 + c];
    sa += x; sb += y; saa += x * x; sbb += y * y; sab += x * y;
  }
  const cov = sab / n - (sa / n) * (sb / n);
  return Math.abs(cov / Math.sqrt((saa / n - (sa / n) ** 2) * (sbb / n - (sb / n) ** 2)));
}

async function benchSize(n: number, rows: Row[]): Promise<void> {
  const blobs = gaussianBlobs(n, D, K, SEED + n, SPREAD);
  const scaled = Float64Array.from(blobs.data);
  zscoreInPlace(scaled, n, D);

  const ours = await measure(() => {
    const copy = Float64Array.from(blobs.data);
    zscoreInPlace(copy, n, D);
    return pca(copy, n, D, 2).scores;
  });
  const druidInput = Array.from({ length: n }, (_, i) => scaled.subarray(i * D, i * D + D));
  const druid = await measure(() => {
    const y = DruidPCA.transform(druidInput, { d: 2 }) as unknown as ArrayLike<number>[];
    const flat = new Float64Array(n * 2);
    for (let i = 0; i < n; i++) { flat[2 * i] = y[i][0]; flat[2 * i + 1] = y[i][1]; }
    return flat;
  });
  const v2 = (s: ArrayLike<number>) => { let a = 0; for (let i = 0; i < n; i++) a += s[2 * i + 1] ** 2; return a / n; };
  const agree = `PC2 variance ours/druid ${(v2(ours.result) / v2(druid.result)).toFixed(4)}; |r| PC1 ${absCorr(ours.result, druid.result, n, 0).toFixed(6)}, PC2 ${absCorr(ours.result, druid.result, n, 1).toFixed(6)}`;
  rows.push({ task: 'z-score+PCA (2-D)', n, who: 'ours', ms: ours.ms, peakMiB: ours.peakMiB, check: agree });
  rows.push({ task: 'PCA (2-D)', n, who: 'druid.js 0.9.0', ms: druid.ms, peakMiB: druid.peakMiB, check: 'same input, already z-scored' });

  const km = await measure(() =>
    kmeans(scaled, n, D, { k: K, restarts: RESTARTS, maxIterations: MAX_ITER, tol: 1e-4, random: seededRandom(SEED) }));
  rows.push({
    task: `k-means k=${K}, ${RESTARTS} inits`, n, who: 'ours', ms: km.ms, peakMiB: km.peakMiB,
    check: `ARI ${adjustedRandIndex(km.result.labels, blobs.truth).toFixed(4)}, inertia ${km.result.inertia.toFixed(0)}`,
  });
  const points = rowsOf({ ...blobs, data: scaled });
  const ml = await measure(() => {
    let best: { clusters: number[]; inertia: number } | null = null;
    for (let r = 0; r < RESTARTS; r++) {
      const res = mlKmeans(points, K, { initialization: 'kmeans++', seed: SEED + r, maxIterations: MAX_ITER });
      const inertia = inertiaOf(scaled, n, D, res.clusters, res.centroids);
      if (!best || inertia < best.inertia) best = { clusters: res.clusters, inertia };
    }
    return best!;
  });
  rows.push({
    task: `k-means k=${K}, ${RESTARTS} inits`, n, who: 'ml-kmeans 7.0.1', ms: ml.ms, peakMiB: ml.peakMiB,
    check: `ARI ${adjustedRandIndex(ml.result.clusters, blobs.truth).toFixed(4)}, inertia ${ml.result.inertia.toFixed(0)}`,
  });
}

function print(rows: Row[]): void {
  const head = ['task', 'n', 'implementation', 'median ms', 'peak MiB', 'ours/peer time', 'check'];
  const body = rows.map((r, i) => {
    const peer = i % 2 === 0 ? rows[i + 1] : null;
    return [r.task, String(r.n), r.who, r.ms.toFixed(0), r.peakMiB.toFixed(1), peer ? (r.ms / peer.ms).toFixed(2) : '', r.check];
  });
  const widths = head.map((h, j) => Math.max(h.length, ...body.map((b) => b[j].length)));
  const line = (cells: string[]) => `| ${cells.map((c, j) => c.padEnd(widths[j])).join(' | ')} |`;
  console.log(line(head));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const b of body) console.log(line(b));
}

export async function run(quick: boolean): Promise<void> {
  const sizes = quick ? [2_000, 10_000] : [10_000, 100_000];
  const rows: Row[] = [];
  console.log(`Gaussian blobs, d = ${D}, k = ${K}, seed ${SEED}; median of 3 runs; Node ${process.version}${quick ? ' (quick)' : ''}`);
  for (const n of sizes) await benchSize(n, rows);
  print(rows);
  console.log('peak MiB: largest rise of the process RSS during a run, sampled every 1 ms from a worker thread.');
  console.log('ml-kmeans gets number[][] input (converted outside the timing); restarts = separate seeded runs, best inertia kept.');
}
