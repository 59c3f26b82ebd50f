import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { quietContext } from '../../src/core/job';
import { cellText, findColumn } from '../../src/core/table/table';
import { jobs } from '../../src/worker/jobs';
import { duckdb, sqlPath } from '../fixtures/duckdb';
import { tempDir } from '../temp';

describe('parse job', () => {
  it('reads a Parquet File (Blob) by offset: same table and hash as its bytes, progress to the end', async () => {
    const dir = tempDir('parse-job');
    const path = join(dir, 'w.parquet');
    // Written by DuckDB (@duckdb/node-api 1.5), three row groups.
    await duckdb(`COPY (SELECT i AS window_id, 'S' || (i % 4) AS subject, i * 0.25 AS acc_mean, (i % 9) * 1.5 AS gyro_sd
      FROM range(3000) t(i) ORDER BY i) TO ${sqlPath(path)} (FORMAT parquet, ROW_GROUP_SIZE 1000)`);
    const bytes = new Uint8Array(readFileSync(path));
    const stages: string[] = [];
    const ctx = { ...quietContext, progress: (stage: string, _f: number, detail?: string) => void stages.push(detail ? `${stage}: ${detail}` : stage) };
    const fromBlob = await jobs.parse({ fileName: 'w.parquet', blob: new Blob([bytes]) }, ctx);
    const fromBytes = await jobs.parse({ fileName: 'w.parquet', bytes }, quietContext);
    // The hash of the whole file, as Node's crypto (OpenSSL) computes it.
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    expect(fromBlob.sha256).toBe(sha256);
    expect(fromBytes.sha256).toBe(sha256);
    expect(fromBlob.table.nRows).toBe(3000);
    const col = (t: typeof fromBlob.table, name: string) => {
      const c = findColumn(t, name);
      if (!c) throw new Error(`no column ${name}`);
      return Array.from({ length: t.nRows }, (_, r) => cellText(c, r));
    };
    for (const name of ['window_id', 'subject', 'acc_mean', 'gyro_sd']) expect(col(fromBlob.table, name)).toEqual(col(fromBytes.table, name));
    expect(col(fromBlob.table, 'acc_mean')[2999]).toBe('749.75');
    expect(fromBlob.roles).toEqual(fromBytes.roles);
    expect(stages).toContain('reading');
    expect(stages).toContain('parsing: decoding');
  });
});

describe('parse job: the hash on another thread', () => {
  const csv = new TextEncoder().encode('window_id,subject,acc_mean\n1,S1,0.5\n2,S1,0.75\n3,S2,1.25\n');
  // SHA-256 as Node's crypto (OpenSSL) computes it.
  const want = createHash('sha256').update(csv).digest('hex');

  it('takes the digest from the host\'s hasher (hashBlob, as the hashing worker runs it), and hashes here if that fails', async () => {
    const { createJobs } = await import('../../src/worker/jobs');
    const { hashBlob } = await import('../../src/core/hash/blob-hash');
    const started: number[] = [];
    const hashing = createJobs({
      blobHasher: (blob) => {
        started.push(blob.size);
        return { digest: hashBlob(blob), stop: () => {} };
      },
    });
    const ok = await hashing.parse({ fileName: 'w.csv', blob: new Blob([csv]) }, quietContext);
    expect(started).toEqual([csv.length]);
    expect(ok.sha256).toBe(want);
    const failing = createJobs({ blobHasher: () => ({ digest: Promise.reject(new Error('no thread')), stop: () => {} }) });
    const fallback = await failing.parse({ fileName: 'w.csv', blob: new Blob([csv]) }, quietContext);
    expect(fallback.sha256).toBe(want);
    expect(fallback.table.nRows).toBe(3);
  });

  it('stops the hasher when the file is bad', async () => {
    const { createJobs } = await import('../../src/worker/jobs');
    let stopped = 0;
    const all = createJobs({ blobHasher: () => ({ digest: new Promise<string>(() => {}), stop: () => { stopped++; } }) });
    await expect(all.parse({ fileName: 'bad.csv', blob: new Blob(['a,b\n1\n']) }, quietContext)).rejects.toThrow('bad.csv, row 2');
    expect(stopped).toBe(1);
  });
});
