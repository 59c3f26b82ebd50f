import { InputError } from '../errors';
import { BLOCK, joinBlocks, joinSegments } from './blocks';
import { bytesText, CsvColumn, type CsvColumnState } from './csv-column';
import { MissingMarkers } from './missing-markers';
import { sniffDecimal, sniffDelimiter, type Delimiter } from './csv-sniff';
import { AUTO_FLOAT32_BYTES, DEFAULT_READ_OPTIONS, type ReadOptions, type TableReader } from './reader.types';
import { roleFromName } from './roles';
import type { Role } from './roles.types';
import type { Table } from './table';

const QUOTE = 0x22;
/** Exact powers of ten 10^0 .. 10^22. */
const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);
/** A relative margin well above the error of a long quick mantissa (see quickRecord). */
const NEAR = 2 ** -48;
const LF = 0x0a;
const CR = 0x0d;
/** Bytes gathered before the delimiter and decimal mark are guessed. */
const SNIFF_BYTES = 64 * 1024;
/** Columns whose name suggests one of these roles keep double precision (times, ids, codes). */
const WIDE_ROLES: ReadonlySet<Role> = new Set(['id', 'subject', 'session', 'start', 'end', 'duration', 'label', 'metadata']);
const DELIMITER_NAMES: Record<Delimiter, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

/** What a reader of the rest of a file needs from its start: the dialect and the header's columns. */
export interface CsvLayout {
  delimiter: Delimiter;
  /** Decimal mark byte: 0x2e '.' or 0x2c ','. */
  point: number;
  names: string[];
  /** Per column: kept in double precision. */
  wide: boolean[];
  /** Missing-value markers (MissingMarkers.list). */
  missing: string[];
}

/** The rows a reader took from one part of a file, not yet finished into a table. */
export interface CsvPartState {
  nRows: number;
  /** Line of each row, counted from 1 at the part's first byte, in blocks of BLOCK. */
  lines: Int32Array[];
  columns: CsvColumnState[];
  /** The line after the part's last, counted as `lines`. */
  nextLine: number;
}

/**
 * Streaming reader of delimited text (comma, semicolon or tab; detected unless given), straight
 * from UTF-8 bytes: optional BOM, RFC 4180 quotes (delimiters, line breaks and doubled quotes inside
 * quoted cells), LF / CRLF / CR line ends, blank lines skipped, decimal point or comma. Each chunk
 * is parsed as it arrives; only an unfinished last record is carried to the next chunk.
 */
export class CsvReader implements TableReader {
  bytesConsumed = 0;
  private readonly opts: Required<ReadOptions>;
  private readonly markers: MissingMarkers;
  private pending: Uint8Array = new Uint8Array(0);
  private sniffed = false;
  private atStart = true;
  private delim: Delimiter = ',';
  private delimByte = 0x2c;
  private point = 0x2e;
  private line = 1;
  private header: string[] | null = null;
  private columns: CsvColumn[] = [];
  private nRows = 0;
  private readonly lineBlocks: Int32Array[] = [];
  private quotes = false;
  /** Rows the columns have storage for. */
  private capacity = 0;
  /** Per column: the block of the current rows, and how plain numbers go into it (see takeCode). */
  private dst: (Float32Array | Float64Array)[] = [];
  private takes = new Uint8Array(0);
  /** Fields of the record read by quickRecord that the columns must parse (their indices). */
  private slow = new Int32Array(64);
  private nSlow = 0;
  private quickOk = false;
  /** Set by absorb, after which the input is complete. */
  private sealed = false;
  private tailLines: { head: number; blocks: Int32Array[]; n: number } | null = null;
  // Field bounds of the record being read, reused.
  private fs = new Int32Array(64);
  private fe = new Int32Array(64);
  private ff = new Uint8Array(64);

