/**
 * The Map's point rasterizer: draws every window as a small disc straight into a pixel buffer
 * (one uint32 per device pixel, the memory layout of an ImageData), so a frame is one pass over
 * the points and one putImageData, at any study size. DOM-free: the caller owns the buffer.
 *
 * Colours are packed RGBA uint32 in ImageData byte order on a little-endian machine
 * (0xAABBGGRR), as every platform the app runs on is. Discs are drawn without anti-aliasing; a
 * pass blends one constant alpha over what is already there.
 */

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
  /** 1 = selected; null = no selection. */
  selection: Uint8Array | null;
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

/**
 * Reusable per-frame scratch: stamps and blend tables are rebuilt only when the style changes,
 * so drawing a frame allocates nothing.
 */
export class Rasterizer {
  private stampRadius = -1;
  private stamp: Stamp = discStamp(0);
  private linear: Int32Array = new Int32Array(0);
  private linearWidth = -1;
  private rb: Float64Array = new Float64Array(0);
  private g: Float64Array = new Float64Array(0);
  private opaque: Uint32Array = new Uint32Array(0);
  private seen: Uint8Array = new Uint8Array(0);

  /** Clears the buffer to one packed colour. */
  clear(buf: PixelBuffer, colour: number): void {
    buf.pixels.fill(colour);
  }

  /**
   * Draws the points: everything first (dimmed when there is a selection), then, for a selection,
   * a ring and the disc of every selected point on top.
   */
  draw(buf: PixelBuffer, pts: RasterPoints, t: PixelTransform, style: RasterStyle): DrawStats {
    const sel = pts.selection;
    const stats = this.pass(buf, pts, t, style.palette, -1, style.radius, sel ? style.dimmedAlpha : style.alpha, null, true);
    if (sel) {
      this.pass(buf, pts, t, style.palette, style.outline, style.selectedRadius + 1, 1, sel, false);
      this.pass(buf, pts, t, style.palette, -1, style.selectedRadius, 1, sel, false);
    }
    return stats;
  }

  private useStamp(radius: number, width: number): void {
    if (radius !== this.stampRadius) {
      this.stamp = discStamp(radius);
      this.stampRadius = radius;
      this.linearWidth = -1;
    }
    if (width !== this.linearWidth) {
      const o = this.stamp.offsets;
      this.linear = new Int32Array(o.length / 2);
      for (let k = 0; k < this.linear.length; k++) this.linear[k] = o[2 * k + 1] * width + o[2 * k];
      this.linearWidth = width;
    }
  }

  /** Premultiplied colour channels (red|blue and green lanes) for one alpha; `fixed` ≥ 0 paints every point that colour. */
  private useColours(palette: Uint32Array, fixed: number, a256: number): void {
    if (this.rb.length < palette.length + 1) {
      this.rb = new Float64Array(palette.length + 1);
      this.g = new Float64Array(palette.length + 1);
      this.opaque = new Uint32Array(palette.length + 1);
    }
    for (let c = 0; c < palette.length; c++) {
      const col = fixed >= 0 ? fixed : palette[c];
      this.opaque[c] = col | 0xff000000;
      this.rb[c] = (col & 0xff00ff) * a256;
      this.g[c] = (col & 0xff00) * a256;
    }
  }

  private pass(
    buf: PixelBuffer, pts: RasterPoints, t: PixelTransform, palette: Uint32Array, fixed: number,
    radius: number, alpha: number, only: Uint8Array | null, count: boolean,
  ): DrawStats {
    const { pixels, width: W, height: H } = buf;
    this.useStamp(radius, W);
    const a256 = Math.round(Math.min(1, Math.max(0, alpha)) * 256);
    const inv = 256 - a256;
    this.useColours(palette, fixed, a256);
    const rbT = this.rb, gT = this.g, opaque = this.opaque, lin = this.linear, off = this.stamp.offsets, R = this.stamp.reach;
    const { coords, colourIndex, labels } = pts;
    const n = colourIndex.length;
    if (count) this.resetSeen(labels);
    const seen = this.seen;
    let drawn = 0, clusters = 0;
    const { a, bx, by } = t;
    const m = lin.length;
    for (let i = 0; i < n; i++) {
      if (only !== null && only[i] === 0) continue;
      const fx = bx + a * coords[2 * i], fy = by - a * coords[2 * i + 1];
      // Written so that NaN coordinates are skipped too.
      if (!(fx >= -R && fy >= -R && fx < W + R && fy < H + R)) continue;
      // floor() by truncating a positive number: fx + R + 1 > 0 here.
      const px = ((fx + R + 1) | 0) - R - 1, py = ((fy + R + 1) | 0) - R - 1;
      if (count) {
        drawn++;
        const l = labels[i];
        if (l >= 0 && l < seen.length && seen[l] === 0) { seen[l] = 1; clusters++; }
      }
      const c = colourIndex[i];
      const srb = rbT[c], sg = gT[c];
      if (px >= R && py >= R && px < W - R && py < H - R) {
        const base = py * W + px;
        if (inv === 0) {
          // Opaque: no need to read what is underneath.
          const col = opaque[c];
          for (let k = 0; k < m; k++) pixels[base + lin[k]] = col;
          continue;
        }
        for (let k = 0; k < m; k++) {
          const p = base + lin[k];
          const d = pixels[p];
          pixels[p] = 0xff000000 | (((srb + (d & 0xff00ff) * inv) >>> 8) & 0xff00ff) | (((sg + (d & 0xff00) * inv) >>> 8) & 0xff00);
        }
      } else {
        for (let k = 0; k < m; k++) {
          const x = px + off[2 * k], y = py + off[2 * k + 1];
          if (x < 0 || y < 0 || x >= W || y >= H) continue;
          const p = y * W + x;
          const d = pixels[p];
          pixels[p] = 0xff000000 | (((srb + (d & 0xff00ff) * inv) >>> 8) & 0xff00ff) | (((sg + (d & 0xff00) * inv) >>> 8) & 0xff00);
        }
      }
    }
    return { pointsDrawn: drawn, clustersDrawn: clusters };
  }

  private resetSeen(labels: Int32Array): void {
    // Cluster ids are small (k). The labels array may be refilled in place (a new tree cut, a
    // merge), so its largest id is found every frame (one pass), and the table grows when needed.
    let max = -1;
    for (let i = 0; i < labels.length; i++) if (labels[i] > max) max = labels[i];
    if (max + 1 > this.seen.length) this.seen = new Uint8Array(max + 1);
    else this.seen.fill(0);
  }
}
