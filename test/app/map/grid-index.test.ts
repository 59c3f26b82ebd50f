import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/core/random';
import { buildGridIndex, nearestPoint, visitCells } from '../../../src/app/map/grid-index';

function randomCoords(n: number, seed: number): Float32Array {
  const r = seededRandom(seed);
  return Float32Array.from({ length: 2 * n }, () => r() * 10 - 5);
}

describe('buildGridIndex', () => {
  it('files every point exactly once', () => {
    const coords = randomCoords(500, 3);
    const g = buildGridIndex(coords);
    expect(g.cellStart[g.cols * g.rows]).toBe(500);
    expect([...g.items].sort((a, b) => a - b)).toEqual(Array.from({ length: 500 }, (_, i) => i));
  });

  it('handles no points and identical points', () => {
    expect(buildGridIndex(new Float32Array(0)).items.length).toBe(0);
    const same = buildGridIndex(Float32Array.from([1, 1, 1, 1, 1, 1]));
    expect(same.items.length).toBe(3);
  });
});

describe('visitCells / nearestPoint', () => {
  const coords = randomCoords(800, 11);
  const g = buildGridIndex(coords);

  it('visits at least every point inside the rectangle', () => {
    const seen = new Set<number>();
    visitCells(g, -1, -2, 1.5, 0.5, (i) => seen.add(i));
    for (let i = 0; i < 800; i++) {
      const x = coords[2 * i], y = coords[2 * i + 1];
      if (x >= -1 && x <= 1.5 && y >= -2 && y <= 0.5) expect(seen.has(i)).toBe(true);
    }
  });

  it('finds the same nearest point as a full scan, or none beyond the radius', () => {
    const r = seededRandom(5);
    for (let q = 0; q < 50; q++) {
      const x = r() * 10 - 5, y = r() * 10 - 5, radius = 0.6;
      let best = -1, bestD = radius * radius;
      for (let i = 0; i < 800; i++) {
        const d = (coords[2 * i] - x) ** 2 + (coords[2 * i + 1] - y) ** 2;
        if (d <= bestD) { bestD = d; best = i; }
      }
      const found = nearestPoint(g, coords, x, y, radius);
      if (best < 0) expect(found).toBe(-1);
      else expect((coords[2 * found] - x) ** 2 + (coords[2 * found + 1] - y) ** 2).toBeCloseTo(bestD, 10);
    }
  });
});
