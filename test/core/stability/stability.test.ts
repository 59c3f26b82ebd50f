import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams, type AnalysisResult, type FeatureMatrix } from '../../../src/core/analysis.types';
import { analyze } from '../../../src/core/analyze';
import { CancelledError, OptionError } from '../../../src/core/errors';
import { quietContext, type JobContext } from '../../../src/core/job';
import { normal, seededRandom } from '../../../src/core/random';
import { drawLeftOut, subjectsToLeaveOut } from '../../../src/core/stability/leave-out';
import { clusterStability, type StabilityInput } from '../../../src/core/stability/stability';

const SUBJECTS = ['P1', 'P2', 'P3', 'P4', 'P5', 'P6', 'P7', 'P8'];

/**
 * Seeded windows of 8 subjects in 3 features: three groups every subject visits (centres 10 apart
 * on the axes) and a fourth group only subject P8 visits (a subject-bound group).
 */
function study(seed: number, missingEvery = 0): FeatureMatrix {
  const random = seededRandom(seed);
  const centres = [[0, 0, 0], [10, 0, 0], [0, 10, 0], [0, 0, 10]];
  const rows: number[][] = [];
  const codes: number[] = [];
  for (let s = 0; s < SUBJECTS.length; s++) {
    for (let g = 0; g < 4; g++) {
      if (g === 3 && s !== 7) continue;
      for (let w = 0; w < (g === 3 ? 40 : 15); w++) {
        rows.push(centres[g].map((c) => c + normal(random)));
        codes.push(s);
      }
    }
  }
  const data = Float64Array.from(rows.flat());
  if (missingEvery > 0) for (let i = 0; i < rows.length; i += missingEvery) data[i * 3 + 1] = Number.NaN;
  return { data, n: rows.length, d: 3, featureNames: ['a', 'b', 'c'], subjectCodes: Int32Array.from(codes) };
}

const params = (p: Partial<AnalysisParams> = {}): AnalysisParams => ({ ...DEFAULT_ANALYSIS_PARAMS, k: 4, seed: 3, ...p });

async function setup(p: AnalysisParams, matrix = study(1)): Promise<{ input: StabilityInput; run: AnalysisResult }> {
  const run = await analyze(matrix, p, quietContext);
  return { input: { matrix, subjectNames: SUBJECTS, params: p, run }, run };
}

describe('leaving subjects out', () => {
  it('leaves out the rounded share, keeping at least one subject', () => {
    expect(subjectsToLeaveOut(12, 0.25)).toBe(3);
    expect(subjectsToLeaveOut(8, 0.25)).toBe(2);
    expect(subjectsToLeaveOut(2, 0.9)).toBe(1);
    expect(subjectsToLeaveOut(5, 0)).toBe(0);
  });

  it('draws distinct subjects, ascending, the same for a seed', () => {
    const a = drawLeftOut(12, 3, seededRandom(5));
    expect(a).toHaveLength(3);
    expect(new Set(a).size).toBe(3);
    expect([...a].sort((x, y) => x - y)).toEqual(a);
    for (const s of a) expect(s >= 0 && s < 12).toBe(true);
    expect(drawLeftOut(12, 3, seededRandom(5))).toEqual(a);
  });
});

