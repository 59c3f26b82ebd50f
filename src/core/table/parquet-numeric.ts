/**
 * A flat numeric Parquet column chunk (FLOAT, DOUBLE, INT32, INT64; required or nullable) decoded
 * straight into a Float32Array/Float64Array, NaN for nulls, without a JavaScript value per cell.
 * Pages: v1 and v2; encodings PLAIN and (RLE_/PLAIN_)DICTIONARY. Anything else throws
 * `UnsupportedChunk`, and the caller reads that column with the general decoder instead.
 */
import { PAGE, readPageHeader } from './parquet-page-header';

export type NumericType = 'FLOAT' | 'DOUBLE' | 'INT32' | 'INT64';
export type Decompress = (input: Uint8Array, length: number) => Uint8Array;

export class UnsupportedChunk extends Error {}

const ENCODING = { plain: 0, plainDictionary: 2, rleDictionary: 8 } as const;

/** Reads `count` plain values of `type` from `bytes` at `offset` into `out` (a Float64Array or the target). */
function readPlain(bytes: Uint8Array, offset: number, type: NumericType, count: number, out: Float32Array | Float64Array, at: number): void {
  const width = type === 'FLOAT' || type === 'INT32' ? 4 : 8;
  if (offset + count * width > bytes.length) throw new Error(`page holds fewer than its ${count} values`);
  const view = new DataView(bytes.buffer, bytes.byteOffset + offset, count * width);
  if (type === 'DOUBLE') {
    if ((bytes.byteOffset + offset) % 8 === 0) out.set(new Float64Array(bytes.buffer, bytes.byteOffset + offset, count), at);
    else for (let i = 0; i < count; i++) out[at + i] = view.getFloat64(8 * i, true);
  } else if (type === 'FLOAT') {
    if ((bytes.byteOffset + offset) % 4 === 0) out.set(new Float32Array(bytes.buffer, bytes.byteOffset + offset, count), at);
    else for (let i = 0; i < count; i++) out[at + i] = view.getFloat32(4 * i, true);
  } else if (type === 'INT32') {
    for (let i = 0; i < count; i++) out[at + i] = view.getInt32(4 * i, true);
  } else {
    for (let i = 0; i < count; i++) out[at + i] = view.getInt32(8 * i + 4, true) * 4294967296 + view.getUint32(8 * i, true);
  }
}

/**
 * The RLE/bit-packed hybrid: `count` values of `bitWidth` bits from bytes [offset, end) into `out`.
 * Returns the offset after the last run read.
 */
export function readHybrid(bytes: Uint8Array, offset: number, end: number, bitWidth: number, count: number, out: Uint32Array): number {
  // A damaged length prefix may point past the page: never read beyond the bytes there are.
  end = Math.min(end, bytes.length);
  let o = offset, n = 0;
  const byteWidth = (bitWidth + 7) >> 3;
  const mask = bitWidth >= 32 ? 0xffffffff : (1 << bitWidth) - 1;
  while (n < count) {
    if (o >= end) throw new Error('levels or dictionary indices run past their page');
    let header = 0, shift = 0, b: number;
    do {
      b = bytes[o++];
      header += (b & 0x7f) * 2 ** shift;
      shift += 7;
    } while (b & 0x80);
    if (header & 1) {
      // Bit-packed: (header >> 1) groups of 8 values, least significant bit first. Only the values
      // still wanted are decoded (a damaged group count of 2^40 must not be looped over).
      const groups = Math.floor(header / 2);
      const runEnd = o + groups * bitWidth;
      const values = Math.min(groups * 8, count - n);
      let acc = 0, bits = 0;
      for (let i = 0; i < values; i++) {
        while (bits < bitWidth) {
          acc += (o < end ? bytes[o] : 0) * 2 ** bits;
          o++;
          bits += 8;
        }
        const v = acc % 2 ** bitWidth;
        acc = Math.floor(acc / 2 ** bitWidth);
        bits -= bitWidth;
        if (n < count) out[n++] = v & mask;
      }
      o = runEnd;
    } else {
      const run = Math.floor(header / 2);
      let v = 0;
      for (let i = 0; i < byteWidth; i++) v += bytes[o++] * 2 ** (8 * i);
      out.fill(v, n, Math.min(count, n + run));
      n = Math.min(count, n + run);
    }
  }
  return o;
}

