import { toScreen } from './map/view';
import type { AppState } from './state/app.svelte';
import type { DrawnFigures } from './state/runs.svelte';

/**
 * A small read-only view of the app for the end-to-end tests, installed as `window.__gleaner` only when a test asks (enableTestHook in test/e2e/harness.ts).
 * It exposes only what a test needs to check the Map and to aim the mouse; it changes nothing.
 *
 * - pointsDrawn, clustersDrawn: from the Map's last frame
 * - windows: rows in the open study; selectionSize: windows in the shared selection
 * - runCount: completed runs since start; busy: a job is running
 * - clusterOf(i): cluster of window i in the latest run (-1 when none)
 * - screenPosition(i): where window i's point is on the page (CSS pixels), or null
 */
export interface TestHook {
  readonly pointsDrawn: number;
  readonly clustersDrawn: number;
  readonly windows: number;
  readonly selectionSize: number;
  readonly runCount: number;
  readonly busy: boolean;
  /** Windows lit up on the Map by the Tree branch under the pointer. */
  readonly highlightSize: number;
  /** Branches the Tree drew last (0 when it is not shown). */
  readonly treeBranches: number;
  /** Points drawn in the sweep view's charts (0 when none). */
  readonly sweepPoints: number;
  /** k of the shown run (0 when none). */
  readonly k: number;
  /** What the Mix, Fingerprints, Timeline and Runs views drew last (runs.svelte.ts DrawnFigures). */
  readonly views: DrawnFigures;
  clusterOf(i: number): number;
  /** Jobs started since load, by job name (reopening a study must start no 'analyze' or 'split'). */
  readonly jobsStarted: Readonly<Record<string, number>>;
  /** Autosaves written since load. */
  readonly autosaves: number;
  /** Display name and colour of a cluster of the shown run, as every view shows them. */
  clusterName(c: number): string;
  clusterColour(c: number): string;
  /** Whether a cluster of the shown run is set aside. */
  clusterSetAside(c: number): boolean;
  screenPosition(i: number): { x: number; y: number } | null;
  /** Layout partials received from running t-SNE/UMAP jobs, and live Map frames drawn from them. */
  readonly partials: number;
  readonly liveFrames: number;
  /** The user's drag of the live Map (CSS pixels) since the run started. */
  readonly livePan: { x: number; y: number };
  /** The last live frame's view and the Map's view (data centre and scale), to check the hand-over. */
  readonly liveLastView: { centreX: number; centreY: number; scale: number } | null;
  readonly mapView: { centreX: number; centreY: number; scale: number } | null;
}

export function installTestHook(app: AppState): void {
  const hook: TestHook = {
    get pointsDrawn() { return app.map.pointsDrawn; },
    get clustersDrawn() { return app.map.clustersDrawn; },
    get windows() { return app.study.table?.nRows ?? 0; },
    get selectionSize() { return app.selection.count; },
    get runCount() { return app.runCount; },
    get busy() { return app.status.busy; },
    get highlightSize() { return app.selection.branchCount; },
    get treeBranches() { return app.treeCut.drawnBranches; },
    get sweepPoints() { return app.sweep.drawnPoints; },
    get k() { return app.study.run?.result.cluster.k ?? 0; },
    get views() { return { ...app.runs.drawn }; },
    clusterOf(i) {
      return app.curation.labels?.[i] ?? app.study.run?.result.labels[i] ?? -1;
    },
    get jobsStarted() { return { ...app.jobsStarted }; },
    get autosaves() { return app.studyFile.autosaves; },
    clusterName: (c) => app.curation.displayName(c),
    clusterColour: (c) => app.curation.colour(c),
    clusterSetAside: (c) => app.curation.clusters[c]?.setAside ?? false,
    get partials() { return app.live.partials; },
    get liveFrames() { return app.live.frames; },
    get livePan() { return { x: app.live.panX, y: app.live.panY }; },
    get liveLastView() {
      const v = app.live.lastView;
      return v && { centreX: v.centreX, centreY: v.centreY, scale: v.scale };
    },
    get mapView() {
      const v = app.map.view;
      return v && { centreX: v.centreX, centreY: v.centreY, scale: v.scale };
    },
    screenPosition(i) {
      const run = app.study.run, view = app.map.view, canvas = app.map.canvas;
      if (!run || !view || !canvas || i < 0 || i >= run.result.labels.length) return null;
      const [x, y] = toScreen(view, run.result.coords[2 * i], run.result.coords[2 * i + 1]);
      const box = canvas.getBoundingClientRect();
      return { x: box.left + x, y: box.top + y };
    },
  };
  Object.defineProperty(window, '__gleaner', { value: Object.freeze(hook), configurable: false });
}
