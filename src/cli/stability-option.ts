import type { StabilityResult } from '../core/stability/stability';
import type { JobClient, RunningJob } from '../worker/client';
import type { Jobs, StabilityJob } from '../worker/jobs';
import type { ProgressReporter } from './progress-bar';

/** What the stability job needs of the analyze command's deps. */
export interface StabilityDeps {
  client: JobClient<Jobs>;
  progress: ProgressReporter;
  onJob(job: RunningJob<unknown> | null): void;
}

/** --stability: the stability job on the worker, with its own progress bar; Ctrl-C cancels it. */
export async function runStability(deps: StabilityDeps, payload: StabilityJob): Promise<StabilityResult> {
  const running = deps.client.run('stability', payload, {
    onProgress: (p) => deps.progress.update(`stability: ${p.stage}`, p.fraction, p.detail),
  });
  deps.onJob(running as RunningJob<unknown>);
  try {
    return await running.result;
  } finally {
    deps.onJob(null);
    deps.progress.finish();
  }
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
