// Valid inputs the fuzzer starts from, one small set per format, all made here: tables written by
// DuckDB (@duckdb/node-api: Parquet in several codecs and encodings) and apache-arrow (IPC file and
// stream), EDF and EDF+ by our writer (its files are checked against pyedflib's in
// test/core/raw/), the study container by encodeStudy, recipes as JSON text.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { tableFromArrays, tableToIPC } from 'apache-arrow';
import { writeEdf } from '../../src/core/raw/edf/write';
import { encodeStudy } from '../../src/core/study/encode';
import { smallStudy } from '../core/study/fixture';
import { duckdb, sqlPath } from '../fixtures/duckdb';

export const FORMATS = ['csv', 'parquet', 'arrow', 'edf', 'study', 'recipe'] as const;
export type FuzzFormat = (typeof FORMATS)[number];

const text = (s: string) => new TextEncoder().encode(s);

function csvSeeds(): Uint8Array[] {
  const rows = Array.from({ length: 12 }, (_, i) => [`w${i}`, `S0${(i % 3) + 1}`, 5 * i, 5 * i + 5, (i * 0.37).toFixed(3), i % 4 === 0 ? '' : String(-i * 1.5e-3), i % 2 ? 'walk' : 'sit']);
  const comma = ['window_id,subject,start,end,acc_mean,gyro_sd,label', ...rows.map((r) => r.join(','))].join('\n');
  const tab = ['window_id\tsubject\tstart_time\tend_time\tacc\tlabel', ...rows.map((r) => [r[0], r[1], `2026-03-02T09:00:${String(r[2]).padStart(2, '0')}Z`, `2026-03-02T09:01:${String(r[2]).padStart(2, '0')}Z`, r[4], r[6]].join('\t'))].join('\r\n');
  const semicolon = ['id;subject;f1;f2', ...rows.map((r) => `${r[0]};"${r[1]}";${String(r[4]).replace('.', ',')};"${r[6]}, ""quoted"""`)].join('\n');
  return [text(`${comma}\n`), text(`\ufeff${tab}\r\n`), text(semicolon)];
}

async function parquetSeeds(dir: string): Promise<Uint8Array[]> {
  const select = `SELECT 'w' || i AS window_id, 'S0' || (i % 3 + 1) AS subject, i * 5 AS start, i * 0.25 AS acc_mean,
    CASE WHEN i % 4 = 0 THEN NULL ELSE (i % 7) * 1.5 END AS gyro_sd, (i % 5)::INTEGER AS code, i % 2 = 0 AS flag,
    TIMESTAMP '2026-03-02 09:00:00' + INTERVAL (i) SECOND AS t FROM range(40) r(i)`;
  const variants = ['COMPRESSION uncompressed', 'COMPRESSION snappy, ROW_GROUP_SIZE 16', 'COMPRESSION zstd', 'COMPRESSION gzip', 'COMPRESSION snappy, PARQUET_VERSION v2'];
  const paths = variants.map((_, i) => join(dir, `seed-${i}.parquet`));
  await duckdb(...variants.map((v, i) => `COPY (${select}) TO ${sqlPath(paths[i])} (FORMAT parquet, ${v})`));
  return paths.map((p) => new Uint8Array(readFileSync(p)));
}

function arrowSeeds(): Uint8Array[] {
  const n = 24;
  const table = tableFromArrays({
    window_id: Array.from({ length: n }, (_, i) => `w${i}`),
    subject: Array.from({ length: n }, (_, i) => `S0${(i % 3) + 1}`),
    start: Float64Array.from({ length: n }, (_, i) => i * 5),
    acc_mean: Float32Array.from({ length: n }, (_, i) => Math.sin(i)),
    steps: Int32Array.from({ length: n }, (_, i) => i * 3),
  });
  return [tableToIPC(table, 'file'), tableToIPC(table, 'stream')];
}

function edfSeeds(): Uint8Array[] {
  const samples = (n: number, f: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => f(i));
  const signals = [
    { label: 'acc_x', unit: 'g', physMin: -4, physMax: 4, digMin: -32768, digMax: 32767, samplesPerRecord: 8, samples: samples(24, (i) => Math.sin(i / 3)) },
    { label: 'temp', unit: 'degC', physMin: 20, physMax: 45, digMin: -2048, digMax: 2047, samplesPerRecord: 2, samples: samples(6, (i) => 30 + i) },
  ];
  const start = { year: 2026, month: 3, day: 2, hour: 9, minute: 0, second: 0 };
  return [
    writeEdf({ patient: 'P01 F 02-MAR-1990 X', recording: 'fuzz seed', start, recordDuration: 1, plus: true, signals, annotations: [{ onset: 0.5, duration: 1, text: 'walking' }, { onset: 2, text: 'stairs' }] }),
    writeEdf({ patient: 'P02', recording: 'fuzz seed', start, recordDuration: 0.5, plus: false, signals }),
    writeEdf({ patient: 'P03', recording: 'fuzz seed', start: { ...start, subsecond: 0.25 }, recordDuration: 1, plus: true, signals, recordOnsets: [0, 1, 5] }),
  ];
}

function studySeeds(): Uint8Array[] {
  const base = smallStudy();
  return [encodeStudy(base), encodeStudy({ ...base, notes: 'a note, "quoted"', view: { colourBy: 'subject' } })];
}

function recipeSeeds(): Uint8Array[] {
  const recipes = [
    { version: 1, steps: [{ type: 'zscore' }, { type: 'impute', method: 'mean', scope: 'global' }] },
    { version: 1, steps: [{ type: 'drop-missing', axis: 'features', threshold: 0.5 }, { type: 'clip', lower: 1, upper: 99 }, { type: 'robust', quantileRange: [25, 75] }] },
    { version: 1, steps: [{ type: 'log', mode: 'signed-log', features: ['f1'] }, { type: 'prune-constant', minVariance: 0, maxModeShare: 0.95 }, { type: 'prune-correlated', threshold: 0.9 }, { type: 'subject-zscore' }, { type: 'minmax' }] },
  ];
  return recipes.map((r) => text(JSON.stringify(r, null, 1)));
}

/** The seeds of one format; Parquet ones are written by DuckDB into `dir`. */
export async function seedsFor(format: FuzzFormat, dir: string): Promise<Uint8Array[]> {
  switch (format) {
    case 'csv': return csvSeeds();
    case 'parquet': return parquetSeeds(dir);
    case 'arrow': return arrowSeeds();
    case 'edf': return edfSeeds();
    case 'study': return studySeeds();
    case 'recipe': return recipeSeeds();
  }
}
