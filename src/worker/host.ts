import { CancelledError, InputError } from '../core/errors';
import type { JobContext } from '../core/job';
import { transferablesOf, type ErrorPayload, type FromHost, type MessagePortLike, type ToHost } from './protocol';

/** A job: takes a payload, reports through the context, returns a result (typed arrays are transferred). */
export type JobHandler = (payload: never, ctx: JobContext) => Promise<unknown>;

/**
 * Progress messages are sent at most this often (ms); the first, the last and the first of each new
 * stage always go (a short stage would otherwise never be named while it runs).
 */
const PROGRESS_INTERVAL_MS = 100;
/** Intermediate results are sent at most this often (ms): a few redraws per second. */
const PARTIAL_INTERVAL_MS = 250;
/** Work between checkpoints longer than this yields to the event loop so cancel messages get in. */
const SLICE_MS = 30;

/**
 * Serves jobs on a port: runs each `run` message's handler, posts throttled progress, honours
 * `cancel` at the handler's next checkpoint, and turns every failure into an `error` message.
 * `now` is the driver's clock (performance.now), injected so that this file stays testable.
 */
export function serveJobs(
  port: MessagePortLike<ToHost, FromHost>,
  jobs: Record<string, JobHandler>,
  now: () => number,
): void {
  const cancelled = new Set<number>();
  port.listen((msg) => {
    if (msg.type === 'cancel') {
      cancelled.add(msg.id);
      return;
    }
    const handler = jobs[msg.job];
    if (!handler) {
      port.post({ type: 'error', id: msg.id, error: { name: 'Error', message: `unknown job "${msg.job}"` } });
      return;
    }
    void runOne(msg.id, handler, msg.payload);
  });

  async function runOne(id: number, handler: JobHandler, payload: unknown): Promise<void> {
    let lastPost = -Infinity;
    let lastStage: string | null = null;
    let lastPartial = -Infinity;
    let sliceStart = now();
    const ctx: JobContext = {
      progress(stage, fraction, detail) {
        const t = now();
        if (t - lastPost >= PROGRESS_INTERVAL_MS || fraction >= 1 || stage !== lastStage) {
          lastPost = t;
          lastStage = stage;
          port.post({ type: 'progress', id, stage, fraction: Math.max(0, Math.min(1, fraction)), ...(detail ? { detail } : {}) });
        }
      },
      wantsPartial: () => now() - lastPartial >= PARTIAL_INTERVAL_MS,
      partial(value) {
        const t = now();
        if (t - lastPartial < PARTIAL_INTERVAL_MS) return;
        lastPartial = t;
        port.post({ type: 'partial', id, value }, transferablesOf(value));
      },
      async checkpoint() {
        if (now() - sliceStart >= SLICE_MS) {
          await new Promise((resolve) => setTimeout(resolve, 0));
          sliceStart = now();
        }
        if (cancelled.has(id)) throw new CancelledError();
      },
    };
    try {
      const result = await handler(payload as never, ctx);
      port.post({ type: 'done', id, result }, transferablesOf(result));
    } catch (err) {
      if (err instanceof CancelledError) port.post({ type: 'cancelled', id });
      else port.post({ type: 'error', id, error: toErrorPayload(err) });
    } finally {
      cancelled.delete(id);
    }
  }
}

export function toErrorPayload(err: unknown): ErrorPayload {
  if (err instanceof InputError) return { name: err.name, message: err.message, details: err.details };
  if (err instanceof Error) return { name: err.name, message: err.message };
  return { name: 'Error', message: String(err) };
}