  constructor(private readonly fileName: string, options: ReadOptions = {}) {
    this.opts = { ...DEFAULT_READ_OPTIONS, ...options };
    this.markers = new MissingMarkers(this.opts.missing);
    const { delimiter, decimal } = this.opts;
    if (delimiter !== 'auto' && decimal !== 'auto') {
      // Nothing to guess: parse from the first chunk.
      this.sniffed = true;
      this.delim = delimiter;
      this.delimByte = delimiter.charCodeAt(0);
      this.point = decimal === ',' ? 0x2c : 0x2e;
    }
  }

  /**
   * A reader for the bytes that follow a record boundary of a file whose start another reader
   * parsed: same dialect and columns, no header, lines counted from 1 at its first byte.
   */
  static continuing(fileName: string, layout: CsvLayout): CsvReader {
    const r = new CsvReader(fileName, { delimiter: layout.delimiter, decimal: layout.point === 0x2c ? ',' : '.', missing: layout.missing });
    r.atStart = false;
    r.header = layout.names.slice();
    r.setColumns(layout.names.map((name, j) => new CsvColumn(name, layout.wide[j], layout.point, r.markers)));
    return r;
  }

  /** The dialect and columns, once the header has been read. */
  layout(): CsvLayout | null {
    if (this.header === null) return null;
    return { delimiter: this.delim, point: this.point, names: this.header.slice(), wide: this.columns.map((c) => c.wide), missing: this.markers.list.slice() };
  }

  /** True once a cell opened with a quote: only then can a line end inside a record. */
  get sawQuote(): boolean {
    return this.quotes;
  }

  /** Bytes of an unfinished record held back for the next chunk. */
  get pendingBytes(): number {
    return this.pending.length;
  }

  /** The 1-based line the next record starts on. */
  get nextLine(): number {
    return this.line;
  }

  /** Ends the input as the tail of a file and returns the rows read, unfinished (see `absorb`). */
  endPart(): CsvPartState {
    const buf = this.pending;
    this.pending = new Uint8Array(0);
    this.parse(buf, true, 0);
    return { nRows: this.nRows, lines: this.lineBlocks.splice(0), columns: this.columns.map((c) => c.state(this.nRows)), nextLine: this.line };
  }

  /**
   * Appends the rows another reader took from the rest of the file (`CsvReader.continuing` from
   * the byte where this reader stopped, at a record boundary), and so ends the input: finish
   * may follow, push may not. Returns false, changing nothing, when the result would not equal
   * reading on (see CsvColumn.canAbsorb); the caller then reads the rest itself.
   */
  absorb(part: CsvPartState): boolean {
    if (this.sealed || this.pending.length > 0 || this.header === null || part.columns.length !== this.columns.length) return false;
    const n1 = this.nRows;
    if (!this.columns.every((c, j) => c.canAbsorb(n1, part.columns[j]))) return false;
    const offset = this.line - 1;
    for (let i = 0; i < part.nRows; i++) part.lines[i >> 16][i & (BLOCK - 1)] += offset;
    this.tailLines = { head: n1, blocks: part.lines, n: part.nRows };
    this.columns.forEach((c, j) => c.absorb(n1, part.columns[j], offset));
    this.nRows = n1 + part.nRows;
    this.sealed = true;
    this.line = part.nextLine + offset;
    return true;
  }

  push(chunk: Uint8Array): void {
    if (this.sealed) throw new Error('CsvReader: no input may follow absorb');
    this.bytesConsumed += chunk.length;
    if (!this.sniffed) {
      const buf = concat(this.pending, chunk);
      if (buf.length < SNIFF_BYTES) {
        this.pending = buf === chunk ? chunk.slice() : buf;
        return;
      }
      this.sniff(buf, false);
      this.pending = buf.slice(this.parse(buf, false, 0));
      return;
    }
    let buf = chunk;
    let start = 0;
    if (this.pending.length > 0) {
      // Finish the held-back record with the chunk's first line rather than copying the whole
      // chunk after it; only a record that runs on past that line (a quoted line break) needs
      // the rest joined too.
      const cut = lineEndAfter(chunk, 0);
      const head = concat(this.pending, cut > 0 ? chunk.subarray(0, cut) : chunk);
      const used = this.parse(head, false, 0);
      if (cut < 0) {
        this.pending = head.slice(used);
        return;
      }
      if (used === head.length) start = cut;
      else buf = concat(head.subarray(used), chunk.subarray(cut));
    }
    const used = this.parse(buf, false, start);
    // Copy the unfinished record so the chunk's memory can go.
    this.pending = buf.slice(used);
  }

