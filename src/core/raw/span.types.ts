/** One channel of a raw-signal span, on a regular grid: sample i is at t0 + i / rate. */
export interface ChannelSpan {
  label: string;
  unit: string;
  /** Samples per second. */
  rate: number;
  /** Time of samples[0], in seconds of the source's own time axis (see RawSource.startEpoch). */
  t0: number;
  /** Physical values; NaN where nothing was recorded (a gap in the recording or an empty cell). */
  samples: Float32Array;
}

export interface RawSpan {
  channels: ChannelSpan[];
}

/** What a raw source holds, without reading its samples. */
export interface RawChannelInfo {
  label: string;
  unit: string;
  rate: number;
}

/** A stretch of time that holds samples, in source seconds: [start, end). */
export interface Coverage {
  start: number;
  end: number;
}

/**
 * A raw-signal file opened for random access. Times are seconds on the source's axis: seconds since
 * `startEpoch` when the file carries an absolute start (EDF start date and time, ISO or Unix-second
 * CSV times), else the file's own time values.
 */
export interface RawSource {
  kind: 'edf' | 'csv';
  fileName: string;
  /** Unix seconds (UTC as written; EDF has no time zone) of time 0, or null when the file's times are relative. */
  startEpoch: number | null;
  channels: RawChannelInfo[];
  /** Stretches of time holding samples, sorted, not overlapping (one for a continuous recording). */
  coverage: Coverage[];
  /** Reads the samples in [start, end) of the chosen channels (labels or indices; default all). */
  readSpan(start: number, end: number, channels?: readonly (string | number)[]): Promise<RawSpan>;
}

/** Reads the samples of `source` in [startSeconds, endSeconds) of the chosen channels. */
export function readSpan(source: RawSource, startSeconds: number, endSeconds: number, channels?: readonly (string | number)[]): Promise<RawSpan> {
  return source.readSpan(startSeconds, endSeconds, channels);
}
