import { InputError } from '../errors';
import { BLOCK, joinSegments, type Segment } from './blocks';
import { parseNumberBytes } from './number-bytes';
import { MissingMarkers, type MissingCount } from './missing-markers';
import type { Column } from './table';
import { parseIsoSeconds } from './timestamps';

const INFINITE = /^[+-]?inf(?:inity)?$/i;
const utf8 = new TextDecoder('utf-8', { fatal: true });

/** Text of bytes [s, e): ASCII directly, anything else through a strict UTF-8 decoder (throws on bad bytes). */
export function bytesText(b: Uint8Array, s: number, e: number): string {
  let ascii = true;
  for (let i = s; i < e; i++) if (b[i] >= 0x80) { ascii = false; break; }
  if (!ascii) return utf8.decode(b.subarray(s, e));
  if (e - s < 64) {
    let t = '';
    for (let i = s; i < e; i++) t += String.fromCharCode(b[i]);
    return t;
  }
  return String.fromCharCode(...b.subarray(s, e));
}

/** First byte of bytes [s, e) that is not valid UTF-8 (e when none). */
export function badUtf8At(b: Uint8Array, s: number, e: number): number {
  for (let i = s; i < e; i++) {
    if (b[i] < 0x80) continue;
    let k = i + 1;
    while (k < e && k < i + 4 && (b[k] & 0xc0) === 0x80) k++;
    try { utf8.decode(b.subarray(i, k)); } catch { return i; }
    i = k - 1;
  }
  return e;
}

/** A column's parse state, as handed from a thread that read one part of a file to the one that joins the parts. */
export interface CsvColumnState {
  /** Rows held. */
  n: number;
  missing: number;
  textCount: number;
  num: (Float32Array | Float64Array)[];
  codes: Int32Array[] | null;
  dictionary: string[];
  iso: Float64Array[] | null;
  allIso: boolean;
  firstText: { line: number; text: string } | null;
  firstInfinite: { line: number; text: string } | null;
  /** Missing cells by marker, in the order of MissingMarkers.list. */
  markerCounts: number[];
}

/**
 * One column of a text table as it streams in. A cell is a number, a missing-value token,
 * Inf, or text. The column ends numeric unless text cells outnumber numbers (then it is
 * categorical); a text column of ISO 8601 times ends numeric, in seconds.
 *
 * The reader owns the row count: it calls `grow` before row r when r is a multiple of BLOCK, and
 * may write a plain number straight into the block `grow` returned while `takesNumbers` holds.
 * Numbers are not counted one by one: a column's numbers are its rows less its missing and text
 * cells (Inf counts as a number, as it is one to the user).
 */
export class CsvColumn {
  private missing = 0;
  private textCount = 0;
  private readonly num: (Float32Array | Float64Array)[] = [];
  private codes: Int32Array[] | null = null;
  private readonly dictionary: string[] = [];
  private readonly index = new Map<string, number>();
  private iso: Float64Array[] | null = null;
  private allIso = true;
  private firstText: { line: number; text: string } | null = null;
  private firstInfinite: { line: number; text: string } | null = null;
  private readonly markerCounts: number[];
  /** Rows appended by absorb, kept in the other reader's blocks until finish joins them. */
  private tail: { head: number; n: number; num: (Float32Array | Float64Array)[]; codes: Int32Array[] | null; iso: Float64Array[] | null } | null = null;

  constructor(readonly name: string, readonly wide: boolean, private readonly point: number, private readonly markers: MissingMarkers = new MissingMarkers()) {
    this.markerCounts = markers.list.map(() => 0);
  }

  /** Storage for the next BLOCK rows; returns the block numbers go to. */
  grow(): Float32Array | Float64Array {
    const block = this.wide ? new Float64Array(BLOCK) : new Float32Array(BLOCK);
    this.num.push(block);
    if (this.codes) this.codes.push(new Int32Array(BLOCK));
    if (this.iso) this.iso.push(new Float64Array(BLOCK));
    return block;
  }

  /**
   * True while a number cell is fully kept by writing its value to the block: no text seen yet,
   * and no missing-value marker that reads as a number (then every cell is matched first).
   */
  get takesNumbers(): boolean {
    return this.codes === null && !this.markers.numeric;
  }

