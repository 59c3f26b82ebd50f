import type { FileMetaData, RowGroup, SchemaTree } from 'hyparquet';
import { PAGE, readPageHeader } from './parquet-page-header';

/**
 * Consistency checks of a Parquet file's counts and sizes before anything is sized from them
 * (format rules: apache/parquet-format, "File Format" and "Data Pages"). A damaged count, say a
 * page claiming two billion values in a file of a few kilobytes, is refused here with a plain
 * error (the caller names the file) instead of driving an allocation or a decoding loop.
 */

/** Bytes per value of each physical type (BOOLEAN is one bit; BYTE_ARRAY has no fixed size). */
const WIDTH: Record<string, number> = { BOOLEAN: 1, INT32: 4, FLOAT: 4, INT64: 8, DOUBLE: 8, INT96: 12 };
/** The most a value's levels and encoding overhead take in a page (an RLE run: varint header + 32-bit value). */
const OVERHEAD_PER_VALUE = 9;
/** No page of a windows table comes near this size; writers default to about 1 MiB. */
const MAX_PAGE_BYTES = 1 << 30;

const safeCount = (n: bigint | number) => Number.isSafeInteger(Number(n)) && Number(n) >= 0;

/**
 * Every column has a name of its own; the file's row count is the sum of its row groups'; a flat
 * column chunk holds one value per row.
 */
export function checkFileCounts(metadata: FileMetaData, schema: SchemaTree): void {
  const names = schema.children.map((n) => n.element.name);
  if (names.some((n) => typeof n !== 'string')) throw new Error('a name for every column of the schema');
  const twice = names.find((n, i) => names.indexOf(n) !== i);
  if (twice !== undefined) throw new Error(`column names used once, found "${twice}" twice`);
  if (!safeCount(metadata.num_rows)) throw new Error(`a row count, found ${metadata.num_rows}`);
  let sum = 0;
  const flat = new Set(schema.children.filter((n) => n.children.length === 0 && n.element.repetition_type !== 'REPEATED').map((n) => n.element.name));
  for (const [g, group] of metadata.row_groups.entries()) {
    if (!safeCount(group.num_rows)) throw new Error(`a row count for row group ${g + 1}, found ${group.num_rows}`);
    sum += Number(group.num_rows);
    for (const c of group.columns) {
      const m = c.meta_data;
      if (!m) continue;
      if (!safeCount(m.num_values) || !safeCount(m.total_compressed_size) || !safeCount(m.data_page_offset)) throw new Error(`sizes and offsets of column "${m.path_in_schema.join('.')}" in row group ${g + 1}`);
      if (m.path_in_schema.length === 1 && flat.has(m.path_in_schema[0]) && Number(m.num_values) !== Number(group.num_rows)) {
        throw new Error(`${group.num_rows} values in column "${m.path_in_schema[0]}" of row group ${g + 1} (one per row), found ${m.num_values}`);
      }
    }
  }
  if (sum !== Number(metadata.num_rows)) throw new Error(`${metadata.num_rows} rows as the row groups add up, found ${sum}`);
}

/**
 * Walks the page headers of each column chunk of a row group held in memory: every page must lie
 * inside its chunk, the data pages' values must add up to the chunk's count, and no page may
 * expand to more bytes than its values can take.
 */
export function checkGroupPages(held: { start: number; bytes: Uint8Array }, group: RowGroup, schema: SchemaTree): void {
  const typeLength = new Map(schema.children.map((n) => [n.element.name, n.element.type_length ?? 0]));
  for (const c of group.columns) {
    const m = c.meta_data;
    if (!m) continue;
    const name = m.path_in_schema.join('.');
    const dict = m.dictionary_page_offset;
    const begin = Number(dict !== undefined && dict > 0n && dict < m.data_page_offset ? dict : m.data_page_offset) - held.start;
    const end = begin + Number(m.total_compressed_size);
    if (begin < 0 || end > held.bytes.length) throw new Error(`column "${name}" inside its row group's bytes`);
    const chunk = held.bytes.subarray(0, end);
    const expected = Number(m.num_values);
    const width = m.type === 'FIXED_LEN_BYTE_ARRAY' ? (typeLength.get(m.path_in_schema[0]) ?? 0) : WIDTH[m.type];
    let values = 0;
    for (let at = begin; at < end && values < expected;) {
      const { header, dataOffset } = readPageHeader(chunk, at);
      const next = dataOffset + header.compressedSize;
      if (next > end) throw new Error(`the pages of column "${name}" inside its chunk`);
      if (header.numValues < 0 || header.uncompressedSize < 0 || header.uncompressedSize > MAX_PAGE_BYTES) throw new Error(`a page size and value count in column "${name}"`);
      const data = header.type === PAGE.data || header.type === PAGE.dataV2;
      if (data) {
        values += header.numValues;
        if (values > expected) throw new Error(`${expected} values in column "${name}" as its metadata says, found pages holding ${values} or more`);
      }
      if ((data || header.type === PAGE.dictionary) && width !== undefined && header.uncompressedSize > header.numValues * (width + OVERHEAD_PER_VALUE) + 1024) {
        throw new Error(`a page of column "${name}" no larger than its ${header.numValues} values need, found ${header.uncompressedSize} bytes`);
      }
      at = next;
    }
    if (values !== expected) throw new Error(`${expected} values in column "${name}" as its metadata says, found pages holding ${values}`);
  }
}
