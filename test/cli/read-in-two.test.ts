// Large delimited files are parsed on two threads (src/cli/csv-in-two.ts). Here the threshold is
// lowered so small files take that path: the table must equal one thread's, its values DuckDB's
// read_csv (@duckdb/node-api, see package.json), and a problem in the second half must be
// reported on the file's own row.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInput, type ReadInputDeps } from '../../src/cli/read-input';
import { seededRandom } from '../../src/core/random';
import { findColumn } from '../../src/core/table/table';
import { duckdb, sqlPath } from '../fixtures/duckdb';
import { tempDir } from '../temp';

const dir = tempDir('in-two');
const ONE: ReadInputDeps = { progress: () => {}, cancelled: () => false, twoThreadsBytes: Infinity, chunkBytes: 1 << 16 };
const TWO: ReadInputDeps = { ...ONE, twoThreadsBytes: 1 };

/** A seeded study table: ids, subjects, times, features with plain, exponent, padded, NA and empty cells. */
function writeStudy(name: string, rows: number, edit: (lines: string[]) => void = () => {}): string {
  const random = seededRandom(4242);
  const lines = ['window_id,subject,start,f0,f1,f2,f3'];
  for (let i = 0; i < rows; i++) {
    const f = [
      (random() * 20 - 10).toFixed(4),
      `${Math.round(random() * 1e6)}e-3`,
      random() < 0.05 ? '' : random() < 0.05 ? 'NA' : ` ${(random() * 3).toFixed(2)} `,
      (random() * 1e3).toFixed(12),
    ];
    lines.push([`w${i}`, `S${String(i % 17).padStart(2, '0')}`, 5 * i, ...f].join(','));
  }
  edit(lines);
  const path = join(dir, name);
  writeFileSync(path, `${lines.join('\r\n')}\r\n`);
  return path;
}

describe('reading a delimited file on two threads', () => {
  it('gives one thread\'s table, with DuckDB read_csv\'s values', async () => {
    const path = writeStudy('study.csv', 20_000);
    const before = readFileSync(path);
    const outcomes: string[] = [];
    const two = await readInput(path, { ...TWO, twoThreadsOutcome: (how) => outcomes.push(how) });
    expect(outcomes).toEqual(['joined']);
    const one = await readInput(path, ONE);
    expect(two.table).toEqual(one.table);
    expect(two.sha256).toBe(one.sha256);
    expect(two.table.nRows).toBe(20_000);
    // The last window's line: header on line 1, windows from line 2.
    expect(two.table.lines?.[19_999]).toBe(20_001);
    const [[s0, s1, s2, s3, nNull]] = (await duckdb(`SELECT sum(f0), sum(f1), sum(f2), sum(f3), count(*) - count(f2) FROM read_csv(${sqlPath(path)}, nullstr = ['', 'NA'], types = {'f2': 'DOUBLE'})`)) as number[][];
    const sum = (name: string) => {
      const c = findColumn(two.table, name);
      if (!c || c.kind !== 'numeric') throw new Error(name);
      let s = 0;
      let missing = 0;
      for (const v of c.values) if (Number.isNaN(v)) missing++; else s += v;
      return [s, missing];
    };
    expect(sum('f0')[0]).toBeCloseTo(Number(s0), 6);
    expect(sum('f1')[0]).toBeCloseTo(Number(s1), 6);
    expect(sum('f2')[0]).toBeCloseTo(Number(s2), 6);
    expect(sum('f3')[0]).toBeCloseTo(Number(s3), 4);
    expect(sum('f2')[1]).toBe(Number(nNull));
    expect(readFileSync(path).equals(before)).toBe(true);
  }, 60_000);

  it('reports a ragged row in the second half on its own line, as one thread does', async () => {
    const path = writeStudy('ragged.csv', 20_000, (lines) => { lines[15_000] += ',7'; });
    const one = await readInput(path, ONE).then(() => '', (e: Error) => e.message);
    const outcomes: string[] = [];
    const two = await readInput(path, { ...TWO, twoThreadsOutcome: (how) => outcomes.push(how) }).then(() => '', (e: Error) => e.message);
    // Thrown from the second thread's part, so no outcome is told.
    expect(outcomes).toEqual([]);
    expect(one).toBe('ragged.csv, row 15001: expected 7 fields, as in the header, found "8 fields (the delimiter is comma)"');
    expect(two).toBe(one);
  }, 60_000);

  it('reports the first problem of the file when both halves have one', async () => {
    const path = writeStudy('two-problems.csv', 20_000, (lines) => {
      lines[3_000] = lines[3_000].replace(/,[^,]*$/, '');
      lines[16_000] += ',7';
    });
    const two = await readInput(path, TWO).then(() => '', (e: Error) => e.message);
    const one = await readInput(path, ONE).then(() => '', (e: Error) => e.message);
    expect(one).toBe('two-problems.csv, row 3001: expected 7 fields, as in the header, found "6 fields (the delimiter is comma)"');
    expect(two).toBe(one);
  }, 60_000);

  it('reads on by itself when a quoted cell comes before the middle, and still gives one thread\'s table', async () => {
    const path = writeStudy('quoted.csv', 20_000, (lines) => {
      lines[10] = lines[10].replace(/^w9,S09/, 'w9,"S09"');
      // A quoted line break just past the middle: the cut must not fall inside it.
      lines[10_001] = lines[10_001].replace(/^(w10000),S\d\d/, '$1,"S\r\n16"');
    });
    const outcomes: string[] = [];
    const two = await readInput(path, { ...TWO, twoThreadsOutcome: (how) => outcomes.push(how) });
    expect(outcomes).toEqual(['a quoted cell before the cut']);
    const one = await readInput(path, ONE);
    expect(two.table).toEqual(one.table);
    const subject = findColumn(two.table, 'subject');
    expect(subject?.kind === 'categorical' && subject.dictionary).toContain('S\r\n16');
  }, 60_000);

  it('stops when cancelled while both threads read', async () => {
    const path = writeStudy('cancel.csv', 20_000);
    let chunks = 0;
    const read = readInput(path, { ...TWO, progress: () => { chunks++; }, cancelled: () => chunks > 2 });
    await expect(read).rejects.toThrow('cancelled');
  }, 60_000);
});
