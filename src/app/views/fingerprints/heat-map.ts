import { viridis } from '../../lib/palette';

/** Standardized means beyond ±CLAMP share the end colours of the scale. */
export const CLAMP = 2;

/** Viridis colour of a standardized mean: -CLAMP → dark purple, 0 → teal, +CLAMP → yellow; NaN → null. */
export function zColour(z: number): [number, number, number] | null {
  if (!Number.isFinite(z)) return null;
  return viridis((Math.max(-CLAMP, Math.min(CLAMP, z)) + CLAMP) / (2 * CLAMP));
}

/** Geometry of the clusters × features grid. */
export interface HeatLayout {
  left: number;
  top: number;
  cellW: number;
  cellH: number;
  width: number;
  height: number;
}

export function heatLayout(k: number, d: number, available: number): HeatLayout {
  const left = 130, top = 110;
  const cellW = Math.max(8, Math.min(26, Math.floor((available - left - 12) / Math.max(1, d))));
  const cellH = 22;
  return { left, top, cellW, cellH, width: left + cellW * d + 12, height: top + cellH * k + 28 };
}

/** The cell under a point, as (row = cluster, column position in the feature order), or null. */
export function cellAt(l: HeatLayout, k: number, d: number, x: number, y: number): { row: number; col: number } | null {
  const col = Math.floor((x - l.left) / l.cellW), row = Math.floor((y - l.top) / l.cellH);
  if (x < l.left || y < l.top || col >= d || row >= k) return null;
  return { row, col };
}

/**
 * Two outlines of one feature's distribution (the focused cluster and all other windows), each
 * scaled to its own total so their shapes compare: SVG paths in a w × h box.
 */
export function distributionPaths(inside: ArrayLike<number>, outside: ArrayLike<number>, w: number, h: number): { inside: string; outside: string } {
  const bins = inside.length;
  const sum = (a: ArrayLike<number>) => { let s = 0; for (let i = 0; i < a.length; i++) s += a[i]; return s; };
  const si = sum(inside) || 1, so = sum(outside) || 1;
  let peak = 0;
  for (let b = 0; b < bins; b++) peak = Math.max(peak, inside[b] / si, outside[b] / so);
  const path = (a: ArrayLike<number>, s: number) => {
    const bw = w / bins;
    let p = `M0 ${h}`;
    for (let b = 0; b < bins; b++) {
      const y = h - (peak > 0 ? (a[b] / s / peak) * (h - 1) : 0);
      p += ` L${(b * bw).toFixed(1)} ${y.toFixed(1)} L${((b + 1) * bw).toFixed(1)} ${y.toFixed(1)}`;
    }
    return `${p} L${w} ${h} Z`;
  };
  return { inside: path(inside, si), outside: path(outside, so) };
}

/** One cluster's and the other clusters' bin counts of feature j from the k × d × bins histogram block. */
export function splitHistogram(counts: Float64Array, k: number, d: number, bins: number, cluster: number, j: number): { inside: Float64Array; outside: Float64Array } {
  const inside = new Float64Array(bins), outside = new Float64Array(bins);
  for (let c = 0; c < k; c++) {
    const at = (c * d + j) * bins;
    const into = c === cluster ? inside : outside;
    for (let b = 0; b < bins; b++) into[b] += counts[at + b];
  }
  return { inside, outside };
}
