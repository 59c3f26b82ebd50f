import { serveJobs } from './host';
import { jobs } from './jobs';
import type { FromHost, ToHost } from './protocol';

// Entry of the renderer's Web Worker: serves the core jobs over postMessage.
interface WorkerScope {
  postMessage(message: unknown, transfer: Transferable[]): void;
  onmessage: ((event: MessageEvent<ToHost>) => void) | null;
}
const scope = self as unknown as WorkerScope;
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
