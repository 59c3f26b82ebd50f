/**
 * No import circle (files importing each other in a loop, type-only imports included) in the
 * sources, the tests, the bench, the scripts or electron/.
 */
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importCircles, importGraph } from './import-graph';

const ROOT = resolve(import.meta.dirname, '../..');

describe('import graph', () => {
  it('has no circle', () => {
    const graph = importGraph(ROOT, ['src', 'electron', 'bench', 'scripts', 'demo-data', 'test']);
    expect(graph.size).toBeGreaterThan(300);
    expect(importCircles(graph)).toEqual([]);
  });

  it('finds a circle, type imports included', () => {
    const g = new Map([['a.ts', ['b.ts']], ['b.ts', ['c.ts']], ['c.ts', ['a.ts']], ['d.ts', ['a.ts']]]);
    expect(importCircles(g)).toEqual([['a.ts', 'b.ts', 'c.ts']]);
  });
});
