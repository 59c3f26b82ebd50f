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

/** A cut may leave at most this many clusters (the Map's colour index is one byte). */
export const MAX_TREE_CUT = 255;

/** What the tree cut works on (given by AppState: no pointer back to it). */
export interface TreeCutDeps {
  readonly study: Study;
  readonly params: RunParams;
  readonly status: Status;
}

/**
 * The cut of the shown run's tree. Moving the cut recomputes the window labels here on the UI
 * thread (cutTree is one union–find pass over the leaves) and shows them through `setLabels`, so
 * the Map, the cluster list and every view recolour at once; when the drag ends, the worker adds
 * the confidence and cluster means of the new cut (`commit`).
 */
export class TreeCut {
  /** The worker is computing confidence and means of the latest cut. */
  pending = $state(false);
  /** Branches the Tree view drew last (the test hook reads it). */
  drawnBranches = $state(0);
  private readonly newest = new NewestJob<RecutResult>();

  constructor(private readonly deps: TreeCutDeps, private readonly client: JobClient<Jobs>) {}

  /** Clusters of the shown run (0 when it has no tree). */
  get k(): number {
    const r = this.deps.study.run?.result;
    return r?.tree ? r.cluster.k : 0;
  }

  /** Cuts the shown tree into k clusters and shows the labels; returns false when there is no tree or k is out of range. */
  cutInto(k: number): boolean {
    const run = this.deps.study.run;
    const tree = run?.result.tree;
    if (!run || !tree || run.result.cluster.method !== 'hierarchical') return false;
    const kk = Math.max(2, Math.min(k, tree.n, MAX_TREE_CUT));
    if (kk === run.result.cluster.k) return true;
    const leafLabels = cutTree(tree, { k: kk });
    const leafOf = run.result.treeLeafOf;
    const labels = leafOf ? Int32Array.from(leafOf, (leaf) => leafLabels[leaf]) : leafLabels;
    this.setLabels(labels);
    return true;
  }

  /**
   * Shows new flat labels of the shown hierarchical run: the run is replaced (same place in the
   * study's list) by one whose labels, sizes, k and parameters are those of the new cut. Cluster
   * names and curation start afresh, since they belonged to the old clusters.
   */
  setLabels(labels: Int32Array): void {
    const { study } = this.deps;
    const run = study.run;
    if (!run || run.result.cluster.method !== 'hierarchical' || labels.length !== run.result.labels.length) return;
    let k = 0;
    for (let i = 0; i < labels.length; i++) if (labels[i] + 1 > k) k = labels[i] + 1;
    const sizes = new Int32Array(k);
    for (let i = 0; i < labels.length; i++) sizes[labels[i]]++;
    const old = run.result.cluster;
    const cluster: ClusterRecord = { method: 'hierarchical', linkage: old.linkage, k, path: old.path, space: old.space };
    // The silhouette belongs to the old cut: unknown (NaN, sample 0) until the worker measures this one (commit).
    const result: AnalysisResult = { ...run.result, labels, sizes, cluster, metrics: { ...run.result.metrics, silhouette: NaN, silhouetteSampleSize: 0 } };
    const next: Run = { ...run, result, params: { ...run.params, k, cluster: { method: old.linkage, k } } };
    this.replace(run, next);
  }

  /** Asks the worker for the confidence and cluster means of the shown cut (after a drag ends). */
  async commit(): Promise<void> {
    const { study } = this.deps;
    const run = study.run, table = study.table;
    if (!run || !table || run.result.cluster.method !== 'hierarchical') return;
    this.newest.cancel();
    this.pending = true;
    // The side panel follows the cut, so Run reproduces it.
    if (run.result.cluster.k <= PARAMS.k.panel.max) {
      this.deps.params.k = run.result.cluster.k;
      this.deps.params.cutBy = 'k';
    }
    const job = this.client.run('recut', {
      matrix: recipeInput(table, run.roles).matrix, params: run.params, labels: run.result.labels, coords: run.result.coords,
    });
    this.newest.start(job);
    try {
      const { confidence, centroids, silhouette, silhouetteSampleSize } = await job.result;
      if (study.run !== run) return; // the cut moved on, or another run is shown
      this.replace(run, { ...run, result: { ...run.result, confidence, centroids, metrics: { ...run.result.metrics, silhouette, silhouetteSampleSize } } });
      this.deps.status.finish(`Tree cut into ${run.result.cluster.k} clusters (${run.result.cluster.linkage}) · ${run.result.labels.length} windows`);
    } catch (err) {
      if (!isCancelled(err)) this.deps.status.fail('The new cut could not be completed', describeError(err, 'tree cut'), 'Confidence still shows the previous cut.');
    } finally {
      if (this.newest.end(job)) {
        this.pending = false;
      }
    }
  }

  private replace(run: Run, next: Run): void {
    const { study } = this.deps;
    study.kept = study.kept.map((e) => (e.run === run ? { ...e, run: next, name: runName(e.id, next), names: [] } : e));
    study.run = next;
    study.clusterNames = Array.from({ length: next.result.cluster.k }, () => '');
  }
}
