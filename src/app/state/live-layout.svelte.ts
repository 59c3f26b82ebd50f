import type { AnalysisPartial } from '../../core/analysis.types';

/**
 * The layout of a running t-SNE or UMAP as the worker offers it (a few times per second), for the
 * live Map and the status bar: iteration or epoch, cost where known, elapsed time and ETA.
 */
export class LiveLayout {
  /** The latest offered coordinates (the sample's, when sampling); null when no run is live. */
  coords = $state.raw<Float32Array | null>(null);
  unit = $state<AnalysisPartial['unit']>('iteration');
  step = $state(0);
  steps = $state(0);
  cost = $state<number | undefined>(undefined);
  /** Milliseconds since the run started, and the estimate of what is left (null until known). */
  elapsedMs = $state(0);
  etaMs = $state<number | null>(null);
  /** Partials received since the app started, and live Map frames drawn (for the test hook). */
  partials = $state(0);
  frames = $state(0);
  /** The user's drag (CSS pixels) and zoom on top of the fitted live layout; reset by each run. */
  panX = $state(0);
  panY = $state(0);
  zoom = $state(1);
  private startedAt = 0;
  private running = false;

  start(now: number): void {
    this.coords = null;
    this.panX = 0;
    this.panY = 0;
    this.zoom = 1;
    this.step = 0;
    this.steps = 0;
    this.cost = undefined;
    this.elapsedMs = 0;
    this.etaMs = null;
    this.startedAt = now;
    this.running = true;
  }

  /** A progress message: elapsed, and the ETA from the share of the job done so far. */
  tick(now: number, fraction: number): void {
    if (!this.running) return;
    this.elapsedMs = now - this.startedAt;
    this.etaMs = fraction > 0.02 && fraction < 1 ? (this.elapsedMs * (1 - fraction)) / fraction : null;
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
    this.etaMs = null;
  }

  get active(): boolean {
    return this.running;
  }
}

/** "1 min 05 s", "12 s": short durations for the status bar. */
export function formatDuration(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  if (s < 60) return `${s} s`;
  return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
}
