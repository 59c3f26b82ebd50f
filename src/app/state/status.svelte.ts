import { EtaEstimator } from '../../core/progress/eta';

/** The status bar's clock: how often elapsed time and the ETA are refreshed without a message. */
export const TICK_MS = 1000;

/** What the app is doing now (status bar) and the last problem to show (error banner). */
export class Status {
  /** Words for the status bar. */
  message = $state('Open a windows file (CSV) or load the demo study to begin.');
  /** A job is running: the progress bar and Cancel are shown. */
  busy = $state(false);
  stage = $state('');
  /** What the stage is at, from the latest report only: a new stage never shows an old one's. */
  detail = $state('');
  fraction = $state(0);
  /** Since start(), refreshed every TICK_MS while busy and on each report. */
  elapsedMs = $state(0);
  /** Time left, only while the estimate is stable (core/progress/eta.ts); null hides it. */
  etaMs = $state<number | null>(null);
  /** Shown in the banner until dismissed or replaced; null when there is nothing to show. */
  error = $state<{ title: string; message: string } | null>(null);
  private startedAt = 0;
  private eta: EtaEstimator | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;

  /** `now` is the clock (ms, monotonic); injected so that the ticking can be driven by hand. */
  constructor(private readonly now: () => number = () => performance.now()) {}

  start(message: string): void {
    this.busy = true;
    this.stage = '';
    this.detail = '';
    this.fraction = 0;
    this.message = message;
    this.startedAt = this.now();
    this.elapsedMs = 0;
    this.etaMs = null;
    this.eta = new EtaEstimator(this.startedAt);
    this.stopTimer();
    this.timer = setInterval(() => this.tick(), TICK_MS);
  }

  progress(stage: string, fraction: number, detail?: string): void {
    this.stage = stage;
    this.detail = detail ?? '';
    this.fraction = fraction;
    this.eta?.report(this.now(), fraction, stage);
    this.tick();
  }

  /** Elapsed time and the ETA as of now (the timer calls it once a second). */
  tick(): void {
    if (!this.busy) return;
    const t = this.now();
    this.elapsedMs = t - this.startedAt;
    this.etaMs = this.eta ? this.eta.at(t) : null;
  }

  finish(message: string): void {
    this.stopTimer();
    this.busy = false;
    this.fraction = 0;
    this.stage = '';
    this.detail = '';
    this.etaMs = null;
    this.eta = null;
    this.message = message;
  }

  fail(title: string, message: string, statusMessage: string): void {
    this.finish(statusMessage);
    this.error = { title, message };
  }

  dismissError(): void {
    this.error = null;
  }

  private stopTimer(): void {
    if (this.timer !== null) clearInterval(this.timer);
    this.timer = null;
  }
}
