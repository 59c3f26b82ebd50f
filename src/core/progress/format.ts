/** Words and figures for progress lines, shared by the app's status bar and the CLI. */

/** 1234567 → "1,234,567" (integers; the same on every locale, so logs and tests read alike). */
export function grouped(n: number): string {
  const s = String(Math.round(Math.abs(n)));
  return (n < 0 ? '-' : '') + s.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** "1 min 05 s", "12 s": short durations. */
export function formatDuration(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  if (s < 60) return `${s} s`;
  return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
}

export interface ProgressFigures {
  stage: string;
  /** What the stage is at, as the job said with its latest report ('' for nothing). */
  detail: string;
  elapsedMs: number;
  /** null: no trustworthy estimate (see progress/eta.ts). */
  etaMs: number | null;
}

/** "embedding · t-SNE · iteration 340 / 1000 · 12 s elapsed · about 30 s left". */
export function progressText(p: ProgressFigures): string {
  const parts = [p.stage, p.detail].filter((s) => s !== '');
  parts.push(`${formatDuration(p.elapsedMs)} elapsed`);
  if (p.etaMs !== null) parts.push(`about ${formatDuration(p.etaMs)} left`);
  return parts.join(' · ');
}
