import { selectInBox, selectInPolygon } from './polygon';
import type { GridIndex } from './grid-index';
import { panBy, toData, type MapView } from './view';

/** One pointer drag on the Map: a pan, a box selection or a lasso selection. */
export type Gesture =
  | { kind: 'pan'; lastX: number; lastY: number }
  | { kind: 'box'; x0: number; y0: number; x1: number; y1: number }
  | { kind: 'lasso'; points: number[] };

export function startGesture(kind: Gesture['kind'], x: number, y: number): Gesture {
  if (kind === 'pan') return { kind, lastX: x, lastY: y };
  if (kind === 'box') return { kind, x0: x, y0: y, x1: x, y1: y };
  return { kind, points: [x, y] };
}

/** Follows the pointer; returns the new view for a pan, else the same view. */
export function moveGesture(g: Gesture, view: MapView, x: number, y: number): MapView {
  if (g.kind === 'pan') {
    const next = panBy(view, x - g.lastX, y - g.lastY);
    g.lastX = x;
    g.lastY = y;
    return next;
  }
  if (g.kind === 'box') {
    g.x1 = x;
    g.y1 = y;
  } else {
    const n = g.points.length;
    // Skip vertices closer than 2 px to the last one: fewer vertices, same shape.
    if (Math.hypot(x - g.points[n - 2], y - g.points[n - 1]) >= 2) g.points.push(x, y);
  }
  return view;
}

/** The selection a finished box or lasso makes (screen positions converted to map data), or null for a pan or a click. */
export function finishGesture(g: Gesture, view: MapView, grid: GridIndex, coords: Float32Array): Uint8Array | null {
  if (g.kind === 'box') {
    if (Math.abs(g.x1 - g.x0) < 3 && Math.abs(g.y1 - g.y0) < 3) return null;
    const [ax, ay] = toData(view, g.x0, g.y0);
    const [bx, by] = toData(view, g.x1, g.y1);
    return selectInBox(grid, coords, ax, ay, bx, by);
  }
  if (g.kind === 'lasso') {
    if (g.points.length < 6) return null;
    const poly: number[] = [];
    for (let k = 0; k < g.points.length; k += 2) poly.push(...toData(view, g.points[k], g.points[k + 1]));
    return selectInPolygon(grid, coords, poly);
  }
  return null;
}
