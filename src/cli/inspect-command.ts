import { statSync } from 'node:fs';
import { basename } from 'node:path';
import { InputError } from '../core/errors';
import { isoFromEpoch } from '../core/raw/civil-time';
import { openRawCsv } from '../core/raw/csv/read';
import { openEdf, type EdfFile } from '../core/raw/edf/read';
import { looksLikeEdf } from '../core/raw/open';
import type { ByteSource } from '../core/raw/byte-source';
import { detectFormat } from '../core/table/format';
import { inferRolesTold, roleFromName } from '../core/table/roles';
import { missingNotices } from '../core/table/notices';
import type { Table } from '../core/table/table';
import { openFileSource } from './file-source';
import { parseCommand, type CommandSpec } from './parse-command';
import { readInput } from './read-input';
import { UsageError } from './usage-error';

/** `gleaner inspect` takes no flags besides --help. */
const INSPECT: CommandSpec = { name: 'inspect', named: false, flags: [] };

export const INSPECT_USAGE = `Usage: gleaner inspect <file or folder>

Prints a JSON summary of a windows table (columns and their roles, subjects, time range) or of a raw
signal file: EDF/EDF+ (header fields; per signal label, units, ranges, sampling rate, number of
samples; annotations) or a raw-signal CSV (time column, channels, rate, covered time). A windows
table is any input analyze reads: CSV/TSV with an id or subject column, Parquet, Arrow IPC, or a
folder of Parquet parts.`;

/** `gleaner inspect <file>`: returns the exit code (0 done, 1 bad input, 2 bad command line). */
export async function runInspect(argv: readonly string[]): Promise<number> {
  if (argv.includes('--help') || argv.includes('-h')) {
    process.stdout.write(`${INSPECT_USAGE}\n`);
    return 0;
  }
  let positionals: string[];
  try {
    positionals = parseCommand(argv, INSPECT).positionals;
    if (positionals.length !== 1) throw new UsageError('expected one file: gleaner inspect <file>');
  } catch (err) {
    process.stderr.write(`gleaner: ${err instanceof Error ? err.message : String(err)} (see gleaner inspect --help)\n`);
    return 2;
  }
  try {
    const summary = await inspectFile(positionals[0]);
    process.stdout.write(`${JSON.stringify(summary, null, 2)}\n`);
    return 0;
  } catch (err) {
    const sys = err as { code?: unknown };
    const message = err instanceof InputError ? err.message : sys.code === 'ENOENT' ? `cannot open ${positionals[0]}: no such file or folder` : sys.code === 'EISDIR' ? `cannot open ${positionals[0]}: expected a file, found a folder` : `error: ${err instanceof Error ? err.message : String(err)}`;
    process.stderr.write(`gleaner: ${message.replace(/\s*\n\s*/g, ' ')}\n`);
    return 1;
  }
}

/** The JSON summary of one file (see INSPECT_USAGE). */
export async function inspectFile(path: string): Promise<object> {
  const fileName = basename(path);
  if (statSync(path, { throwIfNoEntry: false })?.isDirectory()) return windowsSummary(path, fileName);
  const source = await openFileSource(path);
  try {
    const head = await source.read(0, 4096);
    if (looksLikeEdf(head)) return await edfSummary(await openEdf(source, fileName));
    if (detectFormat(fileName, head) !== 'csv') return await windowsSummary(path, fileName);
    const header = new TextDecoder().decode(head).replace(/^\uFEFF/, '').split(/\r?\n/)[0];
    const names = header.split(/[,;\t]/).map((c) => c.trim());
    if (names.some((n) => roleFromName(n) === 'subject' || roleFromName(n) === 'id')) return await windowsSummary(path, fileName);
    return await rawCsvSummary(source, fileName);
  } finally {
    await source.close();
  }
}