describe('clusterStability', () => {
  it('finds every cluster again when no subject is left out (the resample is the run)', async () => {
    for (const p of [params(), params({ cluster: { method: 'ward', k: 4 } })]) {
      const { input } = await setup(p);
      const r = await clusterStability(input, { resamples: 2, leaveOutShare: 0 }, quietContext);
      expect(r.subjectsLeftOut).toBe(0);
      expect(Array.from(r.jaccard)).toEqual(new Array(8).fill(1));
      for (const c of r.clusters) expect(c.dissolvedShare).toBe(0);
    }
  });

  it('dissolves the subject-bound group exactly when its one subject is left out', async () => {
    const { input, run } = await setup(params());
    const r = await clusterStability(input, { resamples: 12 }, quietContext);
    expect(r.subjectsLeftOut).toBe(2);
    expect(r.leftOut.every((l) => l.length === 2)).toBe(true);
    // P8's group: 40 windows, all of P8 (code 7); the cluster holding most of them.
    const p8 = Array.from({ length: 4 }, (_, c) => input.matrix.subjectCodes!.reduce((a, s, i) => a + (s === 7 && run.labels[i] === c ? 1 : 0), 0));
    const bound = p8.indexOf(Math.max(...p8));
    const without = r.leftOut.map((l) => l.includes(7));
    expect(without.some(Boolean) && !without.every(Boolean)).toBe(true);
    for (let b = 0; b < r.resamples; b++) {
      // Without P8 the cluster keeps no window (Jaccard 0); with P8 it is found again.
      if (without[b]) expect(r.jaccard[b * 4 + bound]).toBe(0);
      else expect(r.jaccard[b * 4 + bound]).toBeGreaterThan(0.9);
    }
    const c = r.clusters[bound];
    expect(c.dissolvedShare).toBe(without.filter(Boolean).length / r.resamples);
    expect(c.dissolvingSubjects[0]).toEqual({ subject: 'P8', leftOut: without.filter(Boolean).length, dissolved: without.filter(Boolean).length, share: 1 });
    // The shared groups: found again whenever P8 is kept. Without P8, k = 4 clusters for three
    // groups split one of them, so they are less than perfect there, yet far above the bound group.
    for (const other of r.clusters.filter((x) => x.cluster !== bound)) {
      for (let b = 0; b < r.resamples; b++) if (!without[b]) expect(r.jaccard[b * 4 + other.cluster]).toBeGreaterThan(0.95);
      expect(other.meanJaccard!).toBeGreaterThan(c.meanJaccard!);
    }
    expect(c.meanJaccard!).toBeLessThanOrEqual(without.filter((w) => !w).length / r.resamples);
  });

  it('is deterministic for a seed; the first resamples of a longer assessment are a shorter one', async () => {
    const { input } = await setup(params());
    const a = await clusterStability(input, { resamples: 4 }, quietContext);
    const b = await clusterStability(input, { resamples: 4 }, quietContext);
    expect(b).toEqual(a);
    const longer = await clusterStability(input, { resamples: 8 }, quietContext);
    expect(longer.leftOut.slice(0, 4)).toEqual(a.leftOut);
    expect(Array.from(longer.jaccard.subarray(0, 16))).toEqual(Array.from(a.jaccard));
    const other = await clusterStability(input, { resamples: 4, seed: 99 }, quietContext);
    expect(other.seed).toBe(99);
    expect(other.leftOut).not.toEqual(a.leftOut);
  });

  it('follows the windows a recipe drops', async () => {
    const matrix = study(2, 7);
    const p = params({ recipe: { version: 1, steps: [{ type: 'drop-missing', axis: 'windows', threshold: 0 }, { type: 'zscore' }] } });
    const { input, run } = await setup(p, matrix);
    expect(run.windows!.length).toBeLessThan(matrix.n);
    const r = await clusterStability(input, { resamples: 2, leaveOutShare: 0 }, quietContext);
    expect(Array.from(r.jaccard)).toEqual(new Array(8).fill(1));
  });

  it('neither assesses nor matches the set-aside noise of HDBSCAN', async () => {
    const { input, run } = await setup(params({ cluster: { method: 'hdbscan', minClusterSize: 10 } }));
    if (run.cluster.method !== 'hdbscan') throw new Error('expected an HDBSCAN run');
    const noise = run.cluster.noiseCluster;
    const r = await clusterStability(input, { resamples: 3 }, quietContext);
    expect(r.clusters).toHaveLength(run.cluster.k);
    for (const c of r.clusters) {
      if (c.cluster === noise) expect(c.meanJaccard).toBeNull();
      else expect(c.meanJaccard).toBeGreaterThanOrEqual(0);
    }
  });

  it('reports progress by resample, up to 1, and stops at a cancelled checkpoint', async () => {
    const { input } = await setup(params());
    const seen: [string, number][] = [];
    await clusterStability(input, { resamples: 3 }, { progress: (s, f) => seen.push([s, f]), checkpoint: () => Promise.resolve() });
    for (let i = 1; i < seen.length; i++) expect(seen[i][1]).toBeGreaterThanOrEqual(seen[i - 1][1]);
    expect(seen[0]).toEqual(['resample 1/3', 0]);
    expect(seen.at(-1)).toEqual(['resample 3/3', 1]);
    expect(seen.some(([s]) => s === 'resample 2/3')).toBe(true);

    let calls = 0;
    const stages: string[] = [];
    const ctx: JobContext = { progress: (s) => stages.push(s), checkpoint: () => (++calls >= 4 ? Promise.reject(new CancelledError()) : Promise.resolve()) };
    await expect(clusterStability(input, { resamples: 50 }, ctx)).rejects.toBeInstanceOf(CancelledError);
    expect(stages).not.toContain('resample 50/50');
  });

  it('validates its options and needs subjects', async () => {
    const { input } = await setup(params());
    await expect(clusterStability(input, { resamples: 0 }, quietContext)).rejects.toBeInstanceOf(OptionError);
    await expect(clusterStability(input, { resamples: 2.5 }, quietContext)).rejects.toThrow(/stability/);
    await expect(clusterStability(input, { resamples: 2, leaveOutShare: 1 }, quietContext)).rejects.toThrow(/leaveOutShare/);
    await expect(clusterStability(input, { resamples: 2, seed: Number.NaN }, quietContext)).rejects.toThrow(/seed/);
    const { subjectCodes: _, ...bare } = input.matrix;
    await expect(clusterStability({ ...input, matrix: bare }, { resamples: 2 }, quietContext)).rejects.toThrow(/subject column/);
    await expect(clusterStability({ ...input, subjectNames: ['P1'] }, { resamples: 2 }, quietContext)).rejects.toThrow(/at least 2 subjects/);
  });
});
