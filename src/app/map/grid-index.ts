/**
 * A uniform grid over 2-D points (interleaved x, y) for hit-testing: which points lie near a
 * position or inside a rectangle, without scanning every point. Cells are stored in CSR form
 * (cellStart offsets into one item array), built once per set of coordinates.
 */
export interface GridIndex {
  minX: number;
  minY: number;
  cellSize: number;
  cols: number;
  rows: number;
  /** Items of cell c are items[cellStart[c] .. cellStart[c + 1]). */
  cellStart: Int32Array;
  items: Int32Array;
}

/** Builds a grid with about `perCell` points per occupied cell on average (at most 512 × 512 cells). */
export function buildGridIndex(coords: Float32Array, perCell = 8): GridIndex {
  const n = coords.length / 2;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = coords[2 * i], y = coords[2 * i + 1];
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  if (n === 0) { minX = minY = 0; maxX = maxY = 1; }
  const span = Math.max(maxX - minX, maxY - minY, 1e-12);
  const side = Math.min(512, Math.max(1, Math.ceil(Math.sqrt(n / perCell))));
  const cellSize = span / side;
  const cols = Math.max(1, Math.ceil((maxX - minX) / cellSize) + 1);
  const rows = Math.max(1, Math.ceil((maxY - minY) / cellSize) + 1);
  const cellOf = new Int32Array(n);
  const cellStart = new Int32Array(cols * rows + 1);
  for (let i = 0; i < n; i++) {
    const cx = Math.floor((coords[2 * i] - minX) / cellSize);
    const cy = Math.floor((coords[2 * i + 1] - minY) / cellSize);
    const c = cy * cols + cx;
    cellOf[i] = c;
    cellStart[c + 1]++;
  }
  for (let c = 0; c < cols * rows; c++) cellStart[c + 1] += cellStart[c];
  const fill = cellStart.slice(0, cols * rows);
  const items = new Int32Array(n);
  for (let i = 0; i < n; i++) items[fill[cellOf[i]]++] = i;
  return { minX, minY, cellSize, cols, rows, cellStart, items };
}

/** Calls `visit` for every point in cells overlapping the rectangle [x0, x1] × [y0, y1]. */
export function visitCells(g: GridIndex, x0: number, y0: number, x1: number, y1: number, visit: (i: number) => void): void {
  const c0 = Math.max(0, Math.floor((x0 - g.minX) / g.cellSize));
  const c1 = Math.min(g.cols - 1, Math.floor((x1 - g.minX) / g.cellSize));
  const r0 = Math.max(0, Math.floor((y0 - g.minY) / g.cellSize));
  const r1 = Math.min(g.rows - 1, Math.floor((y1 - g.minY) / g.cellSize));
  for (let r = r0; r <= r1; r++) {
    for (let c = c0; c <= c1; c++) {
      const cell = r * g.cols + c;
      for (let k = g.cellStart[cell]; k < g.cellStart[cell + 1]; k++) visit(g.items[k]);
    }
  }
}

/** The point nearest to (x, y) within `radius`, or -1. */
export function nearestPoint(g: GridIndex, coords: Float32Array, x: number, y: number, radius: number): number {
  let best = -1;
  let bestD = radius * radius;
  visitCells(g, x - radius, y - radius, x + radius, y + radius, (i) => {
    const dx = coords[2 * i] - x, dy = coords[2 * i + 1] - y;
    const d = dx * dx + dy * dy;
    if (d <= bestD) { bestD = d; best = i; }
  });
  return best;
}
