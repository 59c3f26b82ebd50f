import { visitCells, type GridIndex } from './grid-index';

/**
 * Even–odd (crossing number) point-in-polygon test; `poly` is interleaved x, y of the vertices,
 * closed implicitly (common practice, as in W. R. Franklin's PNPOLY).
 */
export function pointInPolygon(poly: Float64Array | number[], x: number, y: number): boolean {
  const m = poly.length / 2;
  let inside = false;
  for (let i = 0, j = m - 1; i < m; j = i++) {
    const xi = poly[2 * i], yi = poly[2 * i + 1];
    const xj = poly[2 * j], yj = poly[2 * j + 1];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** A selection mask (1 = selected) of the points inside a polygon given in data coordinates. */
export function selectInPolygon(g: GridIndex, coords: Float32Array, poly: number[]): Uint8Array {
  const mask = new Uint8Array(coords.length / 2);
  if (poly.length < 6) return mask;
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (let k = 0; k < poly.length; k += 2) {
    x0 = Math.min(x0, poly[k]); x1 = Math.max(x1, poly[k]);
    y0 = Math.min(y0, poly[k + 1]); y1 = Math.max(y1, poly[k + 1]);
  }
  visitCells(g, x0, y0, x1, y1, (i) => {
    const x = coords[2 * i], y = coords[2 * i + 1];
    if (x >= x0 && x <= x1 && y >= y0 && y <= y1 && pointInPolygon(poly, x, y)) mask[i] = 1;
  });
  return mask;
}

/** A selection mask of the points inside the rectangle spanned by two corners (data coordinates). */
export function selectInBox(g: GridIndex, coords: Float32Array, ax: number, ay: number, bx: number, by: number): Uint8Array {
  const x0 = Math.min(ax, bx), x1 = Math.max(ax, bx), y0 = Math.min(ay, by), y1 = Math.max(ay, by);
  const mask = new Uint8Array(coords.length / 2);
  visitCells(g, x0, y0, x1, y1, (i) => {
    const x = coords[2 * i], y = coords[2 * i + 1];
    if (x >= x0 && x <= x1 && y >= y0 && y <= y1) mask[i] = 1;
  });
  return mask;
}
