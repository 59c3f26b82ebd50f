import { toScreen, type PlacedNode, type TreeLayout } from './layout';

export interface TreeStyle {
  /** Height of the cut line. */
  cut: number;
  /** Cluster of a drawn node that lies below the cut (from its first leaf), else -1. */
  clusterOf: (p: PlacedNode) => number;
  colour: (cluster: number) => string;
  /** The hovered node (its subtree is drawn darker over a light band). */
  hover: PlacedNode | null;
}

const ABOVE = '#9aa0a6';
const INK = '#1f2328';

/** Draws the summarised tree, the cut line and the hover band; returns the number of branches drawn. */
export function drawTree(ctx: CanvasRenderingContext2D, layout: TreeLayout, style: TreeStyle, dpr: number): number {
  const { box } = layout;
  const vertical = layout.orientation === 'vertical';
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.clearRect(0, 0, ctx.canvas.width / dpr, ctx.canvas.height / dpr);
  const line = (a: [number, number], b: [number, number]) => {
    ctx.moveTo(a[0], a[1]);
    ctx.lineTo(b[0], b[1]);
  };

  if (style.hover) {
    const p = style.hover;
    const [x0, y0] = toScreen(layout, p.spanFrom - 3, p.height);
    const [x1, y1] = toScreen(layout, p.spanTo + 3, 0);
    ctx.fillStyle = 'rgb(11 92 173 / 0.10)';
    ctx.fillRect(Math.min(x0, x1), Math.min(y0, y1), Math.abs(x1 - x0) + (vertical ? 0 : 14), Math.abs(y1 - y0) + (vertical ? 14 : 0));
  }

  // Branches grouped by colour: one path per colour keeps the canvas calls few.
  const paths = new Map<string, PlacedNode[]>();
  for (const p of layout.nodes) {
    const c = p.height <= style.cut ? style.clusterOf(p) : -1;
    const key = c < 0 ? ABOVE : style.colour(c);
    let list = paths.get(key);
    if (!list) paths.set(key, (list = []));
    list.push(p);
  }
  ctx.lineWidth = 1.5;
  for (const [colour, list] of paths) {
    ctx.strokeStyle = colour;
    ctx.fillStyle = colour;
    ctx.beginPath();
    for (const p of list) {
      line(toScreen(layout, p.along, p.height), toScreen(layout, p.along, p.parentHeight));
      if (p.node.children) line(toScreen(layout, p.childFrom, p.height), toScreen(layout, p.childTo, p.height));
    }
    ctx.stroke();
    for (const p of list) if (p.node.collapsed) glyph(ctx, layout, p);
  }

  if (style.hover) {
    const p = style.hover;
    ctx.strokeStyle = INK;
    ctx.lineWidth = 3;
    ctx.beginPath();
    line(toScreen(layout, p.along, p.height), toScreen(layout, p.along, p.parentHeight));
    ctx.stroke();
  }

  // The cut line across the whole box.
  const [cx, cy] = toScreen(layout, 0, style.cut);
  ctx.strokeStyle = '#c0392b';
  ctx.lineWidth = 2;
  ctx.setLineDash([6, 4]);
  ctx.beginPath();
  if (vertical) line([box.left - 6, cy], [box.left + box.width + 6, cy]);
  else line([cx, box.top - 6], [cx, box.top + box.height + 6]);
  ctx.stroke();
  ctx.setLineDash([]);
  return layout.nodes.length;
}

/** A collapsed subtree: a small wedge below (or beside) its node, its size shown by the view's labels. */
function glyph(ctx: CanvasRenderingContext2D, layout: TreeLayout, p: PlacedNode): void {
  const [x, y] = toScreen(layout, p.along, p.height);
  const s = Math.max(3, Math.min(7, 2 + Math.log10(p.node.windows + 1) * 1.6));
  ctx.beginPath();
  if (layout.orientation === 'vertical') {
    ctx.moveTo(x, y);
    ctx.lineTo(x - s, y + 2 * s);
    ctx.lineTo(x + s, y + 2 * s);
  } else {
    ctx.moveTo(x, y);
    ctx.lineTo(x + 2 * s, y - s);
    ctx.lineTo(x + 2 * s, y + s);
  }
  ctx.closePath();
  ctx.fill();
}
