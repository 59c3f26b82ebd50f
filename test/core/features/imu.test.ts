import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { featurizeImuRecording } from '../../../src/core/features/featurize';
import { FEATURE_NAMES, imuFeatures, type ImuChannels } from '../../../src/core/features/imu';
import { normal, seededRandom } from '../../../src/core/random';

const FS = 50;
const N = 250;

function channels(f: (i: number) => [number, number, number, number, number, number], n = N): ImuChannels {
  const c = Array.from({ length: 6 }, () => new Float64Array(n));
  for (let i = 0; i < n; i++) f(i).forEach((v, k) => (c[k][i] = v));
  return { accX: c[0], accY: c[1], accZ: c[2], gyrX: c[3], gyrY: c[4], gyrZ: c[5] };
}

function byName(values: Float64Array): Record<string, number> {
  return Object.fromEntries(FEATURE_NAMES.map((name, j) => [name, values[j]]));
}

describe('FEATURE_NAMES', () => {
  it('lists 40 unique snake_case names', () => {
    expect(FEATURE_NAMES).toHaveLength(40);
    expect(new Set(FEATURE_NAMES).size).toBe(40);
    for (const name of FEATURE_NAMES) expect(name).toMatch(/^[a-z][a-z0-9]*(_[a-z0-9]+)*$/);
  });
});

describe('imuFeatures', () => {
  it('gives known means and zero spread for a still watch (face up, gyro 3-4-0 deg/s)', () => {
    const f = byName(imuFeatures(channels(() => [0, 0, 1, 3, 4, 0]), FS, 0, N));
    expect(f.acc_z_mean).toBe(1);
    expect(f.acc_x_mean).toBe(0);
    expect(f.acc_z_sd).toBe(0);
    expect(f.acc_z_range).toBe(0);
    expect(f.acc_mag_mean).toBe(1);
    expect(f.acc_mag_sd).toBe(0);
    expect(f.acc_mag_p90).toBe(1);
    expect(f.acc_dom_freq_hz).toBe(0);
    expect(f.acc_band_1_3hz).toBe(0);
    expect(f.acc_jerk).toBe(0);
    expect(f.acc_corr_xy).toBe(0);
    // |(3, 4, 0)| = 5 (Pythagorean triple).
    expect(f.gyr_mag_mean).toBeCloseTo(5, 12);
    expect(f.gyr_mag_sd).toBeCloseTo(0, 12);
  });

  it('finds the step rhythm of a 2 Hz bounce along gravity and its energy (A²/2)', () => {
    const A = 0.3;
    const f = byName(imuFeatures(channels((i) => [0, 0, 1 + A * Math.sin((2 * Math.PI * 2 * i) / FS + 0.1), 0, 0, 0]), FS, 0, N));
    expect(f.acc_dom_freq_hz).toBe(2);
    // Mean power of a sine is A²/2 and its SD (ddof 0, over whole periods) is A/√2 (textbook).
    expect(f.acc_band_1_3hz).toBeCloseTo((A * A) / 2, 10);
    expect(f.acc_mag_sd).toBeCloseTo(A / Math.SQRT2, 10);
    expect(f.acc_mag_mean).toBeCloseTo(1, 10);
    expect(f.acc_band_3_6hz).toBeCloseTo(0, 10);
    expect(f.acc_mag_range).toBeLessThanOrEqual(2 * A);
    expect(f.acc_mag_range).toBeGreaterThan(2 * A * 0.98);
  });

  it('gives the ddof-0 SD and the percentiles of a known series', () => {
    // Magnitudes 2,4,4,4,5,5,7,9 repeated: population SD 2 (textbook example), numpy-style
    // linear percentiles of the 8-value pattern repeated are easy to check by hand.
    const pattern = [2, 4, 4, 4, 5, 5, 7, 9];
    const f = byName(imuFeatures(channels((i) => [pattern[i % 8], 0, 0, 0, 0, 0], 240), FS, 0, 240));
    expect(f.acc_x_sd).toBeCloseTo(2, 12);
    expect(f.acc_mag_sd).toBeCloseTo(2, 12);
    expect(f.acc_mag_p50).toBe(4.5);
    expect(f.acc_x_range).toBe(7);
  });

  it('gives ±1 for perfectly (anti)correlated axes (Pearson, textbook definition)', () => {
    const random = seededRandom(3);
    const base = Float64Array.from({ length: N }, () => normal(random));
    const f = byName(imuFeatures(channels((i) => [base[i], 2 * base[i] + 0.5, -base[i], 0, 0, 0]), FS, 0, N));
    expect(f.acc_corr_xy).toBeCloseTo(1, 12);
    expect(f.acc_corr_xz).toBeCloseTo(-1, 12);
    expect(f.acc_corr_yz).toBeCloseTo(-1, 12);
  });

  it('measures jerk as the mean absolute change of the magnitude per second', () => {
    // Magnitude rising 0.01 g per sample at 50 Hz changes by 0.5 g/s.
    const f = byName(imuFeatures(channels((i) => [0, 0, 1 + 0.01 * i, 0, 0, 0]), FS, 0, N));
    expect(f.acc_jerk).toBeCloseTo(0.5, 10);
  });
});

describe('featurizeImuRecording', () => {
  it('gives one row per window, each equal to imuFeatures of that window', () => {
    const random = seededRandom(9);
    const rec = channels(() => [normal(random), normal(random), 1 + normal(random), 10 * normal(random), 0, 0], 800);
    const { starts, features } = featurizeImuRecording({ channels: rec, sampleRateHz: FS });
    expect(Array.from(starts)).toEqual([0, 250, 500]);
    expect(features.n).toBe(3);
    expect(features.d).toBe(FEATURE_NAMES.length);
    expect(features.featureNames).toEqual(FEATURE_NAMES);
    const second = imuFeatures(rec, FS, 250, 250);
    expect(Array.from(features.data.subarray(features.d, 2 * features.d))).toEqual(Array.from(second));
  });

  it('rejects channels of unequal length, naming the channel', () => {
    const rec = { ...channels(() => [0, 0, 1, 0, 0, 0], 300), gyrY: new Float64Array(299) };
    expect(() => featurizeImuRecording({ channels: rec, sampleRateHz: FS, fileName: 'S02.csv' })).toThrow(InputError);
    expect(() => featurizeImuRecording({ channels: rec, sampleRateHz: FS, fileName: 'S02.csv' })).toThrow(/S02\.csv, column "gyr_y"/);
  });
});
