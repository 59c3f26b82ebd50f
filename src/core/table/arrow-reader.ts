import { DataType, makeVector, type Table as ArrowTable, type Vector } from 'apache-arrow';
import { decodeArrowIpc } from './arrow-ipc';
import { InputError } from '../errors';
import { quietContext, type JobContext } from '../job';
import { WholeFileReader } from './whole-file-reader';
import { AUTO_FLOAT32_BYTES } from './reader.types';
import { roleFromName } from './roles';
import type { Table } from './table';
import { ValueColumn } from './value-column';

const WIDE_ROLES = new Set(['id', 'subject', 'session', 'start', 'end', 'duration', 'label', 'metadata']);

/** Arrow IPC (file or stream format), decoded column by column with a checkpoint between columns. */
export class ArrowReader extends WholeFileReader {
  async finish(ctx: JobContext = quietContext): Promise<Table> {
    const size = this.bytes.length;
    const bytes = new Uint8Array(this.bytes.take());
    if (size === 0) throw new InputError({ file: this.fileName, expected: 'an Arrow IPC file', found: 'an empty file (0 bytes)' });
    let arrow: ArrowTable;
    try {
      arrow = decodeArrowIpc(bytes);
    } catch (e) {
      throw new InputError({ file: this.fileName, expected: 'a complete Arrow IPC file (it is damaged or cut short)', found: e instanceof Error ? e.message : String(e) });
    }
    const nRows = arrow.numRows;
    if (arrow.schema.fields.length === 0) throw new InputError({ file: this.fileName, expected: 'at least one column', found: 'an Arrow file without columns' });
    if (nRows === 0) throw new InputError({ file: this.fileName, row: 2, expected: 'at least one data row', found: 'an Arrow file with no rows' });
    const names = arrow.schema.fields.map((f) => f.name);
    const twice = names.findIndex((n, i) => names.indexOf(n) !== i);
    if (twice >= 0) {
      // As for a text table's header: two columns of one name would be told apart by position only.
      throw new InputError({ file: this.fileName, column: names[twice], expected: 'unique column names', found: `"${names[twice]}" in columns ${names.indexOf(names[twice]) + 1} and ${twice + 1}` });
    }
    const { precision, totalBytes } = this.opts;
    const narrow = precision === 'float32' || (precision === 'auto' && Math.max(totalBytes, size) > AUTO_FLOAT32_BYTES);
    const columns = [];
    for (const [j, field] of arrow.schema.fields.entries()) {
      const vector = arrow.getChildAt(j) as Vector;
      const time = DataType.isTimestamp(field.type) || DataType.isDate(field.type);
      const role = roleFromName(field.name);
      const column = new ValueColumn(field.name, nRows, !narrow || time || (role !== undefined && WIDE_ROLES.has(role)), time ? 'iso8601' : undefined);
      let start = 0;
      for (const data of vector.data) {
        const part = makeVector(data);
        const plain = (DataType.isFloat(field.type) || DataType.isInt(field.type)) && data.nullCount === 0 ? part.toArray() : Array.from(part);
        column.set(start, time ? (plain as (number | null)[]).map((v) => (v === null ? null : Number(v) / 1000)) : (plain as ArrayLike<unknown>));
        start += data.length;
      }
      columns.push(column.finish());
      ctx.progress('decoding', (j + 1) / arrow.schema.fields.length);
      await ctx.checkpoint();
    }
    return { fileName: this.fileName, nRows, columns };
  }
}
