import { toScreen, type PlacedNode, type TreeLayout } from './layout';
import { niceStep } from './labels';

/** What the Tree figure needs besides the layout: the cut and each branch's (curated) cluster colour. */
export interface TreeFigureStyle {
  cut: number;
  /** Cluster of a drawn node below the cut, else -1. */
  clusterOf: (p: PlacedNode) => number;
  colour: (cluster: number) => string;
  /** Title written above the tree. */
  title: string;
  /** Legend entries (the curated clusters), written after the title. */
  legend: { name: string; colour: string }[];
}

const ABOVE = '#9aa0a6';
/** Room above the tree for the title and the legend (CSS pixels). */
export const TREE_FIGURE_TOP = 42;
const f1 = (v: number) => v.toFixed(1);

function esc(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/**
 * The Tree as a stand-alone SVG document from the same layout the view draws: one path per
 * colour (branches below the cut in their cluster's colour, above it grey), collapsed subtrees as
 * wedges, the dashed cut line and the height axis. `width` × `height` is the view's size.
 */
export function treeSvg(layout: TreeLayout, style: TreeFigureStyle, width: number, height: number): string {
  const vertical = layout.orientation === 'vertical';
  const seg = (a: [number, number], b: [number, number]) => `M${f1(a[0])} ${f1(a[1])}L${f1(b[0])} ${f1(b[1])}`;
  const byColour = new Map<string, { lines: string[]; wedges: string[] }>();
  for (const p of layout.nodes) {
    const c = p.height <= style.cut ? style.clusterOf(p) : -1;
    const key = c < 0 ? ABOVE : style.colour(c);
    let g = byColour.get(key);
    if (!g) byColour.set(key, (g = { lines: [], wedges: [] }));
    g.lines.push(seg(toScreen(layout, p.along, p.height), toScreen(layout, p.along, p.parentHeight)));
    if (p.node.children) g.lines.push(seg(toScreen(layout, p.childFrom, p.height), toScreen(layout, p.childTo, p.height)));
    if (p.node.collapsed) g.wedges.push(wedge(layout, p));
  }
  const branches = [...byColour.entries()].map(([colour, g]) =>
    `<path fill="none" stroke="${colour}" stroke-width="1.5" d="${g.lines.join('')}"/>`
    + (g.wedges.length ? `<path fill="${colour}" stroke="none" d="${g.wedges.join('')}"/>` : '')).join('\n');
  const { box } = layout;
  const [cx, cy] = toScreen(layout, 0, style.cut);
  const cut = vertical ? seg([box.left - 6, cy], [box.left + box.width + 6, cy]) : seg([cx, box.top - 6], [cx, box.top + box.height + 6]);
  const step = niceStep(layout.top / 4);
  const ticks: string[] = [];
  for (let h = 0; h <= layout.top + 1e-9; h += step) {
    const [x, y] = toScreen(layout, 0, h);
    const label = Number(h.toPrecision(3)).toString();
    ticks.push(vertical
      ? `<path stroke="#d0d7de" d="${seg([box.left - 8, y], [box.left - 4, y])}"/><text x="${f1(box.left - 10)}" y="${f1(y + 4)}" text-anchor="end">${label}</text>`
      : `<path stroke="#d0d7de" d="${seg([x, box.top + box.height + 4], [x, box.top + box.height + 8])}"/><text x="${f1(x)}" y="${f1(box.top + box.height + 20)}" text-anchor="middle">${label}</text>`);
  }
  const top = TREE_FIGURE_TOP;
  let lx = 8, more = 0;
  const items: string[] = [];
  for (const e of style.legend) {
    const w = 30 + 6.2 * e.name.length;
    if (lx + w > width - 60) { more++; continue; }
    items.push(`<rect x="${f1(lx)}" y="-17" width="10" height="10" rx="2" fill="${e.colour}"/><text x="${f1(lx + 14)}" y="-8">${esc(e.name)}</text>`);
    lx += w;
  }
  if (more > 0) items.push(`<text x="${f1(lx)}" y="-8">+${more} more</text>`);
  const legend = items.join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height + top}" viewBox="0 ${-top} ${width} ${height + top}" font-family="sans-serif" font-size="11">
<rect x="0" y="${-top}" width="${width}" height="${height + top}" fill="#ffffff"/>
<text x="8" y="-26" font-size="13" font-weight="bold" fill="#1f2328">${esc(style.title)}</text>
<g fill="#1f2328">${legend}</g>
${branches}
<path fill="none" stroke="#c0392b" stroke-width="2" stroke-dasharray="6 4" d="${cut}"/>
<g fill="#57606a">${ticks.join('')}</g>
</svg>`;
}

/** A collapsed subtree's wedge (as the view draws it). */
function wedge(layout: TreeLayout, p: PlacedNode): string {
  const [x, y] = toScreen(layout, p.along, p.height);
  const s = Math.max(3, Math.min(7, 2 + Math.log10(p.node.windows + 1) * 1.6));
  return layout.orientation === 'vertical'
    ? `M${f1(x)} ${f1(y)}L${f1(x - s)} ${f1(y + 2 * s)}L${f1(x + s)} ${f1(y + 2 * s)}Z`
    : `M${f1(x)} ${f1(y)}L${f1(x + 2 * s)} ${f1(y - s)}L${f1(x + 2 * s)} ${f1(y + s)}Z`;
}