  finish(): Promise<Table> {
    try {
      return Promise.resolve(this.finishSync());
    } catch (e) {
      return Promise.reject(e);
    }
  }

  finishSync(): Table {
    const buf = this.pending;
    this.pending = new Uint8Array(0);
    if (!this.sniffed) this.sniff(buf, true);
    if (!this.sealed) this.parse(buf, true, 0);
    const file = this.fileName;
    if (this.header === null) {
      throw new InputError({ file, expected: 'a header row and data rows', found: 'an empty file' });
    }
    if (this.nRows === 0) {
      throw new InputError({ file, row: 2, expected: 'at least one data row after the header', found: 'only the header' });
    }
    const columns = this.columns.map((c) => c.finish(file, this.nRows));
    const t = this.tailLines;
    const lines = t
      ? joinSegments([{ blocks: this.lineBlocks, n: t.head }, { blocks: t.blocks, n: t.n }], (m) => new Int32Array(m))
      : joinBlocks(this.lineBlocks, this.nRows, (m) => new Int32Array(m));
    const missing = this.columns.flatMap((c) => c.missingCount() ?? []);
    return { fileName: file, nRows: this.nRows, columns, lines, ...(missing.length > 0 ? { missing } : {}) };
  }

  private sniff(buf: Uint8Array, complete: boolean): void {
    this.sniffed = true;
    const sample = new TextDecoder('utf-8').decode(buf.subarray(0, SNIFF_BYTES));
    const cut = complete && buf.length <= SNIFF_BYTES;
    const d = this.opts.delimiter;
    this.delim = d === 'auto' ? (/\.(tsv|tab)$/i.test(this.fileName) ? '\t' : sniffDelimiter(sample, cut)) : d;
    this.delimByte = this.delim.charCodeAt(0);
    const dec = this.opts.decimal === 'auto' ? sniffDecimal(sample, cut, this.delim) : this.opts.decimal;
    this.point = dec === ',' ? 0x2c : 0x2e;
  }

  /** Parses the complete records in buf from `start`; returns the offset of the first byte not consumed. */
  private parse(buf: Uint8Array, final: boolean, start: number): number {
    const len = buf.length;
    const delim = this.delimByte;
    let pos = start;
    if (this.atStart && len >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) pos = 3;
    if (len > 0 || final) this.atStart = false;
    while (pos < len) {
      // Once the header is read (setColumns), records with two or more fields try the quick path.
      if (this.quickOk) {
        this.room();
        const next = this.quickRecord(buf, pos, len);
        if (next >= 0) {
          this.commitQuick(buf, this.line);
          this.line++;
          pos = next;
          continue;
        }
      }
      const recStart = pos;
      const recLine = this.line;
      let nf = 0;
      let incomplete = false;
      for (;;) {
        if (nf >= this.fs.length) this.growFields();
        let flag = 0;
        let s: number;
        let e: number;
        if (buf[pos] === QUOTE) {
          flag = 1;
          this.quotes = true;
          const quoteLine = this.line;
          s = pos + 1;
          let i = s;
          for (;;) {
            if (i >= len) {
              if (!final) { incomplete = true; break; }
              throw new InputError({
                file: this.fileName, row: quoteLine, column: this.columnName(nf),
                expected: 'a closing quote (") for the quoted value that starts here',
                found: 'the end of the file',
              });
            }
            const c = buf[i];
            if (c === QUOTE) {
              if (i + 1 >= len && !final) { incomplete = true; break; }
              if (buf[i + 1] === QUOTE) { flag = 3; i += 2; continue; }
              break;
            }
            if (c === LF || (c === CR && buf[i + 1] !== LF)) this.line++;
            i++;
          }
          if (incomplete) break;
          e = i;
          pos = i + 1;
          while (pos < len && (buf[pos] === 0x20 || buf[pos] === 0x09)) pos++;
          if (pos >= len && !final) { incomplete = true; break; }
          if (pos < len) {
            const c = buf[pos];
            if (c !== delim && c !== LF && c !== CR) {
              throw new InputError({
                file: this.fileName, row: this.line, column: this.columnName(nf),
                expected: 'a delimiter or line end after a closing quote',
                found: new TextDecoder().decode(buf.subarray(pos, pos + 20)),
              });
            }
          }
        } else {
          s = pos;
          let i = pos;
          while (i < len) {
            const c = buf[i];
            if (c === delim || c === LF || c === CR) break;
            i++;
          }
          if (i >= len && !final) { incomplete = true; break; }
          e = i;
          pos = i;
        }
        this.fs[nf] = s;
        this.fe[nf] = e;
        this.ff[nf] = flag;
        nf++;
        if (pos < len && buf[pos] === delim) { pos++; continue; }
        if (pos < len) {
          if (buf[pos] === CR) {
            if (pos + 1 >= len && !final) { incomplete = true; break; }
            pos += buf[pos + 1] === LF ? 2 : 1;
          } else pos += 1;
        }
        this.line++;
        break;
      }
      if (incomplete) {
        this.line = recLine;
        return recStart;
      }
      this.record(buf, nf, recLine);
    }
    return pos;
  }

