import { bandPower, createSpectrum, dominantFrequency } from './spectrum';
import { mean, pearson, percentileSorted, range, sdPopulation } from './stats';

/**
 * Per-window features of a wrist IMU: 3-axis accelerometer in g and 3-axis gyroscope in deg/s.
 * All SDs are population SDs (ddof = 0). Spectral features follow spectrum.ts (mean removed,
 * rectangular window, one-sided periodogram summing to the variance).
 */

/** Six channels of equal length, sample i of each taken at the same instant. */
export interface ImuChannels {
  accX: ArrayLike<number>;
  accY: ArrayLike<number>;
  accZ: ArrayLike<number>;
  gyrX: ArrayLike<number>;
  gyrY: ArrayLike<number>;
  gyrZ: ArrayLike<number>;
}

export const IMU_CHANNEL_NAMES = ['acc_x', 'acc_y', 'acc_z', 'gyr_x', 'gyr_y', 'gyr_z'] as const;

/** Frequency bands (Hz, low inclusive, high exclusive) of the acceleration-magnitude energy features. */
export const ACC_BANDS: readonly (readonly [number, number, string])[] = [
  [0.3, 1, 'acc_band_0p3_1hz'],
  [1, 3, 'acc_band_1_3hz'],
  [3, 6, 'acc_band_3_6hz'],
  [6, 12, 'acc_band_6_12hz'],
  [12, Infinity, 'acc_band_12hz_up'],
];

/** Rhythms slower than this are posture drift, not a dominant frequency. */
export const MIN_DOMINANT_HZ = 0.3;

const AXES = ['x', 'y', 'z'] as const;

/** Feature names in output order (stable snake_case; units: g, deg/s, Hz, g², g/s). */
export const FEATURE_NAMES: readonly string[] = [
  ...AXES.flatMap((a) => [`acc_${a}_mean`, `acc_${a}_sd`, `acc_${a}_range`]),
  ...AXES.flatMap((a) => [`gyr_${a}_mean`, `gyr_${a}_sd`, `gyr_${a}_range`]),
  'acc_mag_mean',
  'acc_mag_sd',
  'acc_mag_range',
  'acc_mag_p10',
  'acc_mag_p50',
  'acc_mag_p90',
  'acc_dom_freq_hz',
  'acc_dom_power_share',
  ...ACC_BANDS.map((b) => b[2]),
  'acc_jerk',
  'acc_corr_xy',
  'acc_corr_xz',
  'acc_corr_yz',
  'gyr_mag_mean',
  'gyr_mag_sd',
  'gyr_mag_range',
  'gyr_mag_p90',
  'gyr_dom_freq_hz',
];

export interface ImuFeaturizer {
  readonly sampleRateHz: number;
  readonly windowSamples: number;
  /**
   * Write the FEATURE_NAMES.length features of the window channels[start .. start + windowSamples)
   * into out[outOffset ..]. A NaN sample makes the features that read it NaN (missing).
   */
  compute(channels: ImuChannels, start: number, out: Float64Array, outOffset?: number): void;
}

/** A featurizer with its scratch buffers and DFT tables allocated once, for many windows. */
export function createImuFeaturizer(sampleRateHz: number, windowSamples: number): ImuFeaturizer {
  const n = windowSamples;
  const accMag = new Float64Array(n);
  const gyrMag = new Float64Array(n);
  const sorted = new Float64Array(n);
  const spectrum = createSpectrum(n, sampleRateHz);

  function compute(ch: ImuChannels, start: number, out: Float64Array, outOffset = 0): void {
    const end = start + n;
    let o = outOffset;
    for (const axis of [ch.accX, ch.accY, ch.accZ, ch.gyrX, ch.gyrY, ch.gyrZ]) {
      out[o++] = mean(axis, start, end);
      out[o++] = sdPopulation(axis, start, end);
      out[o++] = range(axis, start, end);
    }
    for (let i = 0; i < n; i++) {
      const ax = ch.accX[start + i];
      const ay = ch.accY[start + i];
      const az = ch.accZ[start + i];
      accMag[i] = Math.sqrt(ax * ax + ay * ay + az * az);
      const gx = ch.gyrX[start + i];
      const gy = ch.gyrY[start + i];
      const gz = ch.gyrZ[start + i];
      gyrMag[i] = Math.sqrt(gx * gx + gy * gy + gz * gz);
    }
    out[o++] = mean(accMag);
    out[o++] = sdPopulation(accMag);
    out[o++] = range(accMag);
    sorted.set(accMag);
    sorted.sort();
    out[o++] = percentileSorted(sorted, 10);
    out[o++] = percentileSorted(sorted, 50);
    out[o++] = percentileSorted(sorted, 90);

    spectrum.compute(accMag);
    const dom = dominantFrequency(spectrum, MIN_DOMINANT_HZ);
    out[o++] = dom.hz;
    out[o++] = dom.share;
    for (const [lo, hi] of ACC_BANDS) out[o++] = bandPower(spectrum, lo, hi);

    let jerk = 0;
    for (let i = 1; i < n; i++) jerk += Math.abs(accMag[i] - accMag[i - 1]);
    out[o++] = (jerk / (n - 1)) * sampleRateHz;

    out[o++] = pearson(ch.accX, ch.accY, start, end);
    out[o++] = pearson(ch.accX, ch.accZ, start, end);
    out[o++] = pearson(ch.accY, ch.accZ, start, end);

    out[o++] = mean(gyrMag);
    out[o++] = sdPopulation(gyrMag);
    out[o++] = range(gyrMag);
    sorted.set(gyrMag);
    sorted.sort();
    out[o++] = percentileSorted(sorted, 90);
    spectrum.compute(gyrMag);
    out[o] = dominantFrequency(spectrum, MIN_DOMINANT_HZ).hz;
  }

  return { sampleRateHz, windowSamples, compute };
}

/** Features of one window (convenience for single windows; use createImuFeaturizer for many). */
export function imuFeatures(channels: ImuChannels, sampleRateHz: number, start: number, windowSamples: number): Float64Array {
  const out = new Float64Array(FEATURE_NAMES.length);
  createImuFeaturizer(sampleRateHz, windowSamples).compute(channels, start, out);
  return out;
}
