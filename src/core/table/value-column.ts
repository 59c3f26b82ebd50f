import type { Column, TimeFormat } from './table';

/**
 * A column filled from decoded values of a columnar file (Parquet, Arrow), by row ranges:
 * numbers, bigints and booleans make a numeric column (null/undefined = missing), strings a
 * categorical one. Feature values are stored in Float32 when `wide` is false.
 */
export class ValueColumn {
  private values: Float32Array | Float64Array | null = null;
  private codes: Int32Array | null = null;
  private readonly dictionary: string[] = [];
  private readonly index = new Map<string, number>();

  constructor(readonly name: string, private readonly nRows: number, private readonly wide: boolean, private readonly time?: TimeFormat) {}

  /** Copies values[0..] into rows start.. (a typed array or a plain array with nulls). */
  set(start: number, data: ArrayLike<unknown>): void {
    const end = Math.min(this.nRows, start + data.length);
    if (data instanceof Float64Array || data instanceof Float32Array || data instanceof Int32Array || data instanceof Uint32Array || data instanceof Uint8Array || data instanceof Int16Array || data instanceof Int8Array || data instanceof Uint16Array) {
      this.numeric().set(data.subarray(0, end - start), start);
      return;
    }
    for (let i = start; i < end; i++) {
      const v = data[i - start];
      if (v === null || v === undefined) {
        if (this.codes) this.codes[i] = -1;
        else this.numeric()[i] = NaN;
      } else if (typeof v === 'number') this.numeric()[i] = v;
      else if (typeof v === 'bigint') this.numeric()[i] = Number(v);
      else if (typeof v === 'boolean') this.numeric()[i] = v ? 1 : 0;
      else this.text()[i] = this.code(String(v));
    }
  }

  /** The numeric storage (created, all NaN, on first use), for decoders that write into it directly. */
  target(): Float32Array | Float64Array {
    if (this.codes) throw new Error(`column ${this.name} already holds text`);
    return this.numeric();
  }

  private numeric(): Float32Array | Float64Array {
    if (!this.values) {
      this.values = this.wide ? new Float64Array(this.nRows) : new Float32Array(this.nRows);
      this.values.fill(NaN);
    }
    return this.values;
  }

  private text(): Int32Array {
    if (!this.codes) {
      this.codes = new Int32Array(this.nRows).fill(-1);
      // Numbers seen before the first text (a mixed column) become text as JavaScript prints them.
      if (this.values) {
        for (let i = 0; i < this.nRows; i++) if (this.values[i] === this.values[i]) this.codes[i] = this.code(String(this.values[i]));
        this.values = null;
      }
    }
    return this.codes;
  }

  private code(s: string): number {
    let c = this.index.get(s);
    if (c === undefined) {
      c = this.dictionary.length;
      this.dictionary.push(s);
      this.index.set(s, c);
    }
    return c;
  }

  finish(): Column {
    if (this.codes) return { kind: 'categorical', name: this.name, codes: this.codes, dictionary: this.dictionary };
    const values = this.numeric();
    return this.time ? { kind: 'numeric', name: this.name, values, time: this.time } : { kind: 'numeric', name: this.name, values };
  }
}
