// Suite "stability": stability across subjects on the demo study (demo-data/windows.csv, 4,851
// windows, 12 subjects): the run of docs/subject-bound.md (z-score + PCA + k-means, k = 7, seed 1),
// then B = 20 resamples (--quick: 5) at the default share (a quarter of the subjects left out) and at
// half. Time is the median of 3 runs after a warm-up; the suite's own figures are the mean Jaccard
// of the loose-watch cluster (>= 90% of its windows from the loose-watch volunteers, truth.csv) and
// the lowest of the activity clusters (>= 90% one activity, < 10% loose-watch windows). Rows in
// bench-results/stability.jsonl.
import { appendFileSync, mkdirSync, readFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { DEFAULT_ANALYSIS_PARAMS } from '../../src/core/analysis.types';
import { analyze } from '../../src/core/analyze';
import { quietContext } from '../../src/core/job';
import { tableStability } from '../../src/core/stability/stability';
import { parseCsv } from '../../src/core/table/csv';
import { featureMatrix } from '../../src/core/table/matrix';
import { inferRoles } from '../../src/core/table/roles';
import { measure } from '../measure';

const OUT = 'bench-results/stability.jsonl';
const PARAMS = { ...DEFAULT_ANALYSIS_PARAMS, k: 7, seed: 1 };

export async function run(quick: boolean): Promise<void> {
  const B = quick ? 5 : 20;
  const table = parseCsv(readFileSync('demo-data/windows.csv'), 'windows.csv');
  const roles = inferRoles(table);
  const truth = readFileSync('demo-data/truth.csv', 'utf8').trimEnd().split('\n').slice(1).map((l) => l.split(','));
  const matrix = featureMatrix(table, roles);
  const runOnce = await measure(() => analyze(featureMatrix(table, roles), PARAMS, quietContext), 3);
  const labels = runOnce.result.labels;
  const loose: number[] = [], activity: number[] = [];
  for (let c = 0; c < PARAMS.k; c++) {
    const members = truth.filter((_, i) => labels[i] === c);
    const looseShare = members.filter((r) => r[2] === '1').length / members.length;
    const counts = new Map<string, number>();
    for (const r of members) counts.set(r[1], (counts.get(r[1]) ?? 0) + 1);
    if (looseShare >= 0.9) loose.push(c);
    else if (looseShare < 0.1 && Math.max(...counts.values()) / members.length >= 0.9) activity.push(c);
  }
  mkdirSync('bench-results', { recursive: true });
  const at = new Date().toISOString();
  const load = loadavg().map((l) => Number(l.toFixed(2)));
  console.log(`stability across subjects, demo study (${matrix.n} windows, ${matrix.d} features), k-means k = 7, B = ${B}; load ${load.join(' ')}`);
  console.log(`one run (analyze): ${(runOnce.ms / 1000).toFixed(2)} s`);
  console.log('| leave out | seconds | per resample ms | peak MiB | loose-watch Jaccard | lowest activity Jaccard |');
  console.log('|---|---|---|---|---|---|');
  for (const share of [0.25, 0.5]) {
    const m = await measure(() => tableStability(table, roles, PARAMS, runOnce.result, { resamples: B, leaveOutShare: share }, quietContext), 3);
    const j = (c: number) => m.result.clusters[c].meanJaccard!;
    const row = {
      suite: 'stability', at, quick, impl: 'gleaner', n: matrix.n, d: matrix.d, k: PARAMS.k, resamples: B, leave_out_share: share,
      seconds: m.ms / 1000, per_resample_ms: m.ms / B, peak_mib: m.peakMiB, analyze_seconds: runOnce.ms / 1000,
      loose_jaccard: loose.length === 1 ? j(loose[0]) : null, min_activity_jaccard: activity.length ? Math.min(...activity.map(j)) : null, load,
    };
    console.log(`| ${share} | ${row.seconds.toFixed(2)} | ${row.per_resample_ms.toFixed(0)} | ${row.peak_mib.toFixed(0)} | ${row.loose_jaccard?.toFixed(3) ?? '–'} | ${row.min_activity_jaccard?.toFixed(3) ?? '–'} |`);
    appendFileSync(OUT, `${JSON.stringify(row)}\n`);
  }
}
