import { describe, expect, it } from 'vitest';
import { irisMatrix, irisTable } from './iris';

// The fixture test/fixtures/iris.csv was typed from the R `datasets::iris` (Fisher) version.
// These checks tie it to that version: its rows 35 and 38 (where the old UCI copy differs) and its
// class means as R prints them (aggregate(. ~ Species, iris, mean)).
describe('iris fixture', () => {
  it('has 150 rows, 3 species of 50, in the R/Fisher version', () => {
    const t = irisTable();
    expect(t.nRows).toBe(150);
    const { data, species } = irisMatrix();
    expect(Array.from(new Set(species))).toEqual([0, 1, 2]);
    // Rows 35 and 38 (1-based) differ between the R/Fisher and the old UCI copy.
    expect(Array.from(data.subarray(34 * 4, 35 * 4))).toEqual([4.9, 3.1, 1.5, 0.2]);
    expect(Array.from(data.subarray(37 * 4, 38 * 4))).toEqual([4.9, 3.6, 1.4, 0.1]);
  });

  it('matches the class means of the R/Fisher version', () => {
    const { data, species } = irisMatrix();
    // R: aggregate(. ~ Species, iris, mean): setosa, versicolor, virginica means.
    const expected = [
      [5.006, 3.428, 1.462, 0.246],
      [5.936, 2.77, 4.26, 1.326],
      [6.588, 2.974, 5.552, 2.026],
    ];
    for (let s = 0; s < 3; s++) {
      for (let j = 0; j < 4; j++) {
        let sum = 0;
        for (let i = 0; i < 150; i++) if (species[i] === s) sum += data[i * 4 + j];
        expect(sum / 50).toBeCloseTo(expected[s][j], 10);
      }
    }
  });
});
