import { InputError } from '../errors';

/** Cell flag bits. */
export const QUOTED = 1;
/** The quoted cell contains doubled quotes ("") that must be unescaped. */
export const ESCAPED = 2;

/**
 * Where every data cell of a delimited text lies, without copying it: cell (r, c) spans
 * text.slice(starts[r * nCols + c], ends[r * nCols + c]) (inside the quotes when quoted).
 */
export interface CellIndex {
  header: string[];
  nCols: number;
  nRows: number;
  starts: Uint32Array;
  ends: Uint32Array;
  flags: Uint8Array;
  /** 1-based line in the file where each data row starts (the header is line 1 when first). */
  lines: Int32Array;
}

const QUOTE = 0x22;
const LF = 0x0a;
const CR = 0x0d;

/**
 * One pass over decoded text: RFC 4180 quotes (doubled quotes inside, delimiters and line breaks
 * allowed in quoted cells), LF / CRLF / CR line ends, blank lines skipped. Fails with an
 * InputError on an unterminated quote, text after a closing quote, or a row with the wrong
 * number of fields.
 */
export function indexCells(text: string, fileName: string, delimiter = ','): CellIndex {
  const delim = delimiter.charCodeAt(0);
  const len = text.length;
  let header: string[] | null = null;
  let nCols = 0;
  let cap = 1024;
  let starts = new Uint32Array(cap);
  let ends = new Uint32Array(cap);
  let flags = new Uint8Array(cap);
  let lines = new Int32Array(64);
  let nCells = 0;
  let nRows = 0;
  // The current record's fields, appended at the end of the buffers, committed when it ends.
  let pos = 0;
  let line = 1;

  const columnName = (j: number): string | undefined =>
    header ? (j < header.length ? header[j] : `column ${j + 1}`) : undefined;

  while (pos < len) {
    const recordLine = line;
    const recordStart = nCells;
    let fieldCount = 0;
    let blank = true;
    // Read the fields of one record.
    for (;;) {
      if (nCells >= cap) {
        cap *= 2;
        starts = grow32(starts, cap);
        ends = grow32(ends, cap);
        const f = new Uint8Array(cap);
        f.set(flags);
        flags = f;
      }
      let flag = 0;
      let s: number;
      let e: number;
      if (pos < len && text.charCodeAt(pos) === QUOTE) {
        blank = false;
        flag = QUOTED;
        const quoteLine = line;
        s = pos + 1;
        let i = s;
        for (;;) {
          if (i >= len) {
            throw new InputError({
              file: fileName, row: quoteLine, column: columnName(fieldCount),
              expected: 'a closing quote (") for the quoted value that starts here',
              found: 'the end of the file',
            });
          }
          const c = text.charCodeAt(i);
          if (c === QUOTE) {
            if (i + 1 < len && text.charCodeAt(i + 1) === QUOTE) { flag |= ESCAPED; i += 2; continue; }
            break;
          }
          if (c === LF || (c === CR && text.charCodeAt(i + 1) !== LF)) line++;
          i++;
        }
        e = i;
        pos = i + 1;
        // Allow spaces between the closing quote and the delimiter.
        while (pos < len && (text.charCodeAt(pos) === 0x20 || text.charCodeAt(pos) === 0x09)) pos++;
        if (pos < len) {
          const c = text.charCodeAt(pos);
          if (c !== delim && c !== LF && c !== CR) {
            throw new InputError({
              file: fileName, row: line, column: columnName(fieldCount),
              expected: 'a delimiter or line end after a closing quote',
              found: text.slice(pos, pos + 20),
            });
          }
        }
      } else {
        s = pos;
        let i = pos;
        while (i < len) {
          const c = text.charCodeAt(i);
          if (c === delim || c === LF || c === CR) break;
          i++;
        }
        e = i;
        pos = i;
        if (e > s) blank = false;
      }
      starts[nCells] = s;
      ends[nCells] = e;
      flags[nCells] = flag;
      nCells++;
      fieldCount++;
      if (pos < len && text.charCodeAt(pos) === delim) { pos++; blank = false; continue; }
      // End of record: consume the line break.
      if (pos < len) {
        if (text.charCodeAt(pos) === CR && text.charCodeAt(pos + 1) === LF) pos += 2;
        else pos += 1;
      }
      line++;
      break;
    }
    if (blank && fieldCount === 1 && isBlank(text, starts[recordStart], ends[recordStart])) {
      nCells = recordStart;
      continue;
    }
    if (header === null) {
      header = [];
      for (let j = 0; j < fieldCount; j++) header.push(cellString(text, starts[j], ends[j], flags[j]).trim());
      nCols = fieldCount;
      nCells = 0;
      continue;
    }
    if (fieldCount !== nCols) {
      throw new InputError({
        file: fileName, row: recordLine,
        expected: `${nCols} fields, as in the header`,
        found: `${fieldCount} field${fieldCount === 1 ? '' : 's'}`,
      });
    }
    if (nRows >= lines.length) {
      const l = new Int32Array(lines.length * 2);
      l.set(lines);
      lines = l;
    }
    lines[nRows++] = recordLine;
  }
  if (header === null) {
    throw new InputError({ file: fileName, expected: 'a header row and data rows', found: 'an empty file' });
  }
  return {
    header, nCols, nRows,
    starts: starts.subarray(0, nCells), ends: ends.subarray(0, nCells), flags: flags.subarray(0, nCells),
    lines: lines.subarray(0, nRows),
  };
}

/** The text of a cell, quotes unescaped. */
export function cellString(text: string, start: number, end: number, flag: number): string {
  const s = text.slice(start, end);
  return flag & ESCAPED ? s.replaceAll('""', '"') : s;
}

function isBlank(text: string, s: number, e: number): boolean {
  for (let i = s; i < e; i++) {
    const c = text.charCodeAt(i);
    if (c !== 0x20 && c !== 0x09) return false;
  }
  return true;
}

function grow32(a: Uint32Array, cap: number): Uint32Array<ArrayBuffer> {
  const b = new Uint32Array(cap);
  b.set(a);
  return b;
}
