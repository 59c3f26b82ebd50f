// Suite "load": reading a windows table of 1,000,000 windows × 50 features (--quick: 100,000) from
// CSV and from Parquet, ours (as the CLI reads: CSV of 32 MiB or more on two threads; also on one
// thread, for comparison) beside DuckDB's read_csv and read_parquet into an in-memory table, in one
// process. The seeded files are generated once into $TMPDIR/gleaner-bench-load/ (CSV written here,
// Parquet converted from it by DuckDB, snappy). Appends JSON lines to bench-results/load.jsonl.
import { DuckDBInstance } from '@duckdb/node-api';
import { spawnSync } from 'node:child_process';
import { appendFileSync, closeSync, existsSync, readFileSync, mkdirSync, openSync, renameSync, statSync, writeSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { normal, seededRandom } from '../../src/core/random';
import { readInput } from '../../src/cli/read-input';
import { CsvReader } from '../../src/core/table/csv-reader';
import type { Table } from '../../src/core/table/table';
import { measure } from '../measure';

const D = 50;
const SUBJECTS = 100;
const SEED = 20240611;
const CACHE = join(tmpdir(), 'gleaner-bench-load');

/** Writes the seeded CSV (window_id, subject, start, f0..f49), a block of rows at a time. */
function writeCsv(path: string, n: number): void {
  const random = seededRandom(SEED + n);
  const fd = openSync(`${path}.part`, 'w');
  const header = ['window_id', 'subject', 'start', ...Array.from({ length: D }, (_, j) => `f${j}`)].join(',');
  writeSync(fd, `${header}\n`);
  let block: string[] = [];
  for (let i = 0; i < n; i++) {
    const cells = [String(i), `S${String(i % SUBJECTS).padStart(3, '0')}`, String(5 * Math.floor(i / SUBJECTS))];
    for (let j = 0; j < D; j++) cells.push((normal(random) * (1 + j / 10) + j).toFixed(6));
    block.push(cells.join(','));
    if (block.length === 10_000) {
      writeSync(fd, `${block.join('\n')}\n`);
      block = [];
    }
  }
  if (block.length) writeSync(fd, `${block.join('\n')}\n`);
  closeSync(fd);
  renameSync(`${path}.part`, path);
}

async function files(n: number): Promise<{ csv: string; parquet: string }> {
  mkdirSync(CACHE, { recursive: true });
  const csv = join(CACHE, `windows-${n}x${D}.csv`);
  const parquet = join(CACHE, `windows-${n}x${D}.parquet`);
  if (!existsSync(csv)) {
    console.log(`load: writing ${csv} (once)`);
    writeCsv(csv, n);
  }
  if (!existsSync(parquet)) {
    console.log(`load: writing ${parquet} with DuckDB (once)`);
    const db = await DuckDBInstance.create(':memory:');
    const con = await db.connect();
    await con.run(`COPY (SELECT * FROM read_csv('${csv}')) TO '${parquet}.part' (FORMAT parquet, COMPRESSION snappy, ROW_GROUP_SIZE 100000)`);
    con.closeSync();
    db.closeSync();
    renameSync(`${parquet}.part`, parquet);
  }
  return { csv, parquet };
}

/**
 * Ours, exactly as the CLI reads (src/cli/read-input.ts): CSV streamed in 4 MiB chunks into the
 * core reader; Parquet hashed in one pass, then decoded by offset one row group at a time.
 */
async function readOurs(path: string, oneThread = false): Promise<Table> {
  const { table } = await readInput(path, { progress: () => {}, cancelled: () => false, ...(oneThread ? { twoThreadsBytes: Infinity } : {}) });
  return table;
}

async function readDuck(sql: string): Promise<number> {
  const db = await DuckDBInstance.create(':memory:');
  const con = await db.connect();
  await con.run(`CREATE TABLE t AS SELECT * FROM ${sql}`);
  const rows = Number((await con.runAndReadAll('SELECT count(*) FROM t')).getRows()[0][0]);
  con.closeSync();
  db.closeSync();
  return rows;
}

/**
 * This process's own peak resident memory (MiB): VmHWM from /proc/self/status on Linux. getrusage's
 * maxrss is not used: on Linux it carries the RSS of the parent at fork over into the child, so a
 * child spawned from a bench that already holds 400 MiB would report at least 400 MiB.
 */
function ownPeakMiB(): number {
  try {
    const hwm = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (hwm) return Number(hwm[1]) / 1024;
  } catch {
    // not Linux: fall back to getrusage
  }
  return process.resourceUsage().maxRSS / 1024;
}

/**
 * Peak resident memory of one read in a fresh process (VmHWM, MiB): the in-process
 * figure is a rise above a warmed-up heap, which hides memory the allocator kept from earlier runs.
 */
function freshPeakMiB(who: 'ours' | 'ours-one' | 'duck', path: string): number {
  const self = fileURLToPath(import.meta.url);
  const r = spawnSync(process.execPath, ['--import', 'tsx', self, who, path], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`load child failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop() as string).peakMiB;
}

/**
 * One thread's parse speed (MB/s, best of 3, from memory, Float32 features) by how the numbers are
 * written: fixed 6 decimals (the main file), shortest round-trip doubles (17 digits, as
 * JavaScript and Python print them) and 18-digit scientific notation.
 */
function numberFormats(rows: number): { format: string; mbPerS: number }[] {
  const formats: [string, (v: number) => string][] = [
    ['fixed 6 decimals', (v) => v.toFixed(6)],
    ['shortest double', (v) => String(v)],
    ['scientific, 18 digits', (v) => v.toExponential(17)],
  ];
  return formats.map(([format, write]) => {
    const random = seededRandom(SEED);
    const lines = [['window_id', 'subject', ...Array.from({ length: D }, (_, j) => `f${j}`)].join(',')];
    for (let i = 0; i < rows; i++) lines.push([i, `S${i % SUBJECTS}`, ...Array.from({ length: D }, () => write(normal(random) * 3))].join(','));
    const bytes = new TextEncoder().encode(`${lines.join('\n')}\n`);
    let best = Infinity;
    for (let rep = 0; rep < 3; rep++) {
      const t = performance.now();
      const reader = new CsvReader('formats.csv', { precision: 'float32' });
      for (let at = 0; at < bytes.length; at += 4 << 20) reader.push(bytes.subarray(at, at + (4 << 20)));
      reader.finishSync();
      best = Math.min(best, performance.now() - t);
    }
    return { format, mbPerS: bytes.length / 1e3 / best };
  });
}

export async function run(quick: boolean): Promise<void> {
  const n = quick ? 100_000 : 1_000_000;
  const { csv, parquet } = await files(n);
  const matrixMiB = (n * D * 4) / 2 ** 20;
  const limitMiB = 2.5 * matrixMiB + 150;
  console.log(`load: ${n} windows × ${D} features; CSV ${(statSync(csv).size / 2 ** 20).toFixed(0)} MiB, Parquet ${(statSync(parquet).size / 2 ** 20).toFixed(0)} MiB`);
  console.log(`memory target: ours at most 2.5 × Float32 matrix (${matrixMiB.toFixed(0)} MiB) + 150 = ${limitMiB.toFixed(0)} MiB`);
  const rows: { task: string; who: string; ms: number; peakMiB: number; check: string }[] = [];
  const loadBefore = loadavg()[0];
  const oursCsv = await measure(() => readOurs(csv));
  rows.push({ task: 'CSV', who: 'gleaner', ms: oursCsv.ms, peakMiB: oursCsv.peakMiB, check: `${oursCsv.result.nRows} rows` });
  const oursCsvOne = await measure(() => readOurs(csv, true));
  rows.push({ task: 'CSV', who: 'gleaner, one thread', ms: oursCsvOne.ms, peakMiB: oursCsvOne.peakMiB, check: `${oursCsvOne.result.nRows} rows` });
  const duckCsv = await measure(() => readDuck(`read_csv('${csv}')`));
  rows.push({ task: 'CSV', who: 'duckdb read_csv', ms: duckCsv.ms, peakMiB: duckCsv.peakMiB, check: `${duckCsv.result} rows` });
  const oursPq = await measure(() => readOurs(parquet));
  rows.push({ task: 'Parquet', who: 'gleaner', ms: oursPq.ms, peakMiB: oursPq.peakMiB, check: `${oursPq.result.nRows} rows` });
  const duckPq = await measure(() => readDuck(`read_parquet('${parquet}')`));
  rows.push({ task: 'Parquet', who: 'duckdb read_parquet', ms: duckPq.ms, peakMiB: duckPq.peakMiB, check: `${duckPq.result} rows` });

  const fresh = [freshPeakMiB('ours', csv), freshPeakMiB('ours-one', csv), freshPeakMiB('duck', csv), freshPeakMiB('ours', parquet), freshPeakMiB('duck', parquet)];
  const base = freshPeakMiB('ours', '');

  console.log(`\ntask     who                    median ms   rise MiB   fresh-process peak MiB (node alone: ${base.toFixed(0)})   check`);
  rows.forEach((r, i) => {
    console.log(`${r.task.padEnd(8)} ${r.who.padEnd(22)} ${r.ms.toFixed(0).padStart(9)} ${r.peakMiB.toFixed(0).padStart(10)} ${fresh[i].toFixed(0).padStart(12)}   ${r.check}`);
  });
  const ratio = (a: number, b: number) => (a / b).toFixed(2);
  console.log(`\nCSV: ours / DuckDB time ${ratio(oursCsv.ms, duckCsv.ms)} (target ≤ 1.5; on one thread ${ratio(oursCsvOne.ms, duckCsv.ms)}); peak in a fresh process ${fresh[0].toFixed(0)} MiB (target ≤ ${limitMiB.toFixed(0)}; rise in this process ${oursCsv.peakMiB.toFixed(0)} MiB)`);
  console.log(`Parquet: ours / DuckDB time ${ratio(oursPq.ms, duckPq.ms)} (target ≤ 1.5); peak in a fresh process ${fresh[3].toFixed(0)} MiB (target ≤ ${limitMiB.toFixed(0)}; rise in this process ${oursPq.peakMiB.toFixed(0)} MiB)`);
  const at = new Date().toISOString();
  const load = [loadBefore, loadavg()[0]].map((l) => Number(l.toFixed(2)));
  const lines = rows.map((r, i) => JSON.stringify({ suite: 'load', at, quick, n, d: D, loadAverage: load, task: r.task, who: r.who, ms: Math.round(r.ms), freshPeakMiB: Math.round(fresh[i]), riseMiB: Math.round(r.peakMiB), limitMiB: Math.round(limitMiB) }));
  const formats = numberFormats(quick ? 10_000 : 40_000);
  console.log(`\nparse speed by number format (one thread, from memory, ${quick ? 10_000 : 40_000} × ${D}): ${formats.map((f) => `${f.format} ${f.mbPerS.toFixed(0)} MB/s`).join('; ')}`);
  for (const f of formats) lines.push(JSON.stringify({ suite: 'load', at, quick, loadAverage: load, task: 'CSV number format', who: 'gleaner, one thread', format: f.format, mbPerS: Math.round(f.mbPerS) }));
  mkdirSync('bench-results', { recursive: true });
  appendFileSync('bench-results/load.jsonl', `${lines.join('\n')}\n`);
}

// Child mode (see freshPeakMiB): `load.ts ours|duck <path>` reads once and prints its peak RSS.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const [who, path] = process.argv.slice(2);
  if (path) {
    if (who === 'ours' || who === 'ours-one') await readOurs(path, who === 'ours-one');
    else await readDuck(path.endsWith('.csv') ? `read_csv('${path}')` : `read_parquet('${path}')`);
  }
  console.log(JSON.stringify({ peakMiB: ownPeakMiB() }));
}
