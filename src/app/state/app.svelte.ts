import type { AnalysisResult } from '../../core/analysis.types';
import type { Host, OpenedFile } from '../../host/host';
import type { JobClient, RunningJob } from '../../worker/client';
import type { ParseResult } from '../../worker/jobs';
import { version } from '../../../package.json';
import { featureMatrix } from '../../core/table/matrix';
import { isoNow } from '../lib/clock';
import { describeError, isCancelled } from '../lib/errors';
import { weakLabelFiles } from '../lib/export-files';
import { ownBuffer, sha256Hex } from '../lib/hash';
import { DockState } from './dock.svelte';
import { MapState } from './map.svelte';
import { RunParams } from './params.svelte';
import { Selection } from './selection.svelte';
import { Status } from './status.svelte';
import { Study } from './study.svelte';
import { startWorker } from './worker-client';

/**
 * The renderer's state and its actions: open a windows table, run the analysis, cancel, export.
 * Every compute step runs in the worker; a failed step leaves the previous study as it was.
 */
export class AppState {
  readonly study = new Study();
  readonly params = new RunParams();
  readonly selection = new Selection();
  readonly status = new Status();
  readonly map = new MapState();
  readonly dock = new DockState();
  aboutOpen = $state(false);
  /** Completed runs since start (tests wait on it). */
  runCount = $state(0);
  private readonly client: JobClient;
  private current: RunningJob<unknown> | null = null;

  constructor(readonly host: Host) {
    this.client = startWorker((message) => this.status.fail('The compute worker stopped', message, 'Reload the window to continue.'));
  }

  async openFromHost(): Promise<void> {
    try {
      const file = await this.host.openWindowsFile();
      if (file) await this.openFile(file);
    } catch (err) {
      this.status.fail('Could not open the file', describeError(err, 'file'), 'Nothing was opened.');
    }
  }

  async openDemo(runAfter: boolean): Promise<void> {
    try {
      const file = await this.host.loadDemo();
      if ((await this.openFile(file)) && runAfter) await this.runAnalysis();
    } catch (err) {
      this.status.fail('Could not load the demo study', describeError(err, 'demo study'), 'Nothing was opened.');
    }
  }

  /** Parses a file in the worker; replaces the study only when the file loaded cleanly. */
  async openFile(file: OpenedFile): Promise<boolean> {
    this.cancel();
    this.current = null;
    this.status.dismissError();
    this.status.start(`Reading ${file.name}…`);
    let job: RunningJob<ParseResult> | null = null;
    try {
      const sha256 = await sha256Hex(file.bytes);
      const bytes = ownBuffer(file.bytes);
      job = this.client.run<ParseResult>('parse', { fileName: file.name, bytes }, {
        transfer: [bytes.buffer],
        onProgress: (p) => this.status.progress(p.stage, p.fraction),
      });
      this.current = job;
      const { table, roles } = await job.result;
      if (this.current !== job) return false; // superseded by a newer action
      featureMatrix(table, roles); // the same check Run makes: fail now, not later
      this.study.load({ fileName: file.name, sha256, bytes: file.bytes.length }, table, roles);
      this.selection.clear();
      const features = roles.filter((r) => r.role === 'feature').length;
      this.status.finish(`Loaded ${file.name}: ${table.nRows} windows, ${features} features. Check the column roles, then Run.`);
      return true;
    } catch (err) {
      if (job && this.current !== job) return false;
      if (isCancelled(err)) this.status.finish(`Opening ${file.name} was cancelled.`);
      else this.status.fail(`Could not load ${file.name}`, describeError(err, file.name), this.keptMessage());
      return false;
    } finally {
      if (job && this.current === job) this.current = null;
    }
  }

  /** Builds the feature matrix from the current roles and runs PCA + k-means in the worker. */
  async runAnalysis(): Promise<void> {
    const { table, source } = this.study;
    if (!table || !source || this.status.busy) return;
    this.status.dismissError();
    let matrix, params;
    const roles = $state.snapshot(this.study.roles);
    try {
      params = this.params.toParams();
      matrix = featureMatrix(table, roles);
    } catch (err) {
      this.status.fail('Cannot run', describeError(err, source.fileName), 'Fix the roles or parameters, then Run again.');
      return;
    }
    const featureNames = matrix.featureNames;
    this.status.start(`Running PCA and k-means (k = ${params.k}, ${params.restarts} restarts) on ${matrix.n} windows…`);
    const job = this.client.run<AnalysisResult>('analyze', { matrix, params }, {
      onProgress: (p) => this.status.progress(p.stage, p.fraction),
    });
    this.current = job;
    try {
      const result = await job.result;
      if (this.current !== job) return; // superseded by a newer action
      this.study.setRun({ result, params, roles, featureNames });
      this.selection.clear();
      this.map.fitNext = true;
      this.runCount++;
      const sil = result.metrics.silhouette;
      this.status.finish(`${result.cluster.k} clusters in ${matrix.n} windows · silhouette ${Number.isFinite(sil) ? sil.toFixed(2) : 'n/a'} · seed ${params.seed}`);
    } catch (err) {
      if (this.current !== job) return; // superseded: the newer action reports its own status
      if (isCancelled(err)) this.status.finish(`Run cancelled. ${this.study.run ? 'The previous map is kept.' : ''}`.trim());
      else this.status.fail('The run failed', describeError(err, source.fileName), this.keptMessage());
    } finally {
      if (this.current === job) this.current = null;
    }
  }

  cancel(): void {
    this.current?.cancel();
  }

  async exportLabels(): Promise<void> {
    const { table, source, run } = this.study;
    if (!table || !source || !run) return;
    try {
      const files = weakLabelFiles({
        source, table, run,
        clusterNames: $state.snapshot(this.study.clusterNames),
        appVersion: version,
        createdAt: isoNow(),
      });
      const outcome = await this.host.saveFiles(source.fileName, files);
      if (outcome) this.status.finish(`Exported ${outcome.names.join(' and ')} to ${outcome.location}.`);
      else this.status.finish('Export cancelled.');
    } catch (err) {
      this.status.fail('Export failed', describeError(err, source.fileName), 'Nothing was exported.');
    }
  }

  private keptMessage(): string {
    return this.study.source ? `Kept the previous study (${this.study.source.fileName}).` : 'Nothing was opened.';
  }
}
