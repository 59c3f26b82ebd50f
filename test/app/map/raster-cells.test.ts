import { describe, expect, it } from 'vitest';
import { drawOrderCells, permute, permutePairs } from '../../../src/app/map/draw-order';
import { Rasterizer, packRGBA, selectedPositions, type PixelBuffer, type RasterPoints, type RasterStyle } from '../../../src/app/map/raster';
import { seededRandom } from '../../../src/core/random';

/** Skipping the grid cells out of view must give the frame and counts of drawing every point. */
describe('Rasterizer.draw with the cells of the drawing order', () => {
  const W = 80, H = 60, n = 3000;
  const random = seededRandom(11);
  const raw = new Float32Array(2 * n), rawLabels = new Int32Array(n), rawIndex = new Uint8Array(n), rawMask = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    raw[2 * i] = 10 * random() - 5;
    raw[2 * i + 1] = 6 * random() * random() - 1;
    rawLabels[i] = Math.floor(random() * 7);
    rawIndex[i] = rawLabels[i];
    rawMask[i] = random() < 0.03 ? 1 : 0;
  }
  raw[20] = Number.NaN;
  const { order, cells } = drawOrderCells(raw, 1, 16);
  const pts: RasterPoints = {
    coords: permutePairs(raw, order),
    colourIndex: permute(rawIndex, order, new Uint8Array(n)),
    labels: permute(rawLabels, order, new Int32Array(n)),
    selected: selectedPositions(permute(rawMask, order, new Uint8Array(n))),
    cells,
  };
  const palette = Uint32Array.from({ length: 7 }, (_, c) => packRGBA(30 * c, 255 - 30 * c, 90));
  const style: RasterStyle = { palette, radius: 1, selectedRadius: 1.8, alpha: 0.35, dimmedAlpha: 0.08, outline: packRGBA(0, 0, 0) };
  const frame = (p: RasterPoints, a: number, bx: number, by: number, s: RasterStyle) => {
    const buf: PixelBuffer = { pixels: new Uint32Array(W * H).fill(packRGBA(255, 255, 255)), width: W, height: H };
    const stats = new Rasterizer().draw(buf, p, { a, bx, by }, s);
    return { stats, pixels: Array.from(buf.pixels) };
  };
  const views: [string, number, number, number][] = [
    ['fitted', 7, 40, 50],
    ['zoomed in on the middle', 60, 40, 90],
    ['zoomed in on a corner', 45, 250, 30],
    ['panned half off the left', 7, -10, 50],
    ['all out of view', 7, 400, 50],
  ];
  for (const [name, a, bx, by] of views) {
    for (const radius of [1, 2.6]) {
      it(`${name}, radius ${radius}`, () => {
        const s = { ...style, radius };
        const skipped = frame(pts, a, bx, by, s);
        const all = frame({ ...pts, cells: null }, a, bx, by, s);
        expect(skipped).toEqual(all);
        if (name !== 'all out of view') expect(all.stats.pointsDrawn).toBeGreaterThan(0);
      });
    }
  }

  it('places every point in the cell its begins say', () => {
    expect(cells).not.toBeNull();
    const { grid, begins, minX, maxY, cellW, cellH } = cells!;
    expect(begins[grid * grid]).toBe(n);
    for (let c = 0; c < grid * grid; c++) {
      const cx = c % grid, cy = Math.floor(c / grid);
      for (let j = begins[c]; j < begins[c + 1]; j++) {
        const x = pts.coords[2 * j], y = pts.coords[2 * j + 1];
        if (Number.isNaN(x)) continue;
        expect(x).toBeGreaterThanOrEqual(minX + cx * cellW - 1e-9);
        expect(x).toBeLessThanOrEqual(minX + (cx + 1) * cellW + 1e-9);
        expect(y).toBeLessThanOrEqual(maxY - cy * cellH + 1e-9);
        expect(y).toBeGreaterThanOrEqual(maxY - (cy + 1) * cellH - 1e-9);
      }
    }
  });
});
