import type { InputErrorDetails } from '../core/errors';
import type { CsvLayout, CsvPartState } from '../core/table/csv-reader';

/** What the part thread (csv-part-thread.ts) is given. */
export interface CsvPartJob {
  path: string;
  fileName: string;
  /** First byte of the part: just past a line end. */
  start: number;
  layout: CsvLayout;
  chunkBytes: number;
}

/** What the part thread posts back: progress, then its rows or the problem it met. */
export type CsvPartMessage =
  | { kind: 'progress'; bytes: number }
  | { kind: 'part'; part: CsvPartState }
  | { kind: 'input-error'; details: InputErrorDetails }
  | { kind: 'error'; message: string };

/** The buffers of a part's blocks, moved (not copied) to the thread that joins the parts. */
export function partBuffers(part: CsvPartState): ArrayBuffer[] {
  const out: ArrayBuffer[] = part.lines.map((b) => b.buffer as ArrayBuffer);
  for (const c of part.columns) {
    for (const b of c.num) out.push(b.buffer as ArrayBuffer);
    for (const b of c.codes ?? []) out.push(b.buffer as ArrayBuffer);
    for (const b of c.iso ?? []) out.push(b.buffer as ArrayBuffer);
  }
  return out;
}
