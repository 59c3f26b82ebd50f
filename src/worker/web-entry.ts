import type { RunningBlobHash } from '../core/hash/blob-hash';
import { serveJobs } from './host';
import { createJobs } from './jobs';
import type { FromHost, ToHost } from './protocol';

// Entry of the renderer's Web Worker: serves the core jobs over postMessage. A parsed file's
// SHA-256 is computed by a nested worker (hash-entry.ts) while this one parses.
interface WorkerScope {
  postMessage(message: unknown, transfer: Transferable[]): void;
  onmessage: ((event: MessageEvent<ToHost>) => void) | null;
}
const scope = self as unknown as WorkerScope;

const jobs = createJobs({ blobHasher: (blob): RunningBlobHash | null => {
  if (typeof Worker === 'undefined') return null;
  const worker = new Worker(new URL('./hash-entry.ts', import.meta.url), { type: 'module' });
  const digest = new Promise<string>((resolve, reject) => {
    worker.onmessage = (event: MessageEvent<{ hex?: string; error?: string }>) => {
      worker.terminate();
      if (event.data.hex) resolve(event.data.hex);
      else reject(new Error(`hashing the file failed: ${event.data.error ?? 'unknown error'}`));
    };
    worker.onerror = (event) => {
      worker.terminate();
      reject(new Error(`hashing the file failed: ${event.message}`));
    };
  });
  digest.catch(() => undefined);
  worker.postMessage({ blob });
  return { digest, stop: () => worker.terminate() };
} });
serveJobs(
  {
    post: (message: FromHost, transfer?: Transferable[]) => scope.postMessage(message, transfer ?? []),
    listen: (handler: (message: ToHost) => void) => {
      scope.onmessage = (event: MessageEvent<ToHost>) => handler(event.data);
    },
  },
  jobs,
  () => performance.now(),
);
