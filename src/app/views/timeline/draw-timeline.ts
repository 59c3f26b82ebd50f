import { durationText, tickStep, type Strip, type TimeView } from './strips';

export const TL = { left: 64, top: 22, rowH: 16, gap: 8, right: 12 } as const;

export interface TimelineScene {
  strips: Strip[];
  labels: Int32Array;
  /** Colour of a cluster (the curated one: set-aside clusters grey). */
  colour: (cluster: number) => string;
  view: TimeView;
  /** Selection mask over run rows, or null. */
  mask: Uint8Array | null;
  /** bound[c]: cluster c is flagged subject-bound. */
  bound: boolean[];
  width: number;
}

export function timelineHeight(strips: number): number {
  return TL.top + strips * (TL.rowH + TL.gap) + 8;
}

/** Draws one strip per subject; returns the number of windows drawn. */
export function drawTimeline(ctx: CanvasRenderingContext2D, s: TimelineScene): number {
  const height = timelineHeight(s.strips.length);
  ctx.clearRect(0, 0, s.width, height);
  const plotW = s.width - TL.left - TL.right;
  const scale = plotW / (s.view.t1 - s.view.t0 || 1);
  const x = (t: number) => TL.left + (t - s.view.t0) * scale;
  // time axis: elapsed time since each subject's first window
  ctx.font = '11px system-ui, sans-serif';
  ctx.fillStyle = '#555';
  ctx.strokeStyle = '#e3e5e8';
  ctx.textAlign = 'center';
  const step = tickStep(s.view.t1 - s.view.t0);
  for (let t = Math.ceil(s.view.t0 / step) * step; t <= s.view.t1; t += step) {
    ctx.beginPath();
    ctx.moveTo(x(t) + 0.5, TL.top - 4);
    ctx.lineTo(x(t) + 0.5, height - 6);
    ctx.stroke();
    ctx.fillText(durationText(t), x(t), TL.top - 8);
  }
  let drawn = 0;
  s.strips.forEach((strip, r) => {
    const y = TL.top + r * (TL.rowH + TL.gap);
    ctx.fillStyle = '#222';
    ctx.textAlign = 'right';
    ctx.font = '12px system-ui, sans-serif';
    ctx.fillText(strip.subject, TL.left - 8, y + 12);
    ctx.fillStyle = '#f1f2f4';
    ctx.fillRect(TL.left, y, plotW, TL.rowH);
    for (let j = 0; j < strip.rows.length; j++) {
      if (strip.ends[j] < s.view.t0 || strip.starts[j] > s.view.t1) continue;
      const row = strip.rows[j];
      const c = s.labels[row];
      const x0 = Math.max(TL.left, x(strip.starts[j])), x1 = Math.min(TL.left + plotW, x(strip.ends[j]));
      ctx.globalAlpha = s.mask && !s.mask[row] ? 0.18 : 1;
      ctx.fillStyle = s.colour(c);
      ctx.fillRect(x0, y, Math.max(1, x1 - x0), TL.rowH);
      if (s.bound[c]) {
        ctx.fillStyle = '#000';
        ctx.fillRect(x0, y + TL.rowH + 1, Math.max(1, x1 - x0), 3);
      }
      drawn++;
    }
    ctx.globalAlpha = 1;
  });
  return drawn;
}
