import { EtaEstimator } from '../core/progress/eta';
import { progressText } from '../core/progress/format';

/** What the CLI shows while a job runs. */
export interface ProgressReporter {
  /** A report: the stage, the fraction of the job, and what the stage is at (cleared when absent). */
  update(stage: string, fraction: number, detail?: string): void;
  /** Clears the bar (TTY) so the next output starts on a clean line. */
  finish(): void;
}

const BAR_WIDTH = 28;
const REDRAW_MS = 80;
/** The bar is redrawn this often without a report, so its elapsed time keeps moving. */
const TICK_MS = 1000;

/** How progress is shown: `auto` is `bar` on a terminal and `none` otherwise. */
export type ProgressMode = 'auto' | 'bar' | 'lines' | 'none';
export const PROGRESS_MODES: readonly ProgressMode[] = ['auto', 'bar', 'lines', 'none'];

/** Plain progress lines (for batch logs) are written at most this often, besides stage changes. */
const LINE_INTERVAL_MS = 2000;

/**
 * `bar`: a one-line progress bar redrawn in place (terminals), with the stage, what it is at, the
 * elapsed time (redrawn every second) and the time left once it is stable (core/progress/eta.ts).
 * `lines`: a plain line at each new stage and every few seconds (batch logs), with the same words.
 * `none`: nothing, so stderr carries only real messages. Elapsed time counts from the first report
 * after a finish() (or after the reporter was made).
 */
export function progressReporter(
  stream: NodeJS.WriteStream,
  mode: ProgressMode = 'auto',
  now: () => number = () => performance.now(),
): ProgressReporter {
  const resolved = mode === 'auto' ? (stream.isTTY ? 'bar' : 'none') : mode;
  if (resolved === 'none') return { update() {}, finish() {} };
  if (resolved === 'lines') return linesReporter(stream, now);
  let last = -Infinity;
  let shown = false;
  const clock = runClock(now);
  let latest = { stage: '', fraction: 0, detail: '' };
  let timer: ReturnType<typeof setInterval> | null = null;
  const draw = () => {
    shown = true;
    const words = clock.words(latest.stage, latest.detail);
    stream.write(`\r\x1b[K${renderBar(words, latest.fraction, stream.columns > 0 ? stream.columns : 80)}`);
  };
  return {
    update(stage, fraction, detail) {
      clock.report(stage, fraction);
      latest = { stage, fraction, detail: detail ?? '' };
      if (timer === null) {
        timer = setInterval(draw, TICK_MS);
        timer.unref?.();
      }
      const t = now();
      if (t - last < REDRAW_MS && fraction < 1) return;
      last = t;
      draw();
    },
    finish() {
      if (timer !== null) clearInterval(timer);
      timer = null;
      clock.reset();
      if (shown) stream.write('\r\x1b[K');
      shown = false;
    },
  };
}

/** Elapsed time and the ETA of the job in progress, as words after the stage. */
function runClock(now: () => number) {
  let startedAt: number | null = null;
  let eta: EtaEstimator | null = null;
  return {
    report(stage: string, fraction: number) {
      const t = now();
      if (startedAt === null || eta === null) {
        startedAt = t;
        eta = new EtaEstimator(t);
      }
      eta.report(t, fraction, stage);
    },
    words(stage: string, detail: string): string {
      const t = now();
      return progressText({ stage, detail, elapsedMs: startedAt === null ? 0 : t - startedAt, etaMs: eta ? eta.at(t) : null });
    },
    reset() {
      startedAt = null;
      eta = null;
    },
  };
}

/** The bar's text, e.g. "[##########..................]  36% clustering". */
export function renderBar(stage: string, fraction: number, columns: number): string {
  const f = Math.max(0, Math.min(1, Number.isFinite(fraction) ? fraction : 0));
  const filled = Math.round(f * BAR_WIDTH);
  const pct = `${Math.floor(f * 100)}%`.padStart(4);
  const line = `[${'#'.repeat(filled)}${'.'.repeat(BAR_WIDTH - filled)}] ${pct} ${stage}`;
  return line.slice(0, Math.max(10, columns - 1));
}

function linesReporter(stream: NodeJS.WriteStream, now: () => number): ProgressReporter {
  let lastStage = '';
  let last = -Infinity;
  const clock = runClock(now);
  return {
    update(stage, fraction, detail) {
      clock.report(stage, fraction);
      const t = now();
      if (stage === lastStage && t - last < LINE_INTERVAL_MS) return;
      lastStage = stage;
      last = t;
      const pct = `${Math.floor(Math.max(0, Math.min(1, fraction)) * 100)}%`;
      stream.write(`gleaner: ${pct} ${clock.words(stage, detail ?? '')}\n`);
    },
    finish() {
      clock.reset();
      lastStage = '';
    },
  };
}
