/**
 * The page behind `npm run bench -- map`: draws seeded synthetic Maps with the app's own renderer
 * in a browser and times redraws after a pan and after a recolour. Built on its own by the bench
 * suite (never part of the app); it installs `window.__mapBench`.
 */
import { normal, seededRandom } from '../../src/core/random';
import { categoryColouring, scaleColouring, type Colouring } from '../../src/app/map/colouring';
import { MapRenderer } from '../../src/app/map/renderer';
import { fitView, panBy } from '../../src/app/map/view';

export interface MapBenchRow {
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

/** n points in k Gaussian blobs (seeded), their cluster and a smooth per-point value. */
function synthetic(n: number, k: number, seed: number): { coords: Float32Array; labels: Int32Array; value: Float64Array } {
  const random = seededRandom(seed);
  const centres = Array.from({ length: k }, () => [normal(random) * 4, normal(random) * 4, 0.5 + random()]);
  const coords = new Float32Array(2 * n), labels = new Int32Array(n), value = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const c = Math.floor(random() * k);
    const [cx, cy, s] = centres[c];
    coords[2 * i] = cx + normal(random) * s;
    coords[2 * i + 1] = cy + normal(random) * s;
    labels[i] = c;
    value[i] = coords[2 * i] + 0.5 * coords[2 * i + 1];
  }
  return { coords, labels, value };
}

function summary(times: number[]): { medianMs: number; p90Ms: number } {
  const s = [...times].sort((a, b) => a - b);
  return { medianMs: s[Math.floor(s.length / 2)], p90Ms: s[Math.min(s.length - 1, Math.ceil(0.9 * s.length) - 1)] };
}

const nextFrame = (): Promise<void> => new Promise((r) => requestAnimationFrame(() => r()));

async function bench(n: number, runs: number, width = 1280, height = 800): Promise<MapBenchRow[]> {
  const canvas = document.querySelector('canvas') ?? document.body.appendChild(document.createElement('canvas'));
  const dpr = window.devicePixelRatio || 1;
  canvas.style.width = `${width}px`;
  canvas.style.height = `${height}px`;
  canvas.width = Math.round(width * dpr);
  canvas.height = Math.round(height * dpr);
  const ctx = canvas.getContext('2d')!;
  const { coords, labels, value } = synthetic(n, 10, 7);
  const names = Array.from({ length: 10 }, (_, c) => `candidate ${c + 1}`);
  const renderer = new MapRenderer();
  renderer.setPoints(coords, labels);
  renderer.setColours(categoryColouring(labels, names, 'cluster'));
  renderer.setSelection(null, 0);
  let view = fitView(coords, width, height);
  let drawn = 0;
  // One frame: draw + putImageData, then read one pixel back so the canvas has really taken it.
  const frame = (): void => {
    drawn = renderer.draw(ctx, view, dpr).pointsDrawn;
    ctx.getImageData(0, 0, 1, 1);
  };
  const rows: MapBenchRow[] = [];
  const pan: number[] = [];
  for (let r = 0; r < runs + 2; r++) {
    view = panBy(view, r % 2 ? -6 : 6, r % 2 ? -4 : 4);
    const t0 = performance.now();
    frame();
    if (r >= 2) pan.push(performance.now() - t0);
    await nextFrame();
  }
  rows.push({ points: n, operation: 'pan', runs, ...summary(pan), pointsDrawn: drawn, width, height, dpr });
  const recolour: number[] = [];
  for (let r = 0; r < runs + 2; r++) {
    const t0 = performance.now();
    const c: Colouring = r % 2 ? categoryColouring(labels, names, 'cluster') : scaleColouring(value, 'value');
    renderer.setColours(c);
    frame();
    if (r >= 2) recolour.push(performance.now() - t0);
    await nextFrame();
  }
  rows.push({ points: n, operation: 'recolour', runs, ...summary(recolour), pointsDrawn: drawn, width, height, dpr });
  return rows;
}

declare global {
  interface Window { __mapBench?: typeof bench }
}
window.__mapBench = bench;
