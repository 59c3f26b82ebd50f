import { CancelledError, InputError, type InputErrorDetails } from '../core/errors';
import type { AnyJobs, ErrorPayload, FromHost, JobTable, MessagePortLike, PayloadOf, ResultOf, ToHost } from './protocol';

export interface Progress {
  stage: string;
  fraction: number;
  /** What the stage is at, when the job says ("epoch 120 / 500"); absent means none. */
  detail?: string;
}

export interface RunningJob<R> {
  /** Job id, increasing: the newest job wins when callers supersede older ones. */
  id: number;
  /** Resolves with the result; rejects with InputError, CancelledError or Error. */
  result: Promise<R>;
  /** Asks the host to stop at its next checkpoint; `result` then rejects with CancelledError. */
  cancel(): void;
}

export interface RunOptions {
  onProgress?: (p: Progress) => void;
  onPartial?: (value: unknown) => void;
  transfer?: Transferable[];
}

/**
 * Starts jobs on a job host and routes its messages back to each job's promise. Typed by the job
 * table the host serves (`JobClient<Jobs>`): a job's payload and result types are its handler's.
 */
export class JobClient<T extends JobTable = AnyJobs> {
  private nextId = 1;
  /** Jobs started since this client was made, by job name (tests check that reopening a study computes nothing). */
  readonly started: Record<string, number> = {};
  private readonly pending = new Map<
    number,
    { resolve: (v: unknown) => void; reject: (e: Error) => void; onProgress?: (p: Progress) => void; onPartial?: (value: unknown) => void }
  >();

  constructor(private readonly port: MessagePortLike<FromHost, ToHost>) {
    port.listen((msg) => this.receive(msg));
  }

  run<N extends keyof T & string>(job: N, payload: PayloadOf<T, N>, options: RunOptions = {}): RunningJob<ResultOf<T, N>> {
    const id = this.nextId++;
    this.started[job] = (this.started[job] ?? 0) + 1;
    const result = new Promise<ResultOf<T, N>>((resolve, reject) => {
      this.pending.set(id, { resolve: resolve as (v: unknown) => void, reject, onProgress: options.onProgress, onPartial: options.onPartial });
    });
    this.port.post({ type: 'run', id, job, payload }, options.transfer);
    return { id, result, cancel: () => this.port.post({ type: 'cancel', id }) };
  }

  /** Rejects every pending job (for example when the host died). */
  failAll(error: Error): void {
    for (const p of this.pending.values()) p.reject(error);
    this.pending.clear();
  }

  private receive(msg: FromHost): void {
    const p = this.pending.get(msg.id);
    if (!p) return;
    switch (msg.type) {
      case 'progress':
        p.onProgress?.({ stage: msg.stage, fraction: msg.fraction, ...(msg.detail ? { detail: msg.detail } : {}) });
        return;
      case 'partial':
        p.onPartial?.(msg.value);
        return;
      case 'done':
        this.pending.delete(msg.id);
        p.resolve(msg.result);
        return;
      case 'cancelled':
        this.pending.delete(msg.id);
        p.reject(new CancelledError());
        return;
      case 'error':
        this.pending.delete(msg.id);
        p.reject(fromErrorPayload(msg.error));
    }
  }
}

export function fromErrorPayload(e: ErrorPayload): Error {
  if (e.name === 'InputError' && e.details) return new InputError(e.details as InputErrorDetails);
  const err = new Error(e.message);
  err.name = e.name;
  return err;
}
