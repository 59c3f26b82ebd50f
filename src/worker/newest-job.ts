import type { RunningJob } from './client';

/**
 * "The newest request wins": the job started last is the one whose result may be shown (a caller
 * asks `isNewest(job)` after awaiting it, so a stale job's late answer is dropped); `cancel()`
 * stops it, and callers cancel the previous one before they start the next.
 */
export class NewestJob<R> {
  private current: RunningJob<R> | null = null;

  /** Makes `job` the newest. */
  start(job: RunningJob<R>): RunningJob<R> {
    this.current = job;
    return job;
  }

  isNewest(job: RunningJob<R>): boolean {
    return this.current === job;
  }

  /** Forgets `job` if it is still the newest; returns whether it was (then the caller tidies up). */
  end(job: RunningJob<R>): boolean {
    if (this.current !== job) return false;
    this.current = null;
    return true;
  }

  cancel(): void {
    this.current?.cancel();
  }

  /** Cancels and forgets the newest job. */
  clear(): void {
    this.current?.cancel();
    this.current = null;
  }
}
