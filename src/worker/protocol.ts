/**
 * Messages between a job client (UI thread or CLI main thread) and a job host (Web Worker or Node
 * worker thread). Every job has an increasing id chosen by the client.
 */

export interface ErrorPayload {
  name: string;
  message: string;
  /** For InputError: the file/row/column/expected details. */
  details?: unknown;
}

import type { JobContext } from '../core/job';

/** A table of jobs by name, as a host serves it (worker/jobs.ts `createJobs`). */
export type JobTable = Record<string, (payload: never, ctx: JobContext) => Promise<unknown>>;
/** A table that names no job in particular (tests, generic drivers): any payload, unknown results. */
export type AnyJobs = Record<string, (payload: unknown, ctx: JobContext) => Promise<unknown>>;
/** The payload a job of the table takes, and the result it resolves to: from its handler's own types. */
export type PayloadOf<T extends JobTable, N extends keyof T> = Parameters<T[N]>[0];
export type ResultOf<T extends JobTable, N extends keyof T> = Awaited<ReturnType<T[N]>>;

export type ToHost =
  | { type: 'run'; id: number; job: string; payload: unknown }
  | { type: 'cancel'; id: number };

export type FromHost =
  | { type: 'progress'; id: number; stage: string; fraction: number; detail?: string }
  | { type: 'partial'; id: number; value: unknown }
  | { type: 'done'; id: number; result: unknown }
  | { type: 'error'; id: number; error: ErrorPayload }
  | { type: 'cancelled'; id: number };

/** The two ends of a message channel, in the shape both Web Workers and worker_threads can fill. */
export interface MessagePortLike<In, Out> {
  post(message: Out, transfer?: Transferable[]): void;
  listen(handler: (message: In) => void): void;
}

/** Collects the ArrayBuffers of the typed arrays in a value (one level deep in objects and arrays). */
export function transferablesOf(value: unknown, found: Set<ArrayBuffer> = new Set(), depth = 0): ArrayBuffer[] {
  if (value && typeof value === 'object' && depth <= 3) {
    if (ArrayBuffer.isView(value)) {
      if (value.buffer instanceof ArrayBuffer) found.add(value.buffer);
    } else if (value instanceof ArrayBuffer) {
      found.add(value);
    } else {
      for (const v of Array.isArray(value) ? value : Object.values(value)) transferablesOf(v, found, depth + 1);
    }
  }
  return [...found];
}
