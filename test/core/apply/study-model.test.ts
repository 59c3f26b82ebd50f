/**
 * The assignment rule on a case worked out by hand: single linkage on a chain of windows 0, 1, ..., 9
 * and a tight group at 12, 12.2, 12.4 (one feature that matters). The chain's centroid is 4.5 and
 * the group's 12.2, so the chain's end (9: 4.5 from its own centroid, 3.2 from the group's) is not in
 * its centroid's cell. The parts rule keeps it, and labels a new window at 8.6 as the chain's.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams } from '../../../src/core/analysis.types';
import { analyze } from '../../../src/core/analyze';
import { applyFrozen } from '../../../src/core/apply/frozen-recipe';
import { assignWindows, studyModel } from '../../../src/core/apply/study-model';
import { quietContext } from '../../../src/core/job';
import type { StudyRun } from '../../../src/core/study/study.types';

const XS = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 12, 12.2, 12.4];

async function run(cluster: AnalysisParams['cluster']): Promise<StudyRun> {
  // A second feature with a tiny alternating value, so the map has two axes.
  const data = Float64Array.from(XS.flatMap((x, i) => [x, (i % 2) * 1e-3]));
  const params: AnalysisParams = { ...DEFAULT_ANALYSIS_PARAMS, k: 2, restarts: 1, recipe: { version: 1, steps: [] }, cluster };
  const result = await analyze({ data, n: XS.length, d: 2, featureNames: ['x', 'y'] }, params, quietContext);
  return { id: 'r', input: 0, roles: [], params: params as unknown as Record<string, unknown>, result, curation: { actions: [], undone: [] }, flags: [], createdAt: '' };
}

const matrix = () => ({ data: Float64Array.from(XS.flatMap((x, i) => [x, (i % 2) * 1e-3])), n: XS.length, d: 2, featureNames: ['x', 'y'] });

describe('studyModel and assignWindows', () => {
  it('a tree run: windows go to the cluster of the nearest part, so the chain keeps its end', async () => {
    const r = await run({ method: 'single', k: 2 });
    expect(Array.from(r.result.labels)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1]);
    const model = studyModel(r, matrix());
    const own = assignWindows(model, matrix().data, XS.length);
    expect(Array.from(own.labels)).toEqual(Array.from(r.result.labels));
    const fresh = applyFrozen(model.frozen, Float64Array.from([8.6, 0, 12.1, 0, -3, 0]), 3, undefined);
    expect(Array.from(assignWindows(model, fresh.data, 3).labels)).toEqual([0, 1, 0]);
    // Confidence is the analysis's: 1 - d1/d2 over the cluster centroids (4.5 and 12.2 on x).
    expect(own.confidence[9]).toBeCloseTo(1 - Math.hypot(12.2 - 9, 1e-3 - 1e-3 / 3) / Math.hypot(9 - 4.5, 1e-3 - 5e-4), 6);
  });

  it('follows the curation: a merged-away cluster takes no window, moved windows go with their new cluster', async () => {
    const r = await run({ method: 'single', k: 2 });
    const chain = 0;
    const group = 1;
    const merged = studyModel({ ...r, curation: { actions: [{ type: 'merge', into: chain, from: [group] }], undone: [] } }, matrix());
    expect(merged.clusters).toEqual([chain]);
    expect(Array.from(assignWindows(merged, Float64Array.from([12.2, 0]), 1).labels)).toEqual([chain]);
    // Windows 8 and 9 moved to the group: its centroid is then the mean of 8, 9, 12, 12.2, 12.4 = 10.72.
    const moved = studyModel({ ...r, curation: { actions: [{ type: 'move', windows: Int32Array.from([8, 9]), to: group }], undone: [] } }, matrix());
    const at = moved.clusters.indexOf(group);
    expect(moved.clusterCentroids[at * 2]).toBeCloseTo((8 + 9 + 12 + 12.2 + 12.4) / 5, 12);
    // Each study window is a part of its own here (13 leaves): 7.4 is nearest 7 (chain), 7.6 nearest 8 (moved).
    expect(Array.from(assignWindows(moved, Float64Array.from([7.4, 0, 7.6, 0]), 2).labels)).toEqual([chain, group]);
  });
});
