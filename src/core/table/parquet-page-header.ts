/**
 * Parquet page headers, read from their Thrift compact-protocol bytes (the fields the numeric column
 * decoder needs; every other field is skipped).
 */

export interface PageHeader {
  /** 0 data page, 1 index page, 2 dictionary page, 3 data page v2. */
  type: number;
  uncompressedSize: number;
  compressedSize: number;
  /** Values in the page, nulls included. */
  numValues: number;
  /** Parquet Encoding enum of the values (0 PLAIN, 2 PLAIN_DICTIONARY, 8 RLE_DICTIONARY, ...). */
  encoding: number;
  /** Data page v2 only. */
  numNulls: number;
  defLevelsBytes: number;
  repLevelsBytes: number;
  isCompressed: boolean;
}

export const PAGE = { data: 0, index: 1, dictionary: 2, dataV2: 3 } as const;

/** A cursor over bytes with the compact protocol's varints. */
class Cursor {
  offset: number;
  constructor(readonly bytes: Uint8Array, offset: number) {
    this.offset = offset;
  }

  byte(): number {
    if (this.offset >= this.bytes.length) throw new Error('page header runs past the end of the column chunk');
    return this.bytes[this.offset++];
  }

  varint(): number {
    let result = 0, shift = 0, b: number;
    do {
      b = this.byte();
      result += (b & 0x7f) * 2 ** shift;
      shift += 7;
    } while (b & 0x80);
    return result;
  }

  zigzag(): number {
    const n = this.varint();
    return n % 2 === 0 ? n / 2 : -(n + 1) / 2;
  }

  /** Skips one value of compact type `t`. */
  skip(t: number): void {
    switch (t) {
      case 1: case 2: return; // booleans live in the field header
      case 3: this.offset++; return;
      case 4: case 5: case 6: this.varint(); return;
      case 7: this.offset += 8; return;
      case 8: this.offset += this.varint(); return;
      case 9: case 10: {
        const h = this.byte();
        const size = h >> 4 === 15 ? this.varint() : h >> 4;
        for (let i = 0; i < size; i++) this.skip((h & 15) === 1 || (h & 15) === 2 ? 3 : h & 15);
        return;
      }
      case 11: {
        const size = this.varint();
        if (size === 0) return;
        const kv = this.byte();
        // Inside collections a boolean takes a byte of its own (compact protocol), so every entry consumes bytes.
        const inCollection = (t: number) => (t === 1 || t === 2 ? 3 : t);
        for (let i = 0; i < size; i++) {
          this.skip(inCollection(kv >> 4));
          this.skip(inCollection(kv & 15));
        }
        return;
      }
      case 12: this.struct(() => false); return;
      default: throw new Error(`page header has an unknown Thrift type ${t}`);
    }
  }

  /** Reads a struct, handing each field to `field` (returns false to have it skipped). */
  struct(field: (id: number, type: number) => boolean): void {
    let id = 0;
    for (;;) {
      const h = this.byte();
      if (h === 0) return;
      const type = h & 15;
      id = h >> 4 ? id + (h >> 4) : this.zigzag();
      if (!field(id, type)) this.skip(type);
    }
  }
}

/** Reads the page header at `offset`; returns it with the offset of the page's bytes. */
export function readPageHeader(bytes: Uint8Array, offset: number): { header: PageHeader; dataOffset: number } {
  const c = new Cursor(bytes, offset);
  const h: PageHeader = { type: -1, uncompressedSize: 0, compressedSize: 0, numValues: 0, encoding: 0, numNulls: 0, defLevelsBytes: 0, repLevelsBytes: 0, isCompressed: true };
  const int = (t: number) => t === 5 || t === 4 || t === 6;
  c.struct((id, t) => {
    if (id === 1 && int(t)) h.type = c.zigzag();
    else if (id === 2 && int(t)) h.uncompressedSize = c.zigzag();
    else if (id === 3 && int(t)) h.compressedSize = c.zigzag();
    else if (id === 5 && t === 12) {
      // DataPageHeader: num_values, encoding.
      c.struct((f, ft) => {
        if (f === 1 && int(ft)) h.numValues = c.zigzag();
        else if (f === 2 && int(ft)) h.encoding = c.zigzag();
        else return false;
        return true;
      });
    } else if (id === 7 && t === 12) {
      // DictionaryPageHeader: num_values, encoding.
      c.struct((f, ft) => {
        if (f === 1 && int(ft)) h.numValues = c.zigzag();
        else if (f === 2 && int(ft)) h.encoding = c.zigzag();
        else return false;
        return true;
      });
    } else if (id === 8 && t === 12) {
      // DataPageHeaderV2: num_values, num_nulls, num_rows, encoding, level byte lengths, is_compressed.
      c.struct((f, ft) => {
        if (f === 1 && int(ft)) h.numValues = c.zigzag();
        else if (f === 2 && int(ft)) h.numNulls = c.zigzag();
        else if (f === 4 && int(ft)) h.encoding = c.zigzag();
        else if (f === 5 && int(ft)) h.defLevelsBytes = c.zigzag();
        else if (f === 6 && int(ft)) h.repLevelsBytes = c.zigzag();
        else if (f === 7 && (ft === 1 || ft === 2)) h.isCompressed = ft === 1;
        else return false;
        return true;
      });
    } else return false;
    return true;
  });
  if (h.type < 0 || h.compressedSize < 0) throw new Error('page header without a page type or size');
  return { header: h, dataOffset: c.offset };
}
