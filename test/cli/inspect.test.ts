import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeEdf } from '../../src/core/raw/edf/write';
import { REFERENCE_EDF } from '../core/raw/reference-edf';
import { duckdb, sqlPath } from '../fixtures/duckdb';
import { hasStackTrace, runCli } from './run-cli';

let dir = '';
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'gleaner-inspect-'));
  writeFileSync(join(dir, 'small.edf'), writeEdf({
    patient: 'P01', recording: 'bench test', start: { year: 2026, month: 3, day: 2, hour: 9, minute: 0, second: 0 }, recordDuration: 1, plus: true,
    signals: [{ label: 'acc_x', unit: 'g', physMin: -4, physMax: 4, digMin: -32768, digMax: 32767, samplesPerRecord: 50, samples: new Float64Array(150) }],
    annotations: [{ onset: 1, duration: 2, text: 'walking' }],
  }));
  writeFileSync(join(dir, 'raw.csv'), 'time,acc\n0,1\n0.5,2\n1,3\n');
  writeFileSync(join(dir, 'windows.csv'), 'window_id,subject,start,end,f1,f2\nw1,S01,0,5,1,2\nw2,S02,5,10,3,4\n');
  writeFileSync(join(dir, 'broken.edf'), '0       ' + ' '.repeat(100));
  // The same windows as Parquet (DuckDB @duckdb/node-api, snappy), and as a folder partitioned by subject.
  const csv = sqlPath(join(dir, 'windows.csv'));
  await duckdb(`COPY (SELECT * FROM read_csv(${csv})) TO ${sqlPath(join(dir, 'windows.parquet'))} (FORMAT parquet)`);
  await duckdb(`COPY (SELECT * FROM read_csv(${csv})) TO ${sqlPath(join(dir, 'parts'))} (FORMAT parquet, PARTITION_BY (subject))`);
}, 60_000);
afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('gleaner inspect <file>', () => {
  it('prints an EDF+ summary: header fields, signals with units, ranges, rate, samples, and annotations', () => {
    const r = runCli(['inspect', join(dir, 'small.edf')]);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const s = JSON.parse(r.stdout);
    expect(s).toMatchObject({ kind: 'edf', format: 'EDF+C', start: '2026-03-02T09:00:00Z', dataRecords: 3, recordDuration: 1 });
    expect(s.signals[0]).toEqual({ label: 'acc_x', transducer: '', unit: 'g', physicalMin: -4, physicalMax: 4, digitalMin: -32768, digitalMax: 32767, prefilter: '', samplesPerRecord: 50, rate: 50, samples: 150 });
    expect(s.annotations).toEqual([{ onset: 1, duration: 2, text: 'walking' }]);
  });

  it('summarizes the reference file test_generator.edf (test/fixtures/edf; values and their sources in SOURCE.md there)', () => {
    const s = JSON.parse(runCli(['inspect', join(REFERENCE_EDF, 'test_generator.edf')]).stdout);
    expect(s).toMatchObject({ format: 'EDF+C', headerBytes: 3328, dataRecords: 600, startDate: '2011-04-04', startTime: '12:57:02' });
    expect(s.signals[0]).toMatchObject({ label: 'squarewave', unit: 'uV', rate: 200, samples: 120000 });
    expect(s.annotations.map((a: { text: string }) => a.text)).toEqual(['Recording starts', 'Recording ends']);
  });

  it('prints a raw CSV summary and a windows table summary', () => {
    const raw = JSON.parse(runCli(['inspect', join(dir, 'raw.csv')]).stdout);
    expect(raw).toMatchObject({ kind: 'raw-csv', timeColumn: 'time', rows: 3, rate: 2, channels: [{ label: 'acc', unit: '', rate: 2 }] });
    const win = JSON.parse(runCli(['inspect', join(dir, 'windows.csv')]).stdout);
    expect(win).toMatchObject({ kind: 'windows', rows: 2, subjects: 2, features: 2 });
    expect(win.columns.map((c: { role: string }) => c.role)).toEqual(['id', 'subject', 'start', 'end', 'feature', 'feature']);
  });

  it('summarizes a Parquet windows table and a folder of Parquet parts as analyze reads them', () => {
    const pq = runCli(['inspect', join(dir, 'windows.parquet')]);
    expect(pq.stderr).toBe('');
    expect(JSON.parse(pq.stdout)).toMatchObject({ kind: 'windows', file: 'windows.parquet', rows: 2, subjects: 2, features: 2, start: [0, 5] });
    const parts = JSON.parse(runCli(['inspect', join(dir, 'parts')]).stdout);
    expect(parts).toMatchObject({ kind: 'windows', file: 'parts', rows: 2, subjects: 2, features: 2 });
  });

  it('fails with one line naming the file for a broken EDF, a missing file, and a bad command line', () => {
    const broken = runCli(['inspect', join(dir, 'broken.edf')]);
    expect(broken.status).toBe(1);
    expect(broken.stderr).toMatch(/^gleaner: broken\.edf: expected .*truncated/);
    expect(hasStackTrace(broken.stderr)).toBe(false);
    const missing = runCli(['inspect', join(dir, 'nope.edf')]);
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/cannot open .*nope\.edf: no such file/);
    expect(runCli(['inspect']).status).toBe(2);
  });
});
