/**
 * What a long-running core computation sees of its driver. Kernels stay pure: the driver (a Web
 * Worker, a Node worker thread, or a test) decides how progress is shown and how cancellation
 * arrives.
 */
export interface JobContext {
  /**
   * Report progress: a stage name, the fraction done of the whole job (0..1), and optionally what
   * the stage is at ("iteration 340 / 1000", "12,000 / 90,000 windows"). A detail belongs to the
   * report it comes with: the next report without one clears it.
   */
  progress(stage: string, fraction: number, detail?: string): void;
  /**
   * Called between slices of work. Resolves when the job may go on; rejects with CancelledError
   * when it was cancelled. Drivers yield to their event loop here so cancel messages get in.
   */
  checkpoint(): Promise<void>;
  /**
   * Offer an intermediate result (for example the map layout so far) to whoever watches the job.
   * Drivers may drop offers to keep a few per second; the value must not be mutated afterwards
   * (pass a copy). Optional: kernels call it as `ctx.partial?.(...)`.
   */
  partial?(value: unknown): void;
  /** Whether a partial offered now would be delivered (lets kernels skip copying otherwise). */
  wantsPartial?(): boolean;
}

/** A context for tests and synchronous callers: no progress, never cancelled. */
export const quietContext: JobContext = {
  progress() {},
  checkpoint: () => Promise.resolve(),
};
