import { describe, expect, it } from 'vitest';
import { subjectZscore } from '../../../src/core/recipe/subject-zscore';

describe('subjectZscore(data, n, d, subjects)', () => {
  // scipy.stats.zscore docstring values (ddof 0): subject 7 carries the 10-value example,
  // subject 3 the example with NaN omitted. Rows of the two subjects are interleaved.
  const ten = [0.7972, 0.0767, 0.4383, 0.7866, 0.8091, 0.1954, 0.6307, 0.6599, 0.1065, 0.0508];
  const tenZ = [1.1273, -1.247, -0.0552, 1.0923, 1.1664, -0.8559, 0.5786, 0.6748, -1.1488, -1.3324];
  const five = [25.11, 30.1, NaN, 32.02, 43.15];
  const fiveZ = [-1.13490897, -0.37830299, NaN, -0.08718406, 1.60039602];

  it('z-scores each feature within each subject, NaN omitted and kept', () => {
    const values: number[] = [];
    const subjects: number[] = [];
    for (let i = 0; i < 10; i++) {
      values.push(ten[i]); subjects.push(7);
      if (i < 5) { values.push(five[i]); subjects.push(3); }
    }
    const input = Float64Array.from(values);
    const { data, effect } = subjectZscore(input, values.length, 1, subjects);
    let t = 0;
    let f = 0;
    subjects.forEach((s, i) => {
      if (s === 7) expect(data[i]).toBeCloseTo(tenZ[t++], 3);
      else if (Number.isNaN(fiveZ[f])) { expect(data[i]).toBeNaN(); f++; } else expect(data[i]).toBeCloseTo(fiveZ[f++], 7);
    });
    expect(effect).toEqual({ groups: 2, windowsWithoutSubject: 0, constantCells: 0 });
    expect(input[0]).toBe(0.7972); // input untouched
  });

  it('removes a subject offset and scale that a global z-score keeps', () => {
    // Two subjects with the same pattern, one shifted by 100 and scaled by 10 (common practice:
    // per-subject standardization removes between-subject offsets).
    const data = Float64Array.from([1, 2, 3, 110, 120, 130]);
    const out = subjectZscore(data, 6, 1, [0, 0, 0, 1, 1, 1]).data;
    for (let i = 0; i < 3; i++) expect(out[i]).toBeCloseTo(out[i + 3], 12);
  });

  it('sets a feature constant within a subject to 0 and groups windows without a subject together', () => {
    const data = Float64Array.from([5, 1, 5, 2, 9, 3, 4, 8]); // n = 4, d = 2
    const r = subjectZscore(data, 4, 2, [0, 0, -1, -1]);
    expect(Array.from(r.data.subarray(0, 4))).toEqual([0, -1, 0, 1]);
    expect(r.data[4]).toBeCloseTo(1, 12);
    expect(r.data[6]).toBeCloseTo(-1, 12);
    expect(r.effect).toEqual({ groups: 2, windowsWithoutSubject: 2, constantCells: 1 });
  });

  it('rejects shapes that do not fit', () => {
    expect(() => subjectZscore(new Float64Array(5), 2, 2, [0, 0])).toThrow(/shape/);
    expect(() => subjectZscore(new Float64Array(4), 2, 2, [0])).toThrow(/subject codes/);
  });
});
