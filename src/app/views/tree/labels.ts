import { toScreen, type PlacedNode, type TreeLayout } from './layout';

/**
 * Window counts of the cut's clusters, written just below the cut line at each cluster's top
 * branch; a label that would overlap the previous one is left out (the hover read-out has it).
 */
export function drawClusterCounts(ctx: CanvasRenderingContext2D, layout: TreeLayout, tops: PlacedNode[], cut: number): void {
  ctx.font = '11px system-ui, sans-serif';
  ctx.textBaseline = 'top';
  ctx.lineWidth = 3;
  ctx.strokeStyle = 'rgb(255 255 255 / 0.9)';
  ctx.fillStyle = '#1f2328';
  const vertical = layout.orientation === 'vertical';
  let last = -Infinity;
  for (const p of [...tops].sort((a, b) => a.along - b.along)) {
    const text = p.node.windows.toLocaleString('en');
    const w = ctx.measureText(text).width;
    const [x, y] = toScreen(layout, p.along, cut);
    const at = vertical ? x - w / 2 : y;
    if (at < last + 4) continue;
    const tx = vertical ? x - w / 2 : x + 4, ty = vertical ? y + 4 : y - 6;
    ctx.strokeText(text, tx, ty);
    ctx.fillText(text, tx, ty);
    last = vertical ? at + w : at + 12;
  }
}

/** Height axis: a few round ticks along the box's edge. */
export function drawHeightAxis(ctx: CanvasRenderingContext2D, layout: TreeLayout): void {
  const { box, top } = layout;
  const step = niceStep(top / 4);
  ctx.font = '11px system-ui, sans-serif';
  ctx.fillStyle = '#57606a';
  ctx.strokeStyle = '#d0d7de';
  ctx.lineWidth = 1;
  const vertical = layout.orientation === 'vertical';
  ctx.textBaseline = vertical ? 'middle' : 'top';
  ctx.textAlign = vertical ? 'right' : 'center';
  for (let h = 0; h <= top + 1e-9; h += step) {
    const [x, y] = toScreen(layout, 0, h);
    const label = Number(h.toPrecision(3)).toString();
    if (vertical) {
      ctx.beginPath(); ctx.moveTo(box.left - 8, y); ctx.lineTo(box.left - 4, y); ctx.stroke();
      ctx.fillText(label, box.left - 10, y);
    } else {
      const yy = box.top + box.height + 6;
      ctx.beginPath(); ctx.moveTo(x, yy - 2); ctx.lineTo(x, yy + 2); ctx.stroke();
      ctx.fillText(label, x, yy + 4);
    }
  }
  ctx.textAlign = 'start';
}

/** A round tick step near `raw` (1, 2 or 5 times a power of ten). */
export function niceStep(raw: number): number {
  if (!(raw > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(raw));
  const f = raw / p;
  return (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10) * p;
}

/** "k = 12" at the end of the cut line (bold while the line is dragged), so the count is read where the hand is. */
export function drawCutLabel(ctx: CanvasRenderingContext2D, layout: TreeLayout, cut: number, text: string, active: boolean): void {
  const vertical = layout.orientation === 'vertical';
  const [x, y] = toScreen(layout, vertical ? layout.box.width : 0, cut);
  ctx.font = `${active ? 'bold ' : ''}12px system-ui, sans-serif`;
  ctx.lineWidth = 3;
  ctx.strokeStyle = 'rgb(255 255 255 / 0.95)';
  ctx.fillStyle = '#b42318';
  const w = ctx.measureText(text).width;
  const tx = vertical ? x - w : x + 4, ty = vertical ? y - 16 : y + 2;
  ctx.textBaseline = 'top';
  ctx.strokeText(text, tx, ty);
  ctx.fillText(text, tx, ty);
}
