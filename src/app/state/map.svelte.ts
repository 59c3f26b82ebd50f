import type { MapView } from '../map/view';

/** How the Map colours windows: by cluster, subject, start time, or a label, metadata or feature column by name. */
import type { ColourBy } from '../map/colouring';

export type { ColourBy };
export type MapTool = 'pan' | 'box' | 'lasso';

/** What the Map shows and how: colouring, the active tool, and what was last drawn. */
export class MapState {
  colourBy = $state<ColourBy>('cluster');
  tool = $state<MapTool>('pan');
  /** Set after a new run: the Map fits the new points into view on its next draw. */
  fitNext = $state(false);
  /**
   * Set when a t-SNE or UMAP run ends: `view` is the last live frame's, kept (not refitted) on the
   * next draw even if the canvas size differs, so the final Map continues from the live one.
   */
  continueView = false;
  /** The user zoomed or panned since the last fit; until then a resize refits the view. */
  userMoved = false;
  /** The last drawn frame, for the status line and the test hook. */
  view = $state.raw<MapView | null>(null);
  pointsDrawn = $state(0);
  clustersDrawn = $state(0);
  /** The canvas element, for converting map positions to page positions. */
  canvas = $state.raw<HTMLCanvasElement | null>(null);
}
