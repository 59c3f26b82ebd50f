// `npm run bench -- map [--quick]`: how long the Map takes to redraw at study scale, in headless
// Chromium with its software renderer (no GPU): median and p90 of ~20 redraws after a pan and
// after a recolour (colour index rebuild + redraw), each including putImageData, at 200,000 and
// 1,000,000 points. Prints a table and appends JSON lines to bench-results/map.jsonl.
import { appendFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, withBenchPage } from '../browser-page';

const BUDGET_MS = 50;

/** One result row of the page's `window.__mapBench` (bench/pages/map-page.ts). */
interface MapBenchRow {
  points: number;
  operation: 'pan' | 'recolour';
  runs: number;
  medianMs: number;
  p90Ms: number;
  pointsDrawn: number;
  width: number;
  height: number;
  dpr: number;
}
declare global {
  interface Window { __mapBench?: (n: number, runs: number, width?: number, height?: number) => Promise<MapBenchRow[]> }
}

export async function run(quick: boolean): Promise<void> {
  const rows: MapBenchRow[] = [];
  const { browser: version } = await withBenchPage({ entry: 'bench/pages/map-page.ts', name: 'map', viewport: { width: 1300, height: 820 } }, async (page) => {
    await page.waitForFunction(() => typeof window.__mapBench === 'function');
    const runs = quick ? 7 : 21;
    for (const n of quick ? [200_000] : [200_000, 1_000_000]) {
      rows.push(...(await page.evaluate(([n, runs]) => window.__mapBench!(n, runs), [n, runs] as const)));
      // The last frame (the feature-value colouring), to check by eye: test-output/map-<n>.png.
      mkdirSync(join(ROOT, 'test-output'), { recursive: true });
      await page.locator('canvas').screenshot({ path: join(ROOT, `test-output/map-${n}.png`) });
    }
  });
  console.log(`Map redraw in headless Chromium (${version}, --disable-gpu, software raster), canvas ${rows[0].width}×${rows[0].height} CSS px at dpr ${rows[0].dpr}`);
  console.log('| points | operation | median ms | p90 ms | in view | budget |');
  console.log('|--------|-----------|-----------|--------|---------|--------|');
  for (const r of rows) {
    const ok = r.medianMs <= BUDGET_MS ? 'ok' : 'OVER';
    console.log(`| ${r.points.toLocaleString('en')} | ${r.operation} | ${r.medianMs.toFixed(1)} | ${r.p90Ms.toFixed(1)} | ${r.pointsDrawn.toLocaleString('en')} | ${ok} (≤ ${BUDGET_MS}) |`);
  }
  console.log(`median of ${rows[0].runs} redraws after 2 warm-ups; a redraw = raster pass + putImageData (+ a 1-pixel readback); recolour also rebuilds the colour index.`);
  const out = join(ROOT, 'bench-results');
  mkdirSync(out, { recursive: true });
  const at = new Date().toISOString();
  appendFileSync(join(out, 'map.jsonl'), rows.map((r) => JSON.stringify({ suite: 'map', at, quick, ...r })).join('\n') + '\n');
}
