// Suite "hdbscan": our HDBSCAN beside R's dbscan::hdbscan (Debian r-cran-dbscan, when Rscript and
// the package are installed) on the same seeded blobs (d = 10, k = 8, minPts 25) in one run.
// Full: 20k (R too, 3 runs each) and 100k (ours only, 1 run: R's dist() of 100k windows needs
// 40 GB). --quick: 5k. Rows in bench-results/hdbscan.jsonl ({suite, impl, n, d, seconds,
// peak_mib, clusters, noise, ari_truth, ari_vs_r, same_noise}). Where the two differ, see the note on
// stability in src/core/cluster/hdbscan.ts.
import { execFileSync } from 'node:child_process';
import { appendFileSync, mkdirSync, readFileSync, rmSync, writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir, loadavg } from 'node:os';
import { join } from 'node:path';
import { hdbscan } from '../../src/core/cluster/hdbscan';
import { adjustedRandIndex } from '../../src/core/metrics/ari';
import { gaussianBlobs } from '../blobs';
import { measure } from '../measure';

const D = 10, K = 8, SEED = 20261204, MIN_PTS = 25;
const OUT = 'bench-results/hdbscan.jsonl';

/** R's hdbscan on a CSV of the data: labels (0 = noise) and its own timing of hdbscan() alone, median of `runs`. */
function rHdbscan(data: Float64Array, n: number, d: number, runs: number): { labels: Int32Array; seconds: number } | string {
  const dir = mkdtempSync(join(tmpdir(), 'gleaner-hdbscan-bench-'));
  try {
    const csv = join(dir, 'x.csv');
    const lines: string[] = [];
    for (let i = 0; i < n; i++) lines.push(Array.from(data.subarray(i * d, (i + 1) * d)).join(','));
    writeFileSync(csv, `${lines.join('\n')}\n`);
    const script = `suppressMessages(library(dbscan)); x <- as.matrix(read.csv("${csv}", header = FALSE));
t <- c(); for (r in 1:${runs}) { t0 <- proc.time()[["elapsed"]]; res <- hdbscan(x, minPts = ${MIN_PTS}); t <- c(t, proc.time()[["elapsed"]] - t0) }
writeLines(as.character(res$cluster), "${join(dir, 'labels.txt')}"); cat(median(t))`;
    const seconds = Number(execFileSync('Rscript', ['-e', script], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] }).trim());
    const labels = Int32Array.from(readFileSync(join(dir, 'labels.txt'), 'utf8').trim().split('\n').map(Number));
    return { labels, seconds };
  } catch (err) {
    return `R dbscan not run: ${(err as Error).message.split('\n')[0]}`;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

async function once<T>(fn: () => Promise<T>): Promise<{ ms: number; peakMiB: number; result: T }> {
  const t0 = performance.now();
  const result = await fn();
  return { ms: performance.now() - t0, peakMiB: Number.NaN, result };
}

export async function run(quick: boolean): Promise<void> {
  const sizes = quick ? [5000] : [20_000, 100_000];
  mkdirSync('bench-results', { recursive: true });
  const at = new Date().toISOString();
  console.log(`HDBSCAN, blobs d = ${D}, k = ${K}, minPts ${MIN_PTS}; load ${loadavg().map((l) => l.toFixed(2)).join(' ')}`);
  console.log('| n | impl | seconds | peak MiB | clusters | noise | ARI vs truth | ARI vs R | same noise |');
  console.log('|---|---|---|---|---|---|---|---|---|');
  for (const n of sizes) {
    const { data, truth } = gaussianBlobs(n, D, K, SEED, 1.5);
    const runs = n > 50_000 ? 1 : 3;
    // Above 50k one timed run without the warm-up (each takes minutes); peak memory then unmeasured.
    const m = n > 50_000 ? await once(() => hdbscan(data, n, D, { minClusterSize: MIN_PTS })) : await measure(() => hdbscan(data, n, D, { minClusterSize: MIN_PTS }), runs);
    const ours = m.result.labels;
    const noise = ours.reduce((a, l) => a + (l < 0 ? 1 : 0), 0);
    const r = n <= 50_000 ? rHdbscan(data, n, D, runs) : 'R dbscan not run: its distance matrix of 100k windows needs 40 GB';
    const rLabels = typeof r === 'string' ? null : r.labels;
    const ariR = rLabels ? adjustedRandIndex(ours, rLabels) : null;
    const sameNoise = rLabels ? ours.every((l, i) => (l < 0) === (rLabels[i] === 0)) : null;
    const rows = [{ suite: 'hdbscan', at, quick, impl: 'gleaner', n, d: D, seconds: m.ms / 1000, peak_mib: m.peakMiB, clusters: m.result.clusters, noise, ari_truth: adjustedRandIndex(ours, truth), ari_vs_r: ariR, same_noise: sameNoise, runs }];
    if (rLabels && typeof r !== 'string') {
      const rNoise = rLabels.reduce((a, l) => a + (l === 0 ? 1 : 0), 0);
      rows.push({ suite: 'hdbscan', at, quick, impl: 'R dbscan 1.1.11', n, d: D, seconds: r.seconds, peak_mib: Number.NaN, clusters: new Set(rLabels.filter((l) => l > 0)).size, noise: rNoise, ari_truth: adjustedRandIndex(rLabels, truth), ari_vs_r: 1, same_noise: true, runs });
    }
    for (const row of rows) {
      console.log(`| ${row.n} | ${row.impl} | ${row.seconds.toFixed(2)} | ${Number.isNaN(row.peak_mib) ? '–' : row.peak_mib.toFixed(0)} | ${row.clusters} | ${row.noise} | ${row.ari_truth.toFixed(4)} | ${row.ari_vs_r?.toFixed(4) ?? '–'} | ${row.same_noise ?? '–'} |`);
      appendFileSync(OUT, `${JSON.stringify({ ...row, peak_mib: Number.isNaN(row.peak_mib) ? null : row.peak_mib })}\n`);
    }
    if (typeof r === 'string') console.log(r);
    else console.log(`ratio ours / R at ${n}: ${(m.ms / 1000 / r.seconds).toFixed(2)}× (R's time is of hdbscan() alone, in its own process)`);
  }
}
