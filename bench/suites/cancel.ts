// Suite "cancel": how soon a running t-SNE or UMAP can stop. A job stops at its next
// ctx.checkpoint(), so the longest stretch of work between two checkpoints bounds the time from
// Cancel to the end of the job. Runs each method once on seeded blobs (d = 50, 10 centres) at
// n = 100,000 (--quick: 20,000) with a context that records the gaps, and prints the longest gap,
// the 99th percentile, the number of gaps over 200 ms and where the longest one ended.
// Appends JSON lines to bench-results/cancel.jsonl.
import { appendFileSync, mkdirSync } from 'node:fs';
import type { JobContext } from '../../src/core/job';
import { runTsne } from '../../src/core/embed/tsne';
import { runUmap } from '../../src/core/embed/umap';
import { gaussianBlobs } from '../blobs';

const D = 50;
const SEED = 20240601;
const RESULTS = 'bench-results/cancel.jsonl';

interface GapRow { suite: 'cancel'; method: string; n: number; d: number; seconds: number; checkpoints: number; longest_ms: number; p99_ms: number; over_200ms: number; longest_after: string }

function recorder(): { ctx: JobContext; summary(): Omit<GapRow, 'suite' | 'method' | 'n' | 'd' | 'seconds'> } {
  const gaps: number[] = [];
  let last = performance.now();
  let stage = 'start';
  let longest = 0;
  let longestAfter = '';
  const ctx: JobContext = {
    progress: (s, f) => { stage = `${s} ${(100 * f).toFixed(1)}%`; },
    checkpoint: async () => {
      const gap = performance.now() - last;
      gaps.push(gap);
      if (gap > longest) { longest = gap; longestAfter = stage; }
      await new Promise((r) => setImmediate(r)); // as the worker yields to its message queue
      last = performance.now();
    },
  };
  return {
    ctx,
    summary() {
      const sorted = [...gaps].sort((a, b) => a - b);
      return {
        checkpoints: gaps.length, longest_ms: longest, p99_ms: sorted[Math.floor(0.99 * (sorted.length - 1))],
        over_200ms: gaps.filter((g) => g > 200).length, longest_after: longestAfter,
      };
    },
  };
}

export async function run(quick: boolean): Promise<void> {
  const n = quick ? 20_000 : 100_000;
  const blobs = gaussianBlobs(n, D, 10, SEED + n);
  console.log(`cancel: longest work between checkpoints, blobs n = ${n}, d = ${D} (one run each; a shared machine inflates the figures)`);
  const rows: GapRow[] = [];
  for (const method of ['t-SNE', 'UMAP']) {
    const r = recorder();
    const t0 = performance.now();
    if (method === 't-SNE') await runTsne(blobs.data, n, D, { seed: 1 }, r.ctx);
    else await runUmap(blobs.data, n, D, { seed: 1 }, r.ctx);
    const row: GapRow = { suite: 'cancel', method, n, d: D, seconds: (performance.now() - t0) / 1000, ...r.summary() };
    rows.push(row);
    mkdirSync('bench-results', { recursive: true });
    appendFileSync(RESULTS, `${JSON.stringify(row)}\n`);
  }
  console.log('\nmethod  n        seconds  checkpoints  longest ms  p99 ms  gaps > 200 ms  longest gap ended after');
  for (const r of rows) {
    console.log(`${r.method.padEnd(7)} ${String(r.n).padEnd(8)} ${r.seconds.toFixed(1).padStart(7)} ${String(r.checkpoints).padStart(12)} ${r.longest_ms.toFixed(0).padStart(11)} ${r.p99_ms.toFixed(0).padStart(7)} ${String(r.over_200ms).padStart(14)}  ${r.longest_after}`);
  }
}
