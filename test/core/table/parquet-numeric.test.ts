// The typed-array decoder of numeric Parquet columns (src/core/table/parquet-numeric.ts), checked
// against DuckDB (@duckdb/node-api 1.5): files it writes (nullable columns, dictionary pages, several
// row groups, each codec, data page v2) must read back as the values DuckDB itself reads.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readHybrid } from '../../../src/core/table/parquet-numeric';
import { createTableReader } from '../../../src/core/table/reader';
import { findColumn, type Table } from '../../../src/core/table/table';
import { duckdb, sqlPath } from '../../fixtures/duckdb';
import { tempDir } from '../../temp';

const dir = tempDir('parquet-numeric');
const N = 5000;
const COLUMNS = ['d', 'f', 'i', 'b', 'few', 'req'];
// Nulls every 7th/11th row, a FLOAT, INTEGER and BIGINT, a low-cardinality DOUBLE (dictionary pages).
const SRC = `(SELECT CASE WHEN r % 7 = 0 THEN NULL ELSE r * 0.37 - 100 END::DOUBLE AS d,
  (r / 3.0)::FLOAT AS f, (r % 50 - 25)::INTEGER AS i, (r * 1000003)::BIGINT AS b,
  CASE WHEN r % 11 = 0 THEN NULL ELSE (r % 5) * 1.5 END::DOUBLE AS few, r::DOUBLE AS req FROM range(${N}) t(r))`;
const VARIANTS = ['snappy', 'zstd', 'gzip', 'uncompressed', 'v2'];
let expected: (number | null)[][] = [];

async function read(path: string): Promise<Table> {
  const reader = createTableReader('parquet', path.split('/').pop() as string);
  reader.push(new Uint8Array(readFileSync(path)));
  return reader.finish();
}

beforeAll(async () => {
  for (const v of VARIANTS) {
    const options = v === 'v2' ? 'COMPRESSION snappy, PARQUET_VERSION v2' : `COMPRESSION ${v}`;
    await duckdb(`COPY ${SRC} TO ${sqlPath(join(dir, `n-${v}.parquet`))} (FORMAT parquet, ${options}, ROW_GROUP_SIZE 2048)`);
  }
  const rows = await duckdb(`SELECT ${COLUMNS.join(', ')} FROM read_parquet(${sqlPath(join(dir, 'n-snappy.parquet'))})`);
  expected = COLUMNS.map((_, j) => rows.map((r) => (r[j] === null ? null : Number(r[j]))));
}, 60_000);

describe('numeric Parquet columns decoded into typed arrays', () => {
  for (const v of VARIANTS) {
    it(`reads DuckDB's ${v} file as DuckDB reads it (nulls as NaN)`, async () => {
      const t = await read(join(dir, `n-${v}.parquet`));
      expect(t.nRows).toBe(N);
      COLUMNS.forEach((name, j) => {
        const c = findColumn(t, name);
        expect(c?.kind, name).toBe('numeric');
        if (c?.kind !== 'numeric') return;
        const want = expected[j];
        let mismatches = 0;
        for (let r = 0; r < N; r++) {
          const w = want[r];
          if (w === null ? !Number.isNaN(c.values[r]) : c.values[r] !== w) mismatches++;
        }
        expect(mismatches, `${name} in ${v}`).toBe(0);
      });
      // Source: the SQL above: rows 0, 7, 14, ... of d are NULL; row 1 of d is 1 × 0.37 − 100.
      const d = findColumn(t, 'd');
      expect(d?.kind === 'numeric' && Number.isNaN(d.values[7]) && d.values[1]).toBeCloseTo(-99.63, 12);
    });
  }

  it('unpacks the bit-packed example of the Parquet encoding spec', () => {
    // parquet-format Encodings.md, "Run Length Encoding / Bit-Packing Hybrid" (from memory): 0..7 at
    // bit width 3 pack to 10001000 11000110 11111010; the run header (1 group of 8, bit-packed) is 3.
    const out = new Uint32Array(8);
    const end = readHybrid(new Uint8Array([3, 0b10001000, 0b11000110, 0b11111010]), 0, 4, 3, 8, out);
    expect([...out]).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    expect(end).toBe(4);
    // An RLE run (header = count << 1): 5 copies of 300 at bit width 9 (two value bytes, little-endian).
    const run = new Uint32Array(5);
    readHybrid(new Uint8Array([10, 300 & 255, 300 >> 8]), 0, 3, 9, 5, run);
    expect([...run]).toEqual([300, 300, 300, 300, 300]);
  });
});
