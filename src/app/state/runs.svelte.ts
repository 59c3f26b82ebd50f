import { columnWithRole } from '../../core/export/window-columns';
import type { RunProfile } from '../../core/profile/profile';
import { subjectCodes } from '../../core/recipe/subject-codes';
import { featureMatrix } from '../../core/table/matrix';
import { findColumn } from '../../core/table/table';
import type { Jobs } from '../../worker/jobs';
import type { JobClient } from '../../worker/client';
import { describeError, isCancelled } from '../lib/errors';
import { subjectScaledRecipe } from '../lib/recipe-text';
import { tableLabels } from '../lib/run-rows';
import type { RunningJob } from '../../worker/client';
import type { Curation } from './curation.svelte';
import type { MapState } from './map.svelte';
import type { Selection } from './selection.svelte';
import type { Status } from './status.svelte';
import type { Study } from './study.svelte';
import type { KeptRun } from './kept-run';

export type { KeptRun };

/** Figures the views drew last, for the status line and the end-to-end tests. */
export interface DrawnFigures {
  mixBars: number;
  mixSegments: number;
  mixBound: number;
  fingerprintCells: number;
  timelineStrips: number;
  timelineWindows: number;
  contingencyCells: number;
  /** ARI of the comparison on screen (NaN when none). */
  comparisonAri: number;
}

const labelIds = new WeakMap<Int32Array, number>();
let nextLabelsId = 0;

/** A small number naming one labels array (the profile is recomputed when it changes). */
function labelsId(labels: Int32Array): number {
  let id = labelIds.get(labels);
  if (id === undefined) labelIds.set(labels, (id = ++nextLabelsId));
  return id;
}

/** What the runs work on (given by AppState: no pointer back to it). */
export interface RunsDeps {
  readonly study: Study;
  readonly curation: Curation;
  readonly status: Status;
  readonly selection: Selection;
  readonly map: MapState;
  /** Makes a job the one Cancel stops. */
  track<T>(job: RunningJob<T>): RunningJob<T>;
  /** Counts a completed run (tests wait on the count). */
  ranOne(): void;
}

/**
 * The runs kept in the study and what the Mix, Fingerprints, Timeline and runs views need from
 * the worker: the profile of the shown run (composition by a column, fingerprints, label
 * agreement) and the re-run with per-subject scaling. `study.run` stays the shown run;
 * `study.kept` lists every run.
 */
export class Runs {
  /** Column the Mix composes clusters by; '' = the subject column. */
  composeBy = $state('');
  /** Id of the kept run compared with the shown one (null: no comparison). */
  compareWith = $state<number | null>(null);
  /** Profile of the shown run for `composeBy`, once the worker returns it. */
  profile = $state.raw<RunProfile | null>(null);
  profiling = $state(false);
  profileError = $state('');
  drawn = $state<DrawnFigures>({
    mixBars: 0, mixSegments: 0, mixBound: 0, fingerprintCells: 0, timelineStrips: 0, timelineWindows: 0, contingencyCells: 0, comparisonAri: NaN,
  });
  private profileKey = '';
  private profileRequest = 0;

  constructor(private readonly deps: RunsDeps, private readonly client: JobClient<Jobs>) {}

  /** The kept entry of the shown run. */
  get shown(): KeptRun | null {
    const run = this.deps.study.run;
    return this.deps.study.kept.find((k) => k.run === run) ?? null;
  }

  /** The column the Mix composes by (the subject column when none was chosen). */
  composeColumnName(): string {
    const { table } = this.deps.study;
    const run = this.deps.study.run;
    if (!table || !run) return '';
    if (this.composeBy && findColumn(table, this.composeBy)) return this.composeBy;
    return run.roles.find((r) => r.role === 'subject')?.name ?? '';
  }

  /** Asks the worker for the shown run's profile unless it is the one on screen or on its way. */
  ensureProfile(): void {
    const { table } = this.deps.study;
    const run = this.deps.study.run;
    const kept = this.shown;
    if (!table || !run || !kept) { this.profile = null; this.profileKey = ''; return; }
    const column = this.composeColumnName();
    // Curated labels: a new array only when windows moved (merge, split, move), so names and colours do not recompute.
    const labels = this.deps.curation.labelsOf(run);
    const key = `${kept.id}|${column}|${labelsId(labels)}`;
    if (key === this.profileKey) return;
    this.profileKey = key;
    const request = ++this.profileRequest;
    this.profile = null;
    this.profiling = true;
    this.profileError = '';
    let matrix;
    try {
      matrix = featureMatrix(table, run.roles);
    } catch (err) {
      this.profiling = false;
      this.profileError = describeError(err, table.fileName);
      return;
    }
    const subject = run.roles.find((r) => r.role === 'subject')?.name;
    const payload = {
      data: matrix.data, n: matrix.n, d: matrix.d, featureNames: matrix.featureNames,
      labels: tableLabels({ labels, windows: run.result.windows }, table.nRows),
      k: Math.max(run.result.cluster.k, this.deps.curation.k),
      compose: column ? findColumn(table, column) : undefined,
      noun: column && column === subject ? 'subject' : column || 'value',
      label: columnWithRole(table, run.roles, 'label'),
    };
    const job = this.client.run('profile', payload, { transfer: [payload.data.buffer, payload.labels.buffer] });
    job.result.then(
      (profile) => { if (request === this.profileRequest) { this.profile = profile; this.profiling = false; } },
      (err: unknown) => {
        if (request !== this.profileRequest) return;
        this.profiling = false;
        this.profileKey = '';
        this.profileError = describeError(err, table.fileName);
      },
    );
  }

  /**
   * Re-runs the shown run with the same parameters and its recipe's scaling done within each
   * subject, keeps it as a new run, shows it and compares it with the run it came from.
   */
  async rerunSubjectScaled(): Promise<void> {
    const app = this.deps;
    const { table, source } = app.study;
    const base = this.shown;
    if (!table || !source || !base || app.status.busy) return;
    app.status.dismissError();
    const roles = base.run.roles;
    const subject = columnWithRole(table, roles, 'subject');
    if (!subject) {
      app.status.fail('Cannot scale per subject', `${source.fileName}: no column has the role "subject"; give one that role, then try again.`, 'Nothing was run.');
      return;
    }
    let matrix;
    try {
      matrix = featureMatrix(table, roles);
    } catch (err) {
      app.status.fail('Cannot run', describeError(err, source.fileName), 'Fix the roles, then try again.');
      return;
    }
    matrix.subjectCodes = subjectCodes(subject).codes;
    const params = { ...base.run.params, recipe: subjectScaledRecipe(base.run.params.recipe) };
    app.status.start(`Re-running ${base.name} with per-subject scaling on ${matrix.n} windows…`);
    try {
      const job = app.track(this.client.run('analyze', { matrix, params }, {
        onProgress: (p) => app.status.progress(p.stage, p.fraction, p.detail),
      }));
      const result = await job.result;
      app.study.setRun({ result, params, roles, featureNames: matrix.featureNames });
      this.compareWith = base.id;
      app.selection.clear();
      app.map.fitNext = true;
      app.ranOne();
      app.status.finish(`Per-subject scaling: ${result.cluster.k} clusters · silhouette ${result.metrics.silhouette.toFixed(2)} · compared with ${base.name}.`);
    } catch (err) {
      if (isCancelled(err)) app.status.finish('Re-run cancelled.');
      else app.status.fail('The re-run failed', describeError(err, source.fileName), `Kept ${base.name}.`);
    }
  }
}
