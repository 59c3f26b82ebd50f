import { bandOf, type Band } from './band';
import { drawChannel, FONT, INK, tick } from './draw';
import type { Trace } from './reader';

type OkTrace = Extract<Trace, { state: 'ok' }>;

export interface AlignedChannel {
  label: string;
  unit: string;
  /** Seconds from window start of sample 0, and the grid rate. */
  t0: number;
  rate: number;
  rows: Float32Array[];
  /** Result row of each aligned trace. */
  windows: number[];
  band: Band;
  /** Longest window, seconds from its start (the shaded stretch). */
  windowEnd: number;
}

/** Each channel of the traces resampled (nearest sample) on one grid of time from window start. */
export function alignTraces(traces: readonly Trace[]): AlignedChannel[] {
  const ok = traces.filter((t): t is OkTrace => t.state === 'ok');
  if (ok.length === 0) return [];
  const first = ok[0];
  const before = Math.max(...ok.map((t) => t.start - t.from));
  const after = Math.max(...ok.map((t) => t.to - t.start));
  const windowEnd = Math.max(...ok.map((t) => t.end - t.start));
  return first.span.channels.map((proto, c) => {
    const rate = proto.rate;
    const length = Math.max(1, Math.round((before + after) * rate));
    const rows: Float32Array[] = [];
    const windows: number[] = [];
    for (const t of ok) {
      const ch = t.span.channels.find((x) => x.label === proto.label) ?? t.span.channels[c];
      if (!ch) continue;
      const row = new Float32Array(length).fill(NaN);
      for (let j = 0; j < length; j++) {
        const k = Math.round((t.start - before + j / rate - ch.t0) * ch.rate);
        if (k >= 0 && k < ch.samples.length) row[j] = ch.samples[k];
      }
      rows.push(row);
      windows.push(t.window.index);
    }
    return { label: proto.label, unit: proto.unit, t0: -before, rate, rows, windows, band: bandOf(rows, length), windowEnd };
  });
}

export const OVERLAY_PANEL = { height: 190, gap: 12, pad: 10 } as const;

/** One panel per channel: every member thin, the interquartile band, the median; the highlighted member in black. */
export function drawOverlay(ctx: CanvasRenderingContext2D, aligned: readonly AlignedChannel[], width: number, highlight: number, colour: (label: string) => string, title: string): number {
  ctx.font = 'bold 12px system-ui, sans-serif';
  ctx.fillStyle = INK.text;
  ctx.fillText(title, OVERLAY_PANEL.pad, OVERLAY_PANEL.pad + 12);
  let y = OVERLAY_PANEL.pad + 22;
  for (const a of aligned) {
    const plot = { x: OVERLAY_PANEL.pad + 50, y: y + 18, w: width - 2 * OVERLAY_PANEL.pad - 60, h: OVERLAY_PANEL.height - 40 };
    let lo = Infinity, hi = -Infinity;
    for (const r of a.rows) for (const v of r) if (!Number.isNaN(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(plot.x, plot.y, plot.w, plot.h);
    ctx.strokeStyle = INK.frame;
    ctx.strokeRect(plot.x + 0.5, plot.y + 0.5, plot.w - 1, plot.h - 1);
    ctx.fillStyle = INK.text;
    ctx.font = FONT;
    ctx.fillText(`${a.label} (${a.unit || 'no unit'}) · ${a.rows.length} windows aligned at their start · median and interquartile band`, plot.x, y + 12);
    if (lo > hi) {
      y += OVERLAY_PANEL.height + OVERLAY_PANEL.gap;
      continue;
    }
    if (hi === lo) { hi += 1; lo -= 1; }
    const n = a.band.median.length;
    const tEnd = a.t0 + n / a.rate;
    const xOf = (t: number) => plot.x + ((t - a.t0) / (tEnd - a.t0)) * plot.w;
    const yOf = (v: number) => plot.y + plot.h - ((v - lo) / (hi - lo)) * plot.h;
    const grid = (samples: Float32Array) => ({ label: a.label, unit: a.unit, rate: a.rate, t0: a.t0, samples });
    ctx.save();
    ctx.beginPath();
    ctx.rect(plot.x, plot.y, plot.w, plot.h);
    ctx.clip();
    ctx.fillStyle = INK.shade;
    ctx.fillRect(xOf(0), plot.y, xOf(a.windowEnd) - xOf(0), plot.h);
    ctx.strokeStyle = 'rgba(60, 66, 80, 0.22)';
    ctx.lineWidth = 1;
    a.rows.forEach((r) => drawChannel(ctx, grid(r), xOf, yOf));
    // Interquartile band as one filled polygon (q3 forwards, q1 backwards), breaking at gaps.
    ctx.fillStyle = colour(a.label) + '44';
    ctx.beginPath();
    let open = false;
    const close = (end: number, start: number) => {
      for (let j = end; j >= start; j--) ctx.lineTo(xOf(a.t0 + j / a.rate), yOf(a.band.q1[j]));
      ctx.closePath();
    };
    let runStart = 0;
    for (let j = 0; j <= n; j++) {
      const has = j < n && !Number.isNaN(a.band.q3[j]);
      if (has && !open) { ctx.moveTo(xOf(a.t0 + j / a.rate), yOf(a.band.q3[j])); open = true; runStart = j; }
      else if (has) ctx.lineTo(xOf(a.t0 + j / a.rate), yOf(a.band.q3[j]));
      else if (open) { close(j - 1, runStart); open = false; }
    }
    ctx.fill();
    ctx.strokeStyle = colour(a.label);
    ctx.lineWidth = 2.2;
    drawChannel(ctx, grid(a.band.median), xOf, yOf);
    const lit = a.windows.indexOf(highlight);
    if (lit >= 0) {
      ctx.strokeStyle = INK.highlight;
      ctx.lineWidth = 1.8;
      drawChannel(ctx, grid(a.rows[lit]), xOf, yOf);
    }
    ctx.restore();
    ctx.fillStyle = INK.muted;
    ctx.font = '11px system-ui, sans-serif';
    ctx.textAlign = 'right';
    ctx.fillText(tick(hi), plot.x - 4, plot.y + 10);
    ctx.fillText(tick(lo), plot.x - 4, plot.y + plot.h);
    ctx.textAlign = 'left';
    ctx.fillText(`${tick(a.t0)} s`, plot.x, plot.y + plot.h + 13);
    ctx.textAlign = 'right';
    ctx.fillText(`${tick(tEnd)} s from window start`, plot.x + plot.w, plot.y + plot.h + 13);
    ctx.textAlign = 'left';
    y += OVERLAY_PANEL.height + OVERLAY_PANEL.gap;
  }
  return y;
}
