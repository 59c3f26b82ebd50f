import type { SweepRow } from '../../core/cluster/sweep';
import type { Jobs } from '../../worker/jobs';
import { NewestJob } from '../../worker/newest-job';
import type { JobClient } from '../../worker/client';
import { describeError, isCancelled } from '../lib/errors';
import type { RunParams } from './params.svelte';
import type { Study } from './study.svelte';
import { recipeInput } from './recipe.svelte';

/** Range the sweep view offers by default (common practice for a first look: 2 to 12 clusters). */
export const SWEEP_RANGE = { kMin: 2, kMax: 12, limit: 40 } as const;

/** What the sweep works on (given by AppState: no pointer back to it). */
export interface SweepDeps {
  readonly study: Study;
  readonly params: RunParams;
  /** Runs the analysis with the current parameters. */
  runAnalysis(): Promise<void>;
}

/** The k sweep of the shown run's scaled features: one row per k, computed in the worker. */
export class SweepState {
  kMin = $state<number>(SWEEP_RANGE.kMin);
  kMax = $state<number>(SWEEP_RANGE.kMax);
  rows = $state.raw<SweepRow[]>([]);
  running = $state(false);
  stage = $state('');
  fraction = $state(0);
  error = $state('');
  /** Points the sweep charts drew last (the test hook reads it). */
  drawnPoints = $state(0);
  /** The run the rows were computed for (rows are dropped when another study is opened). */
  private forRun: object | null = null;
  private readonly newest = new NewestJob<SweepRow[]>();

  constructor(private readonly deps: SweepDeps, private readonly client: JobClient<Jobs>) {}

  /** True when the rows describe the study on screen (same table, recipe and roles). */
  get current(): boolean {
    return this.rows.length > 0 && this.forRun === this.deps.study.table;
  }

  async run(): Promise<void> {
    const { table, run } = this.deps.study;
    if (!table || !run) return;
    const kMin = Math.round(this.kMin), kMax = Math.round(this.kMax);
    if (!(kMin >= 2 && kMax >= kMin && kMax - kMin < SWEEP_RANGE.limit)) {
      this.error = `Choose k from 2 up, with at most ${SWEEP_RANGE.limit} values of k.`;
      return;
    }
    this.newest.cancel();
    this.error = '';
    this.running = true;
    this.fraction = 0;
    const job = this.client.run('sweep', { matrix: recipeInput(table, run.roles).matrix, params: run.params, kMin, kMax }, {
      onProgress: (p) => {
        this.stage = p.stage;
        this.fraction = p.fraction;
      },
    });
    this.newest.start(job);
    try {
      const rows = await job.result;
      if (!this.newest.isNewest(job)) return;
      this.rows = rows;
      this.forRun = table;
    } catch (err) {
      if (this.newest.isNewest(job) && !isCancelled(err)) this.error = describeError(err, this.deps.study.source?.fileName ?? 'study');
    } finally {
      if (this.newest.end(job)) {
        this.running = false;
      }
    }
  }

  cancel(): void {
    this.newest.cancel();
  }

  /** Uses k for the next run (k-means k, or the tree cut) and runs again. */
  async choose(k: number): Promise<void> {
    this.deps.params.k = k;
    if (this.deps.params.cluster !== 'kmeans') this.deps.params.cutBy = 'k';
    await this.deps.runAnalysis();
  }
}
