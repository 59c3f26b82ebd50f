import { MISSING_COLOUR } from '../../lib/palette';
import { CLAMP, zColour, type HeatLayout } from './heat-map';

export interface HeatScene {
  k: number;
  d: number;
  /** The clusters shown, one per row, top to bottom (clusters emptied by curation are left out). */
  rows: readonly number[];
  /** k × d standardized means, row-major, in table feature order. */
  means: Float64Array;
  /** Feature indices, most separating first. */
  order: Int32Array;
  featureNames: string[];
  clusterNames: string[];
  /** Colour per cluster (the curated ones). */
  colours: string[];
  focused: number;
  /** Share of each cluster's windows in the selection (empty when nothing is selected). */
  selectedShare: number[];
}

/** Draws the clusters × features heat map; returns the number of cells drawn. */
export function drawHeat(ctx: CanvasRenderingContext2D, l: HeatLayout, s: HeatScene): number {
  ctx.clearRect(0, 0, l.width, l.height);
  ctx.font = '12px system-ui, sans-serif';
  let cells = 0;
  for (let r = 0; r < s.rows.length; r++) {
    const c = s.rows[r];
    const y = l.top + r * l.cellH;
    for (let p = 0; p < s.d; p++) {
      const rgb = zColour(s.means[c * s.d + s.order[p]]);
      ctx.fillStyle = rgb ? `rgb(${rgb[0]},${rgb[1]},${rgb[2]})` : MISSING_COLOUR;
      ctx.fillRect(l.left + p * l.cellW, y, l.cellW - 1, l.cellH - 1);
      cells++;
    }
    ctx.fillStyle = s.colours[c] ?? MISSING_COLOUR;
    ctx.fillRect(l.left - 16, y + 5, 11, 11);
    ctx.fillStyle = c === s.focused ? '#000' : '#333';
    ctx.font = `${c === s.focused ? 'bold ' : ''}12px system-ui, sans-serif`;
    ctx.textAlign = 'right';
    ctx.fillText(s.clusterNames[c], l.left - 22, y + 15, l.left - 40);
    const share = s.selectedShare[c] ?? 0;
    if (share > 0) {
      ctx.fillStyle = '#000';
      ctx.fillRect(4, y + 4, Math.max(2, 14 * share), l.cellH - 9);
    }
  }
  const focusedRow = s.rows.indexOf(s.focused);
  if (focusedRow >= 0) {
    ctx.strokeStyle = '#000';
    ctx.lineWidth = 2;
    ctx.strokeRect(l.left - 1, l.top + focusedRow * l.cellH - 1, s.d * l.cellW + 1, l.cellH + 1);
  }
  ctx.font = '11px system-ui, sans-serif';
  ctx.textAlign = 'left';
  ctx.fillStyle = '#333';
  for (let p = 0; p < s.d; p++) {
    ctx.save();
    ctx.translate(l.left + p * l.cellW + l.cellW / 2 + 3, l.top - 6);
    ctx.rotate(-Math.PI / 3);
    ctx.fillText(s.featureNames[s.order[p]], 0, 0, l.top * 1.1);
    ctx.restore();
  }
  drawScale(ctx, l.left, l.top + s.rows.length * l.cellH + 8);
  return cells;
}

function drawScale(ctx: CanvasRenderingContext2D, x: number, y: number): void {
  const w = 160;
  for (let i = 0; i < w; i++) {
    const rgb = zColour(-CLAMP + (2 * CLAMP * i) / (w - 1))!;
    ctx.fillStyle = `rgb(${rgb[0]},${rgb[1]},${rgb[2]})`;
    ctx.fillRect(x + i, y, 1, 10);
  }
  ctx.fillStyle = '#333';
  ctx.font = '11px system-ui, sans-serif';
  ctx.textAlign = 'left';
  ctx.fillText(`−${CLAMP} … +${CLAMP} sd: standardized cluster mean (0 = the study mean); features most separating (Kruskal–Wallis H) on the left`, x + w + 8, y + 9);
}
