/**
 * The Map's point rasterizer: draws every window as a small disc straight into a pixel buffer
 * (one uint32 per device pixel, the memory layout of an ImageData), so a frame is one pass over
 * the points and one putImageData, at any study size. DOM-free: the caller owns the buffer.
 *
 * Colours are packed RGBA uint32 in ImageData byte order on a little-endian machine
 * (0xAABBGGRR), as every platform the app runs on is. Discs are drawn without anti-aliasing; a
 * pass blends one constant alpha over what is already there (the loops are in raster-pass.ts).
 */
import type { DrawCells } from './draw-order';
import { passRange, passSome, type Pass, type PassCount } from './raster-pass';

export interface PixelBuffer {
  /** width × height pixels, row-major, packed 0xAABBGGRR. */
  pixels: Uint32Array;
  width: number;
  height: number;
}

/** Device-pixel transform of a frame: px = bx + a·x, py = by − a·y (screen y grows down). */
export interface PixelTransform {
  a: number;
  bx: number;
  by: number;
}

/** The points of one frame; all arrays in the same (drawing) order. */
export interface RasterPoints {
  /** Interleaved x, y in data units. */
  coords: Float32Array;
  /** Colour per point, an index into the palette. */
  colourIndex: Uint8Array | Uint16Array;
  /** Cluster per point (negative = none), to count the clusters in view. */
  labels: Int32Array;
  /** Positions (in this drawing order, ascending) of the selected points; null = no selection. */
  selected: Int32Array | null;
  /** The grid cells of the drawing order, so cells out of view are skipped; absent = draw all. */
  cells?: DrawCells | null;
}

export interface RasterStyle {
  /** Packed opaque colour per palette index. */
  palette: Uint32Array;
  /** Disc radius in device pixels for all points, and for selected points (drawn on top). */
  radius: number;
  selectedRadius: number;
  /** Opacity of points when nothing is selected, and of unselected points under a selection. */
  alpha: number;
  dimmedAlpha: number;
  /** Packed colour of the ring around selected points. */
  outline: number;
}

export interface DrawStats {
  /** Points whose disc touches the buffer. */
  pointsDrawn: number;
  /** Distinct clusters among those points. */
  clustersDrawn: number;
}

/** Packs 8-bit channels into one ImageData pixel. */
export function packRGBA(r: number, g: number, b: number, a = 255): number {
  return ((a << 24) | (b << 16) | (g << 8) | r) >>> 0;
}

/** Packs a '#rrggbb' colour (opaque). */
export function packHex(hex: string): number {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new Error(`expected a colour as #rrggbb, got "${hex}"`);
  const v = parseInt(m[1], 16);
  return packRGBA((v >> 16) & 255, (v >> 8) & 255, v & 255);
}

/** A disc stamp: the pixels whose centres lie within `radius` of the centre of the point's own pixel. */
export interface Stamp {
  /** Interleaved dx, dy of each pixel. */
  offsets: Int16Array;
  /** Largest |dx| or |dy|. */
  reach: number;
}

export function discStamp(radius: number): Stamp {
  const reach = Math.max(0, Math.floor(radius));
  const out: number[] = [];
  const r2 = radius * radius;
  for (let dy = -reach; dy <= reach; dy++) {
    for (let dx = -reach; dx <= reach; dx++) if (dx * dx + dy * dy <= r2 || (dx === 0 && dy === 0)) out.push(dx, dy);
  }
  return { offsets: Int16Array.from(out), reach };
}

function clampCell(v: number, grid: number): number {
  return Math.min(grid - 1, Math.max(0, Math.floor(v)));
}

/** The positions of the non-zero entries of a selection mask, ascending. */
export function selectedPositions(mask: Uint8Array): Int32Array {
  let count = 0;
  for (let i = 0; i < mask.length; i++) if (mask[i] !== 0) count++;
  const list = new Int32Array(count);
  let j = 0;
  for (let i = 0; i < mask.length; i++) if (mask[i] !== 0) list[j++] = i;
  return list;
}

/**
 * Reusable per-frame scratch: stamps and blend tables are rebuilt only when the style changes,
 * so drawing a frame allocates nothing.
 */
export class Rasterizer {
  /** Stamps by radius, with their row-major offsets for the buffer width they were made for. */
  private readonly stamps = new Map<number, { stamp: Stamp; linear: Int32Array; width: number }>();
  private readonly s: Pass = {
    pixels: new Uint32Array(0), width: 0, height: 0, a: 1, bx: 0, by: 0,
    coords: new Float32Array(0), colourIndex: new Uint8Array(0),
    linear: new Int32Array(0), offsets: new Int16Array(0), reach: 0,
    rb: new Int32Array(0), g: new Int32Array(0), opaque: new Uint32Array(0), inv: 0,
  };
  private readonly count: PassCount = { drawn: 0, clusters: 0, seen: new Uint8Array(16) };

