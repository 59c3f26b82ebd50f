import { Worker } from 'node:worker_threads';
import { JobClient } from '../worker/client';
import type { FromHost, ToHost } from '../worker/protocol';

export interface JobThread {
  client: JobClient;
  /** Stops the thread; pending jobs reject. */
  close(): Promise<void>;
}

/**
 * Starts the worker thread that runs the core jobs and returns a client for it. From the built
 * CLI (dist-cli/*.js) the thread runs thread-entry.js directly. From source (`node --import tsx`),
 * Node 20 does not apply the parent's module hooks to a worker's entry file, so the thread first
 * registers tsx itself and then imports thread-entry.ts.
 */
export function startJobThread(): JobThread {
  const fromSource = import.meta.url.endsWith('.ts');
  const entry = new URL(fromSource ? './thread-entry.ts' : './thread-entry.js', import.meta.url);
  let worker: Worker;
  if (fromSource) {
    const tsx = import.meta.resolve('tsx/esm/api');
    const boot = `import(${JSON.stringify(tsx)}).then((m) => { m.register(); return import(${JSON.stringify(entry.href)}); })`;
    worker = new Worker(boot, { eval: true });
  } else {
    worker = new Worker(entry);
  }
  const client = new JobClient({
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
