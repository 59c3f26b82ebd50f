/**
 * Layers as allow lists: every source file belongs to one layer (the most specific folder below
 * that has an entry; `dir/*` holds only the files directly in `dir`), and each layer lists the
 * layers it may import (static imports, type-only ones included, found by ./import-graph). A file
 * in a folder with no layer fails, so a new folder is placed on purpose. What may not be imported
 * from packages (Node built-ins, electron) and the core's forbidden globals stay in eslint.config.js.
 */
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importGraph } from './import-graph';

const ROOT = resolve(import.meta.dirname, '../..');
const APP = ['src/app/components', 'src/app/views', 'src/app/state', 'src/app/map', 'src/app/lib'];

/** Layer → what it may import besides itself. The order inside src/app: views/components → state → map → lib. */
export const LAYERS: Record<string, string[]> = {
  'src/core': [],
  'src/worker': ['src/core'],
  'src/host': ['src/core'],
  'src/app/lib': ['src/core', 'src/host'],
  'src/app/map': ['src/app/lib', 'src/core'],
  'src/app/state': ['src/app/map', 'src/app/lib', 'src/core', 'src/host', 'src/worker', 'package.json'],
  'src/app/components': ['src/app/views', 'src/app/state', 'src/app/map', 'src/app/lib', 'src/core', 'src/host', 'package.json'],
  'src/app/views': ['src/app/components', 'src/app/state', 'src/app/map', 'src/app/lib', 'src/core', 'src/host', 'src/worker'],
  // main.ts, App.svelte and the test instrumentation, which the entry installs only when a test asks.
  'src/app/*': [...APP, 'src/core', 'src/host', 'src/worker'],
  'src/cli': ['src/core', 'src/worker', 'package.json'],
  'electron': ['src/core'],
  // Pages the browser bench suites build: they draw with the app's map and trace code.
  'bench/pages': ['src/app/map', 'src/app/views', 'src/app/lib', 'src/core'],
  'bench': ['src/core', 'src/worker', 'src/cli'],
  'scripts': [],
  'demo-data': ['src/core'],
};

/** The layer of a file (relative path), or null when no entry covers it. */
export function layerOf(file: string, layers: Record<string, string[]> = LAYERS): string | null {
  const dir = file.includes('/') ? file.slice(0, file.lastIndexOf('/')) : '';
  if (`${dir}/*` in layers) return `${dir}/*`;
  if (file in layers) return file;
  let best: string | null = null;
  for (const layer of Object.keys(layers)) {
    if (layer.endsWith('/*')) continue;
    if ((dir === layer || dir.startsWith(`${layer}/`)) && (best === null || layer.length > best.length)) best = layer;
  }
  return best;
}

/** The imports that break the allow lists, as "from → to (layer → layer)" lines. */
export function layerViolations(graph: Map<string, string[]>, layers: Record<string, string[]> = LAYERS): string[] {
  const out: string[] = [];
  for (const [file, targets] of graph) {
    const from = layerOf(file, layers);
    if (from === null) {
      out.push(`${file}: in no layer (add its folder to LAYERS in test/lint/layers.test.ts)`);
      continue;
    }
    for (const target of targets) {
      const to = layerOf(target, layers) ?? target;
      if (to !== from && !layers[from].includes(to)) out.push(`${file} → ${target} (${from} may not import ${to})`);
    }
  }
  return out.sort();
}

describe('layers (allow lists)', () => {
  it('every import of the sources is allowed by its layer', () => {
    const graph = importGraph(ROOT, ['src', 'electron', 'bench', 'scripts', 'demo-data']);
    expect(graph.size).toBeGreaterThan(300);
    expect(layerViolations(graph)).toEqual([]);
  });

  it('places files in the most specific layer; a folder without one is reported', () => {
    expect(layerOf('src/app/main.ts')).toBe('src/app/*');
    expect(layerOf('src/app/state/app.svelte.ts')).toBe('src/app/state');
    expect(layerOf('src/core/cluster/hierarchy/ward.ts')).toBe('src/core');
    expect(layerOf('bench/pages/map-page.ts')).toBe('bench/pages');
    expect(layerOf('bench/suites/map.ts')).toBe('bench');
    expect(layerOf('src/app/newfolder/x.ts')).toBe(null);
    const graph = new Map([
      ['src/app/newfolder/x.ts', []],
      ['src/app/state/a.svelte.ts', ['src/app/views/B.svelte']],
      ['src/app/lib/c.ts', ['src/app/map/view.ts']],
      ['src/app/map/d.ts', ['src/app/lib/palette.ts']],
    ]);
    expect(layerViolations(graph)).toEqual([
      'src/app/lib/c.ts → src/app/map/view.ts (src/app/lib may not import src/app/map)',
      'src/app/newfolder/x.ts: in no layer (add its folder to LAYERS in test/lint/layers.test.ts)',
      'src/app/state/a.svelte.ts → src/app/views/B.svelte (src/app/state may not import src/app/views)',
    ]);
  });
});