  /**
   * The common record, read in one pass: exactly one field per column, none quoted, ended by a
   * line end. Plain numbers ([+-]digits[.digits][e[+-]digits]) are parsed on the way when the
   * value is certain to be what the general path stores (see the comment at the check); other
   * cells keep their bounds for CsvColumn.add. Returns the offset after the record, or -1 when
   * the record is anything else (blank, ragged, quoted, unfinished): the general path then reads
   * it, and gives the same table or the same error.
   */
  private quickRecord(buf: Uint8Array, pos: number, len: number): number {
    const nc = this.columns.length;
    const delim = this.delimByte;
    // A decimal mark equal to the delimiter (both given as ',') never splits a number here.
    const point = this.point === delim ? -1 : this.point;
    const dst = this.dst;
    const takes = this.takes;
    const slow = this.slow;
    let nSlow = 0;
    const k = this.nRows & (BLOCK - 1);
    const fs = this.fs;
    const fe = this.fe;
    for (let j = 0; j < nc; j++) {
      const s = pos;
      // Reads stay inside buf (0 past its end): a typed-array read out of bounds gives undefined,
      // and one such read makes every comparison on c slower.
      let c = pos < len ? buf[pos] : 0;
      if (c === QUOTE) return -1;
      let neg = false;
      if (c === 0x2d || c === 0x2b) {
        neg = c === 0x2d;
        c = ++pos < len ? buf[pos] : 0;
      }
      // The first 9 significant digits (leading zeros skipped) in hi and the next 9 in lo, in
      // int32 arithmetic (a shorter chain than doubles); later digits only count.
      let hi = 0;
      let lo = 0;
      let digits = 0;
      let sig = 0;
      let frac = 0;
      while (c >= 0x30 && c <= 0x39) {
        if (sig > 0 || c !== 0x30) {
          if (sig < 9) hi = (hi * 10 + (c - 0x30)) | 0;
          else if (sig < 18) lo = (lo * 10 + (c - 0x30)) | 0;
          sig++;
        }
        digits++;
        c = ++pos < len ? buf[pos] : 0;
      }
      if (c === point) {
        c = ++pos < len ? buf[pos] : 0;
        while (c >= 0x30 && c <= 0x39) {
          if (sig > 0 || c !== 0x30) {
            if (sig < 9) hi = (hi * 10 + (c - 0x30)) | 0;
            else if (sig < 18) lo = (lo * 10 + (c - 0x30)) | 0;
            sig++;
          }
          digits++;
          frac++;
          c = ++pos < len ? buf[pos] : 0;
        }
      }
      let plain = digits > 0;
      let exp = 0;
      if (c === 0x65 || c === 0x45) {
        c = ++pos < len ? buf[pos] : 0;
        let eneg = false;
        if (c === 0x2d || c === 0x2b) {
          eneg = c === 0x2d;
          c = ++pos < len ? buf[pos] : 0;
        }
        let ed = 0;
        while (c >= 0x30 && c <= 0x39) {
          exp = exp * 10 + (c - 0x30);
          ed++;
          c = ++pos < len ? buf[pos] : 0;
        }
        if (ed === 0 || ed > 4) plain = false;
        if (eneg) exp = -exp;
      }
      const kept = sig < 18 ? sig : 18;
      const mant = kept <= 9 ? hi : hi * POW10[kept - 9] + lo;
      const p = exp - frac + (sig - kept);
      if (c !== delim && c !== LF && c !== CR) {
        plain = false;
        while (pos < len) {
          c = buf[pos];
          if (c === delim || c === LF || c === CR) break;
          pos++;
        }
      }
      let v = 0;
      if (plain) {
        if (p < -22 || p > 22) plain = false;
        else {
          const m = p < 0 ? mant / POW10[-p] : mant * POW10[p];
          v = neg ? -m : m;
          // Up to 15 digits, mantissa and power of ten are exact and one division or product is
          // correctly rounded: v is Number(text). Longer mantissas (17-digit shortest doubles,
          // 18-digit scientific notation) are kept only where they are stored in Float32 and
          // v's error (under 3.5e-16 relative) cannot change the Float32 it rounds to: then the
          // block holds Math.fround(Number(text)), as the general path would store.
          if (sig > 15 && (takes[j] !== 2 || Math.fround(v * (1 - NEAR)) !== Math.fround(v * (1 + NEAR)))) plain = false;
        }
      }
      if (pos >= len) return -1;
      if (plain && takes[j] !== 0) {
        // Written for row nRows now; if the record turns out unfinished, it is read again into the same row.
        dst[j][k] = v;
      } else {
        slow[nSlow++] = j;
        fs[j] = s;
        fe[j] = pos;
      }
      if (j < nc - 1) {
        if (c !== delim) return -1;
        pos++;
      } else {
        if (c === delim) return -1;
        if (c === CR) {
          if (pos + 1 >= len) return -1;
          pos += buf[pos + 1] === LF ? 2 : 1;
        } else pos++;
      }
    }
    this.nSlow = nSlow;
    return pos;
  }