  /** Clears the buffer to one packed colour. */
  clear(buf: PixelBuffer, colour: number): void {
    buf.pixels.fill(colour);
  }

  /**
   * Draws the points: everything first (dimmed when there is a selection), then, for a selection,
   * a ring and the disc of every selected point on top.
   */
  draw(buf: PixelBuffer, pts: RasterPoints, t: PixelTransform, style: RasterStyle): DrawStats {
    const s = this.s;
    s.pixels = buf.pixels; s.width = buf.width; s.height = buf.height;
    s.a = t.a; s.bx = t.bx; s.by = t.by;
    s.coords = pts.coords; s.colourIndex = pts.colourIndex;
    const sel = pts.selected;
    this.use(style.radius, style.palette, -1, sel ? style.dimmedAlpha : style.alpha);
    const count = this.count;
    count.seen.fill(0);
    count.drawn = 0;
    count.clusters = 0;
    this.passVisible(pts, count);
    if (sel && sel.length > 0) {
      this.use(style.selectedRadius + 1, style.palette, style.outline, 1);
      passSome(s, sel);
      this.use(style.selectedRadius, style.palette, -1, 1);
      passSome(s, sel);
    }
    return { pointsDrawn: this.count.drawn, clustersDrawn: this.count.clusters };
  }

  /**
   * The full pass, over the cells that can touch the buffer only: the rows of cells in view, each
   * a contiguous run of the drawing order. Skipped points lie wholly outside, so the frame is the
   * same as drawing them all.
   */
  private passVisible(pts: RasterPoints, count: PassCount): void {
    const s = this.s, cells = pts.cells, n = pts.colourIndex.length;
    if (!cells || !(s.a > 0) || cells.begins[cells.begins.length - 1] !== n) {
      passRange(s, 0, n, pts.labels, count);
      return;
    }
    const { grid, begins, minX, maxY, cellW, cellH } = cells;
    // Data extent of the buffer widened by the stamp and a pixel; one more cell each side absorbs rounding.
    const m = s.reach + 1;
    const x0 = (-m - s.bx) / s.a, x1 = (s.width + m - s.bx) / s.a;
    const y0 = (s.by - s.height - m) / s.a, y1 = (s.by + m) / s.a;
    const cx0 = clampCell((x0 - minX) / cellW - 1, grid), cx1 = clampCell((x1 - minX) / cellW + 1, grid);
    const cy0 = clampCell((maxY - y1) / cellH - 1, grid), cy1 = clampCell((maxY - y0) / cellH + 1, grid);
    if (cx0 === 0 && cx1 === grid - 1) {
      passRange(s, begins[cy0 * grid], begins[(cy1 + 1) * grid], pts.labels, count);
      return;
    }
    for (let cy = cy0; cy <= cy1; cy++) passRange(s, begins[cy * grid + cx0], begins[cy * grid + cx1 + 1], pts.labels, count);
  }

  /** Sets the pass's stamp and colours; `fixed` ≥ 0 paints every point that colour. */
  private use(radius: number, palette: Uint32Array, fixed: number, alpha: number): void {
    const s = this.s;
    let st = this.stamps.get(radius);
    if (!st) {
      if (this.stamps.size >= 8) this.stamps.clear();
      st = { stamp: discStamp(radius), linear: new Int32Array(0), width: -1 };
      this.stamps.set(radius, st);
    }
    if (st.width !== s.width) {
      const o = st.stamp.offsets;
      st.linear = new Int32Array(o.length / 2);
      for (let k = 0; k < st.linear.length; k++) st.linear[k] = o[2 * k + 1] * s.width + o[2 * k];
      st.width = s.width;
    }
    s.linear = st.linear;
    s.offsets = st.stamp.offsets;
    s.reach = st.stamp.reach;
    const a256 = Math.round(Math.min(1, Math.max(0, alpha)) * 256);
    s.inv = 256 - a256;
    if (s.rb.length < palette.length) {
      s.rb = new Int32Array(palette.length);
      s.g = new Int32Array(palette.length);
      s.opaque = new Uint32Array(palette.length);
    }
    for (let c = 0; c < palette.length; c++) {
      const col = fixed >= 0 ? fixed : palette[c];
      s.opaque[c] = col | 0xff000000;
      s.rb[c] = Math.imul(col & 0xff00ff, a256);
      s.g[c] = Math.imul(col & 0xff00, a256);
    }
  }
}
