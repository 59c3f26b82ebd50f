import { DataType, RecordBatchFileReader, RecordBatchReader, Table as ArrowTable, tableFromIPC, type Data, type RecordBatch } from 'apache-arrow';
import { Footer } from 'apache-arrow/ipc/metadata/file';
import { boundFlatbufferVectors } from './flatbuffer-bounds';

boundFlatbufferVectors();

/** "ARROW1": the IPC file format's magic, at its start and its end (Arrow columnar format, "IPC File Format"). */
const MAGIC = [0x41, 0x52, 0x52, 0x4f, 0x57, 0x31];
/** A footer Block is a 24-byte struct: offset (int64), metaDataLength (int32, padded), bodyLength (int64). */
const BLOCK_BYTES = 24;

/** Starts with the file format's magic: apache-arrow then reads it as a file, footer and all. */
function startsAsFile(b: Uint8Array): boolean {
  return b.length >= MAGIC.length && MAGIC.every((c, i) => b[i] === c);
}

/**
 * Decodes an Arrow IPC stream or file. For a file, the footer is checked before apache-arrow walks
 * it: its counts of blocks must fit in the footer and every block must lie between the leading
 * magic and the footer; then the record batches are read one by one by index, each of which must be
 * a record batch. (A damaged footer whose block points at a schema or dictionary message, or whose
 * vector length is huge, made apache-arrow's whole-file loop run forever.) Throws plain errors:
 * the caller turns them into an InputError naming the file.
 */
export function decodeArrowIpc(bytes: Uint8Array): ArrowTable {
  const table = startsAsFile(bytes) ? decodeFile(bytes) : tableFromIPC(bytes);
  checkLengths(table, bytes.length);
  return table;
}

/**
 * Every column chunk must hold the rows its record batch declares: a damaged length (say 2^36)
 * over empty buffers would otherwise become billions of rows read cell by cell. Fixed-width,
 * boolean, text and dictionary chunks are checked against their buffers; other types against the
 * file size, at one bit per row or more.
 */
function checkLengths(table: ArrowTable, fileBytes: number): void {
  for (const [j, field] of table.schema.fields.entries()) {
    for (const d of table.getChildAt(j)?.data ?? []) {
      const chunk = d as Data;
      const held = rowsHeld(chunk, fileBytes);
      if (!(chunk.length <= held) || !(chunk.nullCount <= chunk.length)) {
        throw new Error(`column "${field.name}": a batch of ${chunk.length} rows whose data hold at most ${held}`);
      }
    }
  }
}

function rowsHeld(d: Data, fileBytes: number): number {
  const t = d.type;
  if (DataType.isNull(t)) return Infinity;
  if (DataType.isBool(t)) return (d.values?.length ?? 0) * 8;
  if (DataType.isUtf8(t) || DataType.isBinary(t) || DataType.isLargeUtf8(t) || DataType.isLargeBinary(t)) return Math.max(0, (d.valueOffsets?.length ?? 0) - 1);
  if (DataType.isDictionary(t)) return d.values?.length ?? 0;
  if (DataType.isInt(t) || DataType.isFloat(t) || DataType.isDate(t) || DataType.isTimestamp(t) || DataType.isTime(t) || DataType.isDecimal(t) || DataType.isDuration(t) || DataType.isInterval(t) || DataType.isFixedSizeBinary(t)) {
    return Math.floor((d.values?.length ?? 0) / Math.max(1, d.stride));
  }
  return fileBytes * 8;
}

function decodeFile(bytes: Uint8Array): ArrowTable {
  const size = bytes.length;
  if (size < 2 * MAGIC.length + 4 || !MAGIC.every((c, i) => bytes[size - MAGIC.length + i] === c)) throw new Error('an Arrow IPC file that ends with "ARROW1" as it starts');
  const footerLength = new DataView(bytes.buffer, bytes.byteOffset, size).getInt32(size - 10, true);
  const footerStart = size - 10 - footerLength;
  if (footerLength <= 0 || footerStart < 8) throw new Error(`a footer length within the file, found ${footerLength}`);
  const footer = Footer.decode(bytes.subarray(footerStart, size - 10));
  const most = Math.floor(footerLength / BLOCK_BYTES);
  if (footer.numRecordBatches > most || footer.numDictionaries > most) throw new Error(`at most ${most} blocks in a footer of ${footerLength} bytes`);
  const blocks = [
    ...Array.from({ length: footer.numRecordBatches }, (_, i) => footer.getRecordBatch(i)),
    ...Array.from({ length: footer.numDictionaries }, (_, i) => footer.getDictionaryBatch(i)),
  ];
  for (const b of blocks) {
    if (!b || !(b.offset >= 8) || !(b.metaDataLength > 0) || !(b.bodyLength >= 0) || !(b.offset + b.metaDataLength + b.bodyLength <= footerStart)) {
      throw new Error('every block of the footer inside the file');
    }
  }
  const reader = RecordBatchReader.from(bytes);
  if (!(reader instanceof RecordBatchFileReader)) throw new Error('an Arrow IPC file');
  reader.open();
  const batches: RecordBatch[] = [];
  for (let i = 0; i < footer.numRecordBatches; i++) {
    const batch = reader.readRecordBatch(i);
    if (!batch) throw new Error(`record batch ${i + 1} where the footer points`);
    batches.push(batch);
  }
  return new ArrowTable(reader.schema, batches);
}
