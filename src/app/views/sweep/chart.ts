import type { SweepRow } from '../../../core/cluster/sweep';

export type SweepFigure = 'inertia' | 'silhouette' | 'calinskiHarabasz' | 'daviesBouldin';

/** The four figures of the sweep, with how to read each. */
export const SWEEP_FIGURES: { key: SweepFigure; title: string; reading: string }[] = [
  { key: 'inertia', title: 'Inertia (within-cluster SS)', reading: 'look for the elbow' },
  { key: 'silhouette', title: 'Silhouette (sampled)', reading: 'higher is better' },
  { key: 'calinskiHarabasz', title: 'Calinski–Harabasz', reading: 'higher is better' },
  { key: 'daviesBouldin', title: 'Davies–Bouldin', reading: 'lower is better' },
];

export interface ChartBox {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

export interface ChartPoint {
  k: number;
  value: number;
  x: number;
  y: number;
}

export interface Chart {
  points: ChartPoint[];
  /** SVG path through the finite points. */
  path: string;
  min: number;
  max: number;
  /** x of each k, for the axis and the current-k marker. */
  xOf: (k: number) => number;
}

/** Positions of one figure over k in a small chart (linear scales; non-finite values are left out). */
export function sweepChart(rows: readonly SweepRow[], key: SweepFigure, box: ChartBox): Chart {
  const finite = rows.filter((r) => Number.isFinite(r[key]));
  let min = Infinity, max = -Infinity;
  for (const r of finite) {
    min = Math.min(min, r[key]);
    max = Math.max(max, r[key]);
  }
  if (!(max > min)) { min = (Number.isFinite(min) ? min : 0) - 1; max = min + 2; }
  const kMin = rows.length ? rows[0].k : 0, kMax = rows.length ? rows[rows.length - 1].k : 1;
  const w = box.width - box.left - box.right, h = box.height - box.top - box.bottom;
  const xOf = (k: number) => box.left + (kMax > kMin ? ((k - kMin) / (kMax - kMin)) * w : w / 2);
  const yOf = (v: number) => box.top + (1 - (v - min) / (max - min)) * h;
  const points = finite.map((r) => ({ k: r.k, value: r[key], x: xOf(r.k), y: yOf(r[key]) }));
  const path = points.map((p, i) => `${i ? 'L' : 'M'}${p.x.toFixed(1)},${p.y.toFixed(1)}`).join('');
  return { points, path, min, max, xOf };
}

/** A short number for chart labels. */
export function shortNumber(v: number): string {
  const a = Math.abs(v);
  if (a >= 1e6) return `${(v / 1e6).toPrecision(3)}M`;
  if (a >= 1e4) return `${(v / 1e3).toPrecision(3)}k`;
  return Number(v.toPrecision(3)).toString();
}
