import type { AnalysisResult, ClusterRecord } from '../../core/analysis.types';
import { cutTree } from '../../core/cluster/hierarchy/cut';
import type { Jobs } from '../../worker/jobs';
import { NewestJob } from '../../worker/newest-job';
import type { JobClient } from '../../worker/client';
import type { RecutResult } from '../../worker/recut-job';
import { describeError, isCancelled } from '../lib/errors';
import type { RunParams } from './params.svelte';
import type { Status } from './status.svelte';
import type { Study } from './study.svelte';
import { PARAMS } from '../../core/params';
import { recipeInput } from './recipe.svelte';
import { runName } from './kept-run';
import type { Run } from '../../core/run/run.types';
import type { ClusterNote, CurationAction } from '../../core/curation/curation.types';
import { emptyNote } from '../../core/curation/initial-state';
import { carryIdentities, type RememberedCluster } from '../../core/curation/carry-identities';
import type { MergeTree } from '../../core/cluster/hierarchy/merge-tree';

/** A cut may leave at most this many clusters (the Map's colour index is one byte). */
export const MAX_TREE_CUT = 255;

/** What the tree cut needs of the curation: the shown run's curated clusters, and a way to record notes. */
export interface TreeCutCuration {
  labelsOf(run: Run): Int32Array;
  /** The shown run's cluster notes. */
  readonly clusters: readonly Readonly<ClusterNote>[];
  /** Bumped by every curation change. */
  readonly revision: number;
  /** What the study file records of a run's curation, and rebuilding it on a run. */
  recorded(run: Run): { actions: CurationAction[]; undone: CurationAction[] };
  restore(run: Run, recorded: { actions: CurationAction[]; undone: CurationAction[] }): void;
}

/** What the tree cut works on (given by AppState: no pointer back to it). */
export interface TreeCutDeps {
  readonly study: Study;
  readonly params: RunParams;
  readonly status: Status;
  readonly curation: TreeCutCuration;
}

/**
 * Clusters in a hierarchical run's cut. After a re-cut the run's labels keep each cluster's index
 * (carryIdentities), so indices can have gaps and `result.cluster.k` counts index slots; the
 * parameters hold the cut itself (`params.cluster.k`). A run straight from the worker has no gaps.
 */
export function cutClusters(run: Run | null | undefined): number {
  if (!run?.result.tree) return 0;
  const choice = run.params.cluster;
  // A fresh run: cluster.k clusters (its choice may ask for more than the tree has); a re-cut: the choice.
  const slots = run.result.cluster.k;
  return choice && choice.method !== 'kmeans' && choice.method !== 'hdbscan' && typeof choice.k === 'number' ? Math.min(choice.k, slots) : slots;
}

/** A dropped cluster an earlier re-cut of the same tree remembered: its windows and its notes. */
interface Remembered extends RememberedCluster {
  note: Readonly<ClusterNote>;
  /** The cluster that took this one's name when it was merged away (it had none of its own), or -1. */
  adopter: number;
}

/** The run a move of the cut started from, with its curated labels and notes (identities carry from it). */
interface Anchor {
  run: Run;
  k: number;
  labels: Int32Array;
  notes: readonly Readonly<ClusterNote>[];
  /** The clusters remembered when the move began: every cut of the move starts from these. */
  memory: readonly Remembered[];
}

/**
 * The cut of the shown run's tree. Moving the cut recomputes the window labels here on the UI
 * thread (cutTree is one union–find pass over the leaves) and shows them through `setLabels`, so
 * the Map, the cluster list and every view recolour at once; when the drag ends, the worker adds
 * the confidence and cluster means of the new cut (`commit`).
 *
 * Identities persist: every cut is relabelled (`carryIdentities`) against the anchor, the run that
 * was shown when the cut was first moved after the last curation change (drags and arrow keys in
 * between are one move), so each surviving cluster keeps its index (its number and palette
 * colour), and its notes (class and working name, colour, description, set aside) are recorded as
 * curation actions on the new run; going back to the anchor's cut shows the anchor run itself, its
 * curation and undo history whole. Clusters a re-cut merged away are remembered per tree (in
 * memory, not in the study file) and take their index and notes back when a later cut gives back
 * most of their windows.
 */
export class TreeCut {
  /** The worker is computing confidence and means of the latest cut. */
  pending = $state(false);
  /** Branches the Tree view drew last (the test hook reads it). */
  drawnBranches = $state(0);
  private readonly newest = new NewestJob<RecutResult>();
  /** The run the current move of the cut started from. */
  private anchor: Anchor | null = null;
  /** The run the latest cut of this move made (a different shown run starts a new move). */
  private latest: Run | null = null;
  /** The curation's revision after the latest cut (a change since then starts a new move). */
  private revisionAt = -1;
  /** Clusters re-cuts dropped, per tree, by index (not reactive: no view reads it). */
  private readonly memory = new WeakMap<MergeTree, Remembered[]>();

