/** What the CLI shows while a job runs. */
export interface ProgressReporter {
  update(stage: string, fraction: number): void;
  /** Clears the bar (TTY) so the next output starts on a clean line. */
  finish(): void;
}

const BAR_WIDTH = 28;
const REDRAW_MS = 80;

/** How progress is shown: `auto` is `bar` on a terminal and `none` otherwise. */
export type ProgressMode = 'auto' | 'bar' | 'lines' | 'none';
export const PROGRESS_MODES: readonly ProgressMode[] = ['auto', 'bar', 'lines', 'none'];

/** Plain progress lines (for batch logs) are written at most this often, besides stage changes. */
const LINE_INTERVAL_MS = 2000;

/**
 * `bar`: a one-line progress bar redrawn in place (terminals). `lines`: a plain line at each new
 * stage and every few seconds (batch logs). `none`: nothing, so stderr carries only real messages.
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
  return {
    update(stage, fraction) {
      const t = now();
      if (t - last < REDRAW_MS && fraction < 1) return;
      last = t;
      shown = true;
      stream.write(`\r\x1b[K${renderBar(stage, fraction, stream.columns > 0 ? stream.columns : 80)}`);
    },
    finish() {
      if (shown) stream.write('\r\x1b[K');
      shown = false;
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
  return {
    update(stage, fraction) {
      const t = now();
      if (stage === lastStage && t - last < LINE_INTERVAL_MS) return;
      lastStage = stage;
      last = t;
      stream.write(`gleaner: ${stage} ${Math.floor(Math.max(0, Math.min(1, fraction)) * 100)}%\n`);
    },
    finish() {},
  };
}
