import { describe, expect, it } from 'vitest';
import { Rasterizer, discStamp, packHex, packRGBA, type PixelBuffer, type RasterStyle } from '../../../src/app/map/raster';

const WHITE = packHex('#ffffff');
const RED = packHex('#ff0000');
const BLUE = packHex('#0000ff');
const DARK = packHex('#000000');

function buffer(w: number, h: number): PixelBuffer {
  const buf = { pixels: new Uint32Array(w * h), width: w, height: h };
  buf.pixels.fill(WHITE);
  return buf;
}

function style(over: Partial<RasterStyle> = {}): RasterStyle {
  return { palette: Uint32Array.from([RED, BLUE]), radius: 1, selectedRadius: 1, alpha: 1, dimmedAlpha: 0.5, outline: DARK, ...over };
}

/** The pixels as a picture: '.' white, 'r' red, 'b' blue, '#' black, '?' anything else. */
function picture(buf: PixelBuffer): string[] {
  const sym = new Map([[WHITE, '.'], [RED, 'r'], [BLUE, 'b'], [DARK, '#']]);
  const rows: string[] = [];
  for (let y = 0; y < buf.height; y++) {
    let row = '';
    for (let x = 0; x < buf.width; x++) row += sym.get(buf.pixels[y * buf.width + x]) ?? '?';
    rows.push(row);
  }
  return rows;
}

// The identity transform with y up: data (x, y) → pixel (x, H − y).
const ident = (h: number) => ({ a: 1, bx: 0, by: h });

describe('packRGBA / packHex', () => {
  it('packs in ImageData byte order (R first in memory on a little-endian machine)', () => {
    // ImageData stores R, G, B, A bytes in that order (HTML Living Standard, "ImageData").
    const bytes = new Uint8Array(Uint32Array.from([packRGBA(1, 2, 3, 4)]).buffer);
    expect(Array.from(bytes)).toEqual([1, 2, 3, 4]);
    expect(packHex('#0072b2')).toBe(packRGBA(0x00, 0x72, 0xb2, 255));
    expect(() => packHex('red')).toThrow(/#rrggbb/);
  });
});

describe('discStamp(radius)', () => {
  it('covers the pixels whose centres lie within the radius', () => {
    expect(discStamp(0.5).offsets.length / 2).toBe(1);
    expect(discStamp(1).offsets.length / 2).toBe(5); // the plus shape
    expect(discStamp(1.5).offsets.length / 2).toBe(9); // 3 × 3
    expect(discStamp(2.6).offsets.length / 2).toBe(21); // 5 × 5 without its corners
  });
});

describe('Rasterizer.draw', () => {
  it('draws opaque discs at the transformed positions, later points on top', () => {
    const buf = buffer(7, 5);
    const stats = new Rasterizer().draw(buf, {
      coords: Float32Array.from([1.5, 2.5, 2.5, 2.5, 5.5, 3.5]),
      colourIndex: Uint8Array.from([0, 1, 0]),
      labels: Int32Array.from([0, 1, 0]),
      selected: null,
    }, ident(5), style());
    expect(picture(buf)).toEqual([
      '.....r.',
      '.rb.rrr',
      'rbbb.r.',
      '.rb....',
      '.......',
    ]);
    expect(stats).toEqual({ pointsDrawn: 3, clustersDrawn: 2 });
  });

  it('blends with the given alpha over what is there', () => {
    const buf = buffer(3, 3);
    new Rasterizer().draw(buf, {
      coords: Float32Array.from([1.5, 1.5]), colourIndex: Uint8Array.from([0]), labels: Int32Array.from([0]), selected: null,
    }, ident(3), style({ radius: 0.5, alpha: 0.5 }));
    const mid = new Uint8Array(buf.pixels.buffer, 4 * 4, 4);
    // Source-over of red at alpha 0.5 on white: (255, 127.5, 127.5) (common practice); 8-bit fixed point gives 127.
    expect(Array.from(mid)).toEqual([255, 127, 127, 255]);
    expect(buf.pixels[0]).toBe(WHITE);
  });

  it('clips discs at the edges and does not count points outside', () => {
    const buf = buffer(4, 4);
    const stats = new Rasterizer().draw(buf, {
      coords: Float32Array.from([0.2, 0.2, 10, 10, -1.7, 2, Number.NaN, 1]),
      colourIndex: Uint8Array.from([0, 0, 0, 0]),
      labels: Int32Array.from([0, 1, 2, 3]),
      selected: null,
    }, ident(4), style());
    expect(picture(buf)).toEqual(['....', '....', 'r...', 'rr..']);
    expect(stats).toEqual({ pointsDrawn: 1, clustersDrawn: 1 });
  });

  it('dims unselected points and draws selected ones on top with an outline', () => {
    const buf = buffer(9, 5);
    new Rasterizer().draw(buf, {
      coords: Float32Array.from([2.5, 2.5, 6.5, 2.5]),
      colourIndex: Uint8Array.from([0, 1]),
      labels: Int32Array.from([0, 1]),
      selected: Int32Array.from([1]),
    }, ident(5), style({ radius: 1, selectedRadius: 1, dimmedAlpha: 0.5 }));
    const p = picture(buf);
    expect(p[2].slice(5, 8)).toBe('bbb');
    expect(p[1][6]).toBe('b');
    expect(p[1][5]).toBe('#'); // the ring (radius 2) around the selected point
    expect(p[0][6]).toBe('#');
    expect(p[2][4]).toBe('#');
    expect(p[2][2]).toBe('?'); // the unselected point, half-transparent
    const dim = new Uint8Array(buf.pixels.buffer, 4 * (2 * 9 + 2), 4);
    expect(Array.from(dim)).toEqual([255, 127, 127, 255]);
  });

  it('gives the same frame when drawn twice into a cleared buffer (scratch reused)', () => {
    const r = new Rasterizer();
    const pts = { coords: Float32Array.from([1, 1, 3, 2]), colourIndex: Uint8Array.from([1, 0]), labels: Int32Array.from([0, 0]), selected: null };
    const a = buffer(5, 4), b = buffer(5, 4);
    r.draw(a, pts, ident(4), style({ alpha: 0.7 }));
    r.clear(b, WHITE);
    r.draw(b, pts, ident(4), style({ alpha: 0.7 }));
    expect(Array.from(b.pixels)).toEqual(Array.from(a.pixels));
  });
});
