/**
 * The import graph of the repository's own sources (static imports and re-exports, type-only ones
 * included, as TypeScript and Svelte files write them) and its circles: strongly connected
 * components of more than one file (Tarjan's algorithm), or a file importing itself.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';

const SOURCE = /\.(ts|svelte)$/;
const IMPORT = /(?:^|\n)\s*(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|(?:^|\n)\s*import\s*['"]([^'"]+)['"]/g;

function walk(dir: string, out: string[]): void {
  for (const name of readdirSync(dir)) {
    if (name === 'node_modules' || name.startsWith('.')) continue;
    const p = join(dir, name);
    if (statSync(p).isDirectory()) walk(p, out);
    else if (SOURCE.test(name) && !name.endsWith('.d.ts')) out.push(p);
  }
}

function resolveImport(from: string, spec: string): string | null {
  if (!spec.startsWith('.')) return null;
  const base = resolve(dirname(from), spec);
  for (const c of [base, `${base}.ts`, `${base}.svelte`, join(base, 'index.ts')]) if (existsSync(c) && statSync(c).isFile()) return c;
  return null;
}

/** Files (relative to root) and the files each imports, for the given folders. */
export function importGraph(root: string, folders: string[]): Map<string, string[]> {
  const files: string[] = [];
  for (const f of folders) if (existsSync(join(root, f))) walk(join(root, f), files);
  const graph = new Map<string, string[]>();
  for (const file of files) {
    let text = readFileSync(file, 'utf8');
    if (file.endsWith('.svelte')) text = [...text.matchAll(/<script[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]).join('\n');
    const targets = new Set<string>();
    for (const m of text.matchAll(IMPORT)) {
      const to = resolveImport(file, m[1] ?? m[2]);
      if (to) targets.add(relative(root, to));
    }
    graph.set(relative(root, file), [...targets].sort());
  }
  return graph;
}

/** The circles of a graph: each a sorted list of the files in it, the list sorted too. */
export function importCircles(graph: Map<string, string[]>): string[][] {
  let index = 0;
  const idx = new Map<string, number>(), low = new Map<string, number>(), onStack = new Set<string>();
  const stack: string[] = [];
  const out: string[][] = [];
  const visit = (v: string): void => {
    idx.set(v, index); low.set(v, index); index++;
    stack.push(v); onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!idx.has(w)) { visit(w); low.set(v, Math.min(low.get(v)!, low.get(w)!)); }
      else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, idx.get(w)!));
    }
    if (low.get(v) === idx.get(v)) {
      const scc: string[] = [];
      let w: string;
      do { w = stack.pop()!; onStack.delete(w); scc.push(w); } while (w !== v);
      if (scc.length > 1 || (graph.get(v) ?? []).includes(v)) out.push(scc.sort());
    }
  };
  for (const v of graph.keys()) if (!idx.has(v)) visit(v);
  return out.sort((a, b) => (a[0] < b[0] ? -1 : 1));
}
