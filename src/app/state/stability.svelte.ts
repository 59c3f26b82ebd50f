import type { StabilityResult } from '../../core/stability/stability.types';
import type { JobClient, RunningJob } from '../../worker/client';
import type { Jobs } from '../../worker/jobs';
import { describeError, isCancelled } from '../lib/errors';
import type { Curation } from './curation.svelte';
import type { Status } from './status.svelte';
import type { Study } from './study.svelte';

/** Resamples the cluster list's button asks for (the CLI's --stability takes any number). */
export const APP_RESAMPLES = 20;

/** What the stability check works on (given by AppState: no pointer back to it). */
export interface StabilityDeps {
  readonly study: Study;
  readonly curation: Curation;
  readonly status: Status;
  track<T>(job: RunningJob<T>): RunningJob<T>;
}

/**
 * Each shown cluster's stability across subjects (docs/stability.md): the run again on resamples
 * that leave subjects out, in the worker, with progress in the status bar and its Cancel. Measured on
 * the curated clusters shown when the button is pressed; a later change of the clusters marks it
 * out of date rather than showing figures of other clusters.
 */
export class StabilityState {
  /** The last result and the curated labels it was measured on. */
  result = $state.raw<{ labels: Int32Array; value: StabilityResult } | null>(null);
  running = $state(false);

  constructor(private readonly deps: StabilityDeps, private readonly client: JobClient<Jobs>) {}

  /** The figures for the clusters shown, or null when none were measured on them. */
  get current(): StabilityResult | null {
    const r = this.result;
    return r && r.labels === this.deps.curation.labels ? r.value : null;
  }

  /** A result exists, but the clusters changed since. */
  get stale(): boolean {
    return this.result !== null && this.current === null;
  }

  async check(): Promise<void> {
    const { study, curation, status } = this.deps;
    const run = study.run, table = study.table, labels = curation.labels;
    if (!run || !table || !labels || this.running) return;
    this.running = true;
    status.start(`Checking the stability of ${curation.live.length} clusters: ${APP_RESAMPLES} resamples leaving subjects out…`);
    try {
      const job = this.deps.track(this.client.run('stability', {
        table, roles: run.roles, params: run.params,
        run: { labels, windows: run.result.windows, cluster: { ...run.result.cluster, k: Math.max(run.result.cluster.k, curation.k) } },
        options: { resamples: APP_RESAMPLES },
      }, { onProgress: (p) => status.progress(p.stage, p.fraction, p.detail) }));
      const value = await job.result;
      this.result = { labels, value };
      status.finish(`Stability measured on ${value.resamples} resamples, each leaving out ${value.subjectsLeftOut} of ${value.subjects} subjects.`);
    } catch (err) {
      if (isCancelled(err)) status.finish('Stability check cancelled.');
      else status.fail('The stability check failed', describeError(err, study.source?.fileName ?? 'study'), 'The clusters are as they were.');
    } finally {
      this.running = false;
    }
  }
}
