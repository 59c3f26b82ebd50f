import { InputError } from '../../errors';
import type { ByteSource } from '../byte-source';
import type { Coverage } from '../span.types';
import { ABSOLUTE_SECONDS, parseTime, timeFormatOf, type TimeFormat } from './time-value';

/**
 * An index over a raw-signal CSV (a time column and channel columns), built in one pass so that a
 * span can later be read from a byte range without parsing the whole file.
 */
export interface RawCsvIndex {
  fileName: string;
  delimiter: string;
  columns: string[];
  timeColumn: number;
  timeFormat: TimeFormat;
  /** Unix seconds of time 0 when times are absolute (ISO or Unix seconds), else null. */
  startEpoch: number | null;
  /** Subtracted from file times to get source seconds (the first time when absolute, else 0). */
  origin: number;
  rows: number;
  /** Estimated sampling rate (1 / median step of the first rows), samples per second. */
  rate: number;
  /** Byte offset and source time of every STEP-th data row. */
  offsets: Float64Array;
  times: Float64Array;
  /** End of the data (file size). */
  end: number;
  coverage: Coverage[];
}

export const INDEX_STEP = 256;
const CHUNK = 1 << 20;
const RATE_ROWS = 1000;

const TIME_NAMES = /^(time|timestamp|datetime|t)([ _].*)?$/i;

export async function indexRawCsv(source: ByteSource, fileName: string): Promise<RawCsvIndex> {
  let pos = 0;
  let buf = await source.read(0, CHUNK);
  if (buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) pos = 3;
  const headerEnd = buf.indexOf(0x0a, pos);
  if (headerEnd < 0 && buf.length < source.size) throw new InputError({ file: fileName, row: 1, expected: 'a header line shorter than 1 MiB' });
  const headerLine = latin1(buf, pos, headerEnd < 0 ? buf.length : headerEnd).replace(/\r$/, '');
  const delimiter = [',', '\t', ';'].reduce((a, b) => (count(headerLine, b) > count(headerLine, a) ? b : a));
  const columns = headerLine.split(delimiter).map((c) => c.trim().replace(/^"(.*)"$/, '$1'));
  if (columns.length < 2) throw new InputError({ file: fileName, row: 1, expected: 'a time column and at least one channel column', found: headerLine });
  const named = columns.findIndex((c) => TIME_NAMES.test(c));
  const timeColumn = named >= 0 ? named : 0;
  const dl = delimiter.charCodeAt(0);

  let format: TimeFormat | null = null;
  let origin = 0;
  let startEpoch: number | null = null;
  const offsets: number[] = [];
  const times: number[] = [];
  const first: number[] = [];
  let rate = 0;
  const coverage: Coverage[] = [];
  let prev = NaN;
  let rows = 0;

  const step = (t: number) => {
    if (rate === 0) return;
    const last = coverage[coverage.length - 1];
    if (last && t - prev <= 1.5 / rate) last.end = t + 1 / rate;
    else coverage.push({ start: t, end: t + 1 / rate });
  };
  const settleRate = () => {
    const diffs = first.slice(1).map((t, i) => t - first[i]).filter((d) => d > 0).sort((a, b) => a - b);
    rate = diffs.length ? Number((1 / diffs[Math.floor(diffs.length / 2)]).toPrecision(6)) : 1;
    let p = NaN;
    for (const t of first) {
      prev = p;
      step(t);
      p = t;
    }
    prev = p;
  };

  let lineStart = headerEnd < 0 ? source.size : headerEnd + 1;
  let bufStart = 0;
  for (;;) {
    let nl = buf.indexOf(0x0a, lineStart - bufStart);
    if (nl < 0 && bufStart + buf.length < source.size) {
      bufStart = lineStart;
      buf = await source.read(bufStart, CHUNK);
      nl = buf.indexOf(0x0a, 0);
      if (nl < 0 && bufStart + buf.length < source.size) throw new InputError({ file: fileName, row: rows + 2, expected: 'a line shorter than 1 MiB' });
    }
    const lineEnd = nl < 0 ? buf.length : nl;
    const local = lineStart - bufStart;
    if (local >= buf.length) break;
    if (lineEnd > local && !(lineEnd === local + 1 && buf[local] === 0x0d)) {
      const cell = cellAt(buf, local, lineEnd, dl, timeColumn);
      const row = rows + 2;
      format ??= timeFormatOf(cell);
      if (format === null) throw new InputError({ file: fileName, row, column: columns[timeColumn], expected: 'a time in seconds or an ISO 8601 date-time', found: cell });
      let t = parseTime(cell, format);
      if (Number.isNaN(t)) throw new InputError({ file: fileName, row, column: columns[timeColumn], expected: format === 'iso' ? 'an ISO 8601 date-time like the rows above' : 'a time in seconds like the rows above', found: cell });
      if (rows === 0 && (format === 'iso' || t >= ABSOLUTE_SECONDS)) {
        origin = t;
        startEpoch = t;
      }
      t = Math.round((t - origin) * 1e6) / 1e6; // microseconds: absolute times carry float noise
      if (rows > 0 && !(t > (rate > 0 ? prev : first[first.length - 1]))) {
        throw new InputError({ file: fileName, row, column: columns[timeColumn], expected: 'times increasing from row to row', found: cell });
      }
      if (rows % INDEX_STEP === 0) {
        offsets.push(lineStart);
        times.push(t);
      }
      if (rate === 0) {
        first.push(t);
        if (first.length > RATE_ROWS) settleRate();
      } else {
        step(t);
        prev = t;
      }
      rows++;
    }
    if (nl < 0) break;
    lineStart = bufStart + nl + 1;
  }
  if (rows === 0) throw new InputError({ file: fileName, row: 2, expected: 'at least one data row after the header', found: 'only the header' });
  if (rate === 0) settleRate();
  return {
    fileName, delimiter, columns, timeColumn, timeFormat: format ?? 'seconds', startEpoch, origin, rows, rate,
    offsets: Float64Array.from(offsets), times: Float64Array.from(times), end: source.size, coverage,
  };
}

function count(s: string, c: string): number {
  return s.split(c).length - 1;
}

function latin1(b: Uint8Array, from: number, to: number): string {
  return new TextDecoder('utf-8').decode(b.subarray(from, to));
}

/** Text of cell `col` of the line b[from, to) (no quotes in raw-signal files). */
function cellAt(b: Uint8Array, from: number, to: number, delimiter: number, col: number): string {
  let s = from;
  for (let c = 0; c < col; c++) {
    const d = b.indexOf(delimiter, s);
    if (d < 0 || d >= to) return '';
    s = d + 1;
  }
  let e = b.indexOf(delimiter, s);
  if (e < 0 || e > to) e = to;
  if (e > s && b[e - 1] === 0x0d) e--;
  let text = '';
  for (let i = s; i < e; i++) text += String.fromCharCode(b[i]);
  return text.trim();
}
