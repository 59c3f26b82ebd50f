import { createReadStream } from 'node:fs';
import { parentPort, workerData } from 'node:worker_threads';
import { InputError } from '../core/errors';
import { CsvReader } from '../core/table/csv-reader';
import { partBuffers, type CsvPartJob, type CsvPartMessage } from './csv-part-protocol';

// Entry of the thread that reads the second part of a large CSV (see csv-in-two.ts): from a
// record boundary to the end of the file, with the dialect and columns the main thread found.
const port = parentPort;
if (!port) throw new Error('csv-part-thread must run in a worker thread');
const job = workerData as CsvPartJob;
const post = (m: CsvPartMessage, transfer: ArrayBuffer[] = []) => port.postMessage(m, transfer);

try {
  const reader = CsvReader.continuing(job.fileName, job.layout);
  for await (const chunk of createReadStream(job.path, { start: job.start, highWaterMark: job.chunkBytes }) as AsyncIterable<Buffer>) {
    reader.push(new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength));
    post({ kind: 'progress', bytes: reader.bytesConsumed });
  }
  const part = reader.endPart();
  post({ kind: 'part', part }, partBuffers(part));
} catch (e) {
  if (e instanceof InputError) post({ kind: 'input-error', details: e.details });
  else post({ kind: 'error', message: e instanceof Error ? e.message : String(e) });
}
