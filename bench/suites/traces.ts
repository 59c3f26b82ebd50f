// `npm run bench -- traces [--quick]`: how long the Traces view takes to redraw 24 traces of 10 s
// at 50 Hz (three channels, ±2 s context) in headless Chromium with its software renderer (no GPU):
// median and p90 of ~30 full redraws after a hover change and after a resize, 1280 CSS px wide.
// Prints a table and appends JSON lines to bench-results/traces.jsonl.
import { appendFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, withBenchPage } from '../browser-page';

/** One frame at 60 Hz. */
const BUDGET_MS = 16;

/** One result row of the page's `window.__tracesBench` (bench/pages/traces-page.ts). */
interface TracesBenchRow {
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
declare global {
  interface Window { __tracesBench?: (runs: number, width?: number) => Promise<TracesBenchRow[]> }
}

export async function run(quick: boolean): Promise<void> {
  const { result: rows } = await withBenchPage({ entry: 'bench/pages/traces-page.ts', name: 'traces', viewport: { width: 1300, height: 900 } }, async (page) => {
    await page.waitForFunction(() => typeof window.__tracesBench === 'function');
    const runs = quick ? 9 : 31;
    const rows = await page.evaluate((runs) => window.__tracesBench!(runs), runs);
    // The last frame, to check by eye: test-output/traces-bench.png.
    mkdirSync(join(ROOT, 'test-output'), { recursive: true });
    await page.locator('canvas').screenshot({ path: join(ROOT, 'test-output/traces-bench.png') });
    return rows;
  });
  const r0 = rows[0];
  console.log(`Traces redraw in headless Chromium (--disable-gpu, software raster): ${r0.traces} traces × ${r0.channels} channels × ${r0.samplesPerChannel} samples, canvas ${r0.width}×${r0.height} CSS px at dpr ${r0.dpr}`);
  console.log('| operation | median ms | p90 ms | max ms | budget |');
  console.log('|-----------|-----------|--------|--------|--------|');
  for (const r of rows) {
    const ok = r.p90Ms <= BUDGET_MS ? 'ok' : 'OVER';
    console.log(`| ${r.operation} | ${r.medianMs.toFixed(1)} | ${r.p90Ms.toFixed(1)} | ${r.maxMs.toFixed(1)} | ${ok} (p90 ≤ ${BUDGET_MS}) |`);
  }
  console.log(`${r0.runs} redraws each after 2 warm-ups; a redraw = layout + y ranges + canvas resize + draw (+ a 1-pixel readback).`);
  const out = join(ROOT, 'bench-results');
  mkdirSync(out, { recursive: true });
  const at = new Date().toISOString();
  appendFileSync(join(out, 'traces.jsonl'), rows.map((r) => JSON.stringify({ suite: 'traces', at, quick, ...r })).join('\n') + '\n');
}