async function edfSummary(edf: EdfFile): Promise<object> {
  const h = edf.header;
  const first = edf.recordOnsets.length ? edf.recordOnsets[0] : 0;
  const annotations = await edf.annotations();
  return {
    kind: 'edf',
    file: edf.fileName,
    format: h.format,
    version: h.version,
    patient: h.patient,
    recording: h.recording,
    startDate: `${h.start.year}-${pad(h.start.month)}-${pad(h.start.day)}`,
    startTime: `${pad(h.start.hour)}:${pad(h.start.minute)}:${pad(h.start.second)}`,
    start: isoFromEpoch((edf.startEpoch ?? 0) + first),
    headerBytes: h.headerBytes,
    reserved: h.reserved,
    dataRecords: h.records,
    recordDuration: h.recordDuration,
    duration: h.records * h.recordDuration,
    coverage: edf.coverage,
    signals: h.signals.map((s) => ({
      label: s.label,
      transducer: s.transducer,
      unit: s.unit,
      physicalMin: s.physMin,
      physicalMax: s.physMax,
      digitalMin: s.digMin,
      digitalMax: s.digMax,
      prefilter: s.prefilter,
      samplesPerRecord: s.samplesPerRecord,
      rate: h.recordDuration > 0 ? s.samplesPerRecord / h.recordDuration : null,
      samples: s.samplesPerRecord * h.records,
      ...(s.annotation ? { annotationSignal: true } : {}),
    })),
    annotations: annotations.map((a) => ({ onset: a.onset, ...(a.duration !== undefined ? { duration: a.duration } : {}), text: a.text })),
  };
}

async function rawCsvSummary(source: ByteSource, fileName: string): Promise<object> {
  const csv = await openRawCsv(source, fileName);
  const ix = csv.index;
  const cov = csv.coverage;
  return {
    kind: 'raw-csv',
    file: fileName,
    timeColumn: ix.columns[ix.timeColumn],
    timeFormat: ix.timeFormat,
    start: ix.startEpoch !== null ? isoFromEpoch(ix.startEpoch) : null,
    rows: ix.rows,
    rate: ix.rate,
    duration: cov.length ? cov[cov.length - 1].end - cov[0].start : 0,
    gaps: Math.max(0, cov.length - 1),
    coverage: cov,
    channels: csv.channels.map((c) => ({ label: c.label, unit: c.unit, rate: c.rate })),
  };
}

async function windowsSummary(path: string, fileName: string): Promise<object> {
  const { table } = await readInput(path, { progress: () => {}, cancelled: () => false });
  const { roles, notices } = inferRolesTold(table);
  const byRole = (role: string) => roles.findIndex((r) => r.role === role);
  const distinct = (role: string) => {
    const j = byRole(role);
    return j < 0 ? null : distinctValues(table, j);
  };
  const range = (role: string) => {
    const c = table.columns[byRole(role)];
    if (!c || c.kind !== 'numeric') return null;
    let lo = Infinity;
    let hi = -Infinity;
    for (const v of c.values) if (!Number.isNaN(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    return lo <= hi ? [lo, hi] : null;
  };
  return {
    kind: 'windows',
    file: fileName,
    rows: table.nRows,
    subjects: distinct('subject'),
    sessions: distinct('session'),
    features: roles.filter((r) => r.role === 'feature').length,
    start: range('start'),
    end: range('end'),
    columns: roles.map((r, j) => ({ name: r.name, role: r.role, type: table.columns[j].kind, evidence: r.evidence })),
    notices: [...notices, ...missingNotices(table, roles)],
  };
}

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

/** Distinct non-empty values of column j. */
function distinctValues(table: Table, j: number): number {
  const c = table.columns[j];
  if (c.kind === 'numeric') {
    const seen = new Set<number>();
    for (const v of c.values) if (v === v) seen.add(v);
    return seen.size;
  }
  const used = new Uint8Array(c.dictionary.length);
  for (const k of c.codes) if (k >= 0) used[k] = 1;
  return c.dictionary.reduce((n, text, k) => n + (used[k] && text !== '' ? 1 : 0), 0);
}
