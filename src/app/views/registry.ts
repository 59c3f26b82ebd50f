import type { Component } from 'svelte';
import FingerprintsView from './FingerprintsView.svelte';
import MixView from './MixView.svelte';
import RunsView from './RunsView.svelte';
import TimelineView from './TimelineView.svelte';
import TracesView from './TracesView.svelte';
import TreeView from './TreeView.svelte';
import SweepView from './SweepView.svelte';
import QualityView from './QualityView.svelte';

/**
 * The views shown in the dock beside the Map. Each view is one component that reads the app
 * state from context (useApp) and shares the one selection; adding a view is one entry here.
 */
export interface ViewEntry {
  id: string;
  title: string;
  /** One line shown as the tab's tooltip. */
  hint: string;
  component: Component;
}

export const VIEWS: ViewEntry[] = [
  { id: 'tree', title: 'Tree', hint: 'Dendrogram of a hierarchical run: drag the cut line to change the clusters, hover a branch to light its windows on the Map', component: TreeView },
  { id: 'sweep', title: 'Sweep k', hint: 'Inertia, silhouette, Calinski–Harabasz and Davies–Bouldin over a range of k; click a k to use it', component: SweepView },
  { id: 'mix', title: 'Mix', hint: 'What each cluster is made of: subjects or another column, with subject-bound flags', component: MixView },
  { id: 'fingerprints', title: 'Fingerprints', hint: 'Standardized feature means per cluster and the features that set a cluster apart', component: FingerprintsView },
  { id: 'timeline', title: 'Timeline', hint: 'Per subject, the cluster of each window over time', component: TimelineView },
  { id: 'traces', title: 'Traces', hint: 'Raw signal behind the selected windows, or a cluster\'s typical and borderline members', component: TracesView },
  { id: 'quality', title: 'Quality', hint: 'Missing values per subject and feature, near-constant and correlated features, extreme values; each with the recipe step that fixes it', component: QualityView },
  { id: 'runs', title: 'Runs', hint: 'Runs kept in this study; compare two; re-run with per-subject scaling', component: RunsView },
];
