import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { bytesSource, countingSource, type ByteSource } from '../../../src/core/raw/byte-source';
import { createTableReader, readTableSource } from '../../../src/core/table/reader';
import { cellText, findColumn, type Table } from '../../../src/core/table/table';
import { duckdb, sqlPath } from '../../fixtures/duckdb';
import { tempDir } from '../../temp';

const dir = tempDir('parquet-source');
const path = join(dir, 'groups.parquet');
const ROWS = 60_000;
const GROUP = 10_000;

beforeAll(async () => {
  // Written by DuckDB (@duckdb/node-api 1.5): six row groups of 10,000 rows, a text subject,
  // a nullable double, an integer, a timestamp and a hashed (incompressible) double.
  await duckdb(`COPY (SELECT i AS window_id, 'S' || (i % 7) AS subject, TIMESTAMP '2024-03-10 08:00:00' + to_seconds(i * 5) AS start,
      CASE WHEN i % 11 = 0 THEN NULL ELSE i * 0.5 END AS acc_mean, i % 13 AS steps, (hash(i) % 1000003) * 0.001 AS noise
    FROM range(${ROWS}) t(i) ORDER BY i) TO ${sqlPath(path)} (FORMAT parquet, COMPRESSION zstd, ROW_GROUP_SIZE ${GROUP})`);
}, 60_000);

function pushed(bytes: Uint8Array): Promise<Table> {
  const reader = createTableReader('parquet', 'groups.parquet');
  reader.push(bytes);
  return reader.finish();
}

const cells = (t: Table, name: string) => {
  const c = findColumn(t, name);
  if (!c) throw new Error(`no column ${name}`);
  return Array.from({ length: t.nRows }, (_, r) => cellText(c, r));
};

describe('Parquet read by offset', () => {
  it('gives the same table as the pushed bytes, and the values DuckDB wrote', async () => {
    const bytes = new Uint8Array(readFileSync(path));
    const a = await readTableSource('parquet', 'groups.parquet', bytesSource(bytes));
    const b = await pushed(bytes);
    expect(a.nRows).toBe(ROWS);
    for (const name of ['window_id', 'subject', 'start', 'acc_mean', 'steps', 'noise']) expect(cells(a, name)).toEqual(cells(b, name));
    expect(cells(a, 'acc_mean').slice(0, 3)).toEqual(['', '0.5', '1']);
    expect(cells(a, 'subject')[59_999]).toBe(`S${59_999 % 7}`);
    expect(cells(a, 'start')[1]).toBe('2024-03-10T08:00:05.000Z');
  });

  it('reads the footer and then each row group once, never the whole file in one read', async () => {
    const bytes = new Uint8Array(readFileSync(path));
    const largest: number[] = [];
    const inner = bytesSource(bytes);
    const spy: ByteSource = { size: inner.size, read: (o, n) => { largest.push(n); return inner.read(o, n); } };
    const counted = countingSource(spy);
    await readTableSource('parquet', 'groups.parquet', counted);
    expect(Math.max(...largest)).toBeLessThan(bytes.length / 3);
    // Each byte is fetched about once: the footer, then the row groups (the 4-byte magic and a
    // small overlap between the footer read and the last group aside).
    expect(counted.bytesRead).toBeLessThan(bytes.length * 1.5);
  });

  it('names the file when it is cut short', async () => {
    const bytes = new Uint8Array(readFileSync(path));
    const cut = bytes.subarray(0, Math.floor(bytes.length * 0.6));
    await expect(readTableSource('parquet', 'cut.parquet', bytesSource(cut))).rejects.toThrow(InputError);
    await expect(readTableSource('parquet', 'cut.parquet', bytesSource(cut))).rejects.toThrow(/cut\.parquet: expected a complete Parquet file/);
  });
});
