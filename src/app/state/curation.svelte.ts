import {
  canRedo, canUndo, classNames, clusterSizes, createHistory, initialCuration, record, redo, setAsideFlags, undo,
  type ClusterNote, type CurationAction, type CurationState, type History,
} from '../../core/curation';
import { SvelteMap } from 'svelte/reactivity';
import { featureMatrix } from '../../core/table/matrix';
import type { Jobs } from '../../worker/jobs';
import type { JobClient } from '../../worker/client';
import { describeError, isCancelled } from '../lib/errors';
import { categoryColour, MISSING_COLOUR } from '../lib/palette';
import type { Colouring } from '../map/colouring';
import { packHex } from '../map/raster';
import type { Status } from './status.svelte';
import type { Study } from './study.svelte';
import type { Run } from '../../core/run/run.types';
import { candidateName, clusterIdentities, type ClusterIdentity } from '../../core/export/run-model';
import { keepRows } from '../../core/recipe/keep-rows';
import type { Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';
import { recipeInput } from './recipe.svelte';

/** The mean silhouette the cluster list shows: the run's, or one measured on the curated clusters. */
export interface ShownSilhouette {
  value: number;
  /** Being measured for the clusters shown (the previous figure would be stale). */
  pending: boolean;
  /** Measured on the curated clusters rather than the run's own. */
  curated: boolean;
}

/** Up to this many clusters get their own Map colour slot (the Map's colour index is one byte). */
const MAP_SLOTS = 255;

/** Recorded curation of one run, as the study file keeps it. */
export interface RecordedCuration {
  actions: CurationAction[];
  undone: CurationAction[];
}

/** What the curation works on (given by AppState: no pointer back to it). */
export interface CurationDeps {
  readonly study: Study;
  readonly status: Status;
}

/**
 * The curation of the runs in the study: one undo/redo History per run (so a kept run keeps its
 * names and merges when shown again). Every view reads the shown run's clusters here: the curated
 * label of each window, the display name and colour of each cluster, which are set aside.
 */
export class Curation {
  /** Histories of runs that were curated (a reactive map: views update on every change). */
  private readonly histories = new SvelteMap<Run, History>();
  /** Blank histories of runs not curated yet (not reactive: they never change). */
  private readonly blank = new WeakMap<Run, History>();
  private readonly sizeCache = new WeakMap<CurationState, Int32Array>();
  private readonly identityCache = new WeakMap<CurationState, ClusterIdentity[]>();
  private readonly analysedCache = new WeakMap<Run, { table: Table; roles: Roles }>();
  /** Bumped by every change (autosave watches it). */
  revision = $state(0);
  /** A split is running in the worker. */
  splitting = $state(false);
  /** The silhouette measured on curated labels (the labels array it was measured on). */
  private measured = $state.raw<{ labels: Int32Array; silhouette: number } | null>(null);
  private measuring: Int32Array | null = null;

  constructor(private readonly deps: CurationDeps, private readonly client: JobClient<Jobs>) {
    deps.study.namer = (c) => this.displayName(c);
  }

  /** The shown run's history (a blank one until the first change). */
  get history(): History | null {
    const run = this.deps.study.run;
    if (!run) return null;
    const h = this.histories.get(run);
    if (h) return h;
    let b = this.blank.get(run);
    if (!b) {
      b = createHistory(initialCuration(run.result.labels, run.result.cluster.k, run.result.cluster));
      this.blank.set(run, b);
    }
    return b;
  }

  get state(): CurationState | null {
    return this.history?.present ?? null;
  }

  /** Curated cluster per analysed window (the run's labels before any change). */
  get labels(): Int32Array | null {
    return this.state?.labels ?? null;
  }

  get clusters(): readonly Readonly<ClusterNote>[] {
    return this.state?.clusters ?? [];
  }

  /** Clusters in the curation, emptied ones included (splits and moves to a new cluster add some). */
  get k(): number {
    return this.clusters.length;
  }

  /** Curated cluster per window of `run` when it is the shown run, else the run's own labels. */
  labelsOf(run: Run): Int32Array {
    return run === this.deps.study.run ? (this.labels ?? run.result.labels) : run.result.labels;
  }

  get sizes(): Int32Array {
    const s = this.state;
    if (!s) return new Int32Array(0);
    let sizes = this.sizeCache.get(s);
    if (!sizes) {
      sizes = clusterSizes(s);
      this.sizeCache.set(s, sizes);
    }
    return sizes;
  }

  /**
   * Every cluster's identity in the shown run's curation (number, name, class, size, flags): the
   * same function every export calls, so the screen and the files cannot disagree.
   */
  get identities(): ClusterIdentity[] {
    const run = this.deps.study.run;
    const s = this.state;
    return run && s ? this.identitiesOf(run, s) : [];
  }

  /** The identities of a run's curation now (the shown run's, or a kept run's last state). */
  identitiesOf(run: Run, state: CurationState | null = this.stateOf(run)): ClusterIdentity[] {
    if (!state) return [];
    let ids = this.identityCache.get(state);
    if (!ids) {
      const analysed = this.analysed(run);
      ids = clusterIdentities({ state, table: analysed?.table, roles: analysed?.roles });
      this.identityCache.set(state, ids);
    }
    return ids;
  }

  /** A run's curation state now: its history's present, or the run's own labels uncurated. */
  private stateOf(run: Run): CurationState | null {
    if (run === this.deps.study.run) return this.state;
    return this.histories.get(run)?.present ?? initialCuration(run.result.labels, run.result.cluster.k, run.result.cluster);
  }

  /** The rows the run analysed (the recipe may have dropped some), for the composition flags. */
  private analysed(run: Run): { table: Table; roles: Roles } | null {
    const table = this.deps.study.table;
    if (!table) return null;
    let a = this.analysedCache.get(run);
    if (!a) {
      a = run.result.windows ? keepRows(table, run.roles, run.result.windows) : { table, roles: run.roles };
      if (a.table.nRows !== run.result.labels.length) return null;
      this.analysedCache.set(run, a);
    }
    return a;
  }

  /**
   * The mean silhouette of the clusters shown: the run's own until windows move (merge, split,
   * move), then measured again on the curated labels in the worker (`ensureSilhouette`).
   */
  get silhouette(): ShownSilhouette | null {
    const run = this.deps.study.run;
    const labels = this.labels;
    if (!run || !labels) return null;
    if (labels === run.result.labels || this.sameAsRun(labels, run.result.labels)) {
      return { value: run.result.metrics.silhouette, pending: run.result.metrics.silhouetteSampleSize === 0, curated: false };
    }
    const m = this.measured;
    if (m && m.labels === labels) return { value: m.silhouette, pending: false, curated: true };
    return { value: NaN, pending: true, curated: true };
  }

  /** Asks the worker for the silhouette of the curated labels when they differ from the run's and were not measured yet. */
  ensureSilhouette(): void {
    const run = this.deps.study.run, table = this.deps.study.table;
    const labels = this.labels;
    if (!run || !table || !labels || this.sameAsRun(labels, run.result.labels)) return;
    if (this.measured?.labels === labels || this.measuring === labels) return;
    this.measuring = labels;
    let matrix;
    try {
      matrix = recipeInput(table, run.roles).matrix;
    } catch {
      return; // the roles no longer give a matrix: the list says the figure is pending
    }
    const job = this.client.run('silhouette', { matrix, params: run.params, labels: labels.slice() }, { transfer: [matrix.data.buffer] });
    job.result.then(
      (r) => { if (this.measuring === labels) { this.measured = { labels, silhouette: r.silhouette }; this.measuring = null; } },
      () => { if (this.measuring === labels) this.measuring = null; },
    );
  }

  /** Curated labels equal to the run's (nothing moved, or moves undone). */
  private sameAsRun(labels: Int32Array, runLabels: Int32Array): boolean {
    if (labels === runLabels) return true;
    if (labels.length !== runLabels.length) return false;
    for (let i = 0; i < labels.length; i++) if (labels[i] !== runLabels[i]) return false;
    return true;
  }

  /** Indices of clusters still in use (not emptied by a merge or a move). */
  get live(): number[] {
    const sizes = this.sizes;
    return this.clusters.flatMap((c, i) => (c.mergedInto < 0 && sizes[i] > 0 ? [i] : []));
  }

  get canUndo(): boolean {
    const h = this.history;
    return !!h && canUndo(h);
  }

  get canRedo(): boolean {
    const h = this.history;
    return !!h && canRedo(h);
  }

  /** The name shown for a cluster: its class name, else its working name, else "candidate N" (its identity's name). */
  displayName(c: number): string {
    const note = this.clusters[c];
    return note?.className || note?.name || candidateName(c);
  }

  /** The colour chosen for a cluster, else its palette colour (what the colour picker shows). */
  chosenColour(c: number): string {
    return this.clusters[c]?.colour || categoryColour(c);
  }

  /** The colour every view draws a cluster in: light grey once set aside, else its chosen colour. */
  colour(c: number): string {
    return this.clusters[c]?.setAside ? MISSING_COLOUR : this.chosenColour(c);
  }

  /** Class name per cluster ('' for candidates and set-aside clusters), for exports. */
  classNames(): string[] {
    const s = this.state;
    return s ? classNames(s) : [];
  }

  setAside(): boolean[] {
    const s = this.state;
    return s ? setAsideFlags(s) : [];
  }

  /** Applies one change to the shown run; returns false (and reports why) when it does not fit. */
  apply(action: CurationAction): boolean {
    const run = this.deps.study.run, h = this.history;
    if (!run || !h) return false;
    try {
      this.commit(run, record(h, action));
      return true;
    } catch (err) {
      this.deps.status.fail('That change could not be made', describeError(err, 'curation'), 'The clusters are as they were.');
      return false;
    }
  }

  undo(): void {
    const run = this.deps.study.run, h = this.history;
    if (run && h && canUndo(h)) this.commit(run, undo(h));
  }

  redo(): void {
    const run = this.deps.study.run, h = this.history;
    if (run && h && canRedo(h)) this.commit(run, redo(h));
  }

  /** What the study file records for a run. */
  recorded(run: Run): RecordedCuration {
    const h = this.histories.get(run);
    return { actions: h ? [...h.done] : [], undone: h ? [...h.undone] : [] };
  }

  /** Rebuilds a run's history from a study file: the actions done, then those undone (redo still works). */
  restore(run: Run, rec: RecordedCuration): void {
    let h = createHistory(initialCuration(run.result.labels, run.result.cluster.k, run.result.cluster));
    for (const a of rec.actions) h = record(h, a);
    // `undone` lists the most recently undone last: redo replays it from the end.
    for (let i = rec.undone.length - 1; i >= 0; i--) h = record(h, rec.undone[i]);
    for (let i = 0; i < rec.undone.length; i++) h = undo(h);
    this.commit(run, h);
  }

  /** Splits a cluster into k parts: k-means on its windows in the worker, then one 'split' action. */
  async split(cluster: number, k: number): Promise<void> {
    const { table, run } = this.deps.study;
    const labels = this.labels;
    if (!table || !run || !labels || this.splitting) return;
    const members: number[] = [];
    for (let i = 0; i < labels.length; i++) if (labels[i] === cluster) members.push(i);
    this.splitting = true;
    this.deps.status.start(`Splitting ${this.displayName(cluster)} (${members.length} windows) into ${k}…`);
    try {
      const matrix = featureMatrix(table, run.roles);
      const job = this.client.run('split', { matrix, params: run.params, members: Int32Array.from(members), k }, {
        onProgress: (p) => this.deps.status.progress(p.stage, p.fraction),
      });
      const parts = await job.result;
      if (this.deps.study.run !== run || this.labels !== labels) {
        this.deps.status.finish('The split was dropped: the clusters changed while it ran.');
        return;
      }
      if (this.apply({ type: 'split', cluster, k, parts })) this.deps.status.finish(`Split ${this.displayName(cluster)} into ${k} clusters.`);
    } catch (err) {
      if (isCancelled(err)) this.deps.status.finish('Split cancelled.');
      else this.deps.status.fail('The split failed', describeError(err, this.deps.study.source?.fileName ?? 'study'), 'The clusters are as they were.');
    } finally {
      this.splitting = false;
    }
  }

  /** The Map's colouring by curated cluster: chosen colours, set-aside clusters grey, emptied ones left out of the legend. */
  colouring(): Colouring | null {
    const labels = this.labels;
    if (!labels) return null;
    const n = this.clusters.length;
    const slots = Math.min(n, MAP_SLOTS);
    const palette = new Uint32Array(slots + 1);
    for (let c = 0; c < slots; c++) palette[c] = packHex(this.colour(c));
    palette[slots] = packHex(MISSING_COLOUR);
    const index = new Uint8Array(labels.length);
    for (let i = 0; i < labels.length; i++) index[i] = labels[i] < 0 ? slots : labels[i] % MAP_SLOTS;
    const ids = this.identities;
    const entries = this.live.map((c) => ({
      name: this.clusters[c].setAside ? `${this.displayName(c)} (set aside)` : this.displayName(c),
      colour: this.colour(c),
      number: c + 1,
      flags: (ids[c]?.flags ?? []).map((f) => ({ text: f.text, reason: f.reason })),
    }));
    return { index, palette, legend: { kind: 'categories', title: 'cluster', entries } };
  }

  private commit(run: Run, h: History): void {
    this.histories.set(run, h);
    this.revision++;
  }
}
