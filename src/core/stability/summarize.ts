import type { ClusterStability, DissolvingSubject } from './stability.types';

/** Hennig's dissolution threshold: a best Jaccard at most 0.5 (R fpc clusterboot, `dissolution = 0.5`, "smaller or equal"). */
export const DISSOLUTION = 0.5;

/** At most this many dissolving subjects are named per cluster. */
export const MAX_DISSOLVING_SUBJECTS = 3;

/**
 * Per-cluster figures from the resamples' Jaccard similarities (`jaccard`: resamples × k, NaN for a
 * cluster not assessed, i.e. set-aside noise) and the subjects each resample left out.
 */
export function summarizeStability(
  jaccard: Float64Array, k: number, leftOut: readonly (readonly number[])[], subjectNames: readonly string[],
): ClusterStability[] {
  const B = leftOut.length;
  if (jaccard.length !== B * k) throw new Error(`expected ${B} × ${k} similarities, got ${jaccard.length}`);
  const out: ClusterStability[] = [];
  for (let c = 0; c < k; c++) {
    if (B === 0 || Number.isNaN(jaccard[c])) {
      out.push({ cluster: c, meanJaccard: null, dissolvedShare: null, dissolvingSubjects: [] });
      continue;
    }
    let sum = 0, dissolvedCount = 0;
    const absent = new Array<number>(subjectNames.length).fill(0);
    const absentDissolved = new Array<number>(subjectNames.length).fill(0);
    for (let b = 0; b < B; b++) {
      const j = jaccard[b * k + c];
      sum += j;
      const dissolved = j <= DISSOLUTION;
      if (dissolved) dissolvedCount++;
      for (const s of leftOut[b]) {
        absent[s]++;
        if (dissolved) absentDissolved[s]++;
      }
    }
    const dissolvedShare = dissolvedCount / B;
    const subjects: DissolvingSubject[] = [];
    subjectNames.forEach((subject, s) => {
      if (absentDissolved[s] === 0) return;
      const share = absentDissolved[s] / absent[s];
      if (share > dissolvedShare) subjects.push({ subject, leftOut: absent[s], dissolved: absentDissolved[s], share });
    });
    subjects.sort((a, b) => b.share - a.share || b.dissolved - a.dissolved || (a.subject < b.subject ? -1 : a.subject > b.subject ? 1 : 0));
    out.push({ cluster: c, meanJaccard: sum / B, dissolvedShare, dissolvingSubjects: subjects.slice(0, MAX_DISSOLVING_SUBJECTS) });
  }
  return out;
}
