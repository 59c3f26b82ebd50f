import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/core/random';
import { Rasterizer, discStamp, packRGBA, selectedPositions, type PixelBuffer, type PixelTransform, type RasterStyle } from '../../../src/app/map/raster';

/**
 * The rasterizer's fast loops (unrolled stamps, integer blending, selection as a list) against a
 * plain reference written from the definition: every point in order, every pixel of its disc
 * clipped to the buffer, source-over in 8-bit fixed point; then, for a selection, the ring and
 * the disc of each selected point, opaque. The frames must be identical, pixel for pixel.
 */
function reference(
  buf: PixelBuffer, coords: Float32Array, colourIndex: ArrayLike<number>, mask: Uint8Array | null,
  t: PixelTransform, style: RasterStyle,
): void {
  const pass = (radius: number, alpha: number, fixed: number, only: Uint8Array | null): void => {
    const { offsets } = discStamp(radius);
    const a256 = Math.round(alpha * 256);
    for (let i = 0; i < colourIndex.length; i++) {
      if (only && !only[i]) continue;
      const fx = t.bx + t.a * coords[2 * i], fy = t.by - t.a * coords[2 * i + 1];
      if (!Number.isFinite(fx) || !Number.isFinite(fy)) continue;
      const px = Math.floor(fx), py = Math.floor(fy);
      const col = fixed >= 0 ? fixed : style.palette[colourIndex[i]];
      for (let k = 0; k < offsets.length; k += 2) {
        const x = px + offsets[k], y = py + offsets[k + 1];
        if (x < 0 || y < 0 || x >= buf.width || y >= buf.height) continue;
        const p = y * buf.width + x, d = buf.pixels[p];
        const mix = (shift: number): number => ((((col >>> shift) & 255) * a256 + ((d >>> shift) & 255) * (256 - a256)) >> 8) << shift;
        buf.pixels[p] = (0xff000000 | mix(0) | mix(8) | mix(16)) >>> 0;
      }
    }
  };
  pass(style.radius, mask ? style.dimmedAlpha : style.alpha, -1, null);
  if (mask) {
    pass(style.selectedRadius + 1, 1, style.outline, mask);
    pass(style.selectedRadius, 1, -1, mask);
  }
}

function scene(seed: number, n: number, w: number, h: number) {
  const random = seededRandom(seed);
  const coords = new Float32Array(2 * n), index = new Uint16Array(n), labels = new Int32Array(n), mask = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    // Some points off the buffer and across its edges, one without coordinates.
    coords[2 * i] = -3 + random() * (w + 6);
    coords[2 * i + 1] = -3 + random() * (h + 6);
    index[i] = Math.floor(random() * 300);
    labels[i] = Math.floor(random() * 5) - 1;
    mask[i] = random() < 0.05 ? 1 : 0;
  }
  coords[10] = Number.NaN;
  const palette = Uint32Array.from({ length: 300 }, () => packRGBA(Math.floor(random() * 256), Math.floor(random() * 256), Math.floor(random() * 256)));
  return { coords, index, labels, mask, palette };
}

describe('Rasterizer.draw against a plain reference', () => {
  const W = 61, H = 47;
  const cases: [string, number, number][] = [
    ['plus stamp, faint (a million points)', 1, 0.35],
    ['3 × 3 stamp (200,000 points)', 1.5, 0.6],
    ['small study discs', 2.6, 0.8],
    ['one pixel, opaque', 0.5, 1],
    ['plus stamp at dpr 2', 2, 0.35],
  ];
  for (const [name, radius, alpha] of cases) {
    for (const withSelection of [false, true]) {
      it(`${name}${withSelection ? ', with a selection' : ''}`, () => {
        const { coords, index, labels, mask, palette } = scene(Math.round(radius * 10) + (withSelection ? 1 : 0), 400, W, H);
        const style: RasterStyle = { palette, radius, selectedRadius: radius + 0.8, alpha, dimmedAlpha: 0.08, outline: packRGBA(29, 35, 43) };
        // A scale and offset that are not whole pixels.
        const t = { a: 0.93, bx: 1.37, by: H - 0.61 };
        const fast: PixelBuffer = { pixels: new Uint32Array(W * H).fill(packRGBA(255, 255, 255)), width: W, height: H };
        const slow: PixelBuffer = { pixels: fast.pixels.slice(), width: W, height: H };
        const r = new Rasterizer();
        // Twice into the same buffer, so reused scratch and earlier pixels are covered too.
        for (let round = 0; round < 2; round++) {
          r.draw(fast, { coords, colourIndex: index, labels, selected: withSelection ? selectedPositions(mask) : null }, t, style);
          reference(slow, coords, index, withSelection ? mask : null, t, style);
        }
        expect(Array.from(fast.pixels)).toEqual(Array.from(slow.pixels));
      });
    }
  }

  it('counts the points touching the buffer and their clusters', () => {
    const { coords, index, labels, palette } = scene(3, 400, W, H);
    const style: RasterStyle = { palette, radius: 1, selectedRadius: 1.8, alpha: 0.35, dimmedAlpha: 0.08, outline: 0 };
    const t = { a: 0.93, bx: 1.37, by: H - 0.61 };
    const stats = new Rasterizer().draw({ pixels: new Uint32Array(W * H), width: W, height: H }, { coords, colourIndex: index, labels, selected: null }, t, style);
    let drawn = 0;
    const seen = new Set<number>();
    for (let i = 0; i < labels.length; i++) {
      const fx = t.bx + t.a * coords[2 * i], fy = t.by - t.a * coords[2 * i + 1];
      if (!(fx >= -1 && fy >= -1 && fx < W + 1 && fy < H + 1)) continue;
      drawn++;
      if (labels[i] >= 0) seen.add(labels[i]);
    }
    expect(drawn).toBeGreaterThan(300);
    expect(stats).toEqual({ pointsDrawn: drawn, clustersDrawn: seen.size });
  });

  it('lists the positions of a selection mask in order', () => {
    expect(Array.from(selectedPositions(Uint8Array.from([0, 1, 1, 0, 0, 1])))).toEqual([1, 2, 5]);
    expect(selectedPositions(new Uint8Array(4)).length).toBe(0);
  });
});
