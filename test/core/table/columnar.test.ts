import { Field, Float64, Int32, makeData, RecordBatch, Schema, Struct, Table as ArrowTable, tableToIPC, vectorFromArray } from 'apache-arrow';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { detectFormat } from '../../../src/core/table/format';
import { createTableReader } from '../../../src/core/table/reader';
import type { TableFormat } from '../../../src/core/table/reader.types';
import { cellText, findColumn, type Table } from '../../../src/core/table/table';
import { duckdb, sqlPath } from '../../fixtures/duckdb';
import { tempDir } from '../../temp';

const dir = tempDir('columnar');
const CSV = [
  'window_id,subject,start,acc_mean,gyro_sd,label',
  'w1,S01,2024-03-10T08:30:00Z,0.25,1.5,walk',
  'w2,S01,2024-03-10T08:30:05Z,-0.125,,',
  'w3,S02,2024-03-10T09:00:00Z,3.75,2.25,sit',
].join('\n');

async function read(path: string, format?: TableFormat, chunk = 1000): Promise<Table> {
  const bytes = new Uint8Array(readFileSync(path));
  const reader = createTableReader(format ?? detectFormat(path, bytes), path.split('/').pop() as string);
  for (let at = 0; at < bytes.length; at += chunk) reader.push(bytes.subarray(at, at + chunk));
  return reader.finish();
}

const text = (t: Table, name: string) => {
  const c = findColumn(t, name);
  if (!c) throw new Error(`no column ${name}`);
  return Array.from({ length: t.nRows }, (_, r) => cellText(c, r));
};

beforeAll(async () => {
  writeFileSync(join(dir, 'w.csv'), CSV);
  const src = `(SELECT window_id, subject, CAST(start AS TIMESTAMP) AS start, acc_mean, gyro_sd, label FROM read_csv(${sqlPath(join(dir, 'w.csv'))}, timestampformat = '%Y-%m-%dT%H:%M:%SZ'))`;
  // Parquet written by DuckDB (@duckdb/node-api 1.5) with each codec the issue names.
  for (const codec of ['snappy', 'gzip', 'zstd']) {
    await duckdb(`COPY ${src} TO ${sqlPath(join(dir, `w-${codec}.parquet`))} (FORMAT parquet, COMPRESSION ${codec})`);
  }
}, 60_000);

describe('Parquet and Arrow IPC readers', () => {
  for (const codec of ['snappy', 'gzip', 'zstd']) {
    it(`reads a ${codec} Parquet file written by DuckDB with the values DuckDB wrote`, async () => {
      const path = join(dir, `w-${codec}.parquet`);
      expect(detectFormat('anything.bin', readFileSync(path))).toBe('parquet');
      const t = await read(path, undefined, 97);
      expect(t.nRows).toBe(3);
      expect(t.columns.map((c) => c.name)).toEqual(['window_id', 'subject', 'start', 'acc_mean', 'gyro_sd', 'label']);
      expect(text(t, 'window_id')).toEqual(['w1', 'w2', 'w3']);
      expect(text(t, 'acc_mean')).toEqual(['0.25', '-0.125', '3.75']);
      expect(text(t, 'gyro_sd')).toEqual(['1.5', '', '2.25']);
      expect(text(t, 'label')).toEqual(['walk', '', 'sit']);
      // A Parquet TIMESTAMP becomes seconds since 1970, printed back as ISO 8601.
      expect(findColumn(t, 'start')).toMatchObject({ kind: 'numeric', time: 'iso8601' });
      expect(text(t, 'start')).toEqual(['2024-03-10T08:30:00.000Z', '2024-03-10T08:30:05.000Z', '2024-03-10T09:00:00.000Z']);
    });
  }

  it('reads an Arrow IPC file written by apache-arrow 21, nulls as missing values', async () => {
    const arrow = new ArrowTable({
      subject: vectorFromArray(['S01', null, 'S01']),
      acc: vectorFromArray([0.5, null, 2], new Float64()),
      n: vectorFromArray([1, 2, 3], new Int32()),
    });
    const bytes = tableToIPC(arrow, 'file');
    expect(detectFormat('w.arrow', bytes)).toBe('arrow');
    writeFileSync(join(dir, 'w.arrow'), bytes);
    const t = await read(join(dir, 'w.arrow'), undefined, 64);
    expect(t.nRows).toBe(3);
    expect(text(t, 'subject')).toEqual(['S01', '', 'S01']);
    expect(text(t, 'acc')).toEqual(['0.5', '', '2']);
    expect(text(t, 'n')).toEqual(['1', '2', '3']);
  });

  it('refuses an Arrow IPC file with two columns of one name, as a text table\'s header is refused', async () => {
    const fields = [new Field('id', new Int32()), new Field('acc', new Float64()), new Field('acc', new Float64())];
    const children = [
      makeData({ type: new Int32(), data: Int32Array.from([1, 2, 3]) }),
      makeData({ type: new Float64(), data: Float64Array.from([0.1, 0.2, 0.3]) }),
      makeData({ type: new Float64(), data: Float64Array.from([4, 5, 6]) }),
    ];
    const batch = new RecordBatch(new Schema(fields), makeData({ type: new Struct(fields), length: 3, nullCount: 0, children }));
    const bytes = tableToIPC(new ArrowTable(batch), 'file');
    writeFileSync(join(dir, 'twice.arrow'), bytes);
    const e = await read(join(dir, 'twice.arrow')).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).message).toBe('twice.arrow, column "acc": expected unique column names, found "\\"acc\\" in columns 2 and 3"');
  });

  it('refuses a Parquet file cut short, saying so', async () => {
    const whole = readFileSync(join(dir, 'w-zstd.parquet'));
    writeFileSync(join(dir, 'cut.parquet'), whole.subarray(0, whole.length - 10));
    const e = await read(join(dir, 'cut.parquet')).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).message).toMatch(/^cut\.parquet: expected a complete Parquet file/);
  });
});