  constructor(private readonly deps: TreeCutDeps, private readonly client: JobClient<Jobs>) {}

  /** Clusters in the shown run's cut (0 when it has no tree). */
  get k(): number {
    return cutClusters(this.deps.study.run);
  }

  /** Cuts the shown tree into k clusters and shows the labels; returns false when there is no tree or k is out of range. */
  cutInto(k: number): boolean {
    const run = this.deps.study.run;
    const tree = run?.result.tree;
    if (!run || !tree || run.result.cluster.method !== 'hierarchical') return false;
    const kk = Math.max(2, Math.min(k, tree.n, MAX_TREE_CUT));
    if (kk === cutClusters(run)) return true;
    const anchor = this.anchorFor(run);
    if (kk === anchor.k) {
      // Back where the move started: that run, with its curation as it was.
      this.replace(run, anchor.run);
      this.latest = anchor.run;
      this.memory.set(tree, anchor.memory.slice());
      this.revisionAt = this.deps.curation.revision;
      return true;
    }
    const leafLabels = cutTree(tree, { k: kk });
    const leafOf = run.result.treeLeafOf;
    const labels = leafOf ? Int32Array.from(leafOf, (leaf) => leafLabels[leaf]) : leafLabels;
    this.showCut(run, anchor, tree, labels, kk);
    return true;
  }

  /**
   * Shows new flat labels (0..k-1, a cut of the tree) of the shown hierarchical run: identities are
   * carried from the run the move started from, and the run is replaced (same place in the study's
   * list) by one whose labels, sizes and parameters are those of the new cut.
   */
  setLabels(labels: Int32Array): void {
    const run = this.deps.study.run;
    const tree = run?.result.tree;
    if (!run || !tree || run.result.cluster.method !== 'hierarchical' || labels.length !== run.result.labels.length) return;
    let max = -1;
    for (const c of labels) if (c > max) max = c;
    const present = new Uint8Array(max + 1);
    for (const c of labels) present[c] = 1;
    this.showCut(run, this.anchorFor(run), tree, labels, present.reduce((a, b) => a + b, 0));
  }

  private anchorFor(run: Run): Anchor {
    if (this.anchor && this.latest === run && this.deps.curation.revision === this.revisionAt) return this.anchor;
    const { curation } = this.deps;
    const memory = run.result.tree ? (this.memory.get(run.result.tree) ?? []).slice() : [];
    this.anchor = { run, k: cutClusters(run), labels: curation.labelsOf(run), notes: curation.clusters.slice(), memory };
    this.latest = run;
    return this.anchor;
  }

  private showCut(run: Run, anchor: Anchor, tree: MergeTree, cut: Int32Array, k: number): void {
    const memory = anchor.memory.slice();
    const carried = carryIdentities(anchor.labels, cut, { remembered: memory });
    const { labels, slots } = carried;
    const sizes = new Int32Array(slots);
    for (let i = 0; i < labels.length; i++) sizes[labels[i]]++;
    const old = run.result.cluster;
    if (old.method !== 'hierarchical') return;
    const cluster: ClusterRecord = { method: 'hierarchical', linkage: old.linkage, k: slots, path: old.path, space: old.space };
    // The silhouette belongs to the old cut: unknown (NaN, sample 0) until the worker measures this one (commit).
    const result: AnalysisResult = { ...run.result, labels, sizes, cluster, metrics: { ...run.result.metrics, silhouette: NaN, silhouetteSampleSize: 0 } };
    const next: Run = { ...run, result, params: { ...run.params, k, cluster: { method: old.linkage, k } } };
    // Notes of every cluster that keeps (or takes back) an identity.
    const notes: (Readonly<ClusterNote> | undefined)[] = new Array(slots);
    carried.indexOf.forEach((index, j) => {
      if (carried.origin[j] === 'kept') notes[index] = anchor.notes[index];
      else if (carried.origin[j] === 'remembered') notes[index] = memory.find((r) => r.index === index)?.note;
    });
    // A remembered cluster back with its name: the cluster that held the name meanwhile gives it back.
    carried.indexOf.forEach((index, j) => {
      if (carried.origin[j] !== 'remembered') return;
      const r = memory.find((m) => m.index === index), a = r ? notes[r.adopter] : undefined;
      if (r && a && a.name === r.note.name && a.className === r.note.className) notes[r.adopter] = { ...a, name: '', className: '' };
    });
    // Clusters merged away: remembered; a kept cluster without a user name takes the name of the
    // largest one merged into it, so no name the user gave is lost from the screen.
    const anchorSizes = new Int32Array(anchor.notes.length);
    for (const c of anchor.labels) if (c >= 0 && c < anchorSizes.length) anchorSizes[c]++;
    const dropped = [...carried.dropped].sort((a, b) => anchorSizes[b.index] - anchorSizes[a.index] || a.index - b.index);
    // The windows of every dropped cluster, in one pass over the anchor's labels.
    const slot = new Int32Array(anchorSizes.length).fill(-1);
    dropped.forEach((x, i) => { slot[x.index] = i; });
    const members = dropped.map((x) => new Int32Array(anchorSizes[x.index]));
    const filled = new Int32Array(dropped.length);
    anchor.labels.forEach((c, i) => {
      const at = c >= 0 && c < slot.length ? slot[c] : -1;
      if (at >= 0) members[at][filled[at]++] = i;
    });
    for (const [i, { index, into }] of dropped.entries()) {
      const note = anchor.notes[index];
      if (!note) continue;
      const windows = members[i];
      const target = carried.indexOf[into], kept = notes[target];
      const adopts = !!(note.name || note.className) && !(kept?.name || kept?.className);
      if (adopts) notes[target] = { ...(kept ?? emptyNote()), name: note.name, className: note.className };
      const at = memory.findIndex((r) => r.index === index);
      memory.splice(at < 0 ? memory.length : at, 1, { index, windows, note, adopter: adopts ? target : -1 });
    }
    // An index in use again is no longer a remembered one.
    const inUse = new Uint8Array(slots);
    for (const index of carried.indexOf) if (index < slots) inUse[index] = 1;
    this.memory.set(tree, memory.filter((r) => !(r.index < slots && inUse[r.index])));
    const actions: CurationAction[] = [];
    notes.forEach((note, cluster) => {
      if (!note || note.mergedInto >= 0) return;
      if (note.className) actions.push({ type: 'promote', cluster, className: note.className });
      if (note.name) actions.push({ type: 'name', cluster, name: note.name });
      if (note.colour) actions.push({ type: 'colour', cluster, colour: note.colour });
      if (note.description) actions.push({ type: 'describe', cluster, description: note.description });
      if (note.setAside) actions.push({ type: 'set-aside', cluster, value: true });
    });
    this.replace(run, next);
    this.latest = next;
    if (actions.length > 0) this.deps.curation.restore(next, { actions, undone: [] });
    this.revisionAt = this.deps.curation.revision;
    const { status } = this.deps;
    if (!status.busy) status.message = `Tree cut into ${k} clusters (${old.linkage}) · confidence follows when the cut is let go`;
  }