  /** Ends the record quickRecord read: the cells it did not store go through their columns. */
  private commitQuick(buf: Uint8Array, line: number): void {
    const r = this.nRows++;
    this.lineBlocks[r >> 16][r & (BLOCK - 1)] = line;
    const cols = this.columns;
    for (let i = 0; i < this.nSlow; i++) {
      const j = this.slow[i];
      cols[j].add(r, buf, this.fs[j], this.fe[j], false, line, this.fileName);
      this.takes[j] = takeCode(cols[j]);
    }
  }

  /** Storage for row nRows in every column. */
  private room(): void {
    if (this.nRows < this.capacity) return;
    this.lineBlocks.push(new Int32Array(BLOCK));
    for (let j = 0; j < this.columns.length; j++) this.dst[j] = this.columns[j].grow();
    this.capacity += BLOCK;
  }

  private setColumns(columns: CsvColumn[]): void {
    this.columns = columns;
    this.dst = columns.map(() => new Float64Array(0));
    this.takes = Uint8Array.from(columns, takeCode);
    this.quickOk = columns.length >= 2;
    while (this.fs.length < columns.length) this.growFields();
  }

  private record(buf: Uint8Array, nf: number, line: number): void {
    if (nf === 1 && this.ff[0] === 0 && isBlank(buf, this.fs[0], this.fe[0])) return;
    if (this.header === null) {
      this.startColumns(buf, nf, line);
      return;
    }
    const nCols = this.columns.length;
    if (nf !== nCols) {
      throw new InputError({
        file: this.fileName, row: line,
        expected: `${nCols} fields, as in the header`,
        found: `${nf} field${nf === 1 ? '' : 's'} (the delimiter is ${DELIMITER_NAMES[this.delim]})`,
      });
    }
    this.room();
    const r = this.nRows++;
    this.lineBlocks[r >> 16][r & (BLOCK - 1)] = line;
    for (let j = 0; j < nCols; j++) {
      const flag = this.ff[j];
      const text = flag & 2 ? this.unescaped(buf, j, line) : undefined;
      const col = this.columns[j];
      col.add(r, buf, this.fs[j], this.fe[j], flag !== 0, line, this.fileName, text);
      this.takes[j] = takeCode(col);
    }
  }

