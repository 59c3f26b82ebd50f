import { toScreen, type PlacedNode, type TreeLayout } from './layout';

/**
 * The drawn node whose branch is nearest the pointer within `radius` pixels: a branch is the stem
 * from the node up to its parent's height, plus (for collapsed subtrees) the glyph below it.
 */
export function nodeAt(layout: TreeLayout, x: number, y: number, radius = 6): PlacedNode | null {
  let best: PlacedNode | null = null, bestD = radius;
  const vertical = layout.orientation === 'vertical';
  for (const p of layout.nodes) {
    const [ax, ay] = toScreen(layout, p.along, p.height);
    const [bx, by] = toScreen(layout, p.along, p.parentHeight);
    // Distance to the stem segment (axis-aligned).
    let d: number;
    if (vertical) {
      const lo = Math.min(ay, by), hi = Math.max(ay, by) ;
      d = Math.hypot(x - ax, y < lo ? lo - y : y > hi ? y - hi : 0);
      if (p.node.collapsed && y >= ay && y <= ay + 14 && Math.abs(x - ax) <= 7) d = 0;
    } else {
      const lo = Math.min(ax, bx), hi = Math.max(ax, bx);
      d = Math.hypot(y - ay, x < lo ? lo - x : x > hi ? x - hi : 0);
      if (p.node.collapsed && x >= ax && x <= ax + 14 && Math.abs(y - ay) <= 7) d = 0;
    }
    if (d < bestD || (d === bestD && best && p.node.windows < best.node.windows)) {
      best = p;
      bestD = d;
    }
  }
  return best;
}
