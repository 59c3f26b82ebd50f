import { describe, expect, it } from 'vitest';
import { placeWindows, stratifiedSample } from '../../../src/core/embed/place';
import { CancelledError } from '../../../src/core/errors';
import type { JobContext } from '../../../src/core/job';
import { seededRandom } from '../../../src/core/random';

describe('stratifiedSample', () => {
  const codes = Int32Array.from({ length: 1000 }, (_, i) => (i < 600 ? 0 : i < 900 ? 1 : 2));

  it('draws each subject in proportion to its windows, distinct and ascending', () => {
    const s = stratifiedSample(1000, 100, codes, seededRandom(3));
    expect(s).toHaveLength(100);
    expect(new Set(s).size).toBe(100);
    for (let i = 1; i < s.length; i++) expect(s[i]).toBeGreaterThan(s[i - 1]);
    const per = [0, 0, 0];
    for (const i of s) per[codes[i]]++;
    expect(per).toEqual([60, 30, 10]);
  });

  it('is seeded: the same seed gives the same sample, another seed another one', () => {
    expect(stratifiedSample(1000, 100, codes, seededRandom(3))).toEqual(stratifiedSample(1000, 100, codes, seededRandom(3)));
    expect(stratifiedSample(1000, 100, codes, seededRandom(4))).not.toEqual(stratifiedSample(1000, 100, codes, seededRandom(3)));
  });

  it('gives a small subject at least one window, and all windows when the sample is as large as the study', () => {
    const skewed = Int32Array.from({ length: 1000 }, (_, i) => (i < 998 ? 0 : 1));
    const s = stratifiedSample(1000, 50, skewed, seededRandom(1));
    expect(s).toHaveLength(50);
    expect(Array.from(s).filter((i) => skewed[i] === 1)).toHaveLength(1);
    expect(Array.from(stratifiedSample(10, 10, undefined, seededRandom(1)))).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });
});

describe('placeWindows', () => {
  // Five windows on a line in a 1-D feature space; windows 0, 2 and 4 are sampled.
  const data = Float64Array.from([0, 1, 4, 4, 10]);
  const sample = Int32Array.from([0, 2, 4]);
  const sampleCoords = Float32Array.from([0, 0, 10, 20, 30, 30]);

  it('keeps sampled positions and places the others at the inverse-distance weighted mean of their k nearest sampled windows', async () => {
    const { coords, placed } = await placeWindows(data, 5, 1, sample, sampleCoords, { k: 2 });
    expect(Array.from(placed)).toEqual([0, 1, 0, 1, 0]);
    expect(Array.from(coords.subarray(0, 2))).toEqual([0, 0]);
    expect(Array.from(coords.subarray(4, 6))).toEqual([10, 20]);
    // Window 1 (feature 1): nearest sampled are window 0 (distance 1, weight 1) and window 2
    // (distance 3, weight 1/3): x = (1·0 + 1/3·10) / (4/3) = 2.5, y = (1/3·20) / (4/3) = 5 (by hand).
    expect(coords[2]).toBeCloseTo(2.5, 5);
    expect(coords[3]).toBeCloseTo(5, 5);
    // Window 3 coincides with sampled window 2: it takes that position.
    expect(Array.from(coords.subarray(6, 8))).toEqual([10, 20]);
  });

  it('reports progress up to 1 and stops at a cancelled checkpoint', async () => {
    const seen: number[] = [];
    await placeWindows(data, 5, 1, sample, sampleCoords, { k: 2, ctx: { progress: (_s, f) => seen.push(f), checkpoint: () => Promise.resolve() } });
    expect(seen[seen.length - 1]).toBe(1);
    const cancelled: JobContext = { progress() {}, checkpoint: () => Promise.reject(new CancelledError()) };
    await expect(placeWindows(data, 5, 1, sample, sampleCoords, { ctx: cancelled })).rejects.toBeInstanceOf(CancelledError);
  });
});
