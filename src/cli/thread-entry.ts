import { parentPort } from 'node:worker_threads';
import { serveJobs } from '../worker/host';
import { jobs } from '../worker/jobs';
import type { FromHost, ToHost } from '../worker/protocol';

// Entry of the CLI's worker thread: serves the core jobs over the thread's parent port.
const port = parentPort;
if (!port) throw new Error('thread-entry must run in a worker thread');
serveJobs(
  {
    post: (message: FromHost, transfer?: Transferable[]) => port.postMessage(message, (transfer ?? []) as ArrayBuffer[]),
    listen: (handler: (message: ToHost) => void) => port.on('message', handler),
  },
  jobs,
  () => performance.now(),
);
