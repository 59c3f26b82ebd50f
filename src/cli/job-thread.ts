import { JobClient } from '../worker/client';
import type { Jobs } from '../worker/jobs';
import type { FromHost, ToHost } from '../worker/protocol';
import { spawnThread } from './spawn-thread';

export interface JobThread {
  client: JobClient<Jobs>;
  /** Stops the thread; pending jobs reject. */
  close(): Promise<void>;
}

/** Starts the worker thread that runs the core jobs (thread-entry) and returns a client for it. */
export function startJobThread(): JobThread {
  const worker = spawnThread('thread-entry');
  const client = new JobClient<Jobs>({
    post: (message: ToHost, transfer?: Transferable[]) => worker.postMessage(message, (transfer ?? []) as ArrayBuffer[]),
    listen: (handler: (message: FromHost) => void) => worker.on('message', handler),
  });
  let closing = false;
  worker.on('error', (err) => client.failAll(err instanceof Error ? err : new Error(String(err))));
  worker.on('exit', (code) => {
    if (!closing) client.failAll(new Error(`the job thread stopped unexpectedly (exit code ${code})`));
  });
  return {
    client,
    async close() {
      closing = true;
      await worker.terminate();
    },
  };
}
