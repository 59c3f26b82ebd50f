import type { ChannelSpan } from '../../../core/raw/span.types';
import type { Cell, Layout } from './layout';

export const INK = { text: '#1d2330', muted: '#5b6472', frame: '#c9ced6', shade: 'rgba(0, 114, 178, 0.10)', message: '#a33a00', highlight: '#111111' };
export const FONT = '12px system-ui, sans-serif';
const SMALL = '11px system-ui, sans-serif';

export interface DrawOptions {
  ranges: ([number, number] | null)[];
  highlight: number;
  channelColour: (label: string) => string;
  clusterColour: (index: number) => string;
}

/** A short number for axis labels (3 significant digits, no trailing zeros). */
export function tick(v: number): string {
  if (v === 0 || !Number.isFinite(v)) return '0';
  return String(Number(v.toPrecision(3)));
}

/**
 * One channel as a polyline from t0 at `rate`, mapped by the given scales; NaN samples break the
 * line. Where several samples fall in one device-pixel column, only their lowest and highest (in
 * the order they occur) are drawn: the same picture with far fewer segments for dense signals.
 */
export function drawChannel(ctx: CanvasRenderingContext2D, ch: ChannelSpan, xOf: (t: number) => number, yOf: (v: number) => number): void {
  const scale = Math.abs(ctx.getTransform().a) || 1;
  ctx.beginPath();
  let pen = false;
  let col = NaN, cx = 0, lo = 0, hi = 0, loAt = 0, hiAt = 0;
  const flush = (): void => {
    if (Number.isNaN(col)) return;
    const [a, b] = loAt <= hiAt ? [lo, hi] : [hi, lo];
    if (pen) ctx.lineTo(cx, a);
    else ctx.moveTo(cx, a);
    if (b !== a) ctx.lineTo(cx, b);
    pen = true;
    col = NaN;
  };
  for (let i = 0; i < ch.samples.length; i++) {
    const v = ch.samples[i];
    if (Number.isNaN(v)) {
      flush();
      pen = false;
      continue;
    }
    const x = xOf(ch.t0 + i / ch.rate), y = yOf(v);
    const c = Math.floor(x * scale);
    if (c !== col) {
      flush();
      col = c;
      cx = x;
      lo = hi = y;
      loAt = hiAt = i;
    } else if (y < lo) {
      lo = y;
      loAt = i;
    } else if (y > hi) {
      hi = y;
      hiAt = i;
    }
  }
  flush();
  ctx.stroke();
}

function wrap(ctx: CanvasRenderingContext2D, text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    const next = line ? `${line} ${word}` : word;
    if (ctx.measureText(next).width > width && line) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

function drawCell(ctx: CanvasRenderingContext2D, cell: Cell, range: [number, number] | null, o: DrawOptions): void {
  const { trace, x, y, w, h } = cell;
  const win = trace.window;
  const lit = win.index === o.highlight;
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(x, y, w, h);
  ctx.lineWidth = lit ? 2.5 : 1;
  ctx.strokeStyle = lit ? INK.highlight : INK.frame;
  ctx.strokeRect(x + 0.5, y + 0.5, w - 1, h - 1);
  // Label: cluster colour, window id, subject, start.
  ctx.fillStyle = o.clusterColour(win.index);
  ctx.fillRect(x + 6, y + 7, 8, 8);
  ctx.fillStyle = INK.text;
  ctx.font = FONT;
  ctx.textBaseline = 'alphabetic';
  ctx.fillText(`${win.link.id} · ${win.link.subject} · ${win.startText}`, x + 18, y + 15, w - 24);
  const plot = { x: x + 44, y: y + 22, w: w - 52, h: h - 40 };
  if (trace.state === 'loading') {
    ctx.fillStyle = INK.muted;
    ctx.fillText('reading…', plot.x, plot.y + plot.h / 2);
    return;
  }
  if (trace.state === 'message') {
    ctx.fillStyle = INK.message;
    ctx.font = SMALL;
    wrap(ctx, trace.message, w - 16).slice(0, 5).forEach((line, i) => ctx.fillText(line, x + 8, y + 36 + i * 14));
    return;
  }
  const xOf = (t: number) => plot.x + ((t - trace.from) / (trace.to - trace.from)) * plot.w;
  // The window itself, shaded within its context.
  ctx.fillStyle = INK.shade;
  ctx.fillRect(xOf(trace.start), plot.y, xOf(trace.end) - xOf(trace.start), plot.h);
  if (!range) {
    ctx.fillStyle = INK.message;
    ctx.fillText('no samples here (a gap in the recording)', plot.x, plot.y + plot.h / 2);
    return;
  }
  const [lo, hi] = range;
  const yOf = (v: number) => plot.y + plot.h - ((v - lo) / (hi - lo)) * plot.h;
  ctx.strokeStyle = INK.frame;
  ctx.lineWidth = 1;
  ctx.beginPath();
  ctx.moveTo(plot.x - 0.5, plot.y);
  ctx.lineTo(plot.x - 0.5, plot.y + plot.h);
  ctx.stroke();
  ctx.save();
  ctx.beginPath();
  ctx.rect(plot.x, plot.y, plot.w, plot.h);
  ctx.clip();
  // Traces are one device pixel wide (the highlighted one thicker): a software rasteriser draws
  // 1-pixel lines on a fast path, while wider strokes of dense polylines cost ~10× more (bench traces).
  ctx.lineWidth = lit ? 1.6 : 1 / Math.max(1e-3, Math.abs(ctx.getTransform().a));
  for (const ch of trace.span.channels) {
    ctx.strokeStyle = o.channelColour(ch.label);
    drawChannel(ctx, ch, xOf, yOf);
  }
  ctx.restore();
  // Axis: range and units at left, context edges below.
  const units = [...new Set(trace.span.channels.map((c) => c.unit || 'no unit'))].join(', ');
  ctx.fillStyle = INK.muted;
  ctx.font = SMALL;
  ctx.textAlign = 'right';
  ctx.fillText(tick(hi), plot.x - 4, plot.y + 9);
  ctx.fillText(tick(lo), plot.x - 4, plot.y + plot.h);
  ctx.textAlign = 'left';
  const margin = trace.start - trace.from;
  ctx.fillText(units, x + 8, y + h - 5, 110);
  ctx.textAlign = 'center';
  ctx.fillText(`window ${tick(trace.end - trace.start)} s${margin > 0 ? ` · ±${tick(margin)} s context` : ''}`, plot.x + plot.w / 2 + 30, y + h - 5);
  ctx.textAlign = 'left';
}

/** Draws all small multiples: section titles, then one framed plot (or message) per trace. */
export function drawMultiples(ctx: CanvasRenderingContext2D, layout: Layout, o: DrawOptions): void {
  ctx.font = 'bold 12px system-ui, sans-serif';
  ctx.fillStyle = INK.text;
  for (const t of layout.titles) ctx.fillText(t.text, t.x, t.y);
  layout.cells.forEach((cell, i) => drawCell(ctx, cell, o.ranges[i], o));
}
