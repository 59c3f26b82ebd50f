import { toScreen } from '../map/view';
import type { AppState } from '../state/app.svelte';

/**
 * A small read-only view of the app for the end-to-end tests, installed as `window.__gleaner`.
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
  clusterOf(i: number): number;
  screenPosition(i: number): { x: number; y: number } | null;
}

export function installTestHook(app: AppState): void {
  const hook: TestHook = {
    get pointsDrawn() { return app.map.pointsDrawn; },
    get clustersDrawn() { return app.map.clustersDrawn; },
    get windows() { return app.study.table?.nRows ?? 0; },
    get selectionSize() { return app.selection.count; },
    get runCount() { return app.runCount; },
    get busy() { return app.status.busy; },
    clusterOf(i) {
      return app.study.run?.result.labels[i] ?? -1;
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
