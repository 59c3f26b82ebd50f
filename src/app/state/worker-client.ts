import { JobClient } from '../../worker/client';
import type { Jobs } from '../../worker/jobs';
import type { FromHost, ToHost } from '../../worker/protocol';

/** Starts the compute worker (all parsing and analysis run there, never on the UI thread). */
export function startWorker(onCrash: (message: string) => void): JobClient<Jobs> {
  const worker = new Worker(new URL('../../worker/web-entry.ts', import.meta.url), { type: 'module' });
  const client = new JobClient<Jobs>({
    post: (message: ToHost, transfer?: Transferable[]) => worker.postMessage(message, transfer ?? []),
    listen: (handler: (message: FromHost) => void) => {
      worker.onmessage = (event: MessageEvent<FromHost>) => handler(event.data);
    },
  });
  worker.onerror = (event) => {
    const message = `The compute worker stopped: ${event.message || 'unknown error'}`;
    client.failAll(new Error(message));
    onCrash(message);
  };
  return client;
}