export interface NumericChunk {
  /** The file's bytes. */
  file: Uint8Array;
  /** Byte range of the column chunk (from the dictionary page, if any). */
  start: number;
  length: number;
  type: NumericType;
  /** Values (nulls included) the chunk holds. */
  numValues: number;
  /** 1 for a nullable column, 0 for a required one. */
  maxDefinition: number;
  codec: string;
  decompress: Record<string, Decompress | undefined>;
}

function inflate(c: NumericChunk, input: Uint8Array, size: number): Uint8Array {
  if (c.codec === 'UNCOMPRESSED') return input;
  const custom = c.decompress[c.codec];
  let out: Uint8Array;
  if (custom) out = custom(input, size);
  else throw new UnsupportedChunk(`codec ${c.codec}`);
  if (out.length !== size) throw new Error(`page decompressed to ${out.length} bytes, its header says ${size}`);
  return out;
}

/** Decodes the chunk into out[at .. at + numValues); nulls become NaN. */
export function decodeNumericChunk(c: NumericChunk, out: Float32Array | Float64Array, at: number): void {
  const end = c.start + c.length;
  if (end > c.file.length) throw new Error('column chunk runs past the end of the file');
  let offset = c.start, row = at, done = 0;
  let dictionary: Float64Array | null = null;
  let levels = new Uint32Array(0), indices = new Uint32Array(0), values = new Float64Array(0);
  while (done < c.numValues) {
    const { header: h, dataOffset } = readPageHeader(c.file, offset);
    offset = dataOffset + h.compressedSize;
    if (offset > end) throw new Error('page runs past the end of its column chunk');
    const raw = c.file.subarray(dataOffset, offset);
    if (h.type === PAGE.index) continue;
    if (h.type === PAGE.dictionary) {
      if (h.encoding !== ENCODING.plain && h.encoding !== ENCODING.plainDictionary) throw new UnsupportedChunk(`dictionary encoding ${h.encoding}`);
      dictionary = new Float64Array(h.numValues);
      readPlain(inflate(c, raw, h.uncompressedSize), 0, c.type, h.numValues, dictionary, 0);
      continue;
    }
    if (h.type !== PAGE.data && h.type !== PAGE.dataV2) throw new UnsupportedChunk(`page type ${h.type}`);
    const n = h.numValues;
    if (levels.length < n) {
      levels = new Uint32Array(n);
      indices = new Uint32Array(n);
      values = new Float64Array(n);
    }
    // Definition levels, then the page's values (nulls have none).
    let page: Uint8Array, pos: number, nulls = 0;
    if (h.type === PAGE.data) {
      page = inflate(c, raw, h.uncompressedSize);
      pos = 0;
      if (c.maxDefinition > 0) {
        const len = new DataView(page.buffer, page.byteOffset, page.byteLength).getUint32(0, true);
        readHybrid(page, 4, 4 + len, 1, n, levels);
        pos = 4 + len;
      }
    } else {
      if (h.repLevelsBytes > 0) throw new UnsupportedChunk('repetition levels');
      if (c.maxDefinition > 0) readHybrid(raw, 0, h.defLevelsBytes, 1, n, levels);
      const rest = raw.subarray(h.defLevelsBytes);
      const size = h.uncompressedSize - h.defLevelsBytes;
      page = h.isCompressed && size > 0 ? inflate(c, rest, size) : rest;
      pos = 0;
    }
    if (c.maxDefinition > 0) for (let i = 0; i < n; i++) nulls += levels[i] === 0 ? 1 : 0;
    const present = n - nulls;
    const dense = nulls === 0 ? out : values;
    const denseAt = nulls === 0 ? row : 0;
    if (h.encoding === ENCODING.plain) readPlain(page, pos, c.type, present, dense, denseAt);
    else if (h.encoding === ENCODING.plainDictionary || h.encoding === ENCODING.rleDictionary) {
      if (!dictionary) throw new Error('dictionary-encoded page without a dictionary');
      if (present > 0) readHybrid(page, pos + 1, page.length, page[pos], present, indices);
      for (let i = 0; i < present; i++) {
        const k = indices[i];
        if (k >= dictionary.length) throw new Error(`dictionary index ${k} beyond its ${dictionary.length} entries`);
        dense[denseAt + i] = dictionary[k];
      }
    } else throw new UnsupportedChunk(`encoding ${h.encoding}`);
    if (nulls > 0) {
      for (let i = 0, j = 0; i < n; i++) out[row + i] = levels[i] === 0 ? NaN : values[j++];
    }
    row += n;
    done += n;
  }
}
