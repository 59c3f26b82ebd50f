import type { AnalysisPartial } from '../../core/analysis.types';

/**
 * The layout of a running t-SNE or UMAP as the worker offers it (a few times per second), for the
 * live Map and the status bar's cost. Elapsed time, the ETA and the iteration or epoch counter are
 * the Status's, from progress reports (a partial can arrive after its stage has ended).
 */
export class LiveLayout {
  /** The latest offered coordinates (the sample's, when sampling); null when no run is live. */
  coords = $state.raw<Float32Array | null>(null);
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

  start(): void {
    this.coords = null;
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
