import type { DataQuality } from '../../core/quality';
import type { Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';
import type { RunningJob } from '../../worker/client';
import { NewestJob } from '../../worker/newest-job';
import type { QualityJob } from '../../worker/jobs';
import { describeError, isCancelled } from '../lib/errors';
import { matrixKey, recipeInput } from './recipe.svelte';

type RunJob = (payload: QualityJob) => RunningJob<DataQuality>;

/**
 * The data-quality report of the open study, computed in the worker ('quality' job) when the
 * Quality view asks for it, and again when the file or the column roles change. Also keeps the
 * warnings the last load gave (for example a subject with a single window).
 */
export class QualityState {
  report = $state.raw<DataQuality | null>(null);
  busy = $state(false);
  error = $state('');
  /** Warnings of the file loaded last. */
  loadWarnings = $state<string[]>([]);
  private key = '';
  private readonly newest = new NewestJob<DataQuality>();

  constructor(private readonly runJob: RunJob) {}

  /** Forgets the report (a new file was loaded) and keeps its warnings. */
  reset(warnings: string[]): void {
    this.newest.clear();
    this.key = '';
    this.report = null;
    this.busy = false;
    this.error = '';
    this.loadWarnings = warnings;
  }

  /** Computes the report for this table and roles unless it is already there or on its way. */
  async request(table: Table, roles: Roles, sha256: string): Promise<void> {
    const key = matrixKey(sha256, roles);
    if (key === this.key) return;
    this.newest.cancel();
    this.key = key;
    this.error = '';
    let payload: QualityJob;
    try {
      const input = recipeInput(table, roles);
      payload = { matrix: input.matrix, subjectNames: input.subjectNames };
    } catch (err) {
      this.report = null;
      this.error = describeError(err, table.fileName);
      return;
    }
    const job = this.runJob(payload);
    this.newest.start(job);
    this.busy = true;
    try {
      const report = await job.result;
      if (this.newest.isNewest(job)) this.report = report;
    } catch (err) {
      if (this.newest.isNewest(job) && !isCancelled(err)) this.error = describeError(err, table.fileName);
      if (this.newest.isNewest(job)) this.key = '';
    } finally {
      if (this.newest.end(job)) {
        this.busy = false;
      }
    }
  }
}