  /** Sets row r (storage grown) from cell bytes[s, e); `text` is the unescaped cell when it had doubled quotes. */
  add(r: number, b: Uint8Array, s: number, e: number, quoted: boolean, line: number, fileName: string, text?: string): void {
    const k = r & (BLOCK - 1);
    const block = this.num[r >> 16];
    if (!quoted) {
      while (s < e && (b[s] === 0x20 || b[s] === 0x09)) s++;
      while (e > s && (b[e - 1] === 0x20 || b[e - 1] === 0x09)) e--;
    }
    const v = text === undefined && e > s ? parseNumberBytes(b, s, e, this.point) : NaN;
    if (v === v && !(this.markers.numeric && this.markers.indexOf(this.cellString(b, s, e, text, line, fileName)) >= 0)) {
      block[k] = v;
      if (this.codes) this.setCode(r, this.cellString(b, s, e, text, line, fileName));
      if (this.iso) this.allIso = false;
      return;
    }
    block[k] = NaN;
    const str = text ?? (e > s ? this.cellString(b, s, e, undefined, line, fileName) : '');
    const t = quoted ? str.trim() : str;
    const marker = this.markers.indexOf(t);
    if (marker >= 0) {
      this.missing++;
      this.markerCounts[marker]++;
      if (this.codes) this.codes[r >> 16][k] = -1;
      if (this.iso) this.iso[r >> 16][k] = NaN;
      return;
    }
    if (INFINITE.test(t)) {
      this.firstInfinite ??= { line, text: str };
      if (this.codes) this.setCode(r, str);
      if (this.iso) this.allIso = false;
      return;
    }
    if (!this.codes) this.startText(r);
    this.textCount++;
    this.firstText ??= { line, text: str };
    this.setCode(r, str);
    if (this.allIso) {
      const sec = parseIsoSeconds(t);
      if (sec === sec && this.iso) this.iso[r >> 16][k] = sec;
      else this.allIso = false;
    }
  }

  private cellString(b: Uint8Array, s: number, e: number, text: string | undefined, line: number, fileName: string): string {
    if (text !== undefined) return text;
    try {
      return bytesText(b, s, e);
    } catch {
      const at = badUtf8At(b, s, e);
      throw new InputError({
        file: fileName, row: line, column: this.name,
        expected: 'UTF-8 text (save the file as UTF-8)',
        found: `byte 0x${b[at].toString(16).padStart(2, '0')}`,
      });
    }
  }

  private codeOf(s: string): number {
    let code = this.index.get(s);
    if (code === undefined) {
      code = this.dictionary.length;
      this.dictionary.push(s);
      this.index.set(s, code);
    }
    return code;
  }

  private setCode(r: number, s: string): void {
    (this.codes as Int32Array[])[r >> 16][r & (BLOCK - 1)] = this.codeOf(s);
  }

  /** The first text cell arrives at row r: earlier numbers become text (as JavaScript prints them). */
  private startText(r: number): void {
    this.codes = this.num.map(() => new Int32Array(BLOCK));
    // No text before row r, so its earlier rows are numbers or missing.
    const numbers = r - this.missing;
    this.iso = numbers === 0 ? this.num.map(() => new Float64Array(BLOCK).fill(NaN)) : null;
    if (!this.iso) this.allIso = false;
    for (let i = 0; i < r; i++) {
      const v = this.num[i >> 16][i & (BLOCK - 1)];
      if (v !== v) this.codes[i >> 16][i & (BLOCK - 1)] = -1;
      else this.setCode(i, String(v));
    }
  }

  /** This column's state after n rows, for handing to another thread (the blocks' buffers can be transferred). */
  state(n: number): CsvColumnState {
    return {
      n, missing: this.missing, textCount: this.textCount, num: this.num, codes: this.codes,
      dictionary: this.dictionary, iso: this.iso, allIso: this.allIso, firstText: this.firstText, firstInfinite: this.firstInfinite,
      markerCounts: this.markerCounts,
    };
  }

