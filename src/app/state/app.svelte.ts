import type { AnalysisPartial } from '../../core/analysis.types';
import type { Host, InputFile } from '../../host/host';
import type { JobClient, RunningJob } from '../../worker/client';
import type { Jobs, ParseResult } from '../../worker/jobs';
import { READ_SHARE } from '../../core/input/parse-input';
import { featureMatrix } from '../../core/table/matrix';
import { describeError, isCancelled } from '../lib/errors';
import { ownBuffer } from '../lib/hash';
import { QualityState } from './quality.svelte';
import { StabilityState } from './stability.svelte';
import { Curation } from './curation.svelte';
import { DockState } from './dock.svelte';
import { ViewFigures } from '../lib/figures';
import { LiveLayout } from './live-layout.svelte';
import { liveSources } from './live-sources';
import { MapState } from './map.svelte';
import { placedNote, runDescription } from './run-text';
import { RunParams } from './params.svelte';
import { matrixKey, recipeInput, RecipeState } from './recipe.svelte';
import { Runs } from './runs.svelte';
import { Selection } from './selection.svelte';
import { Status } from './status.svelte';
import { StudyFile } from './study-file.svelte';
import { Study } from './study.svelte';
import { TracesState } from './traces.svelte';
import { SweepState } from './sweep.svelte';
import { TreeCut } from './tree-cut.svelte';
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
  readonly recipe = new RecipeState();
  readonly quality = new QualityState((payload) => this.client.run('quality', payload));
  readonly traces = new TracesState();
  readonly live = new LiveLayout();
  readonly figures = new ViewFigures();
  readonly runs: Runs;
  readonly curation: Curation;
  readonly studyFile: StudyFile;
  readonly treeCut: TreeCut;
  readonly sweep: SweepState;
  readonly stability: StabilityState;
  aboutOpen = $state(false);
  /** Completed runs since start (tests wait on it). */
  runCount = $state(0);
  private readonly client: JobClient<Jobs>;
  private current: RunningJob<unknown> | null = null;

  constructor(readonly host: Host) {
    this.client = startWorker((message) => this.status.fail('The compute worker stopped', message, 'Reload the window to continue.'));
    const { study, params, status, selection, map, dock } = this;
    // Each sub-state gets what it works on, never the whole app (no import circle).
    const curation = new Curation({ study, status }, this.client);
    this.curation = curation;
    this.runs = new Runs({ study, curation, status, selection, map, track: (job) => this.track(job), ranOne: () => void this.runCount++ }, this.client);
    this.studyFile = new StudyFile({ study, curation, map, dock, params, selection, status, host, openFile: (file) => this.openFile(file) });
    this.treeCut = new TreeCut({ study, params, status, curation }, this.client);
    this.sweep = new SweepState({ study, params, runAnalysis: () => this.runAnalysis() }, this.client);
    this.stability = new StabilityState({ study, curation, status, track: (job) => this.track(job) }, this.client);
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
      if ((await this.openFile(file)) && runAfter) {
        await this.runAnalysis();
        // The demo opens as a finished study: its first run is part of opening it, not a change.
        if (this.study.run) this.studyFile.markClean();
      }
    } catch (err) {
      this.status.fail('Could not load the demo study', describeError(err, 'demo study'), 'Nothing was opened.');
    }
  }

  /**
   * Parses a file in the worker; replaces the study only when the file loaded cleanly. A File/Blob
   * goes to the worker as it is and is read there slice by slice (progress = bytes read), so this
   * thread never holds the file; bytes read by the host (Electron) are transferred. Cancel stops it.
   */
  async openFile(file: InputFile): Promise<boolean> {
    this.cancel();
    this.current = null;
    this.status.dismissError();
    this.status.start(`Reading ${file.name}…`);
    let job: RunningJob<ParseResult> | null = null;
    const size = 'blob' in file ? file.blob.size : file.bytes.length;
    try {
      const bytes = 'blob' in file ? null : ownBuffer(file.bytes);
      job = this.client.run('parse', bytes ? { fileName: file.name, bytes } : { fileName: file.name, blob: (file as { blob: Blob }).blob }, {
        transfer: bytes ? [bytes.buffer] : [],
        // Reading takes the first READ_SHARE of the parse job's bar: that much = every byte read.
        onProgress: (p) => this.status.progress(p.stage, p.fraction, p.stage === 'reading' ? `${mib(Math.min(1, p.fraction / READ_SHARE) * size)} of ${mib(size)}` : p.detail),
      });
      this.current = job;
      const { table, roles, warnings, sha256 } = await job.result;
      if (this.current !== job) return false; // superseded by a newer action
      featureMatrix(table, roles); // the same check Run makes: fail now, not later
      this.study.load({ fileName: file.name, sha256, bytes: size }, table, roles);
      this.quality.reset(warnings.map((w) => w.message));
      this.selection.clear();
      const features = roles.filter((r) => r.role === 'feature').length;
      const warned = warnings.length ? ` ${warnings.length} warning${warnings.length === 1 ? '' : 's'} (see Quality): ${warnings[0].message}` : '';
      this.status.finish(`Loaded ${file.name}: ${table.nRows} windows, ${features} features. Check the column roles, then Run.${warned}`);
      return true;
    } catch (err) {
      if (job && this.current !== job) return false;
      if (isCancelled(err)) this.status.finish(`Opening ${file.name} was cancelled. ${this.keptMessage()}`);
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
      params = { ...this.params.toParams(), recipe: this.recipe.toRecipe() };
      matrix = recipeInput(table, roles).matrix;
    } catch (err) {
      this.status.fail('Cannot run', describeError(err, source.fileName), 'Fix the roles or parameters, then Run again.');
      return;
    }
    const featureNames = matrix.featureNames;
    this.status.start(`Running ${runDescription(params)} on ${matrix.n} windows…`);
    const previous = this.study.run;
    const live = liveSources({
      previous, curated: previous ? this.curation.colouring() : null, nInput: matrix.n,
      colourBy: this.map.colourBy, table, roles,
    });
    this.live.start(live.sources, live.why);
    const job = this.client.run('analyze', { matrix, params, cacheKey: matrixKey(source.sha256, roles) }, {
      onProgress: (p) => {
        this.status.progress(p.stage, p.fraction, p.detail);
      },
      onPartial: (value) => {
        if (this.current === job) this.live.offer(value as AnalysisPartial);
      },
    });
    this.current = job;
    try {
      const result = await job.result;
      if (this.current !== job) return; // superseded by a newer action
      this.study.setRun({ result, params, roles, featureNames });
      this.selection.clear();
      // A t-SNE or UMAP map continues from its last live frame (same coordinates, same view).
      const lastView = this.live.lastView;
      if (lastView && result.embed.method !== 'pca') {
        this.map.view = lastView;
        this.map.fitNext = false;
        this.map.continueView = true;
        this.map.userMoved = this.live.zoom !== 1 || this.live.panX !== 0 || this.live.panY !== 0;
      } else {
        this.map.fitNext = true;
      }
      this.runCount++;
      const sil = result.metrics.silhouette;
      this.status.finish(`${result.cluster.k} clusters in ${matrix.n} windows · silhouette ${Number.isFinite(sil) ? sil.toFixed(2) : 'n/a'} · seed ${params.seed}${placedNote(result)}`);
    } catch (err) {
      if (this.current !== job) return; // superseded: the newer action reports its own status
      if (isCancelled(err)) this.status.finish(`Run cancelled. ${this.study.run ? 'The previous map is kept.' : ''}`.trim());
      else this.status.fail('The run failed', describeError(err, source.fileName), this.keptMessage());
    } finally {
      if (this.current === job) {
        this.current = null;
        this.live.stop();
      }
    }
  }

  cancel(): void {
    this.current?.cancel();
  }

  /** Makes `job` the one the status bar's Cancel stops, until it ends (jobs started by views). */
  track<T>(job: RunningJob<T>): RunningJob<T> {
    this.current = job;
    const release = () => {
      if (this.current === job) this.current = null;
    };
    job.result.then(release, release);
    return job;
  }

  /** Jobs started by name since start (the test hook shows them). */
  get jobsStarted(): Readonly<Record<string, number>> {
    return this.client.started;
  }

  private keptMessage(): string {
    return this.study.source ? `Kept the previous study (${this.study.source.fileName}).` : 'Nothing was opened.';
  }
}

/** Bytes as MiB with one decimal, for the loading progress. */
function mib(bytes: number): string {
  return `${(bytes / 1048576).toFixed(1)} MiB`;
}
