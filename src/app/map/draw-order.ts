import { seededRandom } from '../../core/random';

/**
 * Where the cells of the drawing order lie: cell (cx, cy) covers data x from minX + cx·cellW and
 * data y down from maxY − cy·cellH (rows from the top, as the screen), and its points are
 * order[begins[cy·grid + cx] .. begins[cy·grid + cx + 1]). Lets a frame skip cells out of view.
 */
export interface DrawCells {
  grid: number;
  begins: Int32Array;
  minX: number;
  maxY: number;
  cellW: number;
  cellH: number;
}

/**
 * The order the Map draws points in. Points are grouped by a coarse grid over their coordinates
 * (cell by cell, so that consecutive points land near each other in the pixel buffer, which keeps
 * a million-point frame in cache, and a zoomed-in frame can skip the cells out of view), and
 * shuffled (seeded) within each cell, so that where clusters or subjects overlap none of them is
 * always painted last (the table's own order is often by subject and time). Same points and
 * seed → same order.
 */
export function drawOrder(coords: Float32Array, seed = 1, grid = 128): Int32Array {
  return drawOrderCells(coords, seed, grid).order;
}

/** The drawing order and its cells (null when no point has finite coordinates). */
export function drawOrderCells(coords: Float32Array, seed = 1, grid = 128): { order: Int32Array; cells: DrawCells | null } {
  const n = coords.length / 2;
  const shuffled = new Int32Array(n);
  for (let i = 0; i < n; i++) shuffled[i] = i;
  const random = seededRandom(seed);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    const t = shuffled[i];
    shuffled[i] = shuffled[j];
    shuffled[j] = t;
  }
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = coords[2 * i], y = coords[2 * i + 1];
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  const sx = grid / Math.max(maxX - minX, 1e-12), sy = grid / Math.max(maxY - minY, 1e-12);
  const cellOf = (i: number): number => {
    const cx = Math.min(grid - 1, Math.max(0, Math.floor((coords[2 * i] - minX) * sx)));
    const cy = Math.min(grid - 1, Math.max(0, Math.floor((maxY - coords[2 * i + 1]) * sy)));
    return Number.isFinite(cx + cy) ? cy * grid + cx : 0;
  };
  // Stable counting sort of the shuffled points by cell (rows from the top, as the screen).
  const start = new Int32Array(grid * grid + 1);
  for (let i = 0; i < n; i++) start[cellOf(i) + 1]++;
  for (let c = 0; c < grid * grid; c++) start[c + 1] += start[c];
  const begins = start.slice();
  const order = new Int32Array(n);
  for (let j = 0; j < n; j++) {
    const i = shuffled[j];
    order[start[cellOf(i)]++] = i;
  }
  const finite = Number.isFinite(minX + maxX + minY + maxY);
  return { order, cells: finite ? { grid, begins, minX, maxY, cellW: 1 / sx, cellH: 1 / sy } : null };
}

/** out[j] = values[order[j]] for interleaved pairs (coordinates). */
export function permutePairs(values: Float32Array, order: Int32Array, out: Float32Array = new Float32Array(values.length)): Float32Array {
  for (let j = 0; j < order.length; j++) {
    const i = order[j];
    out[2 * j] = values[2 * i];
    out[2 * j + 1] = values[2 * i + 1];
  }
  return out;
}

/** out[j] = values[order[j]], into a reused array of the same kind. */
export function permute<T extends Uint8Array | Int32Array>(values: T, order: Int32Array, out: T): T {
  for (let j = 0; j < order.length; j++) out[j] = values[order[j]];
  return out;
}
