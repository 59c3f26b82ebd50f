import { InputError } from '../errors';
import { BLOCK, joinBlocks } from './blocks';
import { parseNumberBytes } from './number-bytes';
import type { Column } from './table';
import { parseIsoSeconds } from './timestamps';

/** Cells that mean "no value" (case-insensitive), besides the empty cell. */
export const MISSING_TOKENS: readonly string[] = ['na', 'nan', 'null'];

/** Missing-value test on an already trimmed cell. */
export function isMissingToken(s: string): boolean {
  return s === '' || (s.length <= 4 && MISSING_TOKENS.includes(s.toLowerCase()));
}

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

/**
 * One column of a text table as it streams in. A cell is a number, a missing-value token,
 * Inf, or text. The column ends numeric unless text cells outnumber numbers (then it is
 * categorical); a text column of ISO 8601 times ends numeric, in seconds.
 */
export class CsvColumn {
  private n = 0;
  private numeric = 0;
  private textCount = 0;
  private readonly num: (Float32Array | Float64Array)[] = [];
  private codes: Int32Array[] | null = null;
  private readonly dictionary: string[] = [];
  private readonly index = new Map<string, number>();
  private iso: Float64Array[] | null = null;
  private allIso = true;
  private firstText: { line: number; text: string } | null = null;
  private firstInfinite: { line: number; text: string } | null = null;

  constructor(readonly name: string, private readonly wide: boolean, private readonly point: number) {}

  /** Adds cell bytes[s, e) of the row starting on `line`; `text` is the unescaped cell when it had doubled quotes. */
  add(b: Uint8Array, s: number, e: number, quoted: boolean, line: number, fileName: string, text?: string): void {
    const r = this.n++;
    const k = r & (BLOCK - 1);
    if (k === 0) {
      this.num.push(this.wide ? new Float64Array(BLOCK) : new Float32Array(BLOCK));
      if (this.codes) this.codes.push(new Int32Array(BLOCK));
      if (this.iso) this.iso.push(new Float64Array(BLOCK));
    }
    const block = this.num[this.num.length - 1];
    if (!quoted) {
      while (s < e && (b[s] === 0x20 || b[s] === 0x09)) s++;
      while (e > s && (b[e - 1] === 0x20 || b[e - 1] === 0x09)) e--;
    }
    const v = text === undefined && e > s ? parseNumberBytes(b, s, e, this.point) : NaN;
    if (v === v) {
      block[k] = v;
      this.numeric++;
      if (this.codes) this.setCode(r, this.cellString(b, s, e, text, line, fileName));
      if (this.iso) this.allIso = false;
      return;
    }
    block[k] = NaN;
    const str = text ?? (e > s ? this.cellString(b, s, e, undefined, line, fileName) : '');
    const t = quoted ? str.trim() : str;
    if (isMissingToken(t)) {
      if (this.codes) this.codes[r >> 16][k] = -1;
      if (this.iso) this.iso[r >> 16][k] = NaN;
      return;
    }
    if (INFINITE.test(t)) {
      this.numeric++;
      this.firstInfinite ??= { line, text: str };
      if (this.codes) this.setCode(r, str);
      if (this.iso) this.allIso = false;
      return;
    }
    this.textCount++;
    this.firstText ??= { line, text: str };
    if (!this.codes) this.startText(r);
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

  private setCode(r: number, s: string): void {
    let code = this.index.get(s);
    if (code === undefined) {
      code = this.dictionary.length;
      this.dictionary.push(s);
      this.index.set(s, code);
    }
    (this.codes as Int32Array[])[r >> 16][r & (BLOCK - 1)] = code;
  }

  /** The first text cell arrives at row r: earlier numbers become text (as JavaScript prints them). */
  private startText(r: number): void {
    this.codes = this.num.map(() => new Int32Array(BLOCK));
    this.iso = this.numeric === 0 ? this.num.map(() => new Float64Array(BLOCK).fill(NaN)) : null;
    if (!this.iso) this.allIso = false;
    for (let i = 0; i < r; i++) {
      const v = this.num[i >> 16][i & (BLOCK - 1)];
      if (v !== v) this.codes[i >> 16][i & (BLOCK - 1)] = -1;
      else this.setCode(i, String(v));
    }
  }

  get rows(): number {
    return this.n;
  }

  finish(fileName: string): Column {
    const n = this.n;
    if (this.textCount > 0 && this.allIso && this.iso) {
      return { kind: 'numeric', name: this.name, values: joinBlocks(this.iso, n, (m) => new Float64Array(m)), time: 'iso8601' };
    }
    if (this.textCount > 0 && this.textCount >= this.numeric && this.codes) {
      return { kind: 'categorical', name: this.name, codes: joinBlocks(this.codes, n, (m) => new Int32Array(m)), dictionary: this.dictionary };
    }
    const bad = this.firstText ?? this.firstInfinite;
    if (bad) {
      throw new InputError({
        file: fileName, row: bad.line, column: this.name,
        expected: this.firstText
          ? 'a number (leave the cell empty or write NA for a missing value)'
          : 'a finite number (Inf is not allowed; leave the cell empty for a missing value)',
        found: bad.text,
      });
    }
    const values = this.wide ? joinBlocks(this.num as Float64Array[], n, (m) => new Float64Array(m)) : joinBlocks(this.num as Float32Array[], n, (m) => new Float32Array(m));
    return { kind: 'numeric', name: this.name, values };
  }
}
