import { describe, expect, it } from 'vitest';
import { matchClusters } from '../../../src/core/stability/jaccard';

describe('matchClusters (cluster-wise Jaccard, Hennig 2007)', () => {
  it('gives each original cluster its best Jaccard similarity: a worked example', () => {
    // Worked by hand. Ten kept windows; the resample set window 9 aside (noise, -1).
    //   original: A0 = {0,1,2,3}, A1 = {4,5,6}, A2 = {7,8,9}, A3 = {} (no kept window)
    //   resample: B0 = {3,4,5,6,7}, B1 = {0,1,2}, B2 = {8}
    // A0: with B1 3 / (4 + 3 − 3) = 3/4; with B0 1 / (4 + 5 − 1) = 1/8  → 0.75 (B1)
    // A1: with B0 3 / (3 + 5 − 3) = 3/5                                  → 0.6  (B0)
    // A2: with B0 1 / (3 + 5 − 1) = 1/7; with B2 1 / (3 + 1 − 1) = 1/3  → 1/3  (B2)
    // A3: empty, so 0 (R fpc clujaccard with zerobyzero = 0), no counterpart.
    const original = Int32Array.from([0, 0, 0, 0, 1, 1, 1, 2, 2, 2]);
    const resample = Int32Array.from([1, 1, 1, 0, 0, 0, 0, 0, 2, -1]);
    const m = matchClusters(original, resample, 4, 3);
    expect(Array.from(m.jaccard)).toEqual([0.75, 0.6, 1 / 3, 0]);
    expect(Array.from(m.counterpart)).toEqual([1, 0, 2, -1]);
  });

  it('is 1 for every cluster when the resample repeats the partition under other numbers', () => {
    const original = Int32Array.from([0, 0, 1, 1, 1, 2]);
    const renamed = Int32Array.from([2, 2, 0, 0, 0, 1]);
    const m = matchClusters(original, renamed, 3, 3);
    expect(Array.from(m.jaccard)).toEqual([1, 1, 1]);
    expect(Array.from(m.counterpart)).toEqual([2, 0, 1]);
  });

  it('leaves windows set aside in the run out of its clusters', () => {
    // Worked by hand: A0 = {0, 1} (window 2 is noise in the run), B0 = {0, 1, 2}: 2 / (2 + 3 − 2) = 2/3.
    const m = matchClusters(Int32Array.from([0, 0, -1]), Int32Array.from([0, 0, 0]), 1, 1);
    expect(m.jaccard[0]).toBeCloseTo(2 / 3, 15);
  });

  it('refuses labels of different lengths or out of range', () => {
    expect(() => matchClusters(Int32Array.from([0, 1]), Int32Array.from([0]), 2, 1)).toThrow(/differ in length/);
    expect(() => matchClusters(Int32Array.from([0, 2]), Int32Array.from([0, 0]), 2, 1)).toThrow(/out of range/);
  });
});
