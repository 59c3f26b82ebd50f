import { InputError, OptionError } from '../errors';

/** A contiguous run of samples [start, end) recorded without interruption. */
export interface Segment {
  start: number;
  end: number;
}

export interface WindowOptions {
  /** Window length in seconds (default 5). */
  windowSeconds?: number;
  /** Step between window starts in seconds (default = windowSeconds, i.e. no overlap). */
  hopSeconds?: number;
}

export interface ResolvedWindowOptions {
  windowSeconds: number;
  hopSeconds: number;
  /** Window length in samples. */
  windowSamples: number;
  /** Step in samples. */
  hopSamples: number;
}

/** Validate window options against a sample rate; lengths in samples are rounded to whole samples. */
export function resolveWindowOptions(sampleRateHz: number, options: WindowOptions = {}): ResolvedWindowOptions {
  if (!(Number.isFinite(sampleRateHz) && sampleRateHz > 0)) {
    throw new OptionError('sampleRateHz', sampleRateHz, 'a positive number of samples per second');
  }
  const windowSeconds = options.windowSeconds ?? 5;
  if (!(Number.isFinite(windowSeconds) && windowSeconds > 0)) {
    throw new OptionError('windowSeconds', windowSeconds, 'a positive number of seconds');
  }
  const hopSeconds = options.hopSeconds ?? windowSeconds;
  if (!(Number.isFinite(hopSeconds) && hopSeconds > 0)) {
    throw new OptionError('hopSeconds', hopSeconds, 'a positive number of seconds');
  }
  const windowSamples = Math.round(windowSeconds * sampleRateHz);
  const hopSamples = Math.round(hopSeconds * sampleRateHz);
  if (windowSamples < 4) {
    throw new OptionError('windowSeconds', windowSeconds, `at least 4 samples per window at ${sampleRateHz} Hz`);
  }
  if (hopSamples < 1) throw new OptionError('hopSeconds', hopSeconds, `at least 1 sample at ${sampleRateHz} Hz`);
  return { windowSeconds, hopSeconds, windowSamples, hopSamples };
}

/**
 * Start indices of the full windows that fit inside the given segments (or inside one segment of
 * `nSamples` samples). A window never crosses a segment boundary, so gaps in a recording
 * (non-wear, dropped data) produce gaps between windows, never windows over missing time. The
 * remainder at the end of a segment that is shorter than a window is dropped.
 */
export function windowStarts(
  samples: number | readonly Segment[],
  sampleRateHz: number,
  options: WindowOptions = {},
): Int32Array {
  const { windowSamples, hopSamples } = resolveWindowOptions(sampleRateHz, options);
  const segments: readonly Segment[] = typeof samples === 'number' ? [{ start: 0, end: samples }] : samples;
  const starts: number[] = [];
  for (const seg of segments) {
    for (let s = seg.start; s + windowSamples <= seg.end; s += hopSamples) starts.push(s);
  }
  return Int32Array.from(starts);
}

/**
 * Split a recording into contiguous segments at gaps in its time stamps: a new segment starts
 * wherever consecutive stamps are further apart than `maxGapSamples` sample periods (default 1.5).
 * Time stamps must increase.
 */
export function contiguousSegments(
  timeSeconds: ArrayLike<number>,
  sampleRateHz: number,
  options: { maxGapSamples?: number; fileName?: string; column?: string } = {},
): Segment[] {
  const maxGap = (options.maxGapSamples ?? 1.5) / sampleRateHz;
  const segments: Segment[] = [];
  const n = timeSeconds.length;
  if (n === 0) return segments;
  let start = 0;
  for (let i = 1; i < n; i++) {
    const dt = timeSeconds[i] - timeSeconds[i - 1];
    if (!(dt > 0)) {
      throw new InputError({
        file: options.fileName ?? 'recording',
        row: i + 2,
        column: options.column ?? 'time_s',
        expected: 'time stamps that increase from row to row',
        found: String(timeSeconds[i]),
      });
    }
    if (dt > maxGap) {
      segments.push({ start, end: i });
      start = i;
    }
  }
  segments.push({ start, end: n });
  return segments;
}