  /**
   * Whether appending `next` (the same column read from the rest of the file) to this column's
   * first n rows gives exactly what reading on would have. It does unless text and numbers meet
   * in the column: a number read after the first text cell keeps its own spelling as a category,
   * one read before it is spelt as JavaScript prints it, and a separately read part cannot know
   * which applies.
   */
  canAbsorb(n: number, next: CsvColumnState): boolean {
    if (this.textCount === 0 && next.textCount === 0) return true;
    return n - this.missing - this.textCount === 0 && next.n - next.missing - next.textCount === 0;
  }

  /**
   * Appends `next` after this column's first n1 rows: the same column read from the bytes that
   * follow, its line numbers counted from 1 at its first byte, so they move by `lineOffset`.
   * Call canAbsorb first. The rows of `next` stay in its blocks (its codes are rewritten in
   * place) until finish copies them, so the join costs no second copy of the part; nothing may
   * be added after it.
   */
  absorb(n1: number, next: CsvColumnState, lineOffset: number): void {
    if (next.textCount > 0 && !this.codes) this.startText(n1);
    let codes: Int32Array[] | null = null;
    if (this.codes && next.codes) {
      // Part dictionaries list values in order of first appearance, so mapping them in that
      // order gives the codes a single reader would have given.
      const remap = Int32Array.from(next.dictionary, (s) => this.codeOf(s));
      codes = next.codes;
      for (let i = 0; i < next.n; i++) {
        const block = codes[i >> 16];
        const c = block[i & (BLOCK - 1)];
        block[i & (BLOCK - 1)] = c < 0 ? -1 : remap[c];
      }
    }
    this.tail = { head: n1, n: next.n, num: next.num, codes, iso: next.iso };
    this.allIso &&= next.allIso;
    const shift = (at: { line: number; text: string } | null) => (at ? { line: at.line + lineOffset, text: at.text } : null);
    this.firstText ??= shift(next.firstText);
    this.firstInfinite ??= shift(next.firstInfinite);
    this.missing += next.missing;
    this.textCount += next.textCount;
    next.markerCounts.forEach((c, i) => { this.markerCounts[i] += c; });
  }

  /** The column's missing cells by marker; null when it has none. */
  missingCount(): MissingCount | null {
    if (this.missing === 0) return null;
    const byMarker: Record<string, number> = {};
    this.markerCounts.forEach((c, i) => { if (c > 0) byMarker[this.markers.list[i]] = c; });
    return { column: this.name, total: this.missing, byMarker };
  }

  /** This column's own blocks then the absorbed ones (a missing part: n copies of fill). */
  private segments<T extends Float32Array | Float64Array | Int32Array>(own: T[], n: number, tail: T[] | null, fill: number): Segment<T>[] {
    if (!this.tail) return [{ blocks: own, n }];
    return [{ blocks: own, n: this.tail.head }, { blocks: tail, n: this.tail.n, fill }];
  }

  /** The column of n rows. */
  finish(fileName: string, n: number): Column {
    const numbers = n - this.missing - this.textCount;
    const tail = this.tail;
    if (this.textCount > 0 && this.allIso && this.iso) {
      return { kind: 'numeric', name: this.name, values: joinSegments(this.segments(this.iso, n, tail?.iso ?? null, NaN), (m) => new Float64Array(m)), time: 'iso8601' };
    }
    if (this.textCount > 0 && this.textCount >= numbers && this.codes) {
      return { kind: 'categorical', name: this.name, codes: joinSegments(this.segments(this.codes, n, tail?.codes ?? null, -1), (m) => new Int32Array(m)), dictionary: this.dictionary };
    }
    const bad = this.firstText ?? this.firstInfinite;
    if (bad) {
      throw new InputError({
        file: fileName, row: bad.line, column: this.name,
        expected: this.firstText
          ? `a number (leave the cell empty${this.markers.example === undefined ? '' : ` or write ${this.markers.example}`} for a missing value)`
          : 'a finite number (Inf is not allowed; leave the cell empty for a missing value)',
        found: bad.text,
      });
    }
    const values = this.wide
      ? joinSegments(this.segments(this.num as Float64Array[], n, (tail?.num ?? null) as Float64Array[] | null, NaN), (m) => new Float64Array(m))
      : joinSegments(this.segments(this.num as Float32Array[], n, (tail?.num ?? null) as Float32Array[] | null, NaN), (m) => new Float32Array(m));
    return { kind: 'numeric', name: this.name, values };
  }
}
