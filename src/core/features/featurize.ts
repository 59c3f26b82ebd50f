import type { FeatureMatrix } from '../analysis.types';
import { InputError } from '../errors';
import { createImuFeaturizer, FEATURE_NAMES, IMU_CHANNEL_NAMES, type ImuChannels } from './imu';
import { resolveWindowOptions, windowStarts, type Segment, type WindowOptions } from './windowing';

/** A raw IMU recording: six equal-length channels at one sample rate. */
export interface ImuRecording {
  channels: ImuChannels;
  sampleRateHz: number;
  /** Contiguous parts of the recording (see contiguousSegments); default: one segment, all samples. */
  segments?: readonly Segment[];
  /** Where the samples came from, for error messages. */
  fileName?: string;
}

export interface FeaturizedWindows {
  /** Index of each window's first sample in the recording. */
  starts: Int32Array;
  /** Samples per window. */
  windowSamples: number;
  /** One row per window, FEATURE_NAMES as columns. */
  features: FeatureMatrix;
}

/** Cut a recording into windows (see windowStarts) and compute the IMU features of every window. */
export function featurizeImuRecording(recording: ImuRecording, options: WindowOptions = {}): FeaturizedWindows {
  const { channels, sampleRateHz } = recording;
  const file = recording.fileName ?? 'recording';
  const list = [channels.accX, channels.accY, channels.accZ, channels.gyrX, channels.gyrY, channels.gyrZ];
  const length = list[0].length;
  list.forEach((c, i) => {
    if (c.length !== length) {
      throw new InputError({
        file,
        column: IMU_CHANNEL_NAMES[i],
        expected: `${length} samples, like ${IMU_CHANNEL_NAMES[0]}`,
        found: `${c.length} samples`,
      });
    }
  });
  const segments = recording.segments ?? [{ start: 0, end: length }];
  for (const s of segments) {
    if (!(Number.isInteger(s.start) && Number.isInteger(s.end) && s.start >= 0 && s.start <= s.end && s.end <= length)) {
      throw new InputError({ file, expected: `segments inside 0..${length}`, found: `${s.start}..${s.end}` });
    }
  }
  const { windowSamples } = resolveWindowOptions(sampleRateHz, options);
  const starts = windowStarts(segments, sampleRateHz, options);
  const d = FEATURE_NAMES.length;
  const data = new Float64Array(starts.length * d);
  const featurizer = createImuFeaturizer(sampleRateHz, windowSamples);
  for (let w = 0; w < starts.length; w++) featurizer.compute(channels, starts[w], data, w * d);
  return { starts, windowSamples, features: { data, n: starts.length, d, featureNames: [...FEATURE_NAMES] } };
}
