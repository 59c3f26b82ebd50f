import type { RowGroup, SchemaTree } from 'hyparquet';
import { PAGE, readPageHeader, type PageHeader } from './parquet-page-header';

/**
 * Checks the run lengths inside the pages hyparquet will decode: repetition and definition levels
 * and dictionary indices are RLE / bit-packed hybrid runs (apache/parquet-format, Encodings.md),
 * and hyparquet writes an RLE run's values without checking that they fit the page, so a damaged
 * run length of 2^30 grew an array until V8 aborted the process. A run that holds more values than
 * its page has left is refused here. Pages are decompressed for this with the same codecs.
 */

type Decompress = (input: Uint8Array, length: number) => Uint8Array;

/** Parquet Encoding enum values whose pages hold hybrid runs of values. */
const PLAIN_DICTIONARY = 2, RLE = 3, RLE_DICTIONARY = 8;

const bitWidth = (v: number) => 32 - Math.clz32(v);

/** Repetition and definition levels of a column from the schema root (as hyparquet counts them). */
function maxLevels(schema: SchemaTree, path: string[]): { rep: number; def: number } {
  let node = schema, rep = 0, def = 0;
  for (const name of path) {
    const child = node.children.find((c) => c.element.name === name);
    if (!child) return { rep, def };
    if (child.element.repetition_type === 'REPEATED') rep++;
    if (child.element.repetition_type !== 'REQUIRED') def++;
    node = child;
  }
  return { rep: path.length > 1 ? rep : 0, def };
}

/** A varint as hyparquet reads it (32-bit shifts); null past the end. */
function varint(b: Uint8Array, at: number): [number, number] | null {
  let result = 0, shift = 0;
  for (;;) {
    if (at >= b.length) return null;
    const byte = b[at++];
    result |= (byte & 0x7f) << shift;
    if (!(byte & 0x80)) return [result, at];
    shift += 7;
  }
}

/**
 * Walks the hybrid runs of `count` values of `width` bits from b[at], as hyparquet reads them: until
 * `count` values are seen or the bytes end (it reads past a section's stated length, so this does
 * too). Throws on a run that does not fit.
 */
function walkHybrid(b: Uint8Array, at: number, end: number, width: number, count: number, what: string): void {
  let seen = 0;
  while (seen < count && at < end) {
    const v = varint(b, at);
    if (!v) return; // the decoder reports the page cut short
    const [header, next] = v;
    at = next;
    if (header & 1) {
      const values = (header >> 1) << 3;
      if (values < 0) throw new Error(`a bit-packed run of ${values} ${what}`);
      seen += values;
      at += (header >> 1) * width;
    } else {
      const run = header >>> 1;
      if (run > count - seen) throw new Error(`a run of ${run} ${what} where the page has ${count - seen} left`);
      seen += run;
      at += (width + 7) >> 3;
    }
  }
}

const u32 = (b: Uint8Array, at: number) => (at + 4 <= b.length ? new DataView(b.buffer, b.byteOffset + at, 4).getUint32(0, true) : 0);

function checkPage(h: PageHeader, raw: Uint8Array, inflate: (bytes: Uint8Array, size: number) => Uint8Array, levels: { rep: number; def: number }, boolean: boolean): void {
  const runsOfValues = h.encoding === PLAIN_DICTIONARY || h.encoding === RLE_DICTIONARY || h.encoding === RLE;
  let page: Uint8Array, at = 0;
  if (h.type === PAGE.data) {
    if (!levels.rep && !levels.def && !runsOfValues) return;
    page = inflate(raw, h.uncompressedSize);
    for (const [max, what] of [[levels.rep, 'repetition levels'], [levels.def, 'definition levels']] as const) {
      if (!max) continue;
      const length = u32(page, at);
      walkHybrid(page, at + 4, page.length, bitWidth(max), h.numValues, what);
      at += 4 + length;
    }
  } else if (h.type === PAGE.dataV2) {
    if (levels.rep) walkHybrid(raw, 0, raw.length, bitWidth(levels.rep), h.numValues, 'repetition levels');
    if (levels.def) walkHybrid(raw, h.repLevelsBytes, raw.length, bitWidth(levels.def), h.numValues, 'definition levels');
    if (!runsOfValues) return;
    const values = raw.subarray(h.repLevelsBytes + h.defLevelsBytes);
    const size = h.uncompressedSize - h.repLevelsBytes - h.defLevelsBytes;
    page = h.isCompressed && size > 0 ? inflate(values, size) : values;
  } else return;
  if (!runsOfValues) return;
  if (boolean) walkHybrid(page, at + 4, page.length, 1, h.numValues, 'values');
  else if (at < page.length && page[at] > 0) walkHybrid(page, at + 1, page.length, page[at], h.numValues, 'dictionary indices');
}

/**
 * Checks every data page of the named columns of a row group held in memory (`held`: its bytes
 * and where they start in the file). Throws a plain error naming the column; the caller names the file.
 */
export function checkGroupRuns(held: { start: number; bytes: Uint8Array }, group: RowGroup, schema: SchemaTree, columns: readonly string[], codecs: Record<string, Decompress>): void {
  for (const c of group.columns) {
    const m = c.meta_data;
    if (!m || !columns.includes(m.path_in_schema[0])) continue;
    const codec = codecs[m.codec];
    if (m.codec !== 'UNCOMPRESSED' && !codec) continue; // the decoder refuses the codec itself
    const inflate = (bytes: Uint8Array, size: number) => (m.codec === 'UNCOMPRESSED' ? bytes : codec(bytes, size));
    const levels = maxLevels(schema, m.path_in_schema);
    const name = m.path_in_schema.join('.');
    const dict = m.dictionary_page_offset;
    const begin = Number(dict !== undefined && dict > 0n && dict < m.data_page_offset ? dict : m.data_page_offset) - held.start;
    const end = begin + Number(m.total_compressed_size);
    const chunk = held.bytes.subarray(0, end);
    for (let at = begin; at < end;) {
      const { header, dataOffset } = readPageHeader(chunk, at);
      try {
        checkPage(header, chunk.subarray(dataOffset, dataOffset + header.compressedSize), inflate, levels, m.type === 'BOOLEAN');
      } catch (e) {
        throw new Error(`column "${name}": ${e instanceof Error ? e.message : String(e)}`, { cause: e });
      }
      at = dataOffset + header.compressedSize;
    }
  }
}