  /** Asks the worker for the confidence and cluster means of the shown cut (after a drag ends). */
  async commit(): Promise<void> {
    const { study } = this.deps;
    const run = study.run, table = study.table;
    if (!run || !table || run.result.cluster.method !== 'hierarchical') return;
    this.newest.cancel();
    this.pending = false;
    const k = cutClusters(run);
    // The side panel follows the cut, so Run reproduces it.
    if (k <= PARAMS.k.panel.max) {
      this.deps.params.k = k;
      this.deps.params.cutBy = 'k';
    }
    // Back at the anchor's cut: that run's confidence is the cut's already.
    if (run === this.anchor?.run) {
      this.deps.status.finish(`Tree cut into ${k} clusters (${run.result.cluster.linkage}) · ${run.result.labels.length} windows`);
      return;
    }
    this.pending = true;
    const job = this.client.run('recut', {
      matrix: recipeInput(table, run.roles).matrix, params: run.params, labels: run.result.labels, coords: run.result.coords,
    });
    this.newest.start(job);
    try {
      const { confidence, centroids, silhouette, silhouetteSampleSize } = await job.result;
      if (study.run !== run) return; // the cut moved on, or another run is shown
      const next: Run = { ...run, result: { ...run.result, confidence, centroids, metrics: { ...run.result.metrics, silhouette, silhouetteSampleSize } } };
      const untouched = this.revisionAt === this.deps.curation.revision;
      this.replace(run, next, true);
      if (this.latest === run) {
        this.latest = next;
        // Still the same move unless the user curated while the job ran.
        if (untouched) this.revisionAt = this.deps.curation.revision;
      }
      this.deps.status.finish(`Tree cut into ${k} clusters (${run.result.cluster.linkage}) · ${run.result.labels.length} windows`);
    } catch (err) {
      if (!isCancelled(err)) this.deps.status.fail('The new cut could not be completed', describeError(err, 'tree cut'), 'Confidence still shows the previous cut.');
    } finally {
      if (this.newest.end(job)) {
        this.pending = false;
      }
    }
  }

  /** Puts `next` in the place of `run` in the study's list and shows it; `sameLabels` keeps the curation made on `run`. */
  private replace(run: Run, next: Run, sameLabels = false): void {
    const { study, curation } = this.deps;
    const recorded = sameLabels ? curation.recorded(run) : null;
    study.kept = study.kept.map((e) => (e.run === run ? { ...e, run: next, name: runName(e.id, next), names: [] } : e));
    study.run = next;
    study.clusterNames = Array.from({ length: next.result.cluster.k }, () => '');
    if (recorded && (recorded.actions.length > 0 || recorded.undone.length > 0)) curation.restore(next, recorded);
  }
}
