import { describe, expect, it } from 'vitest';
import { fitView, panBy, toData, toScreen, zoomAt } from '../../../src/app/map/view';

describe('fitView', () => {
  it('fits the data bounds into the canvas with a margin, centred', () => {
    const v = fitView(Float32Array.from([0, 0, 10, 5]), 220, 120, 10);
    expect(v.scale).toBeCloseTo(20); // min(200 / 10, 100 / 5)
    expect([v.centreX, v.centreY]).toEqual([5, 2.5]);
    expect(toScreen(v, 0, 0)).toEqual([10, 110]);
    expect(toScreen(v, 10, 5)).toEqual([210, 10]);
  });
  it('survives no points', () => {
    const v = fitView(new Float32Array(0), 100, 100);
    expect(Number.isFinite(v.scale) && v.scale > 0).toBe(true);
  });
});

describe('toScreen / toData', () => {
  it('are inverse (screen y grows down, data y up)', () => {
    const v = { width: 300, height: 200, centreX: 1, centreY: -2, scale: 7 };
    const [sx, sy] = toScreen(v, 3, 4);
    expect(sy).toBeLessThan(100);
    const [x, y] = toData(v, sx, sy);
    expect(x).toBeCloseTo(3, 12);
    expect(y).toBeCloseTo(4, 12);
  });
});

describe('zoomAt / panBy', () => {
  const v = { width: 300, height: 200, centreX: 0, centreY: 0, scale: 10 };
  it('keeps the data point under the cursor in place while zooming', () => {
    const before = toData(v, 40, 170);
    const z = zoomAt(v, 40, 170, 2.5);
    expect(z.scale).toBeCloseTo(25);
    const after = toData(z, 40, 170);
    expect(after[0]).toBeCloseTo(before[0], 12);
    expect(after[1]).toBeCloseTo(before[1], 12);
  });
  it('moves points with the drag', () => {
    const p = panBy(v, 30, -20);
    const [sx, sy] = toScreen(p, 0, 0);
    expect(sx).toBeCloseTo(180, 12);
    expect(sy).toBeCloseTo(80, 12);
  });
});
