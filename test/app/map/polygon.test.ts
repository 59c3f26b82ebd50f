import { describe, expect, it } from 'vitest';
import { buildGridIndex } from '../../../src/app/map/grid-index';
import { pointInPolygon, selectInBox, selectInPolygon } from '../../../src/app/map/polygon';

describe('pointInPolygon (even–odd rule)', () => {
  // Worked examples of the crossing-number test (common practice: a point is inside when a ray from
  // it crosses the boundary an odd number of times).
  const square = [0, 0, 4, 0, 4, 4, 0, 4];
  it('tells inside from outside of a square', () => {
    expect(pointInPolygon(square, 2, 2)).toBe(true);
    expect(pointInPolygon(square, 5, 2)).toBe(false);
    expect(pointInPolygon(square, -1, -1)).toBe(false);
  });

  it('handles a concave polygon (a U shape): the notch is outside', () => {
    const u = [0, 0, 6, 0, 6, 6, 4, 6, 4, 2, 2, 2, 2, 6, 0, 6];
    expect(pointInPolygon(u, 1, 5)).toBe(true); // left arm
    expect(pointInPolygon(u, 5, 5)).toBe(true); // right arm
    expect(pointInPolygon(u, 3, 4)).toBe(false); // the notch
    expect(pointInPolygon(u, 3, 1)).toBe(true); // the base
  });

  it('treats a self-intersecting bow tie by parity: each lobe inside', () => {
    const bow = [0, 0, 4, 4, 4, 0, 0, 4];
    expect(pointInPolygon(bow, 1, 2)).toBe(true);
    expect(pointInPolygon(bow, 3, 2)).toBe(true);
    expect(pointInPolygon(bow, 2, 0.5)).toBe(false);
  });

  it('is the same for an open or explicitly closed ring and either winding', () => {
    const tri = [0, 0, 5, 0, 0, 5];
    for (const poly of [tri, [...tri, 0, 0], [0, 0, 0, 5, 5, 0]]) {
      expect(pointInPolygon(poly, 1, 1)).toBe(true);
      expect(pointInPolygon(poly, 3, 3)).toBe(false);
    }
  });
});

describe('selectInPolygon / selectInBox', () => {
  const coords = Float32Array.from([0.5, 0.5, 1.5, 0.5, 3, 3, 0.5, 2.5, 9, 9]);
  const grid = buildGridIndex(coords, 1);
  it('marks exactly the points inside a lasso', () => {
    expect(Array.from(selectInPolygon(grid, coords, [0, 0, 2, 0, 2, 1, 0, 1]))).toEqual([1, 1, 0, 0, 0]);
    expect(Array.from(selectInPolygon(grid, coords, [0, 0, 2, 0]))).toEqual([0, 0, 0, 0, 0]);
  });
  it('marks the points inside a box given by any two opposite corners', () => {
    expect(Array.from(selectInBox(grid, coords, 4, 4, 0, 0))).toEqual([1, 1, 1, 1, 0]);
    expect(Array.from(selectInBox(grid, coords, 8, 10, 10, 8))).toEqual([0, 0, 0, 0, 1]);
  });
});
