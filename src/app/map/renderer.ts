import type { Colouring } from './colouring';
import { drawOrder, permute, permutePairs } from './draw-order';
import { placedIndex, withPlacedColours } from './placed';
import { BACKGROUND, pointStyle } from './point-style';
import { Rasterizer, type DrawStats, type PixelBuffer, type RasterStyle } from './raster';
import type { MapView } from './view';

/**
 * Draws the Map into a 2-D canvas through one reused ImageData: points are kept in a shuffled
 * drawing order (rebuilt only for new points), colours and selection are re-ordered only when
 * they change, and a frame is one raster pass plus one putImageData.
 */
export class MapRenderer {
  private readonly raster = new Rasterizer();
  private image: ImageData | null = null;
  private buf: PixelBuffer | null = null;
  private srcCoords: Float32Array | null = null;
  private srcLabels: Int32Array | null = null;
  private srcIndex: Uint8Array | null = null;
  private srcSelection: Uint8Array | null = null;
  private order: Int32Array = new Int32Array(0);
  private coords: Float32Array = new Float32Array(0);
  private labels: Int32Array = new Int32Array(0);
  private colourIndex: Uint8Array = new Uint8Array(0);
  private selection: Uint8Array = new Uint8Array(0);
  private hasSelection = false;
  private style: RasterStyle | null = null;
  private styleKey = '';
  private palette: Uint32Array = new Uint32Array(1);
  private readonly transform = { a: 1, bx: 0, by: 0 };
  /** Placed windows (drawing order) and the lighter colouring built from them; null = none placed. */
  private placed: Uint8Array | null = null;
  private srcPlaced: Uint8Array | null = null;
  private placedColours: { src: Uint32Array; index: Uint16Array; palette: Uint32Array } | null = null;

  /** New coordinates and clusters (a new run): rebuilds the drawing order. */
  setPoints(coords: Float32Array, labels: Int32Array): void {
    if (coords === this.srcCoords && labels === this.srcLabels) return;
    const n = labels.length;
    this.order = drawOrder(coords);
    if (n !== this.coords.length / 2) {
      this.coords = new Float32Array(2 * n);
      this.labels = new Int32Array(n);
      this.colourIndex = new Uint8Array(n);
      this.selection = new Uint8Array(n);
    }
    this.srcIndex = null;
    this.srcSelection = null;
    this.srcPlaced = null;
    this.placed = null;
    permutePairs(coords, this.order, this.coords);
    permute(labels, this.order, this.labels);
    this.srcCoords = coords;
    this.srcLabels = labels;
  }

  /** Windows placed from sampled neighbours (1 = placed), drawn lighter; null when none were. */
  setPlaced(mask: Uint8Array | null): void {
    if (mask === this.srcPlaced) return;
    this.srcPlaced = mask;
    this.placedColours = null;
    this.placed = mask && mask.length === this.order.length ? permute(mask, this.order, new Uint8Array(mask.length)) : null;
  }

  /** A new colouring (recolour): re-orders its index array into the reused buffer. */
  setColours(c: Pick<Colouring, 'index' | 'palette'>): void {
    if (c.index !== this.srcIndex && c.index.length === this.order.length) {
      permute(c.index, this.order, this.colourIndex);
      this.srcIndex = c.index;
    }
    if (c.palette !== this.palette) {
      this.palette = c.palette;
      this.styleKey = '';
    }
  }

  /** The shared selection (null or an empty mask = none). */
  setSelection(mask: Uint8Array | null, count: number): void {
    this.hasSelection = mask !== null && count > 0 && mask.length === this.order.length;
    if (!this.hasSelection || mask === this.srcSelection) return;
    permute(mask!, this.order, this.selection);
    this.srcSelection = mask;
  }

  /** Draws one frame; the canvas must be view size × dpr device pixels. */
  draw(ctx: CanvasRenderingContext2D, view: MapView, dpr: number): DrawStats {
    const w = Math.max(1, Math.round(view.width * dpr)), h = Math.max(1, Math.round(view.height * dpr));
    if (!this.image || this.image.width !== w || this.image.height !== h) {
      this.image = new ImageData(w, h);
      this.buf = { pixels: new Uint32Array(this.image.data.buffer), width: w, height: h };
    }
    let palette = this.palette, colourIndex: Uint8Array | Uint16Array = this.colourIndex;
    if (this.placed) {
      let pc = this.placedColours;
      if (!pc || pc.src !== this.palette || pc.index.length !== this.colourIndex.length) {
        pc = this.placedColours = { src: this.palette, palette: withPlacedColours(this.palette), index: new Uint16Array(this.colourIndex.length) };
      }
      palette = pc.palette;
      colourIndex = placedIndex(this.colourIndex, this.placed, this.palette.length, pc.index);
    }
    const key = `${this.order.length}:${dpr}:${palette.length}:${this.placed ? 1 : 0}`;
    if (key !== this.styleKey || !this.style || this.style.palette !== palette) {
      this.style = pointStyle(this.order.length, dpr, palette);
      this.styleKey = key;
    }
    const buf = this.buf!;
    this.raster.clear(buf, BACKGROUND);
    const t = this.transform;
    t.a = view.scale * dpr;
    t.bx = (view.width / 2 - view.centreX * view.scale) * dpr;
    t.by = (view.height / 2 + view.centreY * view.scale) * dpr;
    const stats = this.raster.draw(buf, {
      coords: this.coords,
      colourIndex,
      labels: this.labels,
      selection: this.hasSelection ? this.selection : null,
    }, t, this.style);
    ctx.putImageData(this.image, 0, 0);
    return stats;
  }
}
