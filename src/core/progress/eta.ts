/**
 * When to show a job's "time left", and what it is. Pure: the caller passes every time in (ms on
 * one monotonic clock), so the same reports give the same answers in the app, the CLI and tests.
 *
 * The estimate is the remaining share of the job divided by the rate measured over the last
 * `windowMs` of the current stage (stages run at different speeds, so a rate is never carried over
 * a stage change). It is shown only when all of these hold:
 * - at least `minElapsedMs` since the job started and at least `minFraction` of it done;
 * - the fraction moved within the last `stallMs` (a stalled job has no honest ETA);
 * - the stage has run for `agreeMs` after its first estimate, and the estimates of the end made in
 *   the last `agreeMs` agree: each lies within `tolerance` × the time left (or `slackMs`, if larger)
 *   of the newest, and they do not trend: the end moved by at most `maxDrift` seconds per second
 *   between the oldest and the newest (or by `slackMs` in all). A job speeding up or slowing down
 *   moves its estimated end steadily, which a range check alone lets through.
 * Otherwise `at()` returns null and the ETA is hidden.
 */
export interface EtaOptions {
  minElapsedMs: number;
  minFraction: number;
  windowMs: number;
  /** The rate is measured over at least this long within a stage before an estimate is made. */
  minWindowMs: number;
  agreeMs: number;
  tolerance: number;
  maxDrift: number;
  slackMs: number;
  stallMs: number;
}

export const ETA_DEFAULTS: Readonly<EtaOptions> = {
  minElapsedMs: 5000,
  minFraction: 0.05,
  windowMs: 20_000,
  minWindowMs: 2000,
  agreeMs: 3000,
  tolerance: 0.15,
  maxDrift: 0.25,
  slackMs: 1500,
  stallMs: 5000,
};

interface Sample { t: number; f: number }

/**
 * History is kept at about this spacing (the newest report always counts): a caller reporting
 * thousands of times a second (a kernel driven in-process by the CLI) keeps it short.
 */
const SAMPLE_MS = 100;

export class EtaEstimator {
  private readonly o: EtaOptions;
  private stage: string | null = null;
  /** Reports of the current stage within the rate window (oldest first). */
  private samples: Sample[] = [];
  /** Estimates of the end time made in the current stage (oldest first, pruned to agreeMs). */
  private ends: Sample[] = [];
  private stageFirstEstimate = Infinity;
  private lastFraction = 0;
  private lastAdvance: number;

  constructor(private readonly startedAt: number, options: Partial<EtaOptions> = {}) {
    this.o = { ...ETA_DEFAULTS, ...options };
    this.lastAdvance = startedAt;
  }

  /** A progress report: the fraction done of the whole job (0..1) at time t, in stage `stage`. */
  report(t: number, fraction: number, stage: string): void {
    const f = Math.max(0, Math.min(1, Number.isFinite(fraction) ? fraction : 0));
    if (f > this.lastFraction) this.lastAdvance = t;
    this.lastFraction = Math.max(this.lastFraction, f);
    if (stage !== this.stage) {
      this.stage = stage;
      this.samples = [];
      this.ends = [];
      this.stageFirstEstimate = Infinity;
    }
    // The newest report is always the last sample; it replaces one kept less than SAMPLE_MS before.
    const n = this.samples.length;
    if (n >= 2 && t - this.samples[n - 2].t < SAMPLE_MS) this.samples[n - 1] = { t, f };
    else this.samples.push({ t, f });
    while (this.samples.length > 2 && this.samples[1].t <= t - this.o.windowMs) this.samples.shift();
    const first = this.samples[0];
    const span = t - first.t;
    if (span < this.o.minWindowMs || f <= first.f) return;
    const rate = (f - first.f) / span;
    const end = t + (1 - f) / rate;
    const m = this.ends.length;
    if (m >= 2 && t - this.ends[m - 2].t < SAMPLE_MS) this.ends[m - 1] = { t, f: end };
    else this.ends.push({ t, f: end });
    if (this.stageFirstEstimate === Infinity) this.stageFirstEstimate = t;
    while (this.ends.length > 1 && this.ends[0].t < t - this.o.agreeMs) this.ends.shift();
  }

  /** Milliseconds left to show at time t, or null when the estimate is not (yet) to be trusted. */
  at(t: number): number | null {
    const o = this.o;
    if (t - this.startedAt < o.minElapsedMs || this.lastFraction < o.minFraction || this.lastFraction >= 1) return null;
    if (t - this.lastAdvance > o.stallMs) return null;
    if (this.ends.length < 3 || t - this.stageFirstEstimate < o.agreeMs) return null;
    const newest = this.ends[this.ends.length - 1].f;
    const left = newest - t;
    const allowed = Math.max(o.slackMs, o.tolerance * Math.max(0, left));
    for (const e of this.ends) if (Math.abs(e.f - newest) > allowed) return null;
    const oldest = this.ends[0];
    const moved = Math.abs(newest - oldest.f);
    const over = this.ends[this.ends.length - 1].t - oldest.t;
    if (moved > o.slackMs && moved > o.maxDrift * over) return null;
    return Math.max(0, left);
  }
}
