import type { StabilityResult } from '../core/stability/stability';
import type { StabilityJob } from '../worker/jobs';
import { runCliJob, type CliJobDeps } from './cli-job';

/** --stability: the stability job on the worker, with its own progress bar; Ctrl-C cancels it. */
export function runStability(deps: CliJobDeps, payload: StabilityJob): Promise<StabilityResult> {
  return runCliJob(deps, 'stability', payload, 'stability');
}

/** The settings of the assessment, for summary.json (`stabilityRule`). */
export function stabilityRule(s: StabilityResult): Record<string, unknown> {
  return {
    resamples: s.resamples, leaveOutShare: s.leaveOutShare, subjectsLeftOut: s.subjectsLeftOut, subjects: s.subjects,
    seed: s.seed, dissolution: s.dissolution,
    text: `${s.resamples} resamples, each leaving out ${s.subjectsLeftOut} of ${s.subjects} subjects at random; a cluster's stability is ` +
      'its mean best Jaccard similarity with a cluster of the resample (on the windows kept); it dissolves in a resample ' +
      `when that similarity is at most ${s.dissolution}`,
  };
}

/** The stability fields of one cluster (by index) in summary.json, beside its subject mix. */
export function stabilityFields(index: number, s: StabilityResult): Record<string, unknown> {
  const own = s.clusters[index];
  return {
    stability: own.meanJaccard,
    stabilityDetail: { dissolvedShare: own.dissolvedShare, dissolvingSubjects: own.dissolvingSubjects },
  };
}
