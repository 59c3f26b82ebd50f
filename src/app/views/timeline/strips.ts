/** One subject's windows in time order, times in seconds since its first window. */
export interface Strip {
  subject: string;
  /** Run rows (indices into the run's labels), sorted by start. */
  rows: Int32Array;
  starts: Float64Array;
  ends: Float64Array;
  /** Seconds from the subject's first start to its last end. */
  span: number;
}

export interface StripInput {
  /** Subject code per table row (-1 = none) and the code names. */
  subjectCodes: Int32Array;
  subjectNames: readonly string[];
  /** Start time (seconds) per table row; NaN = unknown. */
  start: ArrayLike<number>;
  /** End time per table row, when known (NaN = unknown). */
  end?: ArrayLike<number>;
  /** Table row of each run row. */
  rows: Int32Array;
}

/**
 * Per subject, the run's windows in time order. A window without an end lasts until the typical
 * (median) start-to-start step of its subject; windows without a start are left out.
 */
export function buildStrips(p: StripInput): Strip[] {
  const bySubject = new Map<number, number[]>();
  for (let i = 0; i < p.rows.length; i++) {
    const row = p.rows[i];
    const s = p.subjectCodes[row];
    if (!(p.start[row] === p.start[row])) continue;
    const list = bySubject.get(s);
    if (list) list.push(i); else bySubject.set(s, [i]);
  }
  const strips: Strip[] = [];
  for (const [code, list] of [...bySubject].sort((a, b) => subjectName(p, a[0]).localeCompare(subjectName(p, b[0]), undefined, { numeric: true }))) {
    list.sort((a, b) => p.start[p.rows[a]] - p.start[p.rows[b]]);
    const t0 = p.start[p.rows[list[0]]];
    const starts = Float64Array.from(list, (i) => p.start[p.rows[i]] - t0);
    const step = medianStep(starts);
    const ends = Float64Array.from(list, (i, j) => {
      const e = p.end ? p.end[p.rows[i]] : NaN;
      return e === e && e > p.start[p.rows[i]] ? e - t0 : starts[j] + step;
    });
    let span = 0;
    for (let j = 0; j < ends.length; j++) span = Math.max(span, ends[j]);
    strips.push({ subject: subjectName(p, code), rows: Int32Array.from(list), starts, ends, span });
  }
  return strips;
}

function subjectName(p: StripInput, code: number): string {
  return code >= 0 ? p.subjectNames[code] ?? String(code) : '(no subject)';
}

function medianStep(starts: Float64Array): number {
  const steps: number[] = [];
  for (let j = 1; j < starts.length; j++) if (starts[j] > starts[j - 1]) steps.push(starts[j] - starts[j - 1]);
  if (steps.length === 0) return 1;
  steps.sort((a, b) => a - b);
  return steps[Math.floor(steps.length / 2)];
}

/** Index in the strip of the window covering time t (seconds since the subject's start), or -1. */
export function windowAt(strip: Strip, t: number): number {
  let lo = 0, hi = strip.starts.length - 1, found = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (strip.starts[mid] <= t) { found = mid; lo = mid + 1; } else hi = mid - 1;
  }
  return found >= 0 && t < strip.ends[found] ? found : -1;
}

/**
 * The bout around window j: the neighbours of the same cluster with no gap between them
 * (a gap is a start later than the previous end by more than `tolerance` seconds). Returns
 * [first, last] strip indices.
 */
export function boutAt(strip: Strip, labels: ArrayLike<number>, j: number, tolerance = 0.5): [number, number] {
  const c = labels[strip.rows[j]];
  let a = j, b = j;
  while (a > 0 && labels[strip.rows[a - 1]] === c && strip.starts[a] - strip.ends[a - 1] <= tolerance) a--;
  while (b < strip.rows.length - 1 && labels[strip.rows[b + 1]] === c && strip.starts[b + 1] - strip.ends[b] <= tolerance) b++;
  return [a, b];
}

/** The visible stretch of time: [t0, t1] seconds. */
export interface TimeView {
  t0: number;
  t1: number;
}

/** Zooms by `factor` (< 1 zooms in) keeping time `at` under the pointer; stays within [0, max], at least 10 s wide. */
export function zoomAt(v: TimeView, at: number, factor: number, max: number): TimeView {
  const width = Math.min(max, Math.max(10, (v.t1 - v.t0) * factor));
  const f = (at - v.t0) / (v.t1 - v.t0 || 1);
  return clampView({ t0: at - f * width, t1: at - f * width + width }, max);
}

/** Moves the view by dt seconds, within [0, max]. */
export function panBy(v: TimeView, dt: number, max: number): TimeView {
  return clampView({ t0: v.t0 + dt, t1: v.t1 + dt }, max);
}

function clampView(v: TimeView, max: number): TimeView {
  const w = v.t1 - v.t0;
  if (w >= max) return { t0: 0, t1: max };
  if (v.t0 < 0) return { t0: 0, t1: w };
  if (v.t1 > max) return { t0: max - w, t1: max };
  return v;
}

/** "1 h 05 min", "12 min 30 s", "45 s" for axis ticks and the view's width. */
export function durationText(s: number): string {
  if (s >= 3600) return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, '0')} min`;
  if (s >= 60) return `${Math.floor(s / 60)} min${s % 60 >= 1 ? ` ${Math.round(s % 60)} s` : ''}`;
  return `${Math.round(s)} s`;
}

/** A tick step (seconds) giving about `target` ticks over `width` seconds. */
export function tickStep(width: number, target = 8): number {
  const steps = [5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 21600, 43200, 86400];
  return steps.find((s) => width / s <= target) ?? 86400 * Math.ceil(width / 86400 / target);
}
