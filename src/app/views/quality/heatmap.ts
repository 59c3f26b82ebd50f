import { viridis } from '../../lib/palette';

/** The missingness heat map: rows (subjects, or one row "all windows"), columns (features), shares in [0, 1]. */
export interface HeatmapData {
  rows: string[];
  columns: string[];
  /** Row-major rows × columns. */
  shares: Float64Array;
}

export interface HeatmapLayout {
  left: number;
  top: number;
  cell: number;
  cellH: number;
  rows: number;
  columns: number;
  /** Share drawn as the top of the colour scale. */
  max: number;
}

const FONT = '11px system-ui, sans-serif';

/** The colour scale's top: the largest share, at least 5% so a few missing values do not look severe. */
export function scaleMax(shares: Float64Array): number {
  let m = 0;
  for (const s of shares) if (s > m) m = s;
  return Math.max(0.05, m);
}

/**
 * Draws the heat map on a canvas sized to `width` CSS pixels: subject names on the left, feature
 * names (rotated) along the bottom, one cell per subject × feature coloured by viridis, and a
 * colour bar. Returns the layout for hit testing.
 */
export function drawHeatmap(canvas: HTMLCanvasElement, data: HeatmapData, width: number): HeatmapLayout {
  const ctx = canvas.getContext('2d');
  const dpr = window.devicePixelRatio || 1;
  const nr = data.rows.length, nc = data.columns.length;
  const measure = (texts: string[]) => {
    if (!ctx) return 0;
    ctx.font = FONT;
    return texts.reduce((m, t) => Math.max(m, ctx.measureText(t).width), 0);
  };
  const left = Math.min(140, Math.ceil(measure(data.rows)) + 10);
  const labelH = Math.min(150, Math.ceil(measure(data.columns)) + 10);
  const top = 6;
  const legendW = 70;
  const cell = Math.max(4, Math.min(24, Math.floor((width - left - legendW) / Math.max(1, nc))));
  const cellH = Math.max(6, Math.min(16, cell));
  const height = top + nr * cellH + labelH;
  canvas.width = Math.round(width * dpr);
  canvas.height = Math.round(height * dpr);
  canvas.style.width = `${width}px`;
  canvas.style.height = `${height}px`;
  const max = scaleMax(data.shares);
  const layout = { left, top, cell, cellH, rows: nr, columns: nc, max };
  if (!ctx) return layout;
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.clearRect(0, 0, width, height);
  for (let r = 0; r < nr; r++) {
    for (let c = 0; c < nc; c++) {
      const [R, G, B] = viridis(data.shares[r * nc + c] / max);
      ctx.fillStyle = `rgb(${R},${G},${B})`;
      ctx.fillRect(left + c * cell, top + r * cellH, cell - (cell > 6 ? 1 : 0), cellH - 1);
    }
  }
  ctx.font = FONT;
  ctx.fillStyle = '#333';
  ctx.textBaseline = 'middle';
  ctx.textAlign = 'right';
  const rowStep = Math.ceil(12 / cellH);
  for (let r = 0; r < nr; r += rowStep) ctx.fillText(data.rows[r], left - 6, top + r * cellH + cellH / 2);
  const colStep = Math.ceil(12 / cell);
  for (let c = 0; c < nc; c += colStep) {
    ctx.save();
    ctx.translate(left + c * cell + cell / 2, top + nr * cellH + 4);
    ctx.rotate(-Math.PI / 2);
    ctx.fillText(data.columns[c], 0, 0);
    ctx.restore();
  }
  // Colour bar: 0 at the bottom, the scale's top share at the top.
  const bx = left + nc * cell + 16, bh = Math.max(40, nr * cellH), bw = 12;
  for (let y = 0; y < bh; y++) {
    const [R, G, B] = viridis(1 - y / bh);
    ctx.fillStyle = `rgb(${R},${G},${B})`;
    ctx.fillRect(bx, top + y, bw, 1);
  }
  ctx.fillStyle = '#333';
  ctx.textAlign = 'left';
  ctx.fillText(`${Math.round(100 * max)}%`, bx + bw + 4, top + 6);
  ctx.fillText('0%', bx + bw + 4, top + bh - 6);
  return layout;
}

/** The cell under a point (CSS pixels relative to the canvas), or null. */
export function cellAt(layout: HeatmapLayout, x: number, y: number): { row: number; column: number } | null {
  const column = Math.floor((x - layout.left) / layout.cell);
  const row = Math.floor((y - layout.top) / layout.cellH);
  if (column < 0 || row < 0 || column >= layout.columns || row >= layout.rows) return null;
  return { row, column };
}

/** Missingness by subject × feature when the study has subjects, else one row over all windows. */
export function heatmapData(report: { featureNames: string[]; missing: { subjects: string[]; perSubject: Float64Array; perFeature: Float64Array } }): HeatmapData {
  const { subjects, perSubject, perFeature } = report.missing;
  return subjects.length > 0
    ? { rows: subjects, columns: report.featureNames, shares: perSubject }
    : { rows: ['all windows'], columns: report.featureNames, shares: perFeature };
}