  private unescaped(buf: Uint8Array, j: number, line: number): string {
    try {
      return bytesText(buf, this.fs[j], this.fe[j]).replaceAll('""', '"');
    } catch {
      throw new InputError({ file: this.fileName, row: line, column: this.columnName(j), expected: 'UTF-8 text (save the file as UTF-8)', found: 'bytes that are not UTF-8' });
    }
  }

  private startColumns(buf: Uint8Array, nf: number, line: number): void {
    const names: string[] = [];
    for (let j = 0; j < nf; j++) {
      let h: string;
      try {
        h = bytesText(buf, this.fs[j], this.fe[j]);
      } catch {
        throw new InputError({ file: this.fileName, row: line, column: `column ${j + 1}`, expected: 'UTF-8 text (save the file as UTF-8)', found: 'bytes that are not UTF-8' });
      }
      if (this.ff[j] & 2) h = h.replaceAll('""', '"');
      h = h.trim();
      names.push(h === '' ? `column ${j + 1}` : h);
    }
    const seen = new Map<string, number>();
    names.forEach((name, j) => {
      const first = seen.get(name);
      if (first !== undefined) {
        throw new InputError({
          file: this.fileName, row: line, column: name,
          expected: 'unique column names',
          found: `"${name}" in columns ${first + 1} and ${j + 1}`,
        });
      }
      seen.set(name, j);
    });
    const { precision, totalBytes } = this.opts;
    const narrow = precision === 'float32' || (precision === 'auto' && totalBytes > AUTO_FLOAT32_BYTES);
    this.header = names;
    this.setColumns(names.map((name) => {
      const role = roleFromName(name);
      return new CsvColumn(name, !narrow || (role !== undefined && WIDE_ROLES.has(role)), this.point, this.markers);
    }));
  }

  private columnName(j: number): string | undefined {
    if (!this.header) return undefined;
    return j < this.header.length ? this.header[j] : `column ${j + 1}`;
  }

  private growFields(): void {
    const n = this.fs.length * 2;
    const s = new Int32Array(n); s.set(this.fs); this.fs = s;
    const e = new Int32Array(n); e.set(this.fe); this.fe = e;
    const f = new Uint8Array(n); f.set(this.ff); this.ff = f;
    this.slow = new Int32Array(n);
  }
}

/** 0: the column holds text, numbers need their spelling; 1: numbers go to its Float64 block; 2: to its Float32 block. */
function takeCode(col: CsvColumn): number {
  return col.takesNumbers ? (col.wide ? 1 : 2) : 0;
}

function isBlank(b: Uint8Array, s: number, e: number): boolean {
  for (let i = s; i < e; i++) if (b[i] !== 0x20 && b[i] !== 0x09) return false;
  return true;
}

/**
 * Where a file may be cut between two readers: the offset just past the first line end (LF, CRLF
 * or a lone CR) in `buf` at or after `from`, or -1 when there is none, or when `buf` ends on a CR
 * whose LF may follow. The cut is a record boundary only if no quoted cell spans it (see sawQuote).
 */
export function lineEndAfter(buf: Uint8Array, from: number): number {
  for (let i = Math.max(0, from); i < buf.length; i++) {
    const c = buf[i];
    if (c === LF) return i + 1;
    if (c === CR) {
      if (i + 1 >= buf.length) return -1;
      return buf[i + 1] === LF ? i + 2 : i + 1;
    }
  }
  return -1;
}

/** a then b in one array (b itself when a is empty). */
function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
  if (a.length === 0) return b;
  const out = new Uint8Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}
