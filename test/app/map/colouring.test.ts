import { describe, expect, it } from 'vitest';
import { categoryColouring, scaleColouring } from '../../../src/app/map/colouring';
import { drawOrder } from '../../../src/app/map/draw-order';
import { packHex } from '../../../src/app/map/raster';
import { CATEGORY_COLOURS, MISSING_COLOUR, hexOf, viridis } from '../../../src/app/lib/palette';

describe('viridis', () => {
  it('matches matplotlib 3.x viridis at its ends, middle and quarter points', () => {
    // matplotlib lib/matplotlib/_cm_listed.py _viridis_data, entries 0, 64, 128, 191, 255 as 8-bit hex
    // (from memory, cross-checked with the stop list in src/app/lib/palette.ts).
    expect(hexOf(viridis(0))).toBe('#440154');
    expect(hexOf(viridis(1))).toBe('#fde725');
    expect(hexOf(viridis(64 / 255))).toBe('#3b528b');
    expect(hexOf(viridis(128 / 255))).toBe('#21918c');
    expect(hexOf(viridis(192 / 255))).toBe('#5ec962');
  });
  it('clamps out-of-range input and rises in lightness', () => {
    expect(viridis(-3)).toEqual(viridis(0));
    expect(viridis(7)).toEqual(viridis(1));
    const lum = (t: number) => { const [r, g, b] = viridis(t); return 0.2126 * r + 0.7152 * g + 0.0722 * b; };
    for (let t = 0.05; t <= 1; t += 0.05) expect(lum(t)).toBeGreaterThan(lum(t - 0.05));
  });
});

describe('categoryColouring', () => {
  it('gives each category its colour and missing values light grey', () => {
    const c = categoryColouring(Int32Array.from([0, 1, -1, 2, 22]), ['a', 'b', '(missing)'], 'label', 2);
    expect(c.palette[c.index[0]]).toBe(packHex(CATEGORY_COLOURS[0]));
    expect(c.palette[c.index[1]]).toBe(packHex(CATEGORY_COLOURS[1]));
    expect(c.palette[c.index[2]]).toBe(packHex(MISSING_COLOUR));
    expect(c.palette[c.index[3]]).toBe(packHex(MISSING_COLOUR));
    expect(c.palette[c.index[4]]).toBe(packHex(CATEGORY_COLOURS[22 % CATEGORY_COLOURS.length]));
    expect(c.legend.kind === 'categories' && c.legend.entries[2].colour).toBe(MISSING_COLOUR);
  });
});

describe('scaleColouring', () => {
  it('maps the minimum to the first viridis colour, the maximum to the last, NaN to grey', () => {
    const c = scaleColouring(Float64Array.from([2, 4, Number.NaN, 3]), 'acc_x_mean');
    expect(c.palette[c.index[0]]).toBe(packHex(hexOf(viridis(0))));
    expect(c.palette[c.index[1]]).toBe(packHex(hexOf(viridis(1))));
    expect(c.palette[c.index[2]]).toBe(packHex(MISSING_COLOUR));
    expect(c.index[3]).toBe(127); // halfway of 255 steps, rounded half up
    expect(c.legend).toMatchObject({ kind: 'scale', min: '2', max: '4', missing: 1 });
  });
  it('survives a constant or all-missing column', () => {
    expect(Array.from(scaleColouring(Float64Array.from([5, 5]), 'f').index)).toEqual([0, 0]);
    expect(scaleColouring(Float64Array.from([Number.NaN]), 'f').legend).toMatchObject({ min: '–', max: '–', missing: 1 });
  });
});

describe('drawOrder', () => {
  it('is a seeded permutation that groups nearby points', () => {
    const coords = Float32Array.from({ length: 2000 }, (_, i) => ((i * 7919) % 1000) / 100);
    const a = drawOrder(coords, 3, 4), b = drawOrder(coords, 3, 4);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect([...a].sort((x, y) => x - y)).toEqual(Array.from({ length: 1000 }, (_, i) => i));
    // Cells come one after another: the cell index never decreases along the order.
    const cell = (i: number) => Math.min(3, Math.floor((coords[2 * i] / 9.99) * 4)) + 4 * Math.min(3, Math.floor(((9.99 - coords[2 * i + 1]) / 9.99) * 4));
    const min = Math.min(...coords.filter((_, k) => k % 2 === 0));
    expect(min).toBe(0);
    for (let j = 1; j < a.length; j++) expect(cell(a[j])).toBeGreaterThanOrEqual(cell(a[j - 1]));
  });
});
