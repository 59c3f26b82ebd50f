import type { AnalysisPartial } from '../../core/analysis.types';
import type { LiveSource } from '../map/live-colouring';
import type { MapView } from '../map/view';

/**
 * The layout of a running t-SNE or UMAP as the worker offers it (a few times per second), for the
 * live Map and the status bar's cost. Elapsed time, the ETA and the iteration or epoch counter are
 * the Status's, from progress reports (a partial can arrive after its stage has ended).
 */
export class LiveLayout {
  /** The latest offered coordinates (the sample's, when sampling); null when no run is live. */
  coords = $state.raw<Float32Array | null>(null);
  /** The input row (window) of each live point; null when they are rows 0..n-1. */
  windows = $state.raw<Int32Array | null>(null);
  /**
   * What the live points may be coloured by, tried in order (taken when the run starts: the
   * previous run's curated clusters, then the chosen colour-by), and why none applies if none does.
   */
  sources = $state.raw<readonly LiveSource[]>([]);
  why = $state('');
  /** The last live frame's view (fit, zoom and pan), which the final Map continues from. */
  lastView: MapView | null = null;
  unit = $state<AnalysisPartial['unit']>('iteration');
  step = $state(0);
  steps = $state(0);
  cost = $state<number | undefined>(undefined);
  /** Partials received since the app started, and live Map frames drawn (for the test hook). */
  partials = $state(0);
  frames = $state(0);
  /** The user's drag (CSS pixels) and zoom on top of the fitted live layout; reset by each run. */
  panX = $state(0);
  panY = $state(0);
  zoom = $state(1);
  private running = false;

  start(sources: readonly LiveSource[] = [], why = ''): void {
    this.coords = null;
    this.windows = null;
    this.sources = sources;
    this.why = why;
    this.lastView = null;
    this.panX = 0;
    this.panY = 0;
    this.zoom = 1;
    this.step = 0;
    this.steps = 0;
    this.cost = undefined;
    this.running = true;
  }

  offer(p: AnalysisPartial): void {
    if (!this.running || p?.kind !== 'layout') return;
    this.partials++;
    this.coords = p.coords;
    this.windows = p.windows ?? null;
    this.unit = p.unit;
    this.step = p.step;
    this.steps = p.steps;
    if (p.cost !== undefined) this.cost = p.cost;
  }

  stop(): void {
    this.running = false;
    this.coords = null;
  }

  get active(): boolean {
    return this.running;
  }
}
