export { bandPower, createSpectrum, dominantFrequency, type Spectrum } from './spectrum';
export { mean, pearson, percentileSorted, range, sdPopulation } from './stats';
export {
  contiguousSegments,
  resolveWindowOptions,
  windowStarts,
  type ResolvedWindowOptions,
  type Segment,
  type WindowOptions,
} from './windowing';
export {
  ACC_BANDS,
  createImuFeaturizer,
  FEATURE_NAMES,
  IMU_CHANNEL_NAMES,
  imuFeatures,
  MIN_DOMINANT_HZ,
  type ImuChannels,
  type ImuFeaturizer,
} from './imu';
export { featurizeImuRecording, type FeaturizedWindows, type ImuRecording } from './featurize';
