import { InputError } from '../errors';
import { BLOCK, joinBlocks } from './blocks';
import { bytesText, CsvColumn } from './csv-column';
import { sniffDecimal, sniffDelimiter, type Delimiter } from './csv-sniff';
import { AUTO_FLOAT32_BYTES, DEFAULT_READ_OPTIONS, type ReadOptions, type TableReader } from './reader.types';
import { roleFromName } from './roles';
import type { Role } from './roles.types';
import type { Table } from './table';

const QUOTE = 0x22;
const LF = 0x0a;
const CR = 0x0d;
/** Bytes gathered before the delimiter and decimal mark are guessed. */
const SNIFF_BYTES = 64 * 1024;
/** Columns whose name suggests one of these roles keep double precision (times, ids, codes). */
const WIDE_ROLES: ReadonlySet<Role> = new Set(['id', 'subject', 'session', 'start', 'end', 'duration', 'label', 'metadata']);
const DELIMITER_NAMES: Record<Delimiter, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

/**
 * Streaming reader of delimited text (comma, semicolon or tab; detected unless given), straight
 * from UTF-8 bytes: optional BOM, RFC 4180 quotes (delimiters, line breaks and doubled quotes inside
 * quoted cells), LF / CRLF / CR line ends, blank lines skipped, decimal point or comma. Each chunk
 * is parsed as it arrives; only an unfinished last record is carried to the next chunk.
 */
export class CsvReader implements TableReader {
  bytesConsumed = 0;
  private readonly opts: Required<ReadOptions>;
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
  // Field bounds of the record being read, reused.
  private fs = new Int32Array(64);
  private fe = new Int32Array(64);
  private ff = new Uint8Array(64);

  constructor(private readonly fileName: string, options: ReadOptions = {}) {
    this.opts = { ...DEFAULT_READ_OPTIONS, ...options };
    const { delimiter, decimal } = this.opts;
    if (delimiter !== 'auto' && decimal !== 'auto') {
      // Nothing to guess: parse from the first chunk.
      this.sniffed = true;
      this.delim = delimiter;
      this.delimByte = delimiter.charCodeAt(0);
      this.point = decimal === ',' ? 0x2c : 0x2e;
    }
  }

  push(chunk: Uint8Array): void {
    this.bytesConsumed += chunk.length;
    let buf = chunk;
    if (this.pending.length > 0) {
      buf = new Uint8Array(this.pending.length + chunk.length);
      buf.set(this.pending);
      buf.set(chunk, this.pending.length);
    }
    if (!this.sniffed) {
      if (buf.length < SNIFF_BYTES) {
        this.pending = buf === chunk ? chunk.slice() : buf;
        return;
      }
      this.sniff(buf, false);
    }
    const used = this.parse(buf, false);
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
    this.parse(buf, true);
    const file = this.fileName;
    if (this.header === null) {
      throw new InputError({ file, expected: 'a header row and data rows', found: 'an empty file' });
    }
    if (this.nRows === 0) {
      throw new InputError({ file, row: 2, expected: 'at least one data row after the header', found: 'only the header' });
    }
    const columns = this.columns.map((c) => c.finish(file));
    const lines = joinBlocks(this.lineBlocks, this.nRows, (m) => new Int32Array(m));
    return { fileName: file, nRows: this.nRows, columns, lines };
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

  /** Parses the complete records in buf; returns the offset of the first byte not consumed. */
  private parse(buf: Uint8Array, final: boolean): number {
    const len = buf.length;
    const delim = this.delimByte;
    let pos = 0;
    if (this.atStart && len >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) pos = 3;
    if (len > 0 || final) this.atStart = false;
    while (pos < len) {
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
    const r = this.nRows++;
    if ((r & (BLOCK - 1)) === 0) this.lineBlocks.push(new Int32Array(BLOCK));
    this.lineBlocks[r >> 16][r & (BLOCK - 1)] = line;
    for (let j = 0; j < nCols; j++) {
      const flag = this.ff[j];
      const text = flag & 2 ? this.unescaped(buf, j, line) : undefined;
      this.columns[j].add(buf, this.fs[j], this.fe[j], flag !== 0, line, this.fileName, text);
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
    this.columns = names.map((name) => {
      const role = roleFromName(name);
      return new CsvColumn(name, !narrow || (role !== undefined && WIDE_ROLES.has(role)), this.point);
    });
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
  }
}

function isBlank(b: Uint8Array, s: number, e: number): boolean {
  for (let i = s; i < e; i++) if (b[i] !== 0x20 && b[i] !== 0x09) return false;
  return true;
}
