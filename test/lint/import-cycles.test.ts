/**
 * No import circle (files importing each other in a loop, type-only imports included) in the
 * sources, the tests, the bench, the scripts or electron/. One known circle is left, listed here
 * with its reason; the test fails on any other circle, and when a listed one is gone (so the list
 * only shrinks).
 */
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importCircles, importGraph } from './import-graph';

const ROOT = resolve(import.meta.dirname, '../..');
const KNOWN: string[][] = [
  // The UMAP bench borrows the embed suite's datasets and timers, and the suite calls it back;
  // moving the shared helpers out of bench/suites/embed.ts is left to the work on that suite.
  ['bench/embed-umap.ts', 'bench/suites/embed.ts'],
];

describe('import graph', () => {
  it('has no circle besides the known one', () => {
    const graph = importGraph(ROOT, ['src', 'electron', 'bench', 'scripts', 'demo-data', 'test']);
    expect(graph.size).toBeGreaterThan(300);
    expect(importCircles(graph)).toEqual(KNOWN);
  });

  it('finds a circle, type imports included', () => {
    const g = new Map([['a.ts', ['b.ts']], ['b.ts', ['c.ts']], ['c.ts', ['a.ts']], ['d.ts', ['a.ts']]]);
    expect(importCircles(g)).toEqual([['a.ts', 'b.ts', 'c.ts']]);
  });
});
