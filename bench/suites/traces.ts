// `npm run bench -- traces [--quick]`: how long the Traces view takes to redraw 24 traces of 10 s
// at 50 Hz (three channels, ±2 s context) in headless Chromium with its software renderer (no GPU):
// median and p90 of ~30 full redraws after a hover change and after a resize, 1280 CSS px wide.
// Prints a table and appends JSON lines to bench-results/traces.jsonl.
import { appendFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import { build } from 'vite';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
/** One frame at 60 Hz. */
const BUDGET_MS = 16;

/** One result row of the page's `window.__tracesBench` (src/app/views/traces/bench-page.ts; bench may not import the app). */
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

type ServeApp = (o: { port?: number; root?: string; demoDir?: string }) => Promise<{ url: string; close: () => Promise<void> }>;

/** Builds the bench page (the Traces view's own layout and drawing modules) into `dir`. */
async function buildPage(dir: string): Promise<void> {
  await build({
    configFile: false,
    root: ROOT,
    logLevel: 'warn',
    build: {
      outDir: dir,
      emptyOutDir: true,
      target: 'es2022',
      lib: { entry: join(ROOT, 'src/app/views/traces/bench-page.ts'), formats: ['es'], fileName: () => 'traces-bench.js' },
    },
  });
  writeFileSync(join(dir, 'index.html'), '<!doctype html><meta charset="utf-8"><title>Traces bench</title>\n<body style="margin:0"><canvas></canvas><script type="module" src="./traces-bench.js"></script></body>\n');
}

export async function run(quick: boolean): Promise<void> {
  const tmp = mkdtempSync(join(tmpdir(), 'gleaner-traces-bench-'));
  const site = join(tmp, 'site');
  await buildPage(site);
  const { serveApp } = (await import(pathToFileURL(join(ROOT, 'scripts/serve.mjs')).href)) as { serveApp: ServeApp };
  const server = await serveApp({ port: 0, root: site, demoDir: site });
  const context = await chromium.launchPersistentContext(join(tmp, 'profile'), {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1300, height: 900 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  });
  let rows: TracesBenchRow[];
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    page.on('pageerror', (e) => console.error(`bench page error: ${e.message}`));
    await page.goto(server.url);
    await page.waitForFunction(() => typeof window.__tracesBench === 'function');
    const runs = quick ? 9 : 31;
    rows = await page.evaluate((runs) => window.__tracesBench!(runs), runs);
    // The last frame, to check by eye: test-output/traces-bench.png.
    mkdirSync(join(ROOT, 'test-output'), { recursive: true });
    await page.locator('canvas').screenshot({ path: join(ROOT, 'test-output/traces-bench.png') });
  } finally {
    await context.close();
    await server.close();
    rmSync(tmp, { recursive: true, force: true });
  }
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
