import { Worker } from 'node:worker_threads';

/** One piece of the input's hash: an optional label (a part's relative path), then a file's bytes. */
export interface HashPart {
  label?: string;
  path: string;
}

/** SHA-256 over the labels and file bytes in order, computed on a second thread (plain JS, eval'd). */
const HASHER = `
const { parentPort, workerData } = require('node:worker_threads');
const { createHash } = require('node:crypto');
const { createReadStream } = require('node:fs');
(async () => {
  const hash = createHash('sha256');
  for (const part of workerData) {
    if (part.label !== undefined) hash.update(part.label);
    for await (const chunk of createReadStream(part.path, { highWaterMark: 4 << 20 })) hash.update(chunk);
  }
  parentPort.postMessage({ hex: hash.digest('hex') });
})().catch((e) => parentPort.postMessage({ error: String(e && e.message || e) }));
`;

export interface RunningHash {
  /** The hex digest once every part is read. */
  readonly digest: Promise<string>;
  /** Stops the thread (the digest then never settles). */
  stop(): void;
}

/**
 * Hashes the input files on a worker thread while the main thread parses them, so the input's
 * SHA-256 costs no wall time on a machine with a second core (each file is read twice, the second
 * time mostly from the page cache). The digest equals hashing the same labels and bytes in order.
 */
export function hashFilesInBackground(parts: HashPart[]): RunningHash {
  const worker = new Worker(HASHER, { eval: true, workerData: parts });
  const digest = new Promise<string>((resolve, reject) => {
    worker.once('message', (m: { hex?: string; error?: string }) => {
      void worker.terminate();
      if (m.hex) resolve(m.hex);
      else reject(new Error(`hashing the input failed: ${m.error ?? 'unknown error'}`));
    });
    worker.once('error', reject);
  });
  return { digest, stop: () => void worker.terminate() };
}
