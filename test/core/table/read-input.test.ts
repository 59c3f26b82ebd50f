// Node-side reading (src/cli/read-input.ts): files streamed in chunks and partitioned Parquet folders.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readInput } from '../../../src/cli/read-input';
import { cellText, findColumn, type Table } from '../../../src/core/table/table';
import { duckdb, sqlPath } from '../../fixtures/duckdb';
import { tempDir } from '../../temp';

const dir = tempDir('read-input');
const deps = { progress: () => {}, cancelled: () => false };
const text = (t: Table, name: string) => {
  const c = findColumn(t, name);
  if (!c) throw new Error(`no column ${name}`);
  return Array.from({ length: t.nRows }, (_, r) => cellText(c, r));
};

beforeAll(async () => {
  const rows = Array.from({ length: 12 }, (_, i) => `w${i},S0${(i % 3) + 1},${5 * i},${(i / 4).toFixed(2)}`);
  writeFileSync(join(dir, 'w.csv'), ['window_id,subject,start,acc_mean', ...rows].join('\n'));
  // A partitioned dataset as a distributed job writes it: DuckDB's PARTITION_BY makes subject=S0x/ folders.
  await duckdb(`COPY (SELECT * FROM read_csv(${sqlPath(join(dir, 'w.csv'))})) TO ${sqlPath(join(dir, 'parts'))} (FORMAT parquet, PARTITION_BY (subject))`);
  writeFileSync(join(dir, 'parts', '_SUCCESS'), '');
}, 60_000);

describe('readInput(path)', () => {
  it('reads a partitioned Parquet folder as one table with its partition column', async () => {
    const got = await readInput(join(dir, 'parts'), deps);
    expect(got.fileName).toBe('parts');
    expect(got.parts).toBe(3);
    expect(got.table.nRows).toBe(12);
    expect(got.table.columns.map((c) => c.name).sort()).toEqual(['acc_mean', 'start', 'subject', 'window_id']);
    // Every window keeps its own subject (the folder it was written to) and its values.
    const ids = text(got.table, 'window_id');
    const subjects = text(got.table, 'subject');
    const acc = text(got.table, 'acc_mean');
    ids.forEach((id, r) => {
      const i = Number(id.slice(1));
      expect(subjects[r]).toBe(`S0${(i % 3) + 1}`);
      expect(Number(acc[r])).toBe(Number((i / 4).toFixed(2)));
    });
    // The folder's hash: SHA-256 (node:crypto) over each part's relative path + newline, then its bytes, in path order.
    const { createHash } = await import('node:crypto');
    const { readdirSync, readFileSync } = await import('node:fs');
    const rels = (readdirSync(join(dir, 'parts'), { recursive: true }) as string[]).filter((f) => f.endsWith('.parquet')).sort();
    expect(rels).toHaveLength(3);
    const want = createHash('sha256');
    for (const rel of rels) want.update(`${rel}\n`).update(readFileSync(join(dir, 'parts', rel)));
    expect(got.sha256).toBe(want.digest('hex'));
  });

  it('streams a CSV file and hashes it (SHA-256 as node:crypto computes it over the whole file)', async () => {
    const { createHash } = await import('node:crypto');
    const { readFileSync } = await import('node:fs');
    const got = await readInput(join(dir, 'w.csv'), deps);
    expect(got.table.nRows).toBe(12);
    expect(got.sha256).toBe(createHash('sha256').update(readFileSync(join(dir, 'w.csv'))).digest('hex'));
  });

  it('stops when cancelled', async () => {
    await expect(readInput(join(dir, 'w.csv'), { ...deps, cancelled: () => true })).rejects.toThrow('cancelled');
  });
});
