import { categoryColour, viridis } from '../../lib/palette';
import { rowShares } from './compare';

export const CT = { left: 150, top: 34, cell: 38 } as const;

export function contingencySize(rows: number, cols: number): { width: number; height: number } {
  return { width: CT.left + cols * CT.cell + 16, height: CT.top + rows * CT.cell + 8 };
}

/**
 * Heat map of a contingency table (rows: clusters of run A, columns: clusters of run B), coloured
 * by each row's share (viridis), counts written in the cells. Returns the number of cells drawn.
 */
export function drawContingency(
  ctx: CanvasRenderingContext2D, counts: number[][], rowNames: string[], colNames: string[], rowIds: number[], colIds: number[],
): number {
  const { width, height } = contingencySize(counts.length, colNames.length);
  ctx.clearRect(0, 0, width, height);
  const shares = rowShares(counts);
  ctx.font = '11px system-ui, sans-serif';
  let cells = 0;
  counts.forEach((row, r) => {
    const y = CT.top + r * CT.cell;
    ctx.fillStyle = categoryColour(rowIds[r]);
    ctx.fillRect(CT.left - 16, y + CT.cell / 2 - 5, 10, 10);
    ctx.fillStyle = '#222';
    ctx.textAlign = 'right';
    ctx.fillText(rowNames[r], CT.left - 22, y + CT.cell / 2 + 4, CT.left - 26);
    row.forEach((v, c) => {
      const [cr, cg, cb] = viridis(shares[r][c]);
      ctx.fillStyle = `rgb(${cr},${cg},${cb})`;
      ctx.fillRect(CT.left + c * CT.cell, y, CT.cell - 1, CT.cell - 1);
      if (v > 0) {
        ctx.fillStyle = shares[r][c] > 0.6 ? '#000' : '#fff';
        ctx.textAlign = 'center';
        ctx.fillText(String(v), CT.left + c * CT.cell + CT.cell / 2, y + CT.cell / 2 + 4);
      }
      cells++;
    });
  });
  colNames.forEach((name, c) => {
    const x = CT.left + c * CT.cell + CT.cell / 2;
    ctx.fillStyle = categoryColour(colIds[c]);
    ctx.fillRect(x - 5, CT.top - 14, 10, 10);
    ctx.fillStyle = '#222';
    ctx.textAlign = 'center';
    ctx.fillText(name, x, CT.top - 20, CT.cell - 2);
  });
  return cells;
}
