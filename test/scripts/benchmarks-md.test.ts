import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { tempDir } from '../temp';

const ROOT = resolve(import.meta.dirname, '../..');
type Md = {
  cell: (v: unknown) => string;
  suiteSection: (name: string, rows: object[]) => string;
  benchmarksMarkdown: (dir: string) => string;
};
const md = (await import(pathToFileURL(join(ROOT, 'scripts/benchmarks-md.mjs')).href)) as Md;

describe('BENCHMARKS.md generation', () => {
  it('formats cells: 4 significant digits, whole from 10,000 up, arrays joined, pipes escaped', () => {
    expect(md.cell(20.544083192000002)).toBe('20.54');
    expect(md.cell(0.0000123456)).toBe('0.00001235');
    expect(md.cell(1000000)).toBe('1000000');
    expect(md.cell(230608.25742904586)).toBe('230608');
    expect(md.cell([1.52, 2])).toBe('1.52 2');
    expect(md.cell('a|b')).toBe('a\\|b');
    expect(md.cell(undefined)).toBe('');
  });

  it('makes one table per suite with the union of fields as columns, in row order', () => {
    const dir = tempDir('bench-md');
    mkdirSync(join(dir, 'r'));
    writeFileSync(join(dir, 'r', 'b.jsonl'), '{"suite":"b","x":1}\n{"suite":"b","x":2,"y":"z"}\n');
    writeFileSync(join(dir, 'r', 'a.jsonl'), '{"suite":"a","t":0.5}\n');
    const out = md.benchmarksMarkdown(join(dir, 'r'));
    expect(out.indexOf('## a')).toBeLessThan(out.indexOf('## b'));
    expect(out).toContain('| x | y |\n| --- | --- |\n| 1 |  |\n| 2 | z |');
    writeFileSync(join(dir, 'r', 'c.jsonl'), '{"suite":"c"}\nnot json\n');
    expect(() => md.benchmarksMarkdown(join(dir, 'r'))).toThrow(/c\.jsonl: row 2: expected one JSON object per line/);
  });

  it('the committed BENCHMARKS.md is the generation of the committed bench-results', () => {
    expect(readFileSync(join(ROOT, 'BENCHMARKS.md'), 'utf8')).toBe(md.benchmarksMarkdown(join(ROOT, 'bench-results')));
  });
});
