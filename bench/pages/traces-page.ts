/**
 * The page behind `npm run bench -- traces`: draws 24 seeded synthetic traces (10 s at 50 Hz, three
 * channels, ±2 s context) with the Traces view's own layout and drawing code, and times full
 * redraws after a hover change and after a resize, as the view's effect does them. Built on its own
 * by the bench suite (never part of the app); it installs `window.__tracesBench`.
 */
import { normal, seededRandom } from '../../src/core/random';
import { categoryColour } from '../../src/app/lib/palette';
import { drawMultiples } from '../../src/app/views/traces/draw';
import { layoutMultiples, yRanges } from '../../src/app/views/traces/layout';
import type { Trace } from '../../src/app/views/traces/reader';

export interface TracesBenchRow {
  operation: 'hover' | 'resize';
  traces: number;
  samplesPerChannel: number;
  channels: number;
  runs: number;
  medianMs: number;
  p90Ms: number;
  maxMs: number;
  width: number;
  height: number;
  dpr: number;
}

const CHANNELS = ['acc_x', 'acc_y', 'acc_z'];

/** `n` traces of `seconds` at `rate` Hz with `margin` s of context each side, three channels each (seeded). */
function synthetic(n: number, seconds: number, rate: number, margin: number, seed: number): Trace[] {
  const random = seededRandom(seed);
  return Array.from({ length: n }, (_, index): Trace => {
    const start = 1000 + 60 * index, end = start + seconds;
    const from = start - margin, to = end + margin;
    const count = Math.round((to - from) * rate);
    const channels = CHANNELS.map((label, c) => {
      const samples = new Float32Array(count);
      const f = 0.5 + random() * 2;
      for (let i = 0; i < count; i++) samples[i] = Math.sin((2 * Math.PI * f * i) / rate + c) + 0.2 * normal(random) + c;
      return { label, unit: 'g', rate, t0: from, samples };
    });
    return {
      window: { index, link: { id: `w${index}`, subject: `S${String(index % 6).padStart(3, '0')}`, start, end }, startText: `${start} s` },
      state: 'ok', span: { channels }, start, end, from, to, file: 'bench.edf',
    };
  });
}

function summary(times: number[]): { medianMs: number; p90Ms: number; maxMs: number } {
  const s = [...times].sort((a, b) => a - b);
  return { medianMs: s[Math.floor(s.length / 2)], p90Ms: s[Math.min(s.length - 1, Math.ceil(0.9 * s.length) - 1)], maxMs: s[s.length - 1] };
}

const nextFrame = (): Promise<void> => new Promise((r) => requestAnimationFrame(() => r()));

async function bench(runs: number, width?: number): Promise<TracesBenchRow[]> {
  width ??= 1280;
  const seconds = 10, rate = 50, margin = 2;
  const canvas = document.querySelector('canvas') ?? document.body.appendChild(document.createElement('canvas'));
  const dpr = window.devicePixelRatio || 1;
  const traces = synthetic(24, seconds, rate, margin, 11);
  const sections = [
    { title: 'Most typical of candidate 1', group: 'typical', traces: traces.slice(0, 12) },
    { title: 'Most borderline of candidate 1', group: 'borderline', traces: traces.slice(12) },
  ];
  const channelColour = (label: string) => categoryColour(Math.max(0, CHANNELS.indexOf(label)));
  const clusterColour = (i: number) => categoryColour(i % 3);
  let height = 0;
  // One redraw as TracesView's effect does it: layout, y ranges, canvas size, clear, draw; then one
  // pixel is read back so the canvas has really rasterised the frame.
  const redraw = (w: number, highlight: number): void => {
    const lay = layoutMultiples(sections, w);
    const ranges = yRanges(lay.cells.map((c) => c.trace), false);
    height = lay.height;
    canvas.style.width = `${w}px`;
    canvas.style.height = `${height}px`;
    canvas.width = Math.round(w * dpr);
    canvas.height = Math.round(height * dpr);
    const ctx = canvas.getContext('2d')!;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    ctx.clearRect(0, 0, w, height);
    drawMultiples(ctx, lay, { ranges, highlight, channelColour, clusterColour });
    ctx.getImageData(0, 0, 1, 1);
  };
  const samplesPerChannel = Math.round((seconds + 2 * margin) * rate);
  const row = (operation: TracesBenchRow['operation'], times: number[], w: number): TracesBenchRow =>
    ({ operation, traces: traces.length, samplesPerChannel, channels: CHANNELS.length, runs, ...summary(times), width: w, height, dpr });
  const hover: number[] = [];
  for (let r = 0; r < runs + 2; r++) {
    const t0 = performance.now();
    redraw(width, r % 25);
    if (r >= 2) hover.push(performance.now() - t0);
    await nextFrame();
  }
  const rows = [row('hover', hover, width)];
  const resize: number[] = [];
  for (let r = 0; r < runs + 2; r++) {
    const w = width - (r % 2) * 40;
    const t0 = performance.now();
    redraw(w, -1);
    if (r >= 2) resize.push(performance.now() - t0);
    await nextFrame();
  }
  rows.push(row('resize', resize, width));
  redraw(width, 5); // the frame left on screen for the screenshot
  return rows;
}

declare global {
  interface Window { __tracesBench?: typeof bench }
}
window.__tracesBench = bench;
