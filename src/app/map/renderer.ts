import type { Colouring } from './colouring';
import { drawOrderCells, permute, permutePairs, type DrawCells } from './draw-order';
import { placedIndex, withPlacedColours } from './placed';
import { BACKGROUND, pointStyle } from './point-style';
import { Rasterizer, selectedPositions, type DrawStats, type PixelBuffer, type RasterPoints, type RasterStyle } from './raster';
import type { MapView } from './view';

/**
 * Draws the Map into a 2-D canvas through one reused ImageData: points are kept in a shuffled
 * drawing order (rebuilt only for new points), colours, placed windows and selection are
 * re-ordered only when they change (the selection as the list of its positions), so a pan is
 * one raster pass over typed arrays (over the grid cells in view only) plus one putImageData.
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
  private cells: DrawCells | null = null;
  private coords: Float32Array = new Float32Array(0);
  private labels: Int32Array = new Int32Array(0);
  private colourIndex: Uint8Array = new Uint8Array(0);
  private selection: Uint8Array = new Uint8Array(0);
  /** Positions of the selected points in drawing order. */
  private selected: Int32Array = new Int32Array(0);
  private hasSelection = false;
  private style: RasterStyle | null = null;
  /** Number of points and device pixel ratio the style was made for (its palette is the third key). */
  private styleFor = { n: -1, dpr: -1 };
  private readonly points: RasterPoints = { coords: new Float32Array(0), colourIndex: new Uint8Array(0), labels: new Int32Array(0), selected: null };
  private palette: Uint32Array = new Uint32Array(1);
  private readonly transform = { a: 1, bx: 0, by: 0 };
  /** Placed windows (drawing order) and the lighter colouring built from them; null = none placed. */
  private placed: Uint8Array | null = null;
  private srcPlaced: Uint8Array | null = null;
  private placedColours: { src: Uint32Array; index: Uint16Array; palette: Uint32Array } | null = null;
  /** Whether placedColours.index matches the current colours and placed windows. */
  private placedFresh = false;

  /** New coordinates and clusters (a new run): rebuilds the drawing order. */
  setPoints(coords: Float32Array, labels: Int32Array): void {
    if (coords === this.srcCoords && labels === this.srcLabels) return;
    const n = labels.length;
    ({ order: this.order, cells: this.cells } = drawOrderCells(coords));
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
    this.placedFresh = false;
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
    this.placedFresh = false;
    this.placed = mask && mask.length === this.order.length ? permute(mask, this.order, new Uint8Array(mask.length)) : null;
  }

  /** A new colouring (recolour): re-orders its index array into the reused buffer. */
  setColours(c: Pick<Colouring, 'index' | 'palette'>): void {
    if (c.index !== this.srcIndex && c.index.length === this.order.length) {
      permute(c.index, this.order, this.colourIndex);
      this.srcIndex = c.index;
      this.placedFresh = false;
    }
    this.palette = c.palette;
  }

  /** The shared selection (null or an empty mask = none). */
  setSelection(mask: Uint8Array | null, count: number): void {
    this.hasSelection = mask !== null && count > 0 && mask.length === this.order.length;
    if (!this.hasSelection || mask === this.srcSelection) return;
    permute(mask!, this.order, this.selection);
    this.srcSelection = mask;
    this.selected = selectedPositions(this.selection);
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
        this.placedFresh = false;
      }
      if (!this.placedFresh) placedIndex(this.colourIndex, this.placed, this.palette.length, pc.index);
      this.placedFresh = true;
      palette = pc.palette;
      colourIndex = pc.index;
    }
    const n = this.order.length, sf = this.styleFor;
    if (!this.style || this.style.palette !== palette || sf.n !== n || sf.dpr !== dpr) {
      this.style = pointStyle(n, dpr, palette);
      sf.n = n;
      sf.dpr = dpr;
    }
    const buf = this.buf!;
    this.raster.clear(buf, BACKGROUND);
    const t = this.transform;
    t.a = view.scale * dpr;
    t.bx = (view.width / 2 - view.centreX * view.scale) * dpr;
    t.by = (view.height / 2 + view.centreY * view.scale) * dpr;
    const pts = this.points;
    pts.coords = this.coords;
    pts.colourIndex = colourIndex;
    pts.labels = this.labels;
    pts.selected = this.hasSelection ? this.selected : null;
    pts.cells = this.cells;
    const stats = this.raster.draw(buf, pts, t, this.style);
    ctx.putImageData(this.image, 0, 0);
    return stats;
  }
}
